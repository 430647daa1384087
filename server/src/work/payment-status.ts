import { formatCents, paymentAccount, type AccountPayment } from '@cc/shared';
import { ApprovalRepository } from '../approvals/approval.repository';
import { ApprovedScopeReader } from '../approvals/approved-scope';
import { ChangeOrderRepository } from '../change-orders/change-order.repository';
import type { Db, Trx } from '../db/knex';
import { invoiceNumber } from '../invoices/invoice-dto';
import type { InvoiceSeries } from '../invoices/invoice.repository';
import { PaymentRepository } from '../payments/payment.repository';

/** A payment as the letter states it. */
export interface LetterPayment extends AccountPayment {
  id: number;
  paidOn: string | null;
}

/** A receipt issued for a payment. */
export interface LetterReceipt {
  paymentId: number | null;
  number: string;
}

const METHOD_TEXT = { card: 'by card', closing: 'from escrow at closing' } as const;

/**
 * The payment sentence of the completion letter from the recorded payments and receipts: what was
 * received (less refunds) against the approved scope, with receipt numbers, and what is still owed or
 * payable at closing. Money in integer cents; only succeeded payments count (the payments account).
 */
export function describePayments(scopeTotalCents: number | null, cardDepositBp: number, payments: readonly LetterPayment[], receipts: readonly LetterReceipt[]): string {
  const received = payments.filter((p) => p.status === 'succeeded');
  const lines = received.map((p) => {
    const receipt = receipts.find((r) => r.paymentId === p.id);
    const refund = p.refundedCents > 0 ? `, ${formatCents(p.refundedCents)} refunded` : '';
    return `${formatCents(p.amountCents)} received ${METHOD_TEXT[p.method]}${p.paidOn ? ` on ${p.paidOn}` : ''}${receipt ? ` (receipt ${receipt.number})` : ''}${refund}`;
  });
  if (scopeTotalCents === null) return lines.length ? `Payments recorded in Closing Circuit: ${lines.join('; ')}.` : 'No payment is recorded in Closing Circuit for this request.';
  const account = paymentAccount(scopeTotalCents, cardDepositBp, payments);
  const total = formatCents(account.scopeTotalCents);
  const standing =
    account.balanceCents === 0 && account.paidCents > 0
      ? `Paid in full: ${formatCents(account.paidCents)} of ${total}.`
      : account.paidCents > 0
        ? `${formatCents(account.paidCents)} of ${total} received; balance ${formatCents(account.balanceCents)}.`
        : `No payment received through Closing Circuit yet; the approved work totals ${total}.`;
  const closing = account.payableAtClosingCents > 0 ? ` ${formatCents(account.payableAtClosingCents)} is payable at closing on the escrow invoice.` : '';
  const overpaid = account.overpaidCents > 0 ? ` ${formatCents(account.overpaidCents)} received beyond the total is to be refunded.` : '';
  return `${standing}${lines.length ? ` ${lines.join('; ')}.` : ''}${closing}${overpaid}`;
}

/** The payment status of a request as the completion letter states it, read from its payments and receipts. */
export async function paymentStatusOf(db: Db | Trx, requestId: number): Promise<string> {
  const scope = await new ApprovedScopeReader(new ApprovalRepository(db), new ChangeOrderRepository(db)).load(requestId, db as Trx);
  const payments = await new PaymentRepository(db).list(requestId, db as Trx);
  const receiptRows: { payment_id: number | null; series: InvoiceSeries; number: number }[] = await db('invoices')
    .where({ request_id: requestId, kind: 'receipt' })
    .orderBy('id')
    .select('payment_id', 'series', 'number');
  return describePayments(
    scope?.totalCents ?? null,
    scope?.cardDepositBp ?? 0,
    payments.map((p) => ({ ...p, paidOn: p.receivedOn ?? p.paidAt?.toISOString().slice(0, 10) ?? null })),
    receiptRows.map((r) => ({ paymentId: r.payment_id, number: invoiceNumber(r.series, r.number) })),
  );
}
