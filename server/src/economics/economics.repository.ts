import { requestReference, type CorrectionOutcome, type ReturnCause, type SiteVisitStatus } from '@cc/shared';
import type { Db, Trx } from '../db/knex';
import { WORK_ITEM_STATUSES } from '../work/work-item.repository';

/** A site visit of the organisation's requests, with what the economics need of its request. */
export interface EconomicsVisit {
  id: number;
  requestId: number;
  reference: string;
  street: string;
  number: number;
  date: string;
  electricianId: number;
  electricianName: string;
  status: SiteVisitStatus;
  startedAt: Date | null;
  finishedAt: Date | null;
}

/** An item booked on one of those visits. */
export interface BookedItem {
  id: number;
  requestId: number;
  siteVisitId: number;
  code: string;
  room: string;
  quantity: number;
}

/** A correction recorded on one of those visits. */
export interface VisitCorrection {
  itemId: number;
  requestId: number;
  siteVisitId: number;
  code: string;
  outcome: CorrectionOutcome;
  isFirstVisit: boolean;
  returnCause: ReturnCause | null;
}

export interface PickTick {
  lineKey: string;
}

export class EconomicsRepository {
  constructor(private readonly db: Db) {}

  /** The organisation's contractors (who can be sent on a visit). */
  async electricians(organisationId: number): Promise<{ id: number; name: string }[]> {
    return this.db('users').where({ organisation_id: organisationId, role: 'contractor' }).orderBy('name').select('id', 'name');
  }

  /** Site visits on requests assigned to the organisation, from `from` to `to`, of one electrician or all. */
  async visits(organisationId: number, from: string, to: string, electricianId?: number): Promise<EconomicsVisit[]> {
    const query = this.db('site_visits as v')
      .join('repair_requests as r', 'r.id', 'v.request_id')
      .join('users as u', 'u.id', 'v.electrician_id')
      .where('r.contractor_organisation_id', organisationId)
      .whereBetween('v.visit_date', [from, to])
      // A cancelled visit neither needs parts nor earns: it is left out of the day's economics.
      .whereNot('v.status', 'cancelled')
      .select('v.id', 'v.request_id', 'v.number', 'v.status', 'v.started_at', 'v.finished_at', 'v.electrician_id', 'u.name as electrician_name', 'r.street', this.db.raw("to_char(v.visit_date, 'YYYY-MM-DD') as visit_date"))
      .orderBy([{ column: 'v.visit_date' }, { column: 'v.arrival_from' }, { column: 'v.id' }]);
    if (electricianId !== undefined) query.where('v.electrician_id', electricianId);
    const rows: {
      id: number;
      request_id: number;
      number: number;
      status: SiteVisitStatus;
      started_at: Date | null;
      finished_at: Date | null;
      electrician_id: number;
      electrician_name: string;
      street: string;
      visit_date: string;
    }[] = await query;
    return rows.map((r) => ({
      id: r.id,
      requestId: r.request_id,
      reference: requestReference(r.request_id),
      street: r.street,
      number: r.number,
      date: r.visit_date,
      electricianId: r.electrician_id,
      electricianName: r.electrician_name,
      status: r.status,
      startedAt: r.started_at,
      finishedAt: r.finished_at,
    }));
  }

  /** Items booked on the visits (their own quantity, the priced one first). */
  async bookedItems(visitIds: readonly number[]): Promise<BookedItem[]> {
    if (!visitIds.length) return [];
    const rows: { id: number; request_id: number; site_visit_id: number; code: string; room: string; quantity: number | null; pricing_quantity: number | null }[] = await this.db('line_items')
      .whereIn('site_visit_id', visitIds)
      .select('id', 'request_id', 'site_visit_id', 'code', 'room', 'quantity', 'pricing_quantity')
      .orderBy('id');
    return rows.map((r) => ({ id: r.id, requestId: r.request_id, siteVisitId: r.site_visit_id, code: r.code, room: r.room, quantity: r.pricing_quantity ?? r.quantity ?? 1 }));
  }

  /** Corrections recorded on the visits. */
  async corrections(visitIds: readonly number[]): Promise<VisitCorrection[]> {
    if (!visitIds.length) return [];
    const rows: { line_item_id: number; request_id: number; site_visit_id: number; code: string; outcome: CorrectionOutcome; first_visit: boolean; return_cause: ReturnCause | null }[] = await this.db('item_corrections as c')
      .join('line_items as i', 'i.id', 'c.line_item_id')
      .whereIn('c.site_visit_id', visitIds)
      .select('c.line_item_id', 'c.request_id', 'c.site_visit_id', 'i.code', 'c.outcome', 'c.first_visit', 'c.return_cause')
      .orderBy('c.line_item_id');
    return rows.map((r) => ({ itemId: r.line_item_id, requestId: r.request_id, siteVisitId: r.site_visit_id, code: r.code, outcome: r.outcome, isFirstVisit: r.first_visit, returnCause: r.return_cause }));
  }

  async latestQuoteVersion(requestId: number): Promise<number | null> {
    const row = (await this.db('quotes').where({ request_id: requestId }).max('version as version').first()) as { version: number | null } | undefined;
    return row?.version ?? null;
  }

  /** Items of the request that reached approved work (approved, or with an outcome since). */
  async approvedWorkItemIds(requestId: number): Promise<number[]> {
    const rows: { id: number }[] = await this.db('line_items').where({ request_id: requestId }).whereIn('status', WORK_ITEM_STATUSES).select('id').orderBy('id');
    return rows.map((r) => r.id);
  }

  async ticks(electricianId: number, date: string): Promise<Set<string>> {
    const rows: { line_key: string }[] = await this.db('pick_list_ticks').where({ electrician_id: electricianId, plan_date: date }).select('line_key');
    return new Set(rows.map((r) => r.line_key));
  }

  async setTick(organisationId: number, electricianId: number, date: string, lineKey: string, isTicked: boolean, by: number): Promise<void> {
    if (isTicked) {
      await this.db('pick_list_ticks')
        .insert({ organisation_id: organisationId, electrician_id: electricianId, plan_date: date, line_key: lineKey, ticked_by: by })
        .onConflict(['electrician_id', 'plan_date', 'line_key'])
        .ignore();
    } else {
      await this.db('pick_list_ticks').where({ electrician_id: electricianId, plan_date: date, line_key: lineKey }).delete();
    }
  }

  /** Spare units per entry key. */
  async spares(organisationId: number): Promise<Record<string, number>> {
    const rows: { entry_key: string; spare_units: number }[] = await this.db('pick_list_spares').where({ organisation_id: organisationId }).select('entry_key', 'spare_units');
    return Object.fromEntries(rows.map((r) => [r.entry_key, r.spare_units]));
  }

  async saveSpares(organisationId: number, spares: readonly { entryKey: string; spareUnits: number }[], trx: Trx): Promise<void> {
    await trx('pick_list_spares').where({ organisation_id: organisationId }).delete();
    const kept = spares.filter((s) => s.spareUnits > 0);
    if (kept.length) await trx('pick_list_spares').insert(kept.map((s) => ({ organisation_id: organisationId, entry_key: s.entryKey, spare_units: s.spareUnits })));
  }
}
