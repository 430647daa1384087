import { bpToFactor, bpToPercent, centsToDollars, dollarsToCents, factorToBp, percentToBp, toWholeNumber } from './units';

describe('rate-book units', () => {
  it('reads dollars exactly into cents and writes them back', () => {
    // The demo rate book's terms (docs/pricing.md §3): $95.00 service call, $185.00 first hour.
    expect(dollarsToCents('95')).toBe(9_500);
    expect(dollarsToCents('$185.00')).toBe(18_500);
    expect(dollarsToCents('0.1')).toBe(10);
    expect(dollarsToCents('1,095.05')).toBe(109_505);
    // 0.29 × 100 is 28.999… in binary floating point; read digit by digit it is 29 cents.
    expect(dollarsToCents('0.29')).toBe(29);
    expect(centsToDollars(109_505)).toBe('1095.05');
    expect(centsToDollars(7)).toBe('0.07');
  });

  it('refuses amounts that are not plain dollars and cents', () => {
    for (const typed of ['', 'abc', '1.234', '-5', '12.']) expect(dollarsToCents(typed)).toBeNull();
  });

  it('reads percentages into basis points (35 % = 3,500 bp) and back', () => {
    expect(percentToBp('35')).toBe(3_500);
    expect(percentToBp('6.25 %')).toBe(625);
    expect(percentToBp('0')).toBe(0);
    expect(percentToBp('6.255')).toBeNull();
    expect(bpToPercent(3_500)).toBe('35');
    expect(bpToPercent(625)).toBe('6.25');
    expect(bpToPercent(650)).toBe('6.5');
  });

  it('reads labour multipliers into basis points (×1.3 = 13,000 bp) and back', () => {
    expect(factorToBp('1.3')).toBe(13_000);
    expect(factorToBp('×1.25')).toBe(12_500);
    expect(factorToBp('2')).toBe(20_000);
    expect(factorToBp('1.30001')).toBeNull();
    expect(bpToFactor(13_000)).toBe('1.3');
    expect(bpToFactor(12_500)).toBe('1.25');
    expect(bpToFactor(20_000)).toBe('2');
  });

  it('reads whole numbers only', () => {
    expect(toWholeNumber('60')).toBe(60);
    expect(toWholeNumber(15)).toBe(15);
    expect(toWholeNumber('1.5')).toBeNull();
    expect(toWholeNumber('')).toBeNull();
  });
});
