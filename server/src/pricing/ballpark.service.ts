import { ballpark, type CurrentUser, type RepairRequestDetail, type RequestBallpark, type SiteConditions } from '@cc/shared';
import type { ItemPricingRepository } from './item-pricing.repository';
import { engineId } from '../rate-book/engine-rate-book';
import { ConflictError, ValidationError } from '../errors';
import { assertMayAct, moverOn } from '../flow/flow.service';
import type { LoadedRateBook, RateBookService } from '../rate-book/rate-book.service';
import type { RequestsService } from '../requests/requests.service';

/** The site conditions flagged on a request and its ballpark range from the assigned contractor's rate book. */
export class BallparkService {
  constructor(
    private readonly access: RequestsService,
    private readonly rateBooks: RateBookService,
    private readonly items: ItemPricingRepository,
  ) {}

  /** The request (404 unless visible) if `user` may see its range: its agents, seller, assigned contractor, admin. */
  private async viewer(user: CurrentUser, requestId: number, canEdit = false): Promise<{ request: RepairRequestDetail; loaded: LoadedRateBook }> {
    const request = await this.access.get(user, requestId);
    const refused = canEdit ? 'Only the agents and the assigned contractor flag site conditions' : 'Only the agents, the seller and the contractor see the ballpark range';
    assertMayAct(moverOn(user, request).actors, canEdit ? 'flag-site-conditions' : 'read-ballpark', request.status, { notYours: refused, notNow: refused });
    if (!request.contractor) throw new ConflictError('No contractor is assigned to this request yet');
    const loaded = await this.rateBooks.load(request.contractor.id);
    if (!loaded) throw new ConflictError(`${request.contractor.name} has no rate book yet`);
    return { request, loaded };
  }

  private async flagged(requestId: number, loaded: LoadedRateBook): Promise<number[]> {
    const live = new Set(loaded.adders.map((a) => a.id));
    return (await this.items.siteAdderIds(requestId)).filter((id) => live.has(id));
  }

  async siteConditions(user: CurrentUser, requestId: number): Promise<SiteConditions> {
    const { loaded } = await this.viewer(user, requestId);
    return {
      adderIds: await this.flagged(requestId, loaded),
      available: loaded.adders.map((a) => ({ id: a.id, name: a.name, effect: a.effect, appliesWhenBuiltBefore: a.appliesWhenBuiltBefore })),
    };
  }

  async setSiteConditions(user: CurrentUser, requestId: number, adderIds: number[]): Promise<SiteConditions> {
    const { loaded } = await this.viewer(user, requestId, true);
    const unknown = adderIds.map((id, i) => ({ id, i })).filter(({ id }) => !loaded.adders.some((a) => a.id === id));
    if (unknown.length) {
      throw new ValidationError("No such site condition in the contractor's rate book", unknown.map(({ i }) => ({ path: `adderIds.${i}`, message: 'Choose one of the listed site conditions' })));
    }
    await this.items.setSiteAdderIds(requestId, adderIds);
    return this.siteConditions(user, requestId);
  }

  /** A low–high range for the whole request: an estimate, not a quote. */
  async ballpark(user: CurrentUser, requestId: number): Promise<RequestBallpark> {
    const { request, loaded } = await this.viewer(user, requestId);
    const items = await this.items.ballparkItems(requestId);
    if (items.length === 0) throw new ConflictError('This request has no items yet to estimate');
    const adderIds = await this.flagged(requestId, loaded);
    const range = ballpark(loaded.book, { items, yearBuilt: request.yearBuilt, siteAdderIds: adderIds.map(engineId) });
    return {
      ...range,
      requestId,
      contractorName: loaded.book.contractorName,
      yearBuilt: request.yearBuilt,
      itemCount: items.length,
      siteConditions: loaded.adders.filter((a) => adderIds.includes(a.id)).map((a) => ({ id: a.id, name: a.name })),
    };
  }
}
