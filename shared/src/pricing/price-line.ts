import type { FlatPricing, TimeAndMaterialsPricing } from './rate-book.schema';
import { applyBasisPoints, compoundMultipliers } from './rounding';

/** Figures of one time-and-materials line on its own, before the visit pools its labour. */
export interface TimeAndMaterialsFigures {
  labourMinutes: number;
  materialsCostCents: number;
  materialsMarkupCents: number;
}

/**
 * Labour and materials of a time-and-materials line:
 * minutes = (minutes per unit + adder minutes per unit) × quantity × combined multiplier (R2, then R1);
 * materials = cost per unit × quantity; markup = materials × markup (R1), entry override first.
 */
export function priceTimeAndMaterialsLine(
  pricing: TimeAndMaterialsPricing,
  quantity: number,
  adderMinutesPerUnit: number,
  multipliersBp: readonly number[],
  defaultMarkupBp: number,
): TimeAndMaterialsFigures {
  const plainMinutes = (pricing.labourMinutesPerUnit + adderMinutesPerUnit) * quantity;
  const labourMinutes =
    multipliersBp.length === 0 ? plainMinutes : applyBasisPoints(plainMinutes, compoundMultipliers(multipliersBp));
  const materialsCostCents = pricing.materialsCentsPerUnit * quantity;
  const materialsMarkupCents = applyBasisPoints(materialsCostCents, pricing.markupBp ?? defaultMarkupBp);
  return { labourMinutes, materialsCostCents, materialsMarkupCents };
}

/**
 * Flat-rate price of a line. `unitsEarlierInVisit` counts units of the same entry on earlier lines
 * of the visit: the first-unit price applies to the visit's first unit of the entry only.
 */
export function priceFlatLine(pricing: FlatPricing, quantity: number, unitsEarlierInVisit: number): number {
  const firstUnits = unitsEarlierInVisit === 0 ? 1 : 0;
  return pricing.firstUnitCents * firstUnits + pricing.additionalUnitCents * (quantity - firstUnits);
}
