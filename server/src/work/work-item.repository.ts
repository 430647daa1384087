import type { FindingCode, ItemStatus, Room } from '@cc/shared';
import type { Db, Trx } from '../db/knex';

/** A line item as the proof side sees it: what was reported, where, its state and its site visit. */
export interface WorkItemRecord {
  id: number;
  version: number;
  code: FindingCode;
  room: Room;
  location: string;
  quantity: number | null;
  necRefs: string[];
  status: ItemStatus;
  quotedVisitKey: string;
  siteVisitId: number | null;
}

/** Item states of the proof side: approved work and what became of it. */
export const WORK_ITEM_STATUSES: readonly ItemStatus[] = ['approved', 'done', 'not-done', 'accepted', 'not-accepted'];

interface Row {
  id: number;
  version: number;
  code: string;
  room: string;
  location: string | null;
  quantity: number | null;
  nec_refs: string[];
  status: string;
  visit_key: string;
  site_visit_id: number | null;
}

function toWorkItem(row: Row): WorkItemRecord {
  return {
    id: row.id,
    version: row.version,
    code: row.code as FindingCode,
    room: row.room as Room,
    location: row.location ?? '',
    quantity: row.quantity,
    necRefs: row.nec_refs,
    status: row.status as ItemStatus,
    quotedVisitKey: row.visit_key,
    siteVisitId: row.site_visit_id,
  };
}

const COLUMNS = ['id', 'version', 'code', 'room', 'location', 'quantity', 'nec_refs', 'status', 'visit_key', 'site_visit_id'];

export class WorkItemRepository {
  constructor(private readonly db: Db) {}

  async listForRequest(requestId: number, trx?: Trx, forUpdate = false): Promise<WorkItemRecord[]> {
    const query = (trx ?? this.db)('line_items').where({ request_id: requestId }).whereIn('status', WORK_ITEM_STATUSES).select(COLUMNS).orderBy('id');
    if (forUpdate) query.forUpdate();
    return ((await query) as Row[]).map(toWorkItem);
  }

  /** The items of the request the seller declined (the completion letter lists them as not done). */
  async listDeclined(requestId: number, trx?: Trx): Promise<WorkItemRecord[]> {
    const rows = (await (trx ?? this.db)('line_items').where({ request_id: requestId, status: 'declined' }).select(COLUMNS).orderBy('id')) as Row[];
    return rows.map(toWorkItem);
  }

  async planOnVisit(itemIds: readonly number[], siteVisitId: number | null, trx: Trx): Promise<void> {
    if (itemIds.length) await trx('line_items').whereIn('id', itemIds).update({ site_visit_id: siteVisitId, updated_at: new Date() });
  }

  /** Locks the request row and answers its status (null when there is no such request). */
  async lockRequest(requestId: number, trx: Trx): Promise<{ status: string; closingDate: string } | null> {
    const row = await trx('repair_requests').where({ id: requestId }).forUpdate().first('status', 'closing_date');
    return row ? { status: row.status, closingDate: row.closing_date } : null;
  }
}
