// How long a quote's prices hold: the rate book's days after the day the quote was sent, counted in
// the contractor's time zone. Offsets from the IANA tz database; US daylight-saving time starts on
// the second Sunday of March (15 U.S.C. 260a), 2027-03-14.
import { validUntil } from '../../server/src/quotes/quote-composer';

describe('validUntil (the last day a quote holds)', () => {
  it('counts from the day it was sent where the contractor works, not from the UTC date', () => {
    // 05:30 UTC on 3 December is 22:30 on 2 December in Denver (UTC-7 in winter).
    const sentAt = new Date('2026-12-03T05:30:00Z');
    expect(validUntil(sentAt, 30, 'America/Denver')).toBe('2027-01-01');
    expect(validUntil(sentAt, 30, 'UTC')).toBe('2027-01-02');
  });

  it('keeps Honolulu’s day until 10:00 UTC (UTC-10 all year)', () => {
    expect(validUntil(new Date('2026-12-03T09:59:00Z'), 30, 'Pacific/Honolulu')).toBe('2027-01-01');
    expect(validUntil(new Date('2026-12-03T10:00:00Z'), 30, 'Pacific/Honolulu')).toBe('2027-01-02');
  });

  it('counts calendar days across the start of daylight-saving time and the end of a year', () => {
    // 08:30 UTC on 14 March 2027 is 01:30 MST, before the clocks go forward at 02:00.
    expect(validUntil(new Date('2027-03-14T08:30:00Z'), 1, 'America/Denver')).toBe('2027-03-15');
    expect(validUntil(new Date('2027-12-31T18:00:00Z'), 1, 'America/New_York')).toBe('2028-01-01');
    expect(validUntil(new Date('2028-02-28T12:00:00Z'), 1, 'America/Chicago')).toBe('2028-02-29');
  });
});
