import type { Db, Trx } from '../db/knex';

export type InvoiceSeries = 'invoice' | 'receipt';
export type InvoiceKind = 'invoice' | 'closing-invoice' | 'receipt';

export interface StoredInvoice<C = unknown> {
  id: number;
  organisationId: number;
  series: InvoiceSeries;
  number: number;
  requestId: number;
  kind: InvoiceKind;
  paymentId: number | null;
  issuedAt: Date;
  addressedTo: unknown;
  content: C;
  totalCents: number;
  balanceCents: number;
  /** An invoice payable at closing: where it was last e-mailed (null for the others). */
  sentTo: string | null;
  sendCount: number;
}

type Row = {
  id: number;
  organisation_id: number;
  series: InvoiceSeries;
  number: number;
  request_id: number;
  kind: InvoiceKind;
  payment_id: number | null;
  issued_at: Date;
  addressed_to: unknown;
  content: unknown;
  total_cents: number;
  balance_cents: number;
  sent_to: string | null;
  send_count: number;
};

const toInvoice = (r: Row): StoredInvoice => ({
  id: r.id,
  organisationId: r.organisation_id,
  series: r.series,
  number: r.number,
  requestId: r.request_id,
  kind: r.kind,
  paymentId: r.payment_id,
  issuedAt: r.issued_at,
  addressedTo: r.addressed_to,
  content: r.content,
  totalCents: r.total_cents,
  balanceCents: r.balance_cents,
  sentTo: r.sent_to,
  sendCount: r.send_count,
});

/** Numbered invoices and receipts. Numbers come from one counter row per organisation and series. */
export class InvoiceRepository {
  constructor(private readonly db: Db) {}

  /**
   * The next number of the series: the counter row is created or incremented in the caller's
   * transaction, which holds its row lock until it ends. Concurrent callers wait their turn, and a
   * transaction that rolls back gives its number back: numbers have no gaps.
   */
  async nextNumber(organisationId: number, series: InvoiceSeries, trx: Trx): Promise<number> {
    const { rows } = await trx.raw<{ rows: { last_number: number }[] }>(
      `INSERT INTO invoice_counters (organisation_id, series, last_number) VALUES (?, ?, 1)
       ON CONFLICT (organisation_id, series) DO UPDATE SET last_number = invoice_counters.last_number + 1
       RETURNING last_number`,
      [organisationId, series],
    );
    return rows[0].last_number;
  }

  async insert(i: Omit<StoredInvoice, 'id' | 'issuedAt' | 'sendCount'> & { issuedBy: number | null }, trx: Trx): Promise<StoredInvoice> {
    const [row] = await trx('invoices')
      .insert({
        organisation_id: i.organisationId,
        series: i.series,
        number: i.number,
        request_id: i.requestId,
        kind: i.kind,
        payment_id: i.paymentId,
        issued_by: i.issuedBy,
        addressed_to: JSON.stringify(i.addressedTo),
        content: JSON.stringify(i.content),
        total_cents: i.totalCents,
        balance_cents: i.balanceCents,
        sent_to: i.sentTo,
        send_count: i.sentTo ? 1 : 0,
      })
      .returning('*');
    return toInvoice(row);
  }

  /** Records one more e-mail of the invoice to `email`; returns which send it is (2 for the first resend). */
  async markSent(id: number, email: string, trx: Trx): Promise<number> {
    const [row] = await trx('invoices').where({ id }).update({ sent_to: email, send_count: trx.raw('send_count + 1') }).returning('send_count');
    return row.send_count as number;
  }

  async list(requestId: number): Promise<StoredInvoice[]> {
    const rows: Row[] = await this.db('invoices').where({ request_id: requestId }).orderBy('id');
    return rows.map(toInvoice);
  }

  /** The invoice `id` of request `requestId`; any request's when `requestId` is null (the mail worker's attachments). */
  async find(requestId: number | null, id: number, trx?: Trx): Promise<StoredInvoice | null> {
    const row: Row | undefined = await (trx ?? this.db)('invoices')
      .where({ id, ...(requestId === null ? {} : { request_id: requestId }) })
      .first();
    return row ? toInvoice(row) : null;
  }
}
