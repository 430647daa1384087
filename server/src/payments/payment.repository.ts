import type { Payment } from '@cc/shared';
import type { Db, Trx } from '../db/knex';

export interface StoredPayment extends Omit<Payment, 'refunds' | 'createdAt' | 'paidAt' | 'checkoutUrl'> {
  requestId: number;
  organisationId: number;
  idempotencyKey: string;
  checkoutSessionId: string | null;
  checkoutUrl: string | null;
  paymentIntentId: string | null;
  createdAt: Date;
  paidAt: Date | null;
}

export interface StoredRefund {
  id: number;
  paymentId: number;
  amountCents: number;
  reason: string;
  status: 'pending' | 'succeeded' | 'failed';
  providerRefundId: string | null;
  createdAt: Date;
}

type PaymentRow = {
  id: number;
  request_id: number;
  organisation_id: number;
  method: Payment['method'];
  purpose: Payment['purpose'];
  amount_cents: number;
  status: Payment['status'];
  refunded_cents: number;
  idempotency_key: string;
  checkout_session_id: string | null;
  checkout_url: string | null;
  payment_intent_id: string | null;
  failure_message: string | null;
  reference: string | null;
  received_on: string | null;
  created_at: Date;
  paid_at: Date | null;
};

const toPayment = (r: PaymentRow): StoredPayment => ({
  id: r.id,
  requestId: r.request_id,
  organisationId: r.organisation_id,
  method: r.method,
  purpose: r.purpose,
  amountCents: r.amount_cents,
  status: r.status,
  refundedCents: r.refunded_cents,
  idempotencyKey: r.idempotency_key,
  checkoutSessionId: r.checkout_session_id,
  checkoutUrl: r.checkout_url,
  paymentIntentId: r.payment_intent_id,
  failureMessage: r.failure_message,
  reference: r.reference,
  receivedOn: r.received_on,
  createdAt: r.created_at,
  paidAt: r.paid_at,
});

type RefundRow = { id: number; payment_id: number; amount_cents: number; reason: string; status: StoredRefund['status']; provider_refund_id: string | null; created_at: Date };
const toRefund = (r: RefundRow): StoredRefund => ({ id: r.id, paymentId: r.payment_id, amountCents: r.amount_cents, reason: r.reason, status: r.status, providerRefundId: r.provider_refund_id, createdAt: r.created_at });

/** Payments of requests, their refunds, and the payment service's events acted on (each once). */
export class PaymentRepository {
  constructor(private readonly db: Db) {}

  async list(requestId: number, trx?: Trx): Promise<StoredPayment[]> {
    const rows: PaymentRow[] = await (trx ?? this.db)('payments').where({ request_id: requestId }).orderBy('id');
    return rows.map(toPayment);
  }

  async find(id: number, trx?: Trx): Promise<StoredPayment | null> {
    const row: PaymentRow | undefined = await (trx ?? this.db)('payments').where({ id }).first();
    return row ? toPayment(row) : null;
  }

  /** Locks the payment row for the rest of the transaction. */
  async lock(id: number, trx: Trx): Promise<StoredPayment | null> {
    const row: PaymentRow | undefined = await trx('payments').where({ id }).forUpdate().first();
    return row ? toPayment(row) : null;
  }

  async findByKey(requestId: number, idempotencyKey: string, trx: Trx): Promise<StoredPayment | null> {
    const row: PaymentRow | undefined = await trx('payments').where({ request_id: requestId, idempotency_key: idempotencyKey }).first();
    return row ? toPayment(row) : null;
  }

  async insert(p: { requestId: number; organisationId: number; method: Payment['method']; purpose: Payment['purpose']; amountCents: number; idempotencyKey: string; createdBy: number }, trx: Trx): Promise<StoredPayment> {
    const [row] = await trx('payments')
      .insert({ request_id: p.requestId, organisation_id: p.organisationId, method: p.method, purpose: p.purpose, amount_cents: p.amountCents, idempotency_key: p.idempotencyKey, created_by: p.createdBy })
      .returning('*');
    return toPayment(row);
  }

  async setCheckout(id: number, sessionId: string, url: string): Promise<void> {
    await this.db('payments').where({ id }).update({ checkout_session_id: sessionId, checkout_url: url });
  }

  async cancel(id: number, message: string): Promise<void> {
    await this.db('payments').where({ id, status: 'pending' }).update({ status: 'cancelled', failure_message: message.slice(0, 500) });
  }

  /** Pending → succeeded, once: false when the payment was credited already (or is not pending). */
  async markSucceeded(id: number, s: { paymentIntentId: string | null; reference?: string; receivedOn?: string }, trx: Trx): Promise<boolean> {
    const updated = await trx('payments')
      .where({ id, status: 'pending' })
      .update({ status: 'succeeded', paid_at: new Date(), payment_intent_id: s.paymentIntentId, failure_message: null, reference: s.reference ?? null, received_on: s.receivedOn ?? null });
    return updated === 1;
  }

  /** Notes why the last card tried was declined, while the payment is still open. */
  async noteDecline(id: number, message: string, trx: Trx): Promise<boolean> {
    return (await trx('payments').where({ id, status: 'pending' }).update({ failure_message: message.slice(0, 500) })) === 1;
  }

  async expire(id: number, trx: Trx): Promise<boolean> {
    return (await trx('payments').where({ id, status: 'pending' }).update({ status: 'cancelled' })) === 1;
  }

  async refunds(paymentIds: readonly number[], trx?: Trx): Promise<StoredRefund[]> {
    if (!paymentIds.length) return [];
    const rows: RefundRow[] = await (trx ?? this.db)('refunds').whereIn('payment_id', paymentIds).orderBy('id');
    return rows.map(toRefund);
  }

  async findRefundByKey(idempotencyKey: string, trx: Trx): Promise<StoredRefund | null> {
    const row: RefundRow | undefined = await trx('refunds').where({ idempotency_key: idempotencyKey }).first();
    return row ? toRefund(row) : null;
  }

  async insertRefund(r: { paymentId: number; amountCents: number; reason: string; idempotencyKey: string; createdBy: number }, trx: Trx): Promise<StoredRefund> {
    const [row] = await trx('refunds').insert({ payment_id: r.paymentId, amount_cents: r.amountCents, reason: r.reason, idempotency_key: r.idempotencyKey, created_by: r.createdBy }).returning('*');
    return toRefund(row);
  }

  async setProviderRefund(id: number, providerRefundId: string): Promise<void> {
    await this.db('refunds').where({ id }).whereNull('provider_refund_id').update({ provider_refund_id: providerRefundId });
  }

  async failRefund(id: number): Promise<void> {
    await this.db('refunds').where({ id, status: 'pending' }).update({ status: 'failed', settled_at: new Date() });
  }

  /** Pending → succeeded once, adding the amount to the payment's refunded total. */
  async settleRefund(id: number, providerRefundId: string, trx: Trx): Promise<boolean> {
    const [row] = await trx('refunds')
      .where({ id, status: 'pending' })
      .update({ status: 'succeeded', settled_at: new Date(), provider_refund_id: providerRefundId })
      .returning(['payment_id', 'amount_cents']);
    if (!row) return false;
    await trx('payments').where({ id: row.payment_id }).increment('refunded_cents', row.amount_cents);
    return true;
  }

  async markRefundFailed(id: number, trx: Trx): Promise<boolean> {
    return (await trx('refunds').where({ id, status: 'pending' }).update({ status: 'failed', settled_at: new Date() })) === 1;
  }

  async findRefund(id: number, trx: Trx): Promise<StoredRefund | null> {
    const row: RefundRow | undefined = await trx('refunds').where({ id }).forUpdate().first();
    return row ? toRefund(row) : null;
  }

  /** Records an event id; false when it was recorded before (a replay: act on it no more). */
  async recordEvent(eventId: string, type: string, trx: Trx): Promise<boolean> {
    const rows = await trx('payment_events').insert({ event_id: eventId, type, outcome: 'received' }).onConflict('event_id').ignore().returning('event_id');
    return rows.length === 1;
  }

  async setEventOutcome(eventId: string, outcome: string, trx: Trx): Promise<void> {
    await trx('payment_events').where({ event_id: eventId }).update({ outcome });
  }
}
