import type { RateBook, RateBookEntryRecord, SiteAdderRecord, VisitTerms } from '@cc/shared';

/** The id an entry or adder has inside the pricing engine: its API id as a string. */
export const engineId = (id: number): string => String(id);

/**
 * A stored rate book in the form the shared pricing engine takes. Entries and adders keep the
 * order of the rate book (labour multipliers compound in that order).
 */
export function toEngineRateBook(
  contractorName: string,
  terms: VisitTerms,
  entries: readonly RateBookEntryRecord[],
  adders: readonly SiteAdderRecord[],
): RateBook {
  return {
    contractorName,
    terms,
    entries: entries.map((e) => ({ id: engineId(e.id), code: e.code, name: e.name, unit: e.unit, pricing: e.pricing })),
    adders: adders.map((a) => ({ id: engineId(a.id), name: a.name, effect: a.effect, appliesWhenBuiltBefore: a.appliesWhenBuiltBefore })),
  };
}
