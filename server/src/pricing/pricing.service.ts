import {
  verifyTotals,
  type ApiErrorDetail,
  type AutoPriceItems,
  type AutoPriceResult,
  type BulkPriceItems,
  type ClaimedTotals,
  type CurrentUser,
  type ItemRef,
  type MarkOutOfScope,
  type PricingVisit,
  type RepairRequestDetail,
  type RequestPricing,
  type RequestStatus,
} from '@cc/shared';
import type { Db, Trx } from '../db/knex';
import type { ItemPricingChanges, ItemPricingRepository, StoredPricingItem } from './item-pricing.repository';
import type { QuoteRepository } from '../quotes/quote.repository';
import { ConflictError, ForbiddenError, NotFoundError, ValidationError } from '../errors';
import type { LoadedRateBook, RateBookService } from '../rate-book/rate-book.service';
import { effectiveQuantity, lineCents, priceRequest, visitsOrDefault, type PricedRequest } from './request-pricing';
import type { RequestsService } from '../requests/requests.service';

/** States in which the assigned contractor prices (and re-prices after sending). */
export const PRICING_STATES: readonly RequestStatus[] = ['pricing', 'quoted'];

/** How an item is named in a message: its number, code and place. */
export function describeItem(item: Pick<StoredPricingItem, 'id' | 'code' | 'location'>): string {
  return `#${item.id} (${item.code}${item.location ? `, ${item.location}` : ''})`;
}

/** Whether `user` is a user of the contractor organisation assigned to the request. */
export function isAssignedContractor(user: CurrentUser, request: RepairRequestDetail): boolean {
  return user.role === 'contractor' && request.contractor !== null && request.contractor.id === user.organisationId;
}

/** 409 with every claimed figure that differs from the server's own, or nothing when they match. */
export function assertClaimedTotals(loaded: LoadedRateBook, priced: PricedRequest, claimed: ClaimedTotals | undefined): void {
  if (!claimed) return;
  const details: ApiErrorDetail[] = [];
  if (priced.input) {
    for (const m of verifyTotals({ rateBook: loaded.book, quote: priced.input }, claimed).mismatches) {
      details.push({ path: `claimedTotals.${m.path}`, message: `You see ${m.claimedCents} cents; the price is ${m.computedCents ?? 'not there'}` });
    }
  } else if (claimed.totalCents !== 0) {
    details.push({ path: 'claimedTotals.totalCents', message: `You see ${claimed.totalCents} cents; nothing is priced` });
  }
  if (details.length) throw new ConflictError('The totals you see are not the current price. Reload to see it.', details);
}

/** Bulk pricing of a request's line items by the assigned contractor. */
export class PricingService {
  constructor(
    private readonly db: Db,
    private readonly access: RequestsService,
    private readonly rateBooks: RateBookService,
    private readonly items: ItemPricingRepository,
    private readonly quotes: QuoteRepository,
  ) {}

  /** The request as `user` sees it (404 otherwise), if they may read its pricing (403 otherwise). */
  private async readable(user: CurrentUser, requestId: number): Promise<RepairRequestDetail> {
    const request = await this.access.get(user, requestId);
    if (!isAssignedContractor(user, request) && user.role !== 'admin') throw new ForbiddenError('Only the assigned contractor prices this request');
    return request;
  }

  /** 403 unless the assigned contractor, 409 unless the request awaits prices; then its rate book. */
  async assertPricer(user: CurrentUser, requestId: number): Promise<{ request: RepairRequestDetail; loaded: LoadedRateBook }> {
    const request = await this.access.get(user, requestId);
    if (!isAssignedContractor(user, request)) throw new ForbiddenError('Only the assigned contractor prices this request');
    if (!PRICING_STATES.includes(request.status)) throw new ConflictError(`This request is not awaiting prices (it is ${request.status})`);
    const loaded = await this.rateBooks.load(request.contractor!.id);
    if (!loaded) throw new ConflictError('Your organisation has no rate book yet: save its terms first');
    return { request, loaded };
  }

  async view(user: CurrentUser, requestId: number): Promise<RequestPricing> {
    const request = await this.readable(user, requestId);
    const loaded = request.contractor ? await this.rateBooks.load(request.contractor.id) : null;
    const [items, visits, latest] = await Promise.all([this.items.listForRequest(requestId), this.items.listVisits(requestId), this.quotes.latestVersion(requestId)]);
    const priced = loaded ? priceRequest(loaded, items, visits) : null;
    const firstEntryOfCode = new Map<string, number>();
    for (const entry of loaded?.entries ?? []) if (entry.code !== null && !firstEntryOfCode.has(entry.code)) firstEntryOfCode.set(entry.code, entry.id);
    return {
      requestId,
      status: request.status,
      canEdit: isAssignedContractor(user, request) && PRICING_STATES.includes(request.status) && loaded !== null,
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
          pricingQuantity: effectiveQuantity(item),
          isQuantityAssumed: item.isQuantityAssumed,
          visitKey: item.visitKey,
          outOfScopeReason: item.outOfScopeReason,
          suggestedEntryId: firstEntryOfCode.get(item.code) ?? null,
          isPriced: line !== undefined,
          lineCents: line ? lineCents(line) : null,
        };
      }),
      visits: visitsOrDefault(visits),
      rateBook: loaded?.book ?? null,
      pricingInput: priced?.input ?? null,
      breakdown: priced?.breakdown ?? null,
      problem: priced?.problem ?? null,
      unpricedItemIds: priced?.unpricedItemIds ?? items.filter((i) => i.status !== 'out-of-scope').map((i) => i.id),
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

  /** Applies changes and re-prices in the same transaction; a refusal of the engine undoes them. */
  private async applyAndReprice(requestId: number, loaded: LoadedRateBook, changes: { item: StoredPricingItem; set: ItemPricingChanges }[], claimed: ClaimedTotals | undefined, trx: Trx): Promise<void> {
    for (const { item, set } of changes) {
      if (!(await this.items.update(item.id, item.version, set, trx))) throw new ConflictError(`Someone else changed item ${describeItem(item)} meanwhile. Reload to see the current prices.`);
    }
    const items = await this.items.listForRequest(requestId, trx);
    const priced = priceRequest(loaded, items, await this.items.listVisits(requestId, trx));
    if (priced.problem) {
      const item = items.find((i) => i.id === priced.problem!.itemId);
      throw new ValidationError(item ? `Item ${describeItem(item)}: ${priced.problem.message}` : priced.problem.message, [{ path: 'set', message: priced.problem.message }]);
    }
    assertClaimedTotals(loaded, priced, claimed);
  }

  /** One change (entry, site conditions, quantity, visit) applied to many items at once. */
  async bulkUpdate(user: CurrentUser, requestId: number, input: BulkPriceItems): Promise<RequestPricing> {
    const { loaded } = await this.assertPricer(user, requestId);
    const { set } = input;
    if (set.entryId != null && !loaded.entries.some((e) => e.id === set.entryId)) {
      throw new ValidationError('No such entry in your rate book', [{ path: 'set.entryId', message: 'Choose an entry of your rate book' }]);
    }
    const adderProblems = (set.adderIds ?? []).map((id, i) => ({ id, i })).filter(({ id }) => !loaded.adders.some((a) => a.id === id));
    if (adderProblems.length) {
      throw new ValidationError('No such site condition in your rate book', adderProblems.map(({ i }) => ({ path: `set.adderIds.${i}`, message: 'Choose a site condition of your rate book' })));
    }
    await this.db.transaction(async (trx) => {
      if (set.visitKey !== undefined && !visitsOrDefault(await this.items.listVisits(requestId, trx)).some((v) => v.key === set.visitKey)) {
        throw new ValidationError('No such visit', [{ path: 'set.visitKey', message: `Plan the visit "${set.visitKey}" first` }]);
      }
      const items = await this.lockedItems(requestId, input.items, trx);
      const changes = items.map((item) => {
        const change: ItemPricingChanges = {};
        if (set.entryId !== undefined) {
          change.entryId = set.entryId;
          if (set.entryId !== null && item.status === 'out-of-scope') Object.assign(change, { status: 'open', outOfScopeReason: null });
          if (set.entryId !== null && set.quantity === undefined && effectiveQuantity(item) === null) Object.assign(change, { pricingQuantity: 1, isQuantityAssumed: true });
        }
        if (set.quantity !== undefined) Object.assign(change, { pricingQuantity: set.quantity, isQuantityAssumed: false });
        if (set.adderIds !== undefined) change.adderIds = [...new Set(set.adderIds)];
        if (set.visitKey !== undefined) change.visitKey = set.visitKey;
        return { item, set: change };
      });
      await this.applyAndReprice(requestId, loaded, changes, input.claimedTotals, trx);
    });
    return this.view(user, requestId);
  }

  /**
   * Gives every open item without an entry the first entry of the rate book for its code. An item
   * whose report gave no quantity is priced at 1 and flagged; an item whose code has no entry stays.
   */
  async autoPrice(user: CurrentUser, requestId: number, input: AutoPriceItems): Promise<AutoPriceResult> {
    const { loaded } = await this.assertPricer(user, requestId);
    const liveEntryIds = new Set(loaded.entries.map((e) => e.id));
    const result = { pricedItemIds: [] as number[], assumedQuantityItemIds: [] as number[], noEntryItemIds: [] as number[] };
    await this.db.transaction(async (trx) => {
      const items = input.items ? await this.lockedItems(requestId, input.items, trx) : await this.items.listForRequest(requestId, trx, true);
      const changes: { item: StoredPricingItem; set: ItemPricingChanges }[] = [];
      for (const item of items) {
        if (item.status !== 'open' || (item.entryId !== null && liveEntryIds.has(item.entryId))) continue;
        const entry = loaded.entries.find((e) => e.code === item.code);
        if (!entry) {
          result.noEntryItemIds.push(item.id);
          continue;
        }
        const set: ItemPricingChanges = { entryId: entry.id };
        if (effectiveQuantity(item) === null) {
          Object.assign(set, { pricingQuantity: 1, isQuantityAssumed: true });
          result.assumedQuantityItemIds.push(item.id);
        }
        result.pricedItemIds.push(item.id);
        changes.push({ item, set });
      }
      await this.applyAndReprice(requestId, loaded, changes, undefined, trx);
    });
    return { pricing: await this.view(user, requestId), ...result };
  }

  /** The contractor declines items as not in their scope, with the reason the seller will read. */
  async markOutOfScope(user: CurrentUser, requestId: number, input: MarkOutOfScope): Promise<RequestPricing> {
    const { loaded } = await this.assertPricer(user, requestId);
    await this.db.transaction(async (trx) => {
      const items = await this.lockedItems(requestId, input.items, trx);
      const changes = items.map((item) => ({ item, set: { status: 'out-of-scope', outOfScopeReason: input.reason } satisfies ItemPricingChanges }));
      await this.applyAndReprice(requestId, loaded, changes, undefined, trx);
    });
    return this.view(user, requestId);
  }

  /** Plans the visits (their site conditions and permit); every item's visit must stay planned. */
  async updateVisits(user: CurrentUser, requestId: number, visits: PricingVisit[]): Promise<RequestPricing> {
    const { loaded } = await this.assertPricer(user, requestId);
    const details: ApiErrorDetail[] = [];
    visits.forEach((v, i) =>
      v.adderIds.forEach((id, j) => {
        if (!loaded.adders.some((a) => a.id === id)) details.push({ path: `visits.${i}.adderIds.${j}`, message: 'Choose a site condition of your rate book' });
      }),
    );
    if (details.length) throw new ValidationError('No such site condition in your rate book', details);
    await this.db.transaction(async (trx) => {
      const items = await this.items.listForRequest(requestId, trx, true);
      const orphans = items.filter((item) => !visits.some((v) => v.key === item.visitKey));
      if (orphans.length) {
        throw new ValidationError('Move the items off a visit before dropping it', [
          { path: 'visits', message: `Still on a visit left out: ${orphans.map(describeItem).join(', ')}` },
        ]);
      }
      await this.items.replaceVisits(requestId, visits, trx);
      const priced = priceRequest(loaded, await this.items.listForRequest(requestId, trx), visits);
      if (priced.problem) throw new ValidationError(priced.problem.message, [{ path: 'visits', message: priced.problem.message }]);
    });
    return this.view(user, requestId);
  }
}
