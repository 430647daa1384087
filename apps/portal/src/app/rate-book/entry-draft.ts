import { EntryPricing, Material, RateBookEntryRecord } from '@cc/shared';
import { bpToFactor, bpToPercent, centsToDollars, dollarsToCents, factorToBp, percentToBp, toWholeNumber } from './units';

/** A material of an entry as typed in the form. */
export interface MaterialDraft {
  name: string;
  quantityPerUnit: string;
  unitCostCents: string;
}

/** An entry's pricing as typed: the fields of both modes, in people's units, named as in the schema. */
export interface PricingDraft {
  mode: EntryPricing['mode'];
  labourMinutesPerUnit: string;
  materialsCentsPerUnit: string;
  /** Empty for the rate book's default markup. */
  markupBp: string;
  minutesLow: string;
  minutesHigh: string;
  materials: MaterialDraft[];
  firstUnitCents: string;
  additionalUnitCents: string;
  hardSiteMultiplierBp: string;
}

const EMPTY_PRICING: PricingDraft = {
  mode: 'time-and-materials',
  labourMinutesPerUnit: '',
  materialsCentsPerUnit: '0.00',
  markupBp: '',
  minutesLow: '',
  minutesHigh: '',
  materials: [],
  firstUnitCents: '',
  additionalUnitCents: '',
  hardSiteMultiplierBp: '1.3',
};

export function materialDraft(material?: Material): MaterialDraft {
  return material
    ? { name: material.name, quantityPerUnit: String(material.quantityPerUnit), unitCostCents: centsToDollars(material.unitCostCents) }
    : { name: '', quantityPerUnit: '1', unitCostCents: '' };
}

/** The form's starting values for an entry (or a new one). */
export function pricingDraft(entry?: Pick<RateBookEntryRecord, 'pricing'>): PricingDraft {
  const p = entry?.pricing;
  if (!p) return { ...EMPTY_PRICING, materials: [] };
  if (p.mode === 'flat') {
    return {
      ...EMPTY_PRICING,
      mode: 'flat',
      firstUnitCents: centsToDollars(p.firstUnitCents),
      additionalUnitCents: centsToDollars(p.additionalUnitCents),
      hardSiteMultiplierBp: bpToFactor(p.hardSiteMultiplierBp),
    };
  }
  return {
    ...EMPTY_PRICING,
    labourMinutesPerUnit: String(p.labourMinutesPerUnit),
    materialsCentsPerUnit: centsToDollars(p.materialsCentsPerUnit),
    markupBp: p.markupBp === null ? '' : bpToPercent(p.markupBp),
    minutesLow: String(p.minutesLow),
    minutesHigh: String(p.minutesHigh),
    materials: p.materials.map(materialDraft),
  };
}

/** The cost of one unit's materials list, or null while a line of it does not read. */
export function materialsTotalCents(materials: readonly MaterialDraft[]): number | null {
  let sum = 0;
  for (const m of materials) {
    const quantity = toWholeNumber(m.quantityPerUnit);
    const cost = dollarsToCents(m.unitCostCents);
    if (quantity === null || cost === null) return null;
    sum += quantity * cost;
  }
  return sum;
}

/**
 * The pricing as the API takes it, for the shared schema to check. A field that does not read is
 * sent as null, so the schema reports it at its path; with a materials list, the cost per unit is
 * the list's sum.
 */
export function toEntryPricing(draft: PricingDraft): unknown {
  if (draft.mode === 'flat') {
    return {
      mode: 'flat',
      firstUnitCents: dollarsToCents(draft.firstUnitCents),
      additionalUnitCents: dollarsToCents(draft.additionalUnitCents),
      hardSiteMultiplierBp: factorToBp(draft.hardSiteMultiplierBp),
    };
  }
  const materials = draft.materials.map((m) => ({ name: m.name.trim(), quantityPerUnit: toWholeNumber(m.quantityPerUnit), unitCostCents: dollarsToCents(m.unitCostCents) }));
  return {
    mode: 'time-and-materials',
    labourMinutesPerUnit: toWholeNumber(draft.labourMinutesPerUnit),
    materialsCentsPerUnit: materials.length ? materialsTotalCents(draft.materials) : dollarsToCents(draft.materialsCentsPerUnit),
    markupBp: draft.markupBp.trim() === '' ? null : percentToBp(draft.markupBp),
    materials,
    minutesLow: toWholeNumber(draft.minutesLow),
    minutesHigh: toWholeNumber(draft.minutesHigh),
  };
}

/** One line about what an entry charges (`30 min + $24.00 materials`, `$175.00, then $85.00 each`). */
export function pricingSummary(pricing: EntryPricing): string {
  if (pricing.mode === 'flat') return `$${centsToDollars(pricing.firstUnitCents)} first, then $${centsToDollars(pricing.additionalUnitCents)} each`;
  const markup = pricing.markupBp === null ? '' : `, markup ${bpToPercent(pricing.markupBp)} %`;
  return `${pricing.labourMinutesPerUnit} min + $${centsToDollars(pricing.materialsCentsPerUnit)} materials${markup}`;
}
