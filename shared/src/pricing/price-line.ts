import type { LineBreakdown } from './pricing-breakdown.schema';
import type { FlatPricing, RateBookEntry, TimeAndMaterialsPricing } from './rate-book.schema';
import { applyBasisPoints } from './rounding';

/** The line as the caller named it. */
export interface LineRef {
  key: string;
  quantity: number;
}

/** Labour adders that apply to one time-and-materials line, already folded (`foldLabourAdders`). */
export interface LineLabourAdders {
  readonly minutesPerUnit: number;
  /** The line's multipliers compounded in rate-book order (R2), or null when it has none. */
  readonly multiplierBp: number | null;
}

/**
 * A time-and-materials line on its own, before the visit pools its labour (`labourCents` is filled
 * in by the visit):
 * minutes = (minutes per unit + adder minutes per unit) × quantity × combined multiplier (R1);
 * materials = cost per unit × quantity; markup = materials × markup (R1), entry override first.
 */
export function priceTimeAndMaterialsLine(
  line: LineRef,
  entry: RateBookEntry & { pricing: TimeAndMaterialsPricing },
  adders: LineLabourAdders,
  defaultMarkupBp: number,
): LineBreakdown {
  const pricing = entry.pricing;
  const plainMinutes = (pricing.labourMinutesPerUnit + adders.minutesPerUnit) * line.quantity;
  const labourMinutes = adders.multiplierBp === null ? plainMinutes : applyBasisPoints(plainMinutes, adders.multiplierBp);
  const materialsCostCents = pricing.materialsCentsPerUnit * line.quantity;
  const materialsMarkupCents = applyBasisPoints(materialsCostCents, pricing.markupBp ?? defaultMarkupBp);
  return {
    key: line.key,
    entryId: entry.id,
    entryName: entry.name,
    code: entry.code,
    mode: 'time-and-materials',
    quantity: line.quantity,
    labourMinutes,
    labourCents: 0,
    materialsCostCents,
    materialsMarkupCents,
    materialsCents: materialsCostCents + materialsMarkupCents,
    flatCents: 0,
  };
}

/**
 * A flat-rate line. `unitsEarlierInVisit` counts units of the same entry on earlier lines of the
 * visit: the first-unit price applies to the visit's first unit of the entry only.
 */
export function priceFlatLine(line: LineRef, entry: RateBookEntry & { pricing: FlatPricing }, unitsEarlierInVisit: number): LineBreakdown {
  const pricing = entry.pricing;
  const firstUnits = unitsEarlierInVisit === 0 ? 1 : 0;
  return {
    key: line.key,
    entryId: entry.id,
    entryName: entry.name,
    code: entry.code,
    mode: 'flat',
    quantity: line.quantity,
    labourMinutes: 0,
    labourCents: 0,
    materialsCostCents: 0,
    materialsMarkupCents: 0,
    materialsCents: 0,
    flatCents: pricing.firstUnitCents * firstUnits + pricing.additionalUnitCents * (line.quantity - firstUnits),
  };
}
