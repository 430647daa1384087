import { amountDue, paymentAccount, type AccountPayment } from './payment-account';

const card = (amountCents: number, status: AccountPayment['status'] = 'succeeded', refundedCents = 0): AccountPayment => ({ method: 'card', status, amountCents, refundedCents });
const closing = (amountCents: number, status: AccountPayment['status'] = 'pending'): AccountPayment => ({ method: 'closing', status, amountCents, refundedCents: 0 });

// Deposits are docs/pricing.md's: 50 % of 31,434 is 15,717 (Example 1); of 44,994 it is 22,497
// (Example 2, 22,497 after rounding half up, rule R1).
describe('paymentAccount', () => {
  it.each([
    ['nothing paid', 31_434, [], { depositCents: 15_717, paidCents: 0, balanceCents: 31_434, overpaidCents: 0 }],
    ['deposit paid', 31_434, [card(15_717)], { paidCents: 15_717, balanceCents: 15_717 }],
    ['a declined or open payment counts for nothing', 31_434, [card(15_717, 'failed'), card(15_717, 'pending')], { paidCents: 0, balanceCents: 31_434 }],
    ['refunds come off what was paid', 31_434, [card(31_434, 'succeeded', 5_000)], { paidCents: 26_434, refundedCents: 5_000, balanceCents: 5_000 }],
    ['paid more than the scope after a change', 0, [card(31_434)], { balanceCents: 0, overpaidCents: 31_434 }],
    ['an open invoice payable at closing', 44_994, [closing(44_994)], { depositCents: 22_497, payableAtClosingCents: 44_994, paidCents: 0 }],
    ['funds received at closing', 44_994, [closing(44_994, 'succeeded')], { payableAtClosingCents: 0, paidCents: 44_994, balanceCents: 0 }],
  ] as const)('%s', (_name, scope, payments, expected) => {
    expect(paymentAccount(scope, 5_000, payments)).toMatchObject(expected);
  });
});

describe('amountDue', () => {
  it('asks the deposit only before anything is paid, the full amount as the balance', () => {
    const fresh = paymentAccount(31_434, 5_000, []);
    expect(amountDue('card-deposit', fresh)).toBe(15_717);
    expect(amountDue('card-full', fresh)).toBe(31_434);
    const afterDeposit = paymentAccount(31_434, 5_000, [card(15_717)]);
    expect(amountDue('card-deposit', afterDeposit)).toBeNull();
    expect(amountDue('card-full', afterDeposit)).toBe(15_717);
  });

  it('asks nothing while an invoice is payable at closing or nothing is owed', () => {
    expect(amountDue('card-full', paymentAccount(31_434, 5_000, [closing(31_434)]))).toBeNull();
    expect(amountDue('at-closing', paymentAccount(31_434, 5_000, [card(31_434)]))).toBeNull();
  });

  it('offers no deposit when the terms ask none or all', () => {
    expect(amountDue('card-deposit', paymentAccount(31_434, 0, []))).toBeNull();
    expect(amountDue('card-deposit', paymentAccount(31_434, 10_000, []))).toBeNull();
  });
});
