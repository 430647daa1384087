import type { LineBreakdown, VisitBreakdown } from './pricing-breakdown.schema';
import { PricingError } from './pricing-error';
import type { PricingLine, Visit } from './pricing-input.schema';
import { foldLabourAdders } from './labour-adders';
import { priceFlatLine, priceTimeAndMaterialsLine, type LineLabourAdders } from './price-line';
import type { FlatPricing, RateBook, RateBookEntry, TimeAndMaterialsPricing } from './rate-book.schema';
import { indexRateBook, type IndexedAdder } from './rate-book-index';
import { allocateByWeight, applyBasisPoints, centsForMinutes, roundUpToIncrement } from './rounding';

type Path = readonly (string | number)[];
const NONE: readonly string[] = [];

/** A visit to price. Defaults of the schema may be left out. */
export type VisitToPrice = Pick<Visit, 'key'> &
  Partial<Pick<Visit, 'adderIds' | 'hasPermit'>> & { lines: readonly LineToPrice[] };
export type LineToPrice = Pick<PricingLine, 'key' | 'entryId' | 'quantity'> & Partial<Pick<PricingLine, 'adderIds'>>;

function unknownAdder(id: string, path: Path): PricingError {
  return new PricingError('unknown-adder', path, `The rate book has no site condition "${id}"`);
}

/** The folded labour of `applied`; a single adder was folded when the rate book was indexed. */
function labourOf(applied: readonly IndexedAdder[]): LineLabourAdders {
  return applied.length === 1 ? applied[0].alone : foldLabourAdders(applied);
}

/**
 * Prices one visit. Rules (docs/pricing.md, "The model"):
 * - the service-call charge is due once per visit;
 * - time-and-materials minutes of all lines, plus per-visit adder minutes, are pooled; when the pool
 *   is not empty the first-hour minimum is due once and covers the first `firstHourCoversMinutes`;
 *   the rest is billed at the hourly rate, rounded up to the billing increment;
 * - flat lines are priced flat and use none of the first hour; a visit of flat lines only pays the
 *   service call but no first-hour minimum;
 * - visit-level adders of kind minutes-per-unit or labour-multiplier apply to every
 *   time-and-materials line of the visit; per-visit minutes count once however many lines flag them;
 * - tax is on materials (cost plus markup) only.
 * Line keys are echoed, not checked: the input schemas refuse repeated keys.
 */
export function priceVisit(book: RateBook, visit: VisitToPrice, path: Path = []): VisitBreakdown {
  const index = indexRateBook(book);
  const terms = book.terms;
  const lineCount = visit.lines.length;
  if (lineCount === 0) throw new PricingError('empty-visit', [...path, 'lines'], `Visit "${visit.key}" has no items`);

  const perVisitAdders: IndexedAdder[] = [];
  const visitWideAdders: IndexedAdder[] = [];
  const visitAdderIds = visit.adderIds ?? NONE;
  for (let i = 0; i < visitAdderIds.length; i++) {
    const found = index.adders.get(visitAdderIds[i]);
    if (!found) throw unknownAdder(visitAdderIds[i], [...path, 'adderIds', i]);
    const bucket = found.adder.effect.kind === 'minutes-per-visit' ? perVisitAdders : visitWideAdders;
    if (!bucket.includes(found)) bucket.push(found);
  }
  const visitWideLabour = labourOf(visitWideAdders);

  const lines: LineBreakdown[] = new Array(lineCount);
  const labourWeights: number[] = new Array(lineCount + 1);
  let flatUnitsSoFar: Map<string, number> | null = null;
  let lineMinutes = 0;
  let flatCents = 0;
  let materialsCostCents = 0;
  let materialsMarkupCents = 0;

  for (let i = 0; i < lineCount; i++) {
    const line = visit.lines[i];
    const entry = index.entries.get(line.entryId);
    if (!entry) {
      throw new PricingError('unknown-entry', [...path, 'lines', i, 'entryId'], `The rate book has no entry "${line.entryId}"`);
    }
    const isFlat = entry.pricing.mode === 'flat';

    // The line's own adders: labour ones it names beyond the visit-wide ones are added to those.
    let labour = visitWideLabour;
    const lineAdderIds = line.adderIds ?? NONE;
    if (lineAdderIds.length > 0) {
      const ownAdders: IndexedAdder[] = [];
      for (let a = 0; a < lineAdderIds.length; a++) {
        const found = index.adders.get(lineAdderIds[a]);
        if (!found) throw unknownAdder(lineAdderIds[a], [...path, 'lines', i, 'adderIds', a]);
        if (found.adder.effect.kind === 'minutes-per-visit') {
          if (!perVisitAdders.includes(found)) perVisitAdders.push(found);
        } else if (isFlat) {
          throw new PricingError('adder-not-for-flat', [...path, 'lines', i, 'adderIds', a], `"${found.adder.name}" changes labour; a flat-rate line has a fixed price`);
        } else if (!visitWideAdders.includes(found) && !ownAdders.includes(found)) {
          ownAdders.push(found);
        }
      }
      if (ownAdders.length > 0) labour = labourOf(visitWideAdders.length === 0 ? ownAdders : visitWideAdders.concat(ownAdders));
    }

    let priced: LineBreakdown;
    if (isFlat) {
      flatUnitsSoFar ??= new Map();
      const earlier = flatUnitsSoFar.get(entry.id) ?? 0;
      flatUnitsSoFar.set(entry.id, earlier + line.quantity);
      priced = priceFlatLine(line, entry as RateBookEntry & { pricing: FlatPricing }, earlier);
      flatCents += priced.flatCents;
    } else {
      priced = priceTimeAndMaterialsLine(line, entry as RateBookEntry & { pricing: TimeAndMaterialsPricing }, labour, terms.materialsMarkupBp);
      lineMinutes += priced.labourMinutes;
      materialsCostCents += priced.materialsCostCents;
      materialsMarkupCents += priced.materialsMarkupCents;
    }
    lines[i] = priced;
    labourWeights[i] = priced.labourMinutes;
  }

  let visitAdderMinutes = 0;
  for (let i = 0; i < perVisitAdders.length; i++) {
    const effect = perVisitAdders[i].adder.effect;
    if (effect.kind === 'minutes-per-visit') visitAdderMinutes += effect.minutes;
  }

  const pooledMinutes = lineMinutes + visitAdderMinutes;
  const firstHourMinimumCents = pooledMinutes > 0 ? terms.firstHourMinimumCents : 0;
  const extraMinutes = Math.max(0, pooledMinutes - terms.firstHourCoversMinutes);
  const billedExtraMinutes = roundUpToIncrement(extraMinutes, terms.billingIncrementMinutes);
  const extraLabourCents = centsForMinutes(billedExtraMinutes, terms.hourlyRateCents);

  labourWeights[lineCount] = visitAdderMinutes;
  const labourShares = allocateByWeight(firstHourMinimumCents + extraLabourCents, labourWeights);
  for (let i = 0; i < lineCount; i++) lines[i].labourCents = labourShares[i];

  const materialsTaxCents = applyBasisPoints(materialsCostCents + materialsMarkupCents, terms.materialsTaxBp);
  const permitCents = visit.hasPermit ? terms.permit.feeCents + terms.permit.handlingCents : 0;
  const subtotalCents =
    terms.serviceCallCents + firstHourMinimumCents + extraLabourCents + flatCents + materialsCostCents + materialsMarkupCents + permitCents;
  const totalCents = subtotalCents + materialsTaxCents;

  return {
    key: visit.key,
    lines,
    visitAdderMinutes,
    visitAdderLabourCents: labourShares[lineCount],
    pooledMinutes,
    extraMinutes,
    billedExtraMinutes,
    serviceCallCents: terms.serviceCallCents,
    firstHourMinimumCents,
    extraLabourCents,
    flatCents,
    materialsCostCents,
    materialsMarkupCents,
    materialsTaxCents,
    permitCents,
    subtotalCents,
    totalCents,
    depositCents: applyBasisPoints(totalCents, terms.cardDepositBp),
  };
}
