import { describePayments, type LetterPayment } from './payment-status';

const card = (overrides: Partial<LetterPayment> = {}): LetterPayment => ({ id: 1, method: 'card', status: 'succeeded', amountCents: 30_000, refundedCents: 0, paidOn: '2026-11-28', ...overrides });

describe('describePayments', () => {
  it('states a card payment in full with its receipt', () => {
    expect(describePayments(30_000, 2500, [card()], [{ paymentId: 1, number: 'R-000004' }])).toBe(
      'Paid in full: $300.00 of $300.00. $300.00 received by card on 2026-11-28 (receipt R-000004).',
    );
  });

  it('states a deposit and the balance still owed', () => {
    expect(describePayments(40_000, 2500, [card({ amountCents: 10_000 })], [])).toBe('$100.00 of $400.00 received; balance $300.00. $100.00 received by card on 2026-11-28.');
  });

  it('counts only succeeded payments, and names what is payable at closing', () => {
    const text = describePayments(40_000, 2500, [card({ status: 'failed' }), { id: 2, method: 'closing', status: 'pending', amountCents: 40_000, refundedCents: 0, paidOn: null }], []);
    expect(text).toBe('No payment received through Closing Circuit yet; the approved work totals $400.00. $400.00 is payable at closing on the escrow invoice.');
  });

  it('takes refunds off what was received', () => {
    expect(describePayments(30_000, 0, [card({ refundedCents: 5_000 })], [])).toContain('$250.00 of $300.00 received; balance $50.00. $300.00 received by card on 2026-11-28, $50.00 refunded.');
  });
});

describe('describePayments without an approved scope on file', () => {
  it('still lists what was received', () => {
    expect(describePayments(null, 0, [card()], [{ paymentId: 1, number: 'R-000001' }])).toBe('Payments recorded in Closing Circuit: $300.00 received by card on 2026-11-28 (receipt R-000001).');
    expect(describePayments(null, 0, [], [])).toBe('No payment is recorded in Closing Circuit for this request.');
  });
});
