import { addDays, editionNote, effectiveQuantity, todayIn, itemStateAfter, lineCents, type HouseCode, type Organisation, type QuoteContractor, type QuoteVersion } from '@cc/shared';
import type { StoredPricingItem } from '../pricing/item-pricing.repository';
import type { NewQuote, NewQuoteLine } from './quote.repository';
import type { LoadedRateBook } from '../rate-book/rate-book.service';
import type { PricedRequest } from '../pricing/request-pricing';

/** Shown on every quote and its PDF (the product's own wording of the trade's safety caution). */
export const QUOTE_SAFETY_NOTICE =
  'Electrical work can cause shock, burns, fire and death. The work in this quote is carried out only by persons ' +
  'licensed for electrical work where the property is, under the electrical code and local amendments adopted there, ' +
  'and with the permits and inspections that apply. The contractor determines and obtains any permit. ' +
  'Code references are for information; the authority having jurisdiction decides.';

/** The contractor as a quote shows it: name, licence and contact, copied in when sent. */
export function quoteContractorOf(org: Organisation): QuoteContractor {
  return { organisationId: org.id, name: org.name, licenceNumber: org.licenceNumber, licenceState: org.licenceState, licenceClass: org.licenceClass, phone: org.phone, address: org.address };
}

/**
 * The last day a quote sent at `sentAt` holds: `days` calendar days after the day it was sent, as a
 * day in the contractor's time zone (`zone`), where the quote's prices are set.
 */
export function validUntil(sentAt: Date, days: number, zone: string): string {
  return addDays(todayIn(zone, sentAt.getTime()), days);
}

export interface QuoteToCompose {
  requestId: number;
  version: number;
  sentBy: number | null;
  sentAt: Date;
  /** The contractor's time zone (its days decide how long the prices hold). */
  timeZone: string;
  note: string | null;
  contractor: QuoteContractor;
  property: QuoteVersion['property'];
  /** When the house was built and the edition adopted there: each priced line keeps its edition note. */
  house: HouseCode;
  loaded: LoadedRateBook;
  items: readonly StoredPricingItem[];
  /** The request priced by the shared engine, with a breakdown. */
  priced: PricedRequest & { input: NonNullable<PricedRequest['input']>; breakdown: NonNullable<PricedRequest['breakdown']> };
  /** Row id of the current version of each entry used. */
  entryVersionRowIds: ReadonlyMap<number, number>;
}

/**
 * A quote version ready to store: its priced lines in item order, then the items declined as not
 * in scope, with each line's entry and site conditions copied in as they are now.
 */
export function composeQuote(q: QuoteToCompose): NewQuote {
  const entries = new Map(q.loaded.entries.map((e) => [e.id, e]));
  const adders = new Map(q.loaded.adders.map((a) => [a.id, a]));
  const lines: NewQuoteLine[] = [];
  for (const item of q.items) {
    const line = q.priced.lineByItem.get(item.id);
    const entry = item.entryId === null ? undefined : entries.get(item.entryId);
    if (!line || !entry) continue;
    lines.push({
      lineItemId: item.id,
      kind: 'priced',
      code: item.code,
      room: item.room,
      location: item.location,
      entry: { id: entry.id, key: entry.key, version: entry.version, name: entry.name, unit: entry.unit, mode: entry.pricing.mode, code: entry.code, pricing: entry.pricing },
      entryVersionId: q.entryVersionRowIds.get(entry.id) ?? null,
      quantity: effectiveQuantity(item),
      isQuantityAssumed: item.isQuantityAssumed,
      adders: item.adderIds.flatMap((id) => {
        const adder = adders.get(id);
        return adder ? [{ id: adder.id, key: adder.key, name: adder.name }] : [];
      }),
      visitKey: item.visitKey,
      labourMinutes: line.labourMinutes,
      labourCents: line.labourCents,
      materialsCents: line.materialsCents,
      flatCents: line.flatCents,
      lineCents: lineCents(line),
      outOfScopeReason: null,
      editionNote: editionNote(item.code, item.room, q.house),
    });
  }
  for (const item of q.items.filter((i) => i.status === itemStateAfter('leave-out'))) {
    lines.push({
      lineItemId: item.id,
      kind: 'out-of-scope',
      code: item.code,
      room: item.room,
      location: item.location,
      entry: null,
      entryVersionId: null,
      quantity: item.quantity,
      isQuantityAssumed: false,
      adders: [],
      visitKey: null,
      labourMinutes: 0,
      labourCents: 0,
      materialsCents: 0,
      flatCents: 0,
      lineCents: 0,
      outOfScopeReason: item.outOfScopeReason,
      editionNote: null,
    });
  }
  const terms = q.loaded.book.terms;
  return {
    requestId: q.requestId,
    version: q.version,
    organisationId: q.contractor.organisationId,
    sentBy: q.sentBy,
    sentAt: q.sentAt,
    validUntil: validUntil(q.sentAt, terms.quoteValidityDays, q.timeZone),
    breakdown: q.priced.breakdown,
    warrantyText: terms.warrantyText,
    safetyNotice: QUOTE_SAFETY_NOTICE,
    note: q.note,
    contractor: q.contractor,
    property: q.property,
    rateBook: q.loaded.book,
    pricingInput: q.priced.input,
    lines,
  };
}
