import type { SiteVisitStatus } from '@cc/shared';
import type { Db, Trx } from '../db/knex';

/** A site visit as stored (access notes included: the service decides who sees them). */
export interface SiteVisitRecord {
  id: number;
  requestId: number;
  number: number;
  date: string;
  arrivalFrom: string;
  arrivalTo: string;
  electricianId: number;
  electricianName: string;
  accessNotes: string | null;
  quotedVisitKey: string | null;
  status: SiteVisitStatus;
  startedAt: Date | null;
  finishedAt: Date | null;
  /** Counts the visit's changes (moved, started, finished, cancelled). */
  version: number;
  /** Set on a cancelled visit only. */
  cancellation: { at: Date; byName: string | null; reason: string } | null;
}

interface Row {
  id: number;
  request_id: number;
  number: number;
  visit_date: string;
  arrival_from: string;
  arrival_to: string;
  electrician_id: number;
  electrician_name: string;
  access_notes: string | null;
  quoted_visit_key: string | null;
  status: SiteVisitStatus;
  started_at: Date | null;
  finished_at: Date | null;
  version: number;
  cancelled_at: Date | null;
  cancelled_by_name: string | null;
  cancel_reason: string | null;
}

function toSiteVisit(row: Row): SiteVisitRecord {
  return {
    id: row.id,
    requestId: row.request_id,
    number: row.number,
    date: row.visit_date,
    arrivalFrom: row.arrival_from,
    arrivalTo: row.arrival_to,
    electricianId: row.electrician_id,
    electricianName: row.electrician_name,
    accessNotes: row.access_notes,
    quotedVisitKey: row.quoted_visit_key,
    status: row.status,
    startedAt: row.started_at,
    finishedAt: row.finished_at,
    version: row.version,
    cancellation: row.cancelled_at ? { at: row.cancelled_at, byName: row.cancelled_by_name, reason: row.cancel_reason ?? '' } : null,
  };
}

export interface NewSiteVisit {
  requestId: number;
  date: string;
  arrivalFrom: string;
  arrivalTo: string;
  electricianId: number;
  accessNotes: string | null;
  quotedVisitKey: string | null;
  bookedBy: number;
}

export class SiteVisitRepository {
  constructor(private readonly db: Db) {}

  private select(trx?: Trx) {
    return (trx ?? this.db)('site_visits as v')
      .join('users as u', 'u.id', 'v.electrician_id')
      .leftJoin('users as c', 'c.id', 'v.cancelled_by')
      .select('v.*', 'u.name as electrician_name', 'c.name as cancelled_by_name');
  }

  /** The people of a contractor organisation who can be sent on a visit. */
  async electricians(organisationId: number): Promise<{ id: number; name: string }[]> {
    return this.db('users').where({ organisation_id: organisationId, role: 'contractor' }).orderBy('name').select('id', 'name');
  }

  async listForRequest(requestId: number, trx?: Trx): Promise<SiteVisitRecord[]> {
    const rows: Row[] = await this.select(trx).where('v.request_id', requestId).orderBy('v.number');
    return rows.map(toSiteVisit);
  }

  async find(requestId: number, id: number, trx?: Trx): Promise<SiteVisitRecord | null> {
    const row: Row | undefined = await this.select(trx).where({ 'v.request_id': requestId, 'v.id': id }).first();
    return row ? toSiteVisit(row) : null;
  }

  async insert(visit: NewSiteVisit, trx: Trx): Promise<number> {
    const { next } = await trx('site_visits').where({ request_id: visit.requestId }).first(trx.raw('coalesce(max(number), 0) + 1 AS next'));
    const [row] = await trx('site_visits')
      .insert({
        request_id: visit.requestId,
        number: next,
        visit_date: visit.date,
        arrival_from: visit.arrivalFrom,
        arrival_to: visit.arrivalTo,
        electrician_id: visit.electricianId,
        access_notes: visit.accessNotes,
        quoted_visit_key: visit.quotedVisitKey,
        booked_by: visit.bookedBy,
      })
      .returning('id');
    return row.id;
  }

  /** Gives a visit another date, electrician and arrival window (the day plan moves booked visits). */
  async reschedule(id: number, to: { date: string; electricianId: number; arrivalFrom: string; arrivalTo: string }, trx: Trx): Promise<void> {
    await trx('site_visits').where({ id }).update({ visit_date: to.date, electrician_id: to.electricianId, arrival_from: to.arrivalFrom, arrival_to: to.arrivalTo, version: trx.raw('version + 1'), updated_at: new Date() });
  }

  /** Finishes at `at` every visit of the request still on site (the letter ends the work); their numbers. */
  async finishStarted(requestId: number, at: Date, trx: Trx): Promise<number[]> {
    const rows: { number: number }[] = await trx('site_visits')
      .where({ request_id: requestId, status: 'started' })
      .update({ status: 'finished', finished_at: at, version: trx.raw('version + 1'), updated_at: at })
      .returning('number');
    return rows.map((r) => r.number).sort((a, b) => a - b);
  }

  /** Moves a visit from one of `from` to `to`; false when it was not in one of those states. */
  async setStatus(id: number, from: readonly SiteVisitStatus[], to: SiteVisitStatus, trx: Trx): Promise<boolean> {
    const now = new Date();
    const updated = await trx('site_visits')
      .where({ id })
      .whereIn('status', from)
      .update({ status: to, version: trx.raw('version + 1'), updated_at: now, ...(to === 'started' ? { started_at: now } : {}), ...(to === 'finished' ? { finished_at: now } : {}) });
    return updated === 1;
  }

  /**
   * Calls off a booked visit at `version` (kept, with who, when and why); false when it was started,
   * finished, cancelled or changed meanwhile.
   */
  async cancel(id: number, version: number, cancellation: { by: number; reason: string; at: Date }, trx: Trx): Promise<boolean> {
    const updated = await trx('site_visits')
      .where({ id, version, status: 'booked' })
      .update({ status: 'cancelled', cancelled_at: cancellation.at, cancelled_by: cancellation.by, cancel_reason: cancellation.reason, version: trx.raw('version + 1'), updated_at: cancellation.at });
    return updated === 1;
  }

  /** How many visits of the request are still booked or on site. */
  async countOpen(requestId: number, trx: Trx): Promise<number> {
    const row = await trx('site_visits').where({ request_id: requestId }).whereIn('status', ['booked', 'started']).count<{ n: string }[]>({ n: '*' }).first();
    return Number(row?.n ?? 0);
  }

  /** Whether an outcome was recorded on the visit (work was done on it: it is finished, not cancelled). */
  async hasOutcomes(id: number, trx: Trx): Promise<boolean> {
    return Boolean(await trx('item_corrections').where({ site_visit_id: id }).first('id'));
  }
}
