import { toIsoDate, toIsoDateOrEmpty } from './iso-date';

describe('toIsoDate', () => {
  it('writes the local calendar date with zero padding', () => {
    expect(toIsoDate(new Date(2026, 0, 5, 23, 59))).toBe('2026-01-05');
    expect(toIsoDate(new Date(2026, 11, 31, 0, 0))).toBe('2026-12-31');
  });
});

describe('toIsoDateOrEmpty', () => {
  it('gives an empty string for missing or invalid dates', () => {
    expect(toIsoDateOrEmpty(null)).toBe('');
    expect(toIsoDateOrEmpty(new Date('not a date'))).toBe('');
    expect(toIsoDateOrEmpty('2026-06-30')).toBe('');
  });

  it('converts a valid date', () => {
    expect(toIsoDateOrEmpty(new Date(2026, 5, 30))).toBe('2026-06-30');
  });
});
