import {
  CONFIRMED_ITEM_STATE,
  compareTotals,
  editionNote,
  effectiveQuantity,
  itemMove,
  lineCents,
  mayAct,
  pricingFieldsFor,
  PRICEABLE_ITEM_STATES,
  visitsOrDefault,
  type ApiErrorDetail,
  type AutoPriceItems,
  type AutoPriceResult,
  type BulkPriceItems,
  type ClaimedTotals,
  type CurrentUser,
  type ItemRef,
  type MarkOutOfScope,
  type PricingFields,
  type PricingVisit,
  type RepairRequestDetail,
  type RequestPricing,
} from '@cc/shared';
import type { Db, Trx } from '../db/knex';
import type { ItemPricingRepository, StoredPricingItem } from './item-pricing.repository';
import type { LineItemRepository } from '../intake/line-item.repository';
import type { QuoteRepository } from '../quotes/quote.repository';
import { ConflictError, NotFoundError, ValidationError } from '../errors';
import { assertMayAct, moverOn, type FlowService, type Mover } from '../flow/flow.service';
import type { LoadedRateBook, RateBookService } from '../rate-book/rate-book.service';
import { priceRequest, type PricedRequest } from './request-pricing';
import type { RequestsService } from '../requests/requests.service';

const NOT_THE_PRICER = 'Only the assigned contractor prices this request';

/** How an item is named in a message: its number, code and place. */
export function describeItem(item: Pick<StoredPricingItem, 'id' | 'code' | 'location'>): string {
  return `#${item.id} (${item.code}${item.location ? `, ${item.location}` : ''})`;
}

/** 409 when an item changed since it was read (the message names it). */
export function staleItem(item: Pick<StoredPricingItem, 'id' | 'code' | 'location'>, then = 'Reload to see the current prices.'): string {
  return `Someone else changed item ${describeItem(item)} meanwhile. ${then}`;
}

/** 409 with every claimed figure that differs from the server's own result, or nothing when they match. */
export function assertClaimedTotals(priced: PricedRequest, claimed: ClaimedTotals | undefined): void {
  if (!claimed) return;
  const details: ApiErrorDetail[] = [];
  if (priced.breakdown) {
    for (const m of compareTotals(priced.breakdown, claimed)) {
      details.push({ path: `claimedTotals.${m.path}`, message: `You see ${m.claimedCents} cents; the price is ${m.computedCents ?? 'not there'}` });
    }
  } else if (claimed.totalCents !== 0) {
    details.push({ path: 'claimedTotals.totalCents', message: `You see ${claimed.totalCents} cents; nothing is priced` });
  }
  if (details.length) throw new ConflictError('The totals you see are not the current price. Reload to see it.', details);
}

/** The request's items, visits and their price as one change left them (priced once, then shown). */
interface PricedState {
  items: StoredPricingItem[];
  visits: PricingVisit[];
  priced: PricedRequest;
}

/** What one change does to one item. */
interface ItemChange {
  item: StoredPricingItem;
  set: PricingFields;
}

/** The contractor who may price the request now, with its rate book. */
interface Pricer {
  request: RepairRequestDetail;
  loaded: LoadedRateBook;
  mover: Mover;
}

/** Bulk pricing of a request's line items by the assigned contractor. */
export class PricingService {
  constructor(
    private readonly db: Db,
    private readonly access: RequestsService,
    private readonly rateBooks: RateBookService,
    private readonly items: ItemPricingRepository,
    private readonly lineItems: LineItemRepository,
    private readonly quotes: QuoteRepository,
    private readonly flow: FlowService,
  ) {}

  /** 403 unless the assigned contractor, 409 unless the request awaits prices; then its rate book. */
  async assertPricer(user: CurrentUser, requestId: number): Promise<Pricer> {
    const request = await this.access.get(user, requestId);
    const mover = moverOn(user, request);
    assertMayAct(mover.actors, 'price', request.status, { notYours: NOT_THE_PRICER, notNow: `This request is not awaiting prices (it is ${request.status})` });
    const loaded = await this.rateBooks.load(request.contractor!.id);
    if (!loaded) throw new ConflictError('Your organisation has no rate book yet: save its terms first');
    return { request, loaded, mover };
  }

  async view(user: CurrentUser, requestId: number): Promise<RequestPricing> {
    const request = await this.access.get(user, requestId);
    assertMayAct(moverOn(user, request).actors, 'read-pricing', request.status, { notYours: NOT_THE_PRICER, notNow: NOT_THE_PRICER });
    const loaded = request.contractor ? await this.rateBooks.load(request.contractor.id) : null;
    const [items, visits] = await Promise.all([this.items.listForRequest(requestId), this.items.listVisits(requestId)]);
    return this.present(user, request, loaded, { items, visits, priced: loaded ? priceRequest(loaded, items, visits) : null });
  }

  /** The pricing page from a state already priced (after a change it is the change's own result). */
  private async present(user: CurrentUser, request: RepairRequestDetail, loaded: LoadedRateBook | null, state: Omit<PricedState, 'priced'> & { priced: PricedRequest | null }): Promise<RequestPricing> {
    const { items, visits, priced } = state;
    const latest = await this.quotes.latestVersion(request.id);
    const firstEntryOfCode = new Map<string, number>();
    for (const entry of loaded?.entries ?? []) if (entry.code !== null && !firstEntryOfCode.has(entry.code)) firstEntryOfCode.set(entry.code, entry.id);
    return {
      requestId: request.id,
      status: request.status,
      canEdit: mayAct(moverOn(user, request).actors, 'price', request.status) && loaded !== null,
      items: items.map((item) => {
        const line = priced?.lineByItem.get(item.id);
        return {
          id: item.id,
          version: item.version,
          code: item.code,
          room: item.room,
          location: item.location,
          quantity: item.quantity,
          status: item.status,
          entryId: item.entryId,
          adderIds: item.adderIds,
          pricingQuantity: item.pricingQuantity,
          isQuantityAssumed: item.isQuantityAssumed,
          visitKey: item.visitKey,
          outOfScopeReason: item.outOfScopeReason,
          suggestedEntryId: firstEntryOfCode.get(item.code) ?? null,
          isPriced: line !== undefined,
          lineCents: line ? lineCents(line) : null,
          editionNote: editionNote(item.code, item.room, request),
        };
      }),
      visits: visitsOrDefault(visits),
      rateBook: loaded?.book ?? null,
      pricingInput: priced?.input ?? null,
      breakdown: priced?.breakdown ?? null,
      problem: priced?.problem ?? null,
      unpricedItemIds: priced?.unpricedItemIds ?? items.filter((i) => PRICEABLE_ITEM_STATES.includes(i.status)).map((i) => i.id),
      currentQuoteVersion: latest,
    };
  }

  /** The items named by `refs`, locked; 404 for one not among the request's items, 409 for a stale one. */
  private async lockedItems(requestId: number, refs: readonly ItemRef[], trx: Trx): Promise<StoredPricingItem[]> {
    const all = new Map((await this.items.listForRequest(requestId, trx, true)).map((i) => [i.id, i]));
    const missing = refs.map((r, i) => ({ r, i })).filter(({ r }) => !all.has(r.id));
    if (missing.length) {
      throw new NotFoundError(`No such item to price: ${missing.map(({ r }) => `#${r.id}`).join(', ')}`, missing.map(({ r, i }) => ({ path: `items.${i}.id`, message: `Item #${r.id} is not an item of this request awaiting prices` })));
    }
    const stale = refs.map((r, i) => ({ r, i, item: all.get(r.id)! })).filter(({ r, item }) => item.version !== r.version);
    if (stale.length) {
      throw new ConflictError(
        `Someone else changed ${stale.length === 1 ? 'item' : 'items'} ${stale.map(({ item }) => describeItem(item)).join(', ')} meanwhile. Reload to see the current prices.`,
        stale.map(({ r, i, item }) => ({ path: `items.${i}.version`, message: `Item #${r.id} is at version ${item.version}, not ${r.version}` })),
      );
    }
    return refs.map((r) => all.get(r.id)!);
  }

  /** Writes one item's change: a change of state goes through the flow (taking an item back in, leaving it out). */
  private async write(trx: Trx, requestId: number, mover: Mover, { item, set }: ItemChange): Promise<void> {
    const { status, ...fields } = set;
    const messages = { notYours: NOT_THE_PRICER, notNow: `Item ${describeItem(item)} cannot be changed now`, stale: staleItem(item) };
    if (status !== undefined && status !== item.status) {
      const event = itemMove('take-back-in', item.status)?.to === status ? 'take-back-in' : 'leave-out';
      await this.flow.moveItem(trx, { ...item, requestId }, event, mover, messages, fields);
    } else if (!(await this.lineItems.update(item.id, item.version, fields, trx))) {
      throw new ConflictError(messages.stale);
    }
  }

  /**
   * Applies changes and prices the request once, in the same transaction: a refusal of the engine
   * or claimed totals that differ from its result undo them. Returns what was priced.
   */
  private async applyAndReprice(requestId: number, pricer: Pricer, changes: readonly ItemChange[], claimed: ClaimedTotals | undefined, trx: Trx): Promise<PricedState> {
    for (const change of changes) await this.write(trx, requestId, pricer.mover, change);
    const [items, visits] = await Promise.all([this.items.listForRequest(requestId, trx), this.items.listVisits(requestId, trx)]);
    const priced = priceRequest(pricer.loaded, items, visits);
    if (priced.problem) {
      const item = items.find((i) => i.id === priced.problem!.itemId);
      throw new ValidationError(item ? `Item ${describeItem(item)}: ${priced.problem.message}` : priced.problem.message, [{ path: 'set', message: priced.problem.message }]);
    }
    assertClaimedTotals(priced, claimed);
    return { items, visits, priced };
  }


  /** One change (entry, site conditions, quantity, visit) applied to many items at once. */
  async bulkUpdate(user: CurrentUser, requestId: number, input: BulkPriceItems): Promise<RequestPricing> {
    const pricer = await this.assertPricer(user, requestId);
    const { loaded } = pricer;
    const { set } = input;
    if (set.entryId != null && !loaded.entries.some((e) => e.id === set.entryId)) {
      throw new ValidationError('No such entry in your rate book', [{ path: 'set.entryId', message: 'Choose an entry of your rate book' }]);
    }
    const adderProblems = (set.adderIds ?? []).map((id, i) => ({ id, i })).filter(({ id }) => !loaded.adders.some((a) => a.id === id));
    if (adderProblems.length) {
      throw new ValidationError('No such site condition in your rate book', adderProblems.map(({ i }) => ({ path: `set.adderIds.${i}`, message: 'Choose a site condition of your rate book' })));
    }
    const state = await this.db.transaction(async (trx) => {
      if (set.visitKey !== undefined && !visitsOrDefault(await this.items.listVisits(requestId, trx)).some((v) => v.key === set.visitKey)) {
        throw new ValidationError('No such visit', [{ path: 'set.visitKey', message: `Plan the visit "${set.visitKey}" first` }]);
      }
      const items = await this.lockedItems(requestId, input.items, trx);
      // What the change does to each item is the shared rule the portal previews it with.
      const changes = items.map((item) => ({ item, set: pricingFieldsFor(item, set) }));
      return this.applyAndReprice(requestId, pricer, changes, input.claimedTotals, trx);
    });
    return this.present(user, pricer.request, loaded, state);
  }

  /**
   * Gives every open item without an entry the first entry of the rate book for its code. An item
   * whose report gave no quantity is priced at 1 and flagged; an item whose code has no entry stays.
   */
  async autoPrice(user: CurrentUser, requestId: number, input: AutoPriceItems): Promise<AutoPriceResult> {
    const pricer = await this.assertPricer(user, requestId);
    const { loaded } = pricer;
    const liveEntryIds = new Set(loaded.entries.map((e) => e.id));
    const result = { pricedItemIds: [] as number[], assumedQuantityItemIds: [] as number[], noEntryItemIds: [] as number[] };
    const state = await this.db.transaction(async (trx) => {
      const items = input.items ? await this.lockedItems(requestId, input.items, trx) : await this.items.listForRequest(requestId, trx, true);
      const changes: ItemChange[] = [];
      for (const item of items) {
        if (item.status !== CONFIRMED_ITEM_STATE || (item.entryId !== null && liveEntryIds.has(item.entryId))) continue;
        const entry = loaded.entries.find((e) => e.code === item.code);
        if (!entry) {
          result.noEntryItemIds.push(item.id);
          continue;
        }
        const set: PricingFields = { entryId: entry.id };
        if (effectiveQuantity(item) === null) {
          Object.assign(set, { pricingQuantity: 1, isQuantityAssumed: true });
          result.assumedQuantityItemIds.push(item.id);
        }
        result.pricedItemIds.push(item.id);
        changes.push({ item, set });
      }
      return this.applyAndReprice(requestId, pricer, changes, undefined, trx);
    });
    return { pricing: await this.present(user, pricer.request, loaded, state), ...result };
  }

  /** The contractor declines items as not in their scope, with the reason the seller will read. */
  async markOutOfScope(user: CurrentUser, requestId: number, input: MarkOutOfScope): Promise<RequestPricing> {
    const pricer = await this.assertPricer(user, requestId);
    const state = await this.db.transaction(async (trx) => {
      const items = await this.lockedItems(requestId, input.items, trx);
      const changes = items.map((item) => ({ item, set: { status: itemMove('leave-out', item.status)?.to ?? item.status, outOfScopeReason: input.reason } }));
      return this.applyAndReprice(requestId, pricer, changes, undefined, trx);
    });
    return this.present(user, pricer.request, pricer.loaded, state);
  }

  /** Plans the visits (their site conditions and permit); every item's visit must stay planned. */
  async updateVisits(user: CurrentUser, requestId: number, visits: PricingVisit[]): Promise<RequestPricing> {
    const pricer = await this.assertPricer(user, requestId);
    const { loaded } = pricer;
    const details: ApiErrorDetail[] = [];
    visits.forEach((v, i) =>
      v.adderIds.forEach((id, j) => {
        if (!loaded.adders.some((a) => a.id === id)) details.push({ path: `visits.${i}.adderIds.${j}`, message: 'Choose a site condition of your rate book' });
      }),
    );
    if (details.length) throw new ValidationError('No such site condition in your rate book', details);
    const state = await this.db.transaction(async (trx) => {
      const items = await this.items.listForRequest(requestId, trx, true);
      const orphans = items.filter((item) => !visits.some((v) => v.key === item.visitKey));
      if (orphans.length) {
        throw new ValidationError('Move the items off a visit before dropping it', [
          { path: 'visits', message: `Still on a visit left out: ${orphans.map(describeItem).join(', ')}` },
        ]);
      }
      await this.items.replaceVisits(requestId, visits, trx);
      const priced = priceRequest(loaded, items, visits);
      if (priced.problem) throw new ValidationError(priced.problem.message, [{ path: 'visits', message: priced.problem.message }]);
      return { items, visits, priced };
    });
    return this.present(user, pricer.request, loaded, state);
  }
}
