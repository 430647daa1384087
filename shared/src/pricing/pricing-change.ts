// What pricing does to a line item, written once for the portal's live pricing and the server:
// what a bulk change sets on an item, which quantity an item is priced at, which items are lines of
// the priced total, and the engine input those lines make.
import { itemMove, itemStateAfter, itemStatesFrom } from '../requests/request-flow';
import type { ItemStatus } from '../items/item-status';
import type { PricingVisit } from '../quotes/request-pricing.schema';
import type { Quote } from './pricing-input.schema';

/** The pricing side of a line item: what the report gave and what the contractor set. */
export interface PricedItemState {
  id: number;
  status: ItemStatus;
  /** The quantity the report gave; null when it said "several". */
  quantity: number | null;
  entryId: number | null;
  adderIds: readonly number[];
  /** The contractor's own quantity; null: the report's. */
  pricingQuantity: number | null;
  isQuantityAssumed: boolean;
  visitKey: string;
  outOfScopeReason: string | null;
}

/** One change the contractor applies to several items at once (the `set` of a bulk change). */
export interface PricingChange {
  entryId?: number | null;
  adderIds?: readonly number[];
  quantity?: number;
  visitKey?: string;
}

/** The fields a pricing change writes on an item. */
export type PricingFields = Partial<Pick<PricedItemState, 'status' | 'entryId' | 'adderIds' | 'pricingQuantity' | 'isQuantityAssumed' | 'visitKey' | 'outOfScopeReason'>>;

/** The visit every item is on until the contractor plans more than one. */
export const DEFAULT_VISIT_KEY = 'visit-1';

/** Item states the contractor works on while pricing: those a price, "not our scope" or taking back starts from. */
export const PRICING_ITEM_STATES: readonly ItemStatus[] = itemStatesFrom(['price', 'leave-out', 'take-back-in']);

/** The state of an item confirmed by the agents and not priced yet (what auto-pricing picks up). */
export const CONFIRMED_ITEM_STATE: ItemStatus = itemStateAfter('confirm');

/** Item states whose items are lines of the quote once they have an entry and a quantity. */
export const PRICEABLE_ITEM_STATES: readonly ItemStatus[] = itemStatesFrom(['price']);

/** The quantity an item is priced at: the contractor's, else the report's; null while unknown. */
export function effectiveQuantity(item: Pick<PricedItemState, 'pricingQuantity' | 'quantity'>): number | null {
  return item.pricingQuantity ?? item.quantity;
}

/**
 * What `change` writes on `item`: choosing an entry takes an item left out back into the quote and,
 * when nobody knows its quantity, prices it at 1 and flags that; a quantity is the contractor's own.
 */
export function pricingFieldsFor(item: PricedItemState, change: PricingChange): PricingFields {
  const fields: PricingFields = {};
  if (change.entryId !== undefined) {
    fields.entryId = change.entryId;
    if (change.entryId !== null && itemMove('take-back-in', item.status)) Object.assign(fields, { status: itemStateAfter('take-back-in'), outOfScopeReason: null });
    if (change.entryId !== null && change.quantity === undefined && effectiveQuantity(item) === null) Object.assign(fields, { pricingQuantity: 1, isQuantityAssumed: true });
  }
  if (change.quantity !== undefined) Object.assign(fields, { pricingQuantity: change.quantity, isQuantityAssumed: false });
  if (change.adderIds !== undefined) fields.adderIds = [...new Set(change.adderIds)];
  if (change.visitKey !== undefined) fields.visitKey = change.visitKey;
  return fields;
}

/** The items with `change` applied to those named in `itemIds`. */
export function applyPricingChange<T extends PricedItemState>(items: readonly T[], itemIds: readonly number[], change: PricingChange): T[] {
  const ids = new Set(itemIds);
  return items.map((item) => (ids.has(item.id) ? { ...item, ...pricingFieldsFor(item, change) } : item));
}

/** The visits of a request: those planned, or the single default visit. */
export function visitsOrDefault(visits: readonly PricingVisit[]): PricingVisit[] {
  return visits.length ? [...visits] : [{ key: DEFAULT_VISIT_KEY, adderIds: [], hasPermit: false }];
}

/** The ids of the rate book the items are priced against (entries and site conditions still in it). */
export interface LiveRateBookIds {
  entryIds: ReadonlySet<number>;
  adderIds: ReadonlySet<number>;
}

/** Whether the item is a line of the priced total: open or priced, with an entry still in the rate book and a quantity. */
export function isPricedLine(item: PricedItemState, live: LiveRateBookIds): boolean {
  return PRICEABLE_ITEM_STATES.includes(item.status) && item.entryId !== null && live.entryIds.has(item.entryId) && effectiveQuantity(item) !== null;
}

export interface LinesToPrice<T extends PricedItemState> {
  /** The engine input; null when no item is a line yet. */
  quote: Quote | null;
  /** The items that are lines, in the order of `quote.lines`. */
  lines: T[];
  /** Open or priced items that are not lines (no entry in the rate book, or no quantity): they hold up the quote. */
  unpricedItemIds: number[];
}

/**
 * The engine input for a request's items: every priced line on its visit, site conditions no
 * longer in the rate book left out, visits without lines not priced. Engine ids are API ids as strings.
 */
export function linesToPrice<T extends PricedItemState>(items: readonly T[], plannedVisits: readonly PricingVisit[], live: LiveRateBookIds): LinesToPrice<T> {
  const lines = items.filter((item) => isPricedLine(item, live));
  const unpricedItemIds = items.filter((i) => PRICEABLE_ITEM_STATES.includes(i.status) && !lines.includes(i)).map((i) => i.id);
  if (lines.length === 0) return { quote: null, lines, unpricedItemIds };
  const liveAdders = (ids: readonly number[]) => ids.filter((id) => live.adderIds.has(id)).map(String);
  const visits = visitsOrDefault(plannedVisits);
  const used = new Set(lines.map((i) => i.visitKey));
  for (const key of used) if (!visits.some((v) => v.key === key)) visits.push({ key, adderIds: [], hasPermit: false });
  return {
    quote: {
      visits: visits.filter((v) => used.has(v.key)).map((v) => ({ key: v.key, adderIds: liveAdders(v.adderIds), hasPermit: v.hasPermit })),
      lines: lines.map((item) => ({
        key: String(item.id),
        entryId: String(item.entryId),
        quantity: effectiveQuantity(item) as number,
        adderIds: liveAdders(item.adderIds),
        visitKey: item.visitKey,
      })),
    },
    lines,
    unpricedItemIds,
  };
}

/** A line's own money from the breakdown: its labour share, materials with markup and flat price. */
export function lineCents(line: { labourCents: number; materialsCents: number; flatCents: number }): number {
  return line.labourCents + line.materialsCents + line.flatCents;
}
