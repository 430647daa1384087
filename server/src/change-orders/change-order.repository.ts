import type { ChangeOrder, SignerCapacity } from '@cc/shared';
import type { Db, Trx } from '../db/knex';

/** A change order line as stored: what changes, on which item, with the work's name for showing. */
export interface StoredChangeOrderLine {
  kind: 'add' | 'quantity' | 'remove';
  lineItemId: number;
  code: string;
  location: string;
  workName: string;
  /** The engine id of the entry (for added lines). */
  entryId: string | null;
  quantityBefore: number | null;
  quantityAfter: number | null;
}

export interface StoredChangeOrder extends Omit<ChangeOrder, 'lines' | 'createdAt' | 'decidedAt'> {
  requestId: number;
  lines: StoredChangeOrderLine[];
  createdAt: Date;
  decidedAt: Date | null;
}

type Row = {
  id: number;
  request_id: number;
  number: number;
  reason: string;
  status: ChangeOrder['status'];
  created_at: Date;
  by_name: string;
  lines: StoredChangeOrderLine[];
  price_cents: number;
  scope_before_cents: number;
  scope_after_cents: number;
  decided_at: Date | null;
  signer_name: string | null;
  signer_capacity: SignerCapacity | null;
  decision_note: string | null;
};

const toChangeOrder = (r: Row): StoredChangeOrder => ({
  id: r.id,
  requestId: r.request_id,
  number: r.number,
  reason: r.reason,
  status: r.status,
  createdAt: r.created_at,
  createdByName: r.by_name,
  lines: r.lines,
  priceCents: r.price_cents,
  scopeBeforeCents: r.scope_before_cents,
  scopeAfterCents: r.scope_after_cents,
  decidedAt: r.decided_at,
  signerName: r.signer_name,
  signerCapacity: r.signer_capacity,
  decisionNote: r.decision_note,
});

export class ChangeOrderRepository {
  constructor(private readonly db: Db) {}

  async list(requestId: number, trx?: Trx): Promise<StoredChangeOrder[]> {
    const rows: Row[] = await (trx ?? this.db)('change_orders as c').join('users as u', 'u.id', 'c.created_by').where('c.request_id', requestId).orderBy('c.number').select('c.*', 'u.name as by_name');
    return rows.map(toChangeOrder);
  }

  async create(c: { requestId: number; createdBy: number; reason: string }, trx: Trx): Promise<{ id: number; number: number }> {
    const last = await trx('change_orders').where({ request_id: c.requestId }).max<{ max: number | null }>('number as max').first();
    const number = (last?.max ?? 0) + 1;
    const [row] = await trx('change_orders')
      .insert({ request_id: c.requestId, number, created_by: c.createdBy, reason: c.reason, lines: JSON.stringify([]), price_cents: 0, scope_before_cents: 0, scope_after_cents: 0 })
      .returning('id');
    return { id: row.id, number };
  }

  async setPricing(id: number, p: { lines: StoredChangeOrderLine[]; priceCents: number; scopeBeforeCents: number; scopeAfterCents: number }, trx: Trx): Promise<void> {
    await trx('change_orders').where({ id }).update({ lines: JSON.stringify(p.lines), price_cents: p.priceCents, scope_before_cents: p.scopeBeforeCents, scope_after_cents: p.scopeAfterCents });
  }

  /** Records the decision if the change order is still waiting; false when it was decided meanwhile. */
  async decide(id: number, d: { status: 'approved' | 'declined'; decidedBy: number; signerName: string; signerCapacity: SignerCapacity; ipAddress: string; userAgent: string; note: string | null }, trx: Trx): Promise<boolean> {
    const updated = await trx('change_orders')
      .where({ id, status: 'sent' })
      .update({ status: d.status, decided_by: d.decidedBy, decided_at: new Date(), signer_name: d.signerName, signer_capacity: d.signerCapacity, ip_address: d.ipAddress, user_agent: d.userAgent, decision_note: d.note });
    return updated === 1;
  }
}
