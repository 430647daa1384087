// The seller's side told by e-mail: each notice reads the facts of what happened in the caller's
// transaction and writes its messages with notify(), so they commit or roll back with the change.
import { signedInCapacity, type SignerCapacity } from '@cc/shared';
import type { SellerNotices } from '../approvals/seller-notices';
import type { Trx } from '../db/knex';
import { invoiceNumber } from '../invoices/invoice-dto';
import type { InvoiceSeries } from '../invoices/invoice.repository';
import type { NotificationsService } from './notifications.service';

export function sellerNoticesByMail(notifications: NotificationsService): SellerNotices {
  const changeOrder = async (trx: Trx, id: number) =>
    (await trx('change_orders').where({ id }).first('number', 'price_cents', 'reason')) as { number: number; price_cents: number; reason: string };
  /** An invoice payable at closing: its number, the amount it asks for and who is paid. */
  const closingInvoice = async (trx: Trx, id: number) => {
    const row: { series: InvoiceSeries; number: number; total_cents: number; balance_cents: number; content: { contractor: { name: string } }; payment_id: number | null } = await trx('invoices')
      .where({ id })
      .first('series', 'number', 'total_cents', 'balance_cents', 'content', 'payment_id');
    const payment = row.payment_id === null ? undefined : await trx('payments').where({ id: row.payment_id }).first('amount_cents');
    return { number: invoiceNumber(row.series, row.number), amountCents: (payment?.amount_cents as number | undefined) ?? row.balance_cents, payee: row.content.contractor.name };
  };
  return {
    async quoteDecided(trx, { requestId, by, approvalId, at }) {
      const approval: { approved_total_cents: number; signer_name: string; signer_capacity: SignerCapacity } = await trx('quote_approvals')
        .where({ id: approvalId })
        .first('approved_total_cents', 'signer_name', 'signer_capacity');
      const counts: { decision: string; n: string }[] = await trx('item_decisions').where({ approval_id: approvalId }).groupBy('decision').select('decision', trx.raw('count(*) AS n'));
      const count = (decision: string) => Number(counts.find((c) => c.decision === decision)?.n ?? 0);
      await notifications.notify(trx, {
        kind: 'items-decided',
        requestId,
        actorUserId: by,
        approvedCount: count('approved'),
        declinedCount: count('declined'),
        approvedCents: approval.approved_total_cents,
        decisionRef: `approval-${approvalId}`,
        signedBy: approval.signer_capacity === 'seller' ? null : signedInCapacity(approval.signer_name, approval.signer_capacity),
        at,
      });
    },

    async paymentReceived(trx, { requestId, by, paymentId, receiptInvoiceId, at }) {
      const payment = await trx('payments').where({ id: paymentId }).first('amount_cents');
      const receipt: { series: InvoiceSeries; number: number } | undefined = receiptInvoiceId === null ? undefined : await trx('invoices').where({ id: receiptInvoiceId }).first('series', 'number');
      await notifications.notify(trx, {
        kind: 'payment-received',
        requestId,
        actorUserId: by,
        paymentId,
        amountCents: payment.amount_cents,
        receiptNumber: receipt ? invoiceNumber(receipt.series, receipt.number) : null,
        at,
      });
    },

    async closingPaymentChosen(trx, { requestId, by, paymentId, invoiceId, escrow, at }) {
      const invoice = await closingInvoice(trx, invoiceId);
      await notifications.notify(trx, { kind: 'closing-invoice', requestId, actorUserId: by, invoiceId, invoiceNumber: invoice.number, amountCents: invoice.amountCents, payee: invoice.payee, escrow, sendNumber: 1, at });
      await notifications.notify(trx, { kind: 'closing-payment-chosen', requestId, actorUserId: by, paymentId, amountCents: invoice.amountCents, invoiceNumber: invoice.number, escrow, at });
    },

    async closingInvoiceSent(trx, { requestId, by, invoiceId, escrow, sendNumber, at }) {
      const invoice = await closingInvoice(trx, invoiceId);
      await notifications.notify(trx, { kind: 'closing-invoice', requestId, actorUserId: by, invoiceId, invoiceNumber: invoice.number, amountCents: invoice.amountCents, payee: invoice.payee, escrow, sendNumber, at });
    },

    async changeOrderSent(trx, { requestId, by, changeOrderId }) {
      const co = await changeOrder(trx, changeOrderId);
      await notifications.notify(trx, { kind: 'change-order-sent', requestId, actorUserId: by, changeOrderId, number: co.number, priceCents: co.price_cents, reason: co.reason });
    },

    async changeOrderDecided(trx, { requestId, by, changeOrderId, isApproved }) {
      const co = await changeOrder(trx, changeOrderId);
      const decided: { signer_name: string; signer_capacity: SignerCapacity } = await trx('change_orders').where({ id: changeOrderId }).first('signer_name', 'signer_capacity');
      const signedBy = signedInCapacity(decided.signer_name, decided.signer_capacity);
      await notifications.notify(trx, { kind: 'change-order-decided', requestId, actorUserId: by, changeOrderId, number: co.number, priceCents: co.price_cents, isApproved, signedBy });
    },

    async refundSettled(trx, { requestId, by, refundId }) {
      const refund = await trx('refunds').where({ id: refundId }).first('amount_cents');
      await notifications.notify(trx, { kind: 'refund-settled', requestId, actorUserId: by, refundId, amountCents: refund.amount_cents });
    },
  };
}
