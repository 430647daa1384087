import { formatCents, formatCentsDelta, MoneyPipe } from './money';

describe('formatCents', () => {
  it('shows whole cents as US dollars with thousands separators', () => {
    // Worked example 1 of docs/pricing.md: one GFCI on its own visit totals 31,434 cents.
    expect(formatCents(31_434)).toBe('$314.34');
    expect(formatCents(8_093_400)).toBe('$80,934.00');
    expect(formatCents(0)).toBe('$0.00');
  });

  it('signs a difference and shows no sign for none', () => {
    expect(formatCentsDelta(13_560)).toBe('+$135.60');
    expect(formatCentsDelta(-350)).toBe('−$3.50');
    expect(formatCentsDelta(0)).toBe('$0.00');
  });

  it('shows a dash for a price not known yet', () => {
    expect(new MoneyPipe().transform(null)).toBe('—');
    expect(new MoneyPipe().transform(19_000)).toBe('$190.00');
  });
});
