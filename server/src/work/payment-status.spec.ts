import type { AccountPayment } from '@cc/shared';
import { LETTER_PAYMENT_WORDS, letterPaymentText } from './payment-status';

const card = (overrides: Partial<AccountPayment> = {}): AccountPayment => ({ method: 'card', status: 'succeeded', amountCents: 30_000, refundedCents: 0, ...overrides });
const closing = (status: AccountPayment['status'], amountCents = 40_000): AccountPayment => ({ method: 'closing', status, amountCents, refundedCents: 0 });

// The letter goes to the inspector and the buyer's agent: it says paid in full, to be paid at closing,
// or nothing, and never an amount (review 7, P3-5).
describe('letterPaymentText', () => {
  it('says the work is paid in full, without amounts or receipt numbers', () => {
    expect(letterPaymentText(30_000, [card()])).toBe('The work in this letter is paid in full.');
    // Funds from escrow recorded after closing: paid in full too.
    expect(letterPaymentText(40_000, [closing('succeeded')])).toBe(LETTER_PAYMENT_WORDS['paid-in-full']);
    // More received than the total (a refund to come) is still paid in full for the buyer's side.
    expect(letterPaymentText(20_000, [card()])).toBe(LETTER_PAYMENT_WORDS['paid-in-full']);
  });

  it('says the work is to be paid at closing when the escrow invoice covers what is left', () => {
    expect(letterPaymentText(40_000, [card({ status: 'failed' }), closing('pending')])).toBe('The work in this letter is to be paid at closing, through the escrow or title company.');
    expect(letterPaymentText(40_000, [card({ amountCents: 10_000 }), closing('pending', 30_000)])).toBe(LETTER_PAYMENT_WORDS['at-closing']);
  });

  it('leaves money out otherwise: nothing paid, a deposit and a balance, refunds, no approved scope', () => {
    expect(letterPaymentText(40_000, [])).toBeNull();
    expect(letterPaymentText(40_000, [card({ amountCents: 10_000 })])).toBeNull();
    expect(letterPaymentText(30_000, [card({ refundedCents: 5_000 })])).toBeNull();
    expect(letterPaymentText(null, [card()])).toBeNull();
    expect(letterPaymentText(0, [])).toBeNull();
  });

  it('never states an amount', () => {
    for (const text of Object.values(LETTER_PAYMENT_WORDS)) expect(text).not.toMatch(/\$|\d/);
  });
});
