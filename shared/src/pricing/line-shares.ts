import type { VisitBreakdown } from './pricing-breakdown.schema';
import { allocateByWeight } from './rounding';

/**
 * What each line of a priced visit bills, the visit's charges included: the visit's subtotal
 * (before tax: service call, first-hour minimum, extra labour, flat prices, materials as charged,
 * permit) split over its lines in proportion to each line's own amount (labour share + materials as
 * charged + flat price), by R5, so the shares add up to the subtotal exactly. A visit whose lines
 * have no amount of their own splits the subtotal evenly. Keyed by line key.
 */
export function lineSharesOfVisit(visit: VisitBreakdown): Map<string, number> {
  const own = visit.lines.map((l) => l.labourCents + l.materialsCents + l.flatCents);
  const weights = own.some((w) => w > 0) ? own : visit.lines.map(() => 1);
  const shares = visit.lines.length ? allocateByWeight(visit.subtotalCents, weights) : [];
  return new Map(visit.lines.map((l, i) => [l.key, shares[i]]));
}
