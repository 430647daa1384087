import { applyBasisPoints } from '../pricing/rounding';

/** A payment as the account counts it. */
export interface AccountPayment {
  method: 'card' | 'closing';
  status: 'pending' | 'succeeded' | 'failed' | 'cancelled';
  amountCents: number;
  refundedCents: number;
}

export interface PaymentAccount {
  /** The approved scope's total (approved items and approved change orders). */
  scopeTotalCents: number;
  /** The deposit the rate book's terms ask for when paying by card: a share of the scope total. */
  depositCents: number;
  /** Money received, less what was refunded. */
  paidCents: number;
  refundedCents: number;
  /** What is still owed (0 when paid in full or more). */
  balanceCents: number;
  /** Money received beyond the scope total: the contractor refunds it. */
  overpaidCents: number;
  /** Money on an escrow invoice that is payable at closing and not yet received. */
  payableAtClosingCents: number;
}

/**
 * Where the money of a request stands: received payments (less refunds) against the approved
 * scope. Only succeeded payments count; integer cents in and out; the deposit share is rounded by
 * the pricing engine's one rule (R1, half up).
 */
export function paymentAccount(scopeTotalCents: number, cardDepositBp: number, payments: readonly AccountPayment[]): PaymentAccount {
  let received = 0;
  let refunded = 0;
  let atClosing = 0;
  for (const p of payments) {
    if (p.status === 'succeeded') {
      received += p.amountCents;
      refunded += p.refundedCents;
    } else if (p.method === 'closing' && p.status === 'pending') {
      atClosing += p.amountCents;
    }
  }
  const paidCents = received - refunded;
  const owed = scopeTotalCents - paidCents;
  return {
    scopeTotalCents,
    depositCents: applyBasisPoints(scopeTotalCents, cardDepositBp),
    paidCents,
    refundedCents: refunded,
    balanceCents: Math.max(0, owed),
    overpaidCents: Math.max(0, -owed),
    payableAtClosingCents: atClosing,
  };
}

export const PAYMENT_PLANS = ['card-deposit', 'card-full', 'at-closing'] as const;
export type PaymentPlan = (typeof PAYMENT_PLANS)[number];

/**
 * What a plan asks the seller to pay now, or null when the plan does not fit the account: the
 * deposit only while nothing has been paid or put on a closing invoice; the full amount is the
 * balance; nothing can be asked while the balance is 0 or a closing invoice is open.
 */
export function amountDue(plan: PaymentPlan, account: PaymentAccount): number | null {
  if (account.balanceCents === 0 || account.payableAtClosingCents > 0) return null;
  if (plan === 'card-deposit') {
    if (account.paidCents > 0 || account.depositCents === 0 || account.depositCents >= account.balanceCents) return null;
    return account.depositCents;
  }
  return account.balanceCents;
}
