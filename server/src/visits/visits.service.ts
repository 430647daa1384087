import { addDays, mayAct, todayIn, wallClock, type CurrentUser, type Electrician, type FlowActor, type RequestStatus, type SiteVisit, BookSiteVisitSchema, CancelSiteVisitSchema } from '@cc/shared';
import type { z } from 'zod';
import type { Db } from '../db/knex';
import { inTransaction } from '../db/transaction';
import type { FlowService } from '../flow/flow.service';
import { ConflictError, NotFoundError, ValidationError } from '../errors';
import type { RequestsService } from '../requests/requests.service';
import type { ProofMessages } from '../work/proof-messages';
import { assertMayAct, requestWithActors } from '../work/request-actors';
import { moveRequest } from '../work/request-moves';
import type { WorkItemRecord, WorkItemRepository } from '../work/work-item.repository';
import type { SiteVisitRecord, SiteVisitRepository } from './site-visit.repository';

const MAX_DAYS_AHEAD = 366;

/** Booking site visits for approved items, marking them started and finished, and calling them off. */
export class VisitsService {
  constructor(
    private readonly db: Db,
    private readonly access: RequestsService,
    private readonly flow: FlowService,
    private readonly visits: SiteVisitRepository,
    private readonly items: WorkItemRepository,
    private readonly messages: ProofMessages,
    /** The time zone an organisation books in (its day-plan settings). */
    private readonly timeZoneOf: (organisationId: number) => Promise<string>,
  ) {}

  /** The electricians of the assigned contractor (who can be sent on a visit). */
  async electricians(user: CurrentUser, requestId: number): Promise<Electrician[]> {
    const { request, actors } = await requestWithActors(this.access, user, requestId);
    assertMayAct(actors, 'book-visit', request.status, 'Booking a visit');
    return this.visits.electricians(request.contractor!.id);
  }

  async book(user: CurrentUser, requestId: number, input: z.output<typeof BookSiteVisitSchema>): Promise<SiteVisit> {
    const { request, actors } = await requestWithActors(this.access, user, requestId);
    assertMayAct(actors, 'book-visit', request.status, 'Booking a visit');
    assertBookable(input, await this.timeZoneOf(request.contractor!.id));
    const electricians = await this.visits.electricians(request.contractor!.id);
    if (!electricians.some((e) => e.id === input.electricianId)) {
      throw new ValidationError('Choose one of your electricians', [{ path: 'electricianId', message: 'Choose a person of your organisation' }]);
    }
    const visitId = await this.db.transaction(async (trx) => {
      const locked = await this.items.lockRequest(requestId, trx);
      const status = locked?.status as RequestStatus;
      if (!locked || status !== request.status) throw new ConflictError('The request changed meanwhile. Reload and try again.');
      const items = await this.items.listForRequest(requestId, trx, true);
      const planned = itemsToPlan(items, input.quotedVisitKey);
      const visitId = await this.visits.insert(
        { requestId, date: input.date, arrivalFrom: input.arrivalFrom, arrivalTo: input.arrivalTo, electricianId: input.electricianId, accessNotes: input.accessNotes || null, quotedVisitKey: input.quotedVisitKey, bookedBy: user.id },
        trx,
      );
      await this.items.planOnVisit(planned.map((i) => i.id), visitId, trx);
      const visit = await this.visits.find(requestId, visitId, trx);
      if (status === 'approved') {
        await moveRequest(this.flow, { requestId, event: 'schedule', actors, by: user.id, note: `Site visit ${visit!.number} booked for ${input.date}` }, trx);
      }
      await this.messages.visitScheduled(trx, { requestId, visitNumber: visit!.number, date: input.date, arrivalFrom: input.arrivalFrom, arrivalTo: input.arrivalTo, by: user.id });
      await this.messages.visitAssigned(trx, { requestId, visitId, visitNumber: visit!.number, before: null, after: { electricianId: input.electricianId, date: input.date, arrivalFrom: input.arrivalFrom, arrivalTo: input.arrivalTo }, by: user.id });
      return visitId;
    });
    return this.get(user, requestId, visitId);
  }

  /** The electrician arrives: the visit is on site, and a request whose visit was booked is under way. */
  async start(user: CurrentUser, requestId: number, visitId: number): Promise<SiteVisit> {
    return this.mark(user, requestId, visitId, 'booked', 'started');
  }

  /**
   * The electrician leaves. Once the request moved past the work (every outcome recorded), a visit that
   * was never marked started can be finished too: it can no longer be started.
   */
  async finish(user: CurrentUser, requestId: number, visitId: number): Promise<SiteVisit> {
    return this.mark(user, requestId, visitId, 'started', 'finished');
  }

  private async mark(user: CurrentUser, requestId: number, visitId: number, onlyFrom: 'booked' | 'started', to: 'started' | 'finished'): Promise<SiteVisit> {
    const { request, actors } = await requestWithActors(this.access, user, requestId);
    const from: ('booked' | 'started')[] = to === 'finished' && !mayAct(actors, 'record-correction', request.status) ? ['booked', 'started'] : [onlyFrom];
    const visit = await this.visits.find(requestId, visitId);
    if (!visit) throw new NotFoundError('No such site visit');
    assertMayAct(actors, to === 'started' ? 'record-correction' : 'finish-visit', request.status, to === 'started' ? 'Starting a visit' : 'Finishing a visit');
    // A visit started before its day ("Start it today anyway") takes place today: it moves to today,
    // and the seller's side hears the new day as when a visit is moved on the day plan.
    const today = to === 'started' ? todayIn(await this.timeZoneOf(request.contractor!.id)) : null;
    await this.db.transaction(async (trx) => {
      const locked = await this.items.lockRequest(requestId, trx);
      if (!locked || locked.status !== request.status) throw new ConflictError('The request changed meanwhile. Reload and try again.');
      if (!(await this.visits.setStatus(visitId, from, to, trx))) {
        throw new ConflictError(to === 'started' ? 'This visit was started already' : 'Only a visit that was started can be finished');
      }
      if (today !== null && visit.date > today) {
        const window = { arrivalFrom: visit.arrivalFrom, arrivalTo: visit.arrivalTo };
        await this.visits.reschedule(visitId, { date: today, electricianId: visit.electricianId, ...window }, trx);
        await this.messages.visitScheduled(trx, { requestId, visitNumber: visit.number, date: today, ...window, by: user.id, previous: { date: visit.date, ...window } });
        const slot = { electricianId: visit.electricianId, ...window };
        await this.messages.visitAssigned(trx, { requestId, visitId, visitNumber: visit.number, before: { ...slot, date: visit.date }, after: { ...slot, date: today }, by: user.id });
      }
      if (to === 'started' && request.status === 'scheduled') {
        await moveRequest(this.flow, { requestId, event: 'start-work', actors, by: user.id }, trx);
      }
    });
    return this.get(user, requestId, visitId);
  }

  /**
   * Calls off a booked visit (the flow table's `cancel-visit` right, the booking right): it is kept as
   * cancelled with who, when and why, its items wait for another visit, and the request goes back from
   * scheduled to approved when it was the last visit booked (no work started). The seller's side and
   * the electrician are told in the same transaction. A visit started, moved or cancelled since the
   * version the person saw answers 409.
   */
  async cancel(user: CurrentUser, requestId: number, visitId: number, input: z.output<typeof CancelSiteVisitSchema>): Promise<SiteVisit> {
    const { request, actors } = await requestWithActors(this.access, user, requestId);
    const visit = await this.visits.find(requestId, visitId);
    if (!visit) throw new NotFoundError('No such site visit');
    assertMayAct(actors, 'cancel-visit', request.status, 'Cancelling a visit');
    await inTransaction(this.db, async (trx) => {
      const locked = await this.items.lockRequest(requestId, trx);
      const status = locked?.status as RequestStatus;
      if (!locked || status !== request.status) throw new ConflictError('The request changed meanwhile. Reload and try again.');
      const now = await this.visits.find(requestId, visitId, trx);
      if (!now || now.status !== 'booked') throw new ConflictError(now?.status === 'cancelled' ? 'This visit was cancelled already' : 'Only a visit not yet started can be cancelled: this one was started meanwhile');
      if (await this.visits.hasOutcomes(visitId, trx)) throw new ConflictError('Outcomes were recorded on this visit: finish it instead of cancelling it');
      if (!(await this.visits.cancel(visitId, input.version, { by: user.id, reason: input.reason, at: new Date() }, trx))) {
        throw new ConflictError('The visit was changed meanwhile (moved or started). Reload and try again.');
      }
      const items = await this.items.listForRequest(requestId, trx, true);
      await this.items.planOnVisit(items.filter((i) => i.siteVisitId === visitId && i.status === 'approved').map((i) => i.id), null, trx);
      if (status === 'scheduled' && (await this.visits.countOpen(requestId, trx)) === 0) {
        await moveRequest(this.flow, { requestId, event: 'unschedule', actors, by: user.id, note: `Site visit ${now.number} on ${now.date} cancelled: ${input.reason}` }, trx);
      }
      const slot = { electricianId: now.electricianId, date: now.date, arrivalFrom: now.arrivalFrom, arrivalTo: now.arrivalTo };
      await this.messages.visitCancelled(trx, { requestId, visitId, visitNumber: now.number, slot, reason: input.reason, by: user.id });
    });
    return this.get(user, requestId, visitId);
  }

  async get(user: CurrentUser, requestId: number, visitId: number): Promise<SiteVisit> {
    const { request, actors } = await requestWithActors(this.access, user, requestId);
    const visit = await this.visits.find(requestId, visitId);
    if (!visit) throw new NotFoundError('No such site visit');
    const items = await this.items.listForRequest(requestId);
    return toSiteVisitDto(visit, items, actors, request.status);
  }
}

/** Approved items not yet on a visit; those of one quoted visit when a key is given. */
function itemsToPlan(items: readonly WorkItemRecord[], quotedVisitKey: string | null): WorkItemRecord[] {
  const open = items.filter((i) => i.status === 'approved' && i.siteVisitId === null);
  if (quotedVisitKey === null) return open;
  if (!items.some((i) => i.quotedVisitKey === quotedVisitKey)) {
    throw new ValidationError('No such visit in the quote', [{ path: 'quotedVisitKey', message: 'Choose one of the quote’s visits' }]);
  }
  return open.filter((i) => i.quotedVisitKey === quotedVisitKey);
}

/** Today's date (YYYY-MM-DD) on the wall clock of `zone`. */

/**
 * The one booking rule for a visit (booking form, day-plan suggestions, moves), in the organisation's
 * time zone: from today to a year ahead, and today only from a time still to come.
 */
export function assertBookable(visit: { date: string; arrivalFrom?: string | null }, zone: string, now = Date.now()): void {
  const here = wallClock(zone, now);
  if (visit.date < here.date) throw new ValidationError('Choose today or a later day', [{ path: 'date', message: `Past: today is ${here.date} in ${zone}` }]);
  if (visit.date > addDays(here.date, MAX_DAYS_AHEAD)) throw new ValidationError('Choose a date at most a year ahead', [{ path: 'date', message: 'Choose a date at most a year ahead' }]);
  if (visit.date === here.date && visit.arrivalFrom && visit.arrivalFrom <= here.clock) {
    // Short field messages: they show under the field on a phone; the summary says what to do.
    throw new ValidationError('Choose an arrival time still to come today, or another day', [{ path: 'arrivalFrom', message: `Past: it is ${here.clock} in ${zone}` }]);
  }
}

export function toSiteVisitDto(visit: SiteVisitRecord, items: readonly WorkItemRecord[], actors: readonly FlowActor[], status: RequestStatus): SiteVisit {
  return {
    id: visit.id,
    number: visit.number,
    date: visit.date,
    arrivalFrom: visit.arrivalFrom,
    arrivalTo: visit.arrivalTo,
    electrician: { id: visit.electricianId, name: visit.electricianName },
    status: visit.status,
    startedAt: visit.startedAt?.toISOString() ?? null,
    finishedAt: visit.finishedAt?.toISOString() ?? null,
    version: visit.version,
    cancellation: visit.cancellation ? { at: visit.cancellation.at.toISOString(), byName: visit.cancellation.byName, reason: visit.cancellation.reason } : null,
    quotedVisitKey: visit.quotedVisitKey,
    itemIds: items.filter((i) => i.siteVisitId === visit.id).map((i) => i.id),
    accessNotes: mayAct(actors, 'see-access-notes', status) ? visit.accessNotes : null,
  };
}
