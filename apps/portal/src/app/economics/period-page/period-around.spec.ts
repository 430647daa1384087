import { periodAround } from './period-page';

describe('periodAround', () => {
  // Calendar facts (ISO 8601 weeks start on Monday): 2026-12-02 is a Wednesday; December has 31 days, February 2028 has 29.
  it.each([
    ['2026-12-02', 'week', '2026-11-30', '2026-12-06'],
    ['2026-12-06', 'week', '2026-11-30', '2026-12-06'],
    ['2026-12-07', 'week', '2026-12-07', '2026-12-13'],
    ['2026-12-02', 'month', '2026-12-01', '2026-12-31'],
    ['2028-02-10', 'month', '2028-02-01', '2028-02-29'],
  ] as const)('%s, %s: %s to %s', (anchor, span, from, to) => {
    expect(periodAround(anchor, span)).toEqual({ from, to });
  });
});
