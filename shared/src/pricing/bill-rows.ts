import type { QuoteBreakdown } from './pricing-breakdown.schema';
import { lineCents } from './pricing-change';

/** One priced line of a bill: the engine's line with its own amount. */
export interface BillLine {
  key: string;
  entryId: string;
  entryName: string;
  quantity: number;
  amountCents: number;
}

/**
 * A priced scope as the rows of an invoice or a receipt, so that the rows add up to the subtotal:
 * each line's own amount (`lineCents`: its share of the visit's first-hour minimum and extra labour,
 * its materials as charged, its flat price), then the charges no line carries: the service calls,
 * the labour of per-visit site conditions, and permits. The first-hour minimum is already in the
 * lines and is not billed again.
 */
export interface BillRows {
  lines: BillLine[];
  serviceCallCents: number;
  visitConditionsCents: number;
  permitCents: number;
  subtotalCents: number;
  taxCents: number;
  totalCents: number;
}

export function billRows(breakdown: QuoteBreakdown | null): BillRows {
  const visits = breakdown?.visits ?? [];
  const lines = visits.flatMap((v) => v.lines.map((l) => ({ key: l.key, entryId: l.entryId, entryName: l.entryName, quantity: l.quantity, amountCents: lineCents(l) })));
  const sum = (pick: (v: QuoteBreakdown['visits'][number]) => number) => visits.reduce((s, v) => s + pick(v), 0);
  const rows: BillRows = {
    lines,
    serviceCallCents: sum((v) => v.serviceCallCents),
    visitConditionsCents: sum((v) => v.visitAdderLabourCents),
    permitCents: sum((v) => v.permitCents),
    subtotalCents: breakdown?.subtotalCents ?? 0,
    taxCents: breakdown?.materialsTaxCents ?? 0,
    totalCents: breakdown?.totalCents ?? 0,
  };
  const added = lines.reduce((s, l) => s + l.amountCents, 0) + rows.serviceCallCents + rows.visitConditionsCents + rows.permitCents;
  if (added !== rows.subtotalCents) throw new Error(`Bill rows add up to ${added} cents, the subtotal is ${rows.subtotalCents}`);
  return rows;
}

/** Each line's own amount in a priced scope, by line key (what the seller sees beside each item). */
export function lineAmountsOf(breakdown: QuoteBreakdown | null): Map<string, number> {
  return new Map(billRows(breakdown).lines.map((l) => [l.key, l.amountCents]));
}
