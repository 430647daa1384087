import type { LineBreakdown, VisitBreakdown } from './pricing-breakdown.schema';
import { PricingError } from './pricing-error';
import type { PricingLine, Visit } from './pricing-input.schema';
import { priceFlatLine, priceTimeAndMaterialsLine } from './price-line';
import type { RateBook } from './rate-book.schema';
import { indexRateBook, type IndexedAdder, type RateBookIndex } from './rate-book-index';
import { allocateByWeight, applyBasisPoints, centsForMinutes, roundUpToIncrement } from './rounding';

type Path = readonly (string | number)[];

/** A visit to price. Defaults of the schema may be left out. */
export type VisitToPrice = Pick<Visit, 'key'> &
  Partial<Pick<Visit, 'adderIds' | 'hasPermit'>> & { lines: readonly LineToPrice[] };
export type LineToPrice = Pick<PricingLine, 'key' | 'entryId' | 'quantity'> & Partial<Pick<PricingLine, 'adderIds'>>;

/** The adder `ids[at]`; `pathTo` builds the error path only when it is needed. */
function resolveAdder(index: RateBookIndex, ids: readonly string[], at: number, pathTo: (at: number) => Path): IndexedAdder {
  const found = index.adders.get(ids[at]);
  if (!found) throw new PricingError('unknown-adder', pathTo(at), `The rate book has no site condition "${ids[at]}"`);
  return found;
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
 */
export function priceVisit(book: RateBook, visit: VisitToPrice, path: Path = []): VisitBreakdown {
  const index = indexRateBook(book);
  const terms = book.terms;
  if (visit.lines.length === 0) throw new PricingError('empty-visit', [...path, 'lines'], `Visit "${visit.key}" has no items`);

  const perVisitAdders = new Set<IndexedAdder>();
  const visitWideLineAdders: IndexedAdder[] = [];
  const visitAdderIds = visit.adderIds ?? [];
  for (let i = 0; i < visitAdderIds.length; i++) {
    const found = resolveAdder(index, visitAdderIds, i, (at) => [...path, 'adderIds', at]);
    if (found.adder.effect.kind === 'minutes-per-visit') perVisitAdders.add(found);
    else if (!visitWideLineAdders.includes(found)) visitWideLineAdders.push(found);
  }

  const lineCount = visit.lines.length;
  const lines: LineBreakdown[] = new Array(lineCount);
  const labourWeights: number[] = new Array(lineCount + 1);
  const flatUnitsSoFar = new Map<string, number>();
  const seenKeys = new Set<string>();
  let lineMinutes = 0;
  let flatCents = 0;
  let materialsCostCents = 0;
  let materialsMarkupCents = 0;

  for (let i = 0; i < lineCount; i++) {
    const line = visit.lines[i];
    if (seenKeys.has(line.key)) {
      throw new PricingError('duplicate-key', [...path, 'lines', i, 'key'], `Line "${line.key}" appears twice`);
    }
    seenKeys.add(line.key);
    const entry = index.entries.get(line.entryId);
    if (!entry) {
      throw new PricingError('unknown-entry', [...path, 'lines', i, 'entryId'], `The rate book has no entry "${line.entryId}"`);
    }
    const pricing = entry.pricing;
    const isFlat = pricing.mode === 'flat';

    // Adders of the line, then the visit-wide ones it does not already name.
    let adderMinutesPerUnit = 0;
    let applied: IndexedAdder[] | null = null;
    const lineAdderIds = line.adderIds ?? [];
    for (let a = 0; a < lineAdderIds.length; a++) {
      const adderPath = (at: number): Path => [...path, 'lines', i, 'adderIds', at];
      const found = resolveAdder(index, lineAdderIds, a, adderPath);
      if (found.adder.effect.kind === 'minutes-per-visit') {
        perVisitAdders.add(found);
      } else if (isFlat) {
        throw new PricingError('adder-not-for-flat', adderPath(a), `"${found.adder.name}" changes labour; a flat-rate line has a fixed price`);
      } else {
        applied ??= [];
        if (!applied.includes(found)) applied.push(found);
      }
    }

    if (pricing.mode === 'flat') {
      const earlier = flatUnitsSoFar.get(entry.id) ?? 0;
      const lineFlat = priceFlatLine(pricing, line.quantity, earlier);
      flatUnitsSoFar.set(entry.id, earlier + line.quantity);
      flatCents += lineFlat;
      labourWeights[i] = 0;
      lines[i] = {
        key: line.key, entryId: entry.id, entryName: entry.name, code: entry.code, mode: 'flat',
        quantity: line.quantity, labourMinutes: 0, labourCents: 0,
        materialsCostCents: 0, materialsMarkupCents: 0, materialsCents: 0, flatCents: lineFlat,
      };
      continue;
    }

    if (visitWideLineAdders.length > 0) {
      applied ??= [];
      for (const found of visitWideLineAdders) if (!applied.includes(found)) applied.push(found);
    }
    const multipliers: number[] = [];
    if (applied) {
      applied.sort((x, y) => x.position - y.position);
      for (const { adder } of applied) {
        if (adder.effect.kind === 'minutes-per-unit') adderMinutesPerUnit += adder.effect.minutes;
        else if (adder.effect.kind === 'labour-multiplier') multipliers.push(adder.effect.multiplierBp);
      }
    }
    const figures = priceTimeAndMaterialsLine(pricing, line.quantity, adderMinutesPerUnit, multipliers, terms.materialsMarkupBp);
    lineMinutes += figures.labourMinutes;
    materialsCostCents += figures.materialsCostCents;
    materialsMarkupCents += figures.materialsMarkupCents;
    labourWeights[i] = figures.labourMinutes;
    lines[i] = {
      key: line.key, entryId: entry.id, entryName: entry.name, code: entry.code, mode: 'time-and-materials',
      quantity: line.quantity, labourMinutes: figures.labourMinutes, labourCents: 0,
      materialsCostCents: figures.materialsCostCents, materialsMarkupCents: figures.materialsMarkupCents,
      materialsCents: figures.materialsCostCents + figures.materialsMarkupCents, flatCents: 0,
    };
  }

  let visitAdderMinutes = 0;
  for (const { adder } of perVisitAdders) if (adder.effect.kind === 'minutes-per-visit') visitAdderMinutes += adder.effect.minutes;

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
