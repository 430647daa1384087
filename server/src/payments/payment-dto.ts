import type { Payment } from '@cc/shared';
import type { StoredPayment, StoredRefund } from './payment.repository';

/** Payments as the page shows them; the payment page link only to those who pay, while it is open. */
export function toPaymentDtos(payments: readonly StoredPayment[], refunds: readonly StoredRefund[], showsCheckout: boolean): Payment[] {
  return payments.map((p) => ({
    id: p.id,
    method: p.method,
    purpose: p.purpose,
    amountCents: p.amountCents,
    status: p.status,
    refundedCents: p.refundedCents,
    failureMessage: p.failureMessage,
    createdAt: p.createdAt.toISOString(),
    paidAt: p.paidAt?.toISOString() ?? null,
    reference: p.reference,
    receivedOn: p.receivedOn,
    checkoutUrl: showsCheckout && p.status === 'pending' && p.method === 'card' ? p.checkoutUrl : null,
    refunds: refunds.filter((r) => r.paymentId === p.id).map((r) => ({ id: r.id, amountCents: r.amountCents, reason: r.reason, status: r.status, createdAt: r.createdAt.toISOString() })),
  }));
}
