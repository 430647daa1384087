import type { ItemStatus, Quote, QuoteContractor, RateBook, SignerCapacity } from '@cc/shared';
import type { Db, Trx } from '../db/knex';

export interface StoredApproval {
  id: number;
  requestId: number;
  quoteId: number;
  quoteVersion: number;
  signedBy: number;
  signedByName: string;
  signerName: string;
  /** Signed by the seller, or for the seller by the listing agent (or an administrator). */
  signerCapacity: SignerCapacity;
  consentText: string;
  signedAt: Date;
  ipAddress: string;
  userAgent: string;
  quoteHash: string;
  approvedTotalCents: number;
  approvedTaxCents: number;
  depositCents: number;
}

export interface StoredDecision {
  lineItemId: number;
  decision: 'approved' | 'declined';
  note: string | null;
  decidedByName: string;
  decidedAt: Date;
  changeOrderNumber: number | null;
}

export interface ScopeLineItem {
  id: number;
  code: string;
  room: string;
  location: string;
  status: ItemStatus;
  version: number;
  changeOrderId: number | null;
}

type ApprovalRow = {
  id: number;
  request_id: number;
  quote_id: number;
  quote_version: number;
  signed_by: number;
  by_name: string;
  signer_name: string;
  signer_capacity: SignerCapacity;
  consent_text: string;
  signed_at: Date;
  ip_address: string;
  user_agent: string;
  quote_hash: string;
  approved_total_cents: number;
  approved_tax_cents: number;
  deposit_cents: number;
};

function toApproval(r: ApprovalRow): StoredApproval {
  return {
    id: r.id,
    requestId: r.request_id,
    quoteId: r.quote_id,
    quoteVersion: r.quote_version,
    signedBy: r.signed_by,
    signedByName: r.by_name,
    signerName: r.signer_name,
    signerCapacity: r.signer_capacity,
    consentText: r.consent_text,
    signedAt: r.signed_at,
    ipAddress: r.ip_address,
    userAgent: r.user_agent,
    quoteHash: r.quote_hash,
    approvedTotalCents: r.approved_total_cents,
    approvedTaxCents: r.approved_tax_cents,
    depositCents: r.deposit_cents,
  };
}

/** The seller's signed decision on a quote version, the decisions on each item, and the quote's pricing. */
export class ApprovalRepository {
  constructor(private readonly db: Db) {}

  async find(requestId: number, trx?: Trx): Promise<StoredApproval | null> {
    const row: ApprovalRow | undefined = await (trx ?? this.db)('quote_approvals as a')
      .join('users as u', 'u.id', 'a.signed_by')
      .where('a.request_id', requestId)
      .first('a.*', 'u.name as by_name');
    return row ? toApproval(row) : null;
  }

  async insert(a: Omit<StoredApproval, 'id' | 'signedAt' | 'signedByName'>, trx: Trx): Promise<number> {
    const [row] = await trx('quote_approvals')
      .insert({
        request_id: a.requestId,
        quote_id: a.quoteId,
        quote_version: a.quoteVersion,
        signed_by: a.signedBy,
        signer_name: a.signerName,
        signer_capacity: a.signerCapacity,
        consent_text: a.consentText,
        ip_address: a.ipAddress,
        user_agent: a.userAgent,
        quote_hash: a.quoteHash,
        approved_total_cents: a.approvedTotalCents,
        approved_tax_cents: a.approvedTaxCents,
        deposit_cents: a.depositCents,
      })
      .returning('id');
    return row.id;
  }

  async insertDecisions(
    rows: { requestId: number; lineItemId: number; approvalId: number | null; changeOrderId: number | null; decision: 'approved' | 'declined'; note: string | null; decidedBy: number }[],
    trx: Trx,
  ): Promise<void> {
    if (!rows.length) return;
    await trx('item_decisions').insert(
      rows.map((r) => ({ request_id: r.requestId, line_item_id: r.lineItemId, approval_id: r.approvalId, change_order_id: r.changeOrderId, decision: r.decision, note: r.note, decided_by: r.decidedBy })),
    );
  }

  async decisions(requestId: number, trx?: Trx): Promise<StoredDecision[]> {
    const rows: { line_item_id: number; decision: 'approved' | 'declined'; note: string | null; by_name: string; decided_at: Date; co_number: number | null }[] = await (trx ?? this.db)('item_decisions as d')
      .join('users as u', 'u.id', 'd.decided_by')
      .leftJoin('change_orders as c', 'c.id', 'd.change_order_id')
      .where('d.request_id', requestId)
      .orderBy('d.id')
      .select('d.line_item_id', 'd.decision', 'd.note', 'u.name as by_name', 'd.decided_at', 'c.number as co_number');
    return rows.map((r) => ({ lineItemId: r.line_item_id, decision: r.decision, note: r.note, decidedByName: r.by_name, decidedAt: r.decided_at, changeOrderNumber: r.co_number }));
  }

  /** Items of the request that a quote or change order may hold (not proposed or removed ones). */
  async lineItems(requestId: number, trx?: Trx): Promise<ScopeLineItem[]> {
    const rows: { id: number; code: string; room: string; location: string | null; status: ItemStatus; version: number; change_order_id: number | null }[] = await (trx ?? this.db)('line_items')
      .where({ request_id: requestId })
      .whereNotIn('status', ['proposed', 'removed'])
      .orderBy('id')
      .select('id', 'code', 'room', 'location', 'status', 'version', 'change_order_id');
    return rows.map((r) => ({ id: r.id, code: r.code, room: r.room, location: r.location ?? '', status: r.status, version: r.version, changeOrderId: r.change_order_id }));
  }

  /** Marks items as added by a change order. */
  async linkToChangeOrder(itemIds: readonly number[], changeOrderId: number, trx: Trx): Promise<void> {
    if (itemIds.length) await trx('line_items').whereIn('id', itemIds).update({ change_order_id: changeOrderId });
  }

  /** The rate book and priced input a quote version was priced with, and its id. */
  async quotePricing(requestId: number, version: number, trx?: Trx): Promise<{ quoteId: number; book: RateBook; input: Quote; contractor: QuoteContractor } | null> {
    const row = await (trx ?? this.db)('quotes').where({ request_id: requestId, version }).first('id', 'rate_book', 'pricing_input', 'contractor');
    return row ? { quoteId: row.id, book: row.rate_book as RateBook, input: row.pricing_input as Quote, contractor: row.contractor as QuoteContractor } : null;
  }

  /** Locks the request row for the rest of the transaction; its status, or null when it is gone. */
  async lockRequest(requestId: number, trx: Trx): Promise<string | null> {
    const row = await trx('repair_requests').where({ id: requestId }).forUpdate().first('status');
    return row?.status ?? null;
  }
}
