import { paymentAccount, type AccountPayment } from '@cc/shared';
import { ApprovalRepository } from '../approvals/approval.repository';
import { ApprovedScopeReader } from '../approvals/approved-scope';
import { ChangeOrderRepository } from '../change-orders/change-order.repository';
import type { Db, Trx } from '../db/knex';
import { PaymentRepository } from '../payments/payment.repository';

/**
 * What the completion letter says about payment. The letter goes to the inspector and the buyer's
 * side, so it says only whether the work is paid in full or to be paid at closing, in neutral words,
 * and nothing otherwise (review 7, P3-5): amounts, deposits, balances and refunds are between the
 * seller and the contractor, on the invoices and receipts.
 */
export const LETTER_PAYMENT_WORDS = {
  'paid-in-full': 'The work in this letter is paid in full.',
  'at-closing': 'The work in this letter is to be paid at closing, through the escrow or title company.',
} as const;

/**
 * The letter's payment sentence from the approved scope's total and the recorded payments (only
 * succeeded payments count, less refunds; a closing invoice still open counts as payable at closing),
 * or null when the letter leaves payment out.
 */
export function letterPaymentText(scopeTotalCents: number | null, payments: readonly AccountPayment[]): string | null {
  if (scopeTotalCents === null || scopeTotalCents <= 0) return null;
  const account = paymentAccount(scopeTotalCents, 0, payments);
  if (account.balanceCents === 0) return LETTER_PAYMENT_WORDS['paid-in-full'];
  if (account.payableAtClosingCents >= account.balanceCents) return LETTER_PAYMENT_WORDS['at-closing'];
  return null;
}

/** The payment sentence of a request's completion letter, read from its approved scope and payments (or null). */
export async function paymentStatusOf(db: Db | Trx, requestId: number): Promise<string | null> {
  const scope = await new ApprovedScopeReader(new ApprovalRepository(db), new ChangeOrderRepository(db)).load(requestId, db as Trx);
  const payments = await new PaymentRepository(db).list(requestId, db as Trx);
  return letterPaymentText(scope?.totalCents ?? null, payments);
}
