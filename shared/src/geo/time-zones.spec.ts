import { effectiveTimeZone, instantOf, isTimeZone, STATE_TIME_ZONES, todayIn, US_TIME_ZONES, wallClock } from './time-zones';

// Offsets and daylight-saving dates: IANA tz database (America/Denver is UTC-7 standard, UTC-6 daylight;
// America/Phoenix keeps UTC-7 all year) and the US rule since 2007 (15 U.S.C. 260a: daylight time from
// the second Sunday of March to the first Sunday of November, at 2:00 local).
describe('time zones', () => {
  it('knows IANA names and refuses others', () => {
    expect(isTimeZone('America/Denver')).toBe(true);
    expect(isTimeZone('UTC')).toBe(true);
    expect(isTimeZone('Mars/Olympus_Mons')).toBe(false);
    expect(isTimeZone('America/Denver; DROP')).toBe(false);
    expect(US_TIME_ZONES.every(isTimeZone)).toBe(true);
    expect(Object.values(STATE_TIME_ZONES).every(isTimeZone)).toBe(true);
  });

  it('takes the chosen zone, else the first state that has one, else UTC', () => {
    expect(effectiveTimeZone('America/Boise', 'CO')).toBe('America/Boise');
    expect(effectiveTimeZone(null, 'CO', 'AZ')).toBe('America/Denver');
    expect(effectiveTimeZone(null, null, 'AZ')).toBe('America/Phoenix');
    expect(effectiveTimeZone('Not/AZone', 'HI')).toBe('Pacific/Honolulu');
    expect(effectiveTimeZone(null)).toBe('UTC');
  });

  it.each([
    // [zone, instant (UTC), wall date, wall clock]
    ['America/Denver', '2026-12-03T02:30:00Z', '2026-12-02', '19:30'], // MST, UTC-7: still the evening before
    ['America/Denver', '2026-07-01T18:00:00Z', '2026-07-01', '12:00'], // MDT, UTC-6
    ['America/Phoenix', '2026-07-01T18:00:00Z', '2026-07-01', '11:00'], // no daylight time, UTC-7
    ['America/New_York', '2026-03-08T07:30:00Z', '2026-03-08', '03:30'], // just after the spring change (EDT)
  ])('reads the wall clock of %s at %s', (zone, at, date, clock) => {
    expect(wallClock(zone, new Date(at))).toEqual({ date, clock });
  });

  it.each([
    ['America/Denver', '2026-12-04', '08:00', '2026-12-04T15:00:00.000Z'],
    ['America/Denver', '2026-07-01', '08:00', '2026-07-01T14:00:00.000Z'],
    ['Pacific/Honolulu', '2026-07-01', '08:00', '2026-07-01T18:00:00.000Z'],
  ])('finds the instant of %s %s %s', (zone, date, clock, iso) => {
    expect(instantOf(zone, date, clock).toISOString()).toBe(iso);
  });
});

describe('todayIn', () => {
  // 2026-12-03T05:30Z is 22:30 on 2 December in Denver (UTC-7 in winter, IANA tz database).
  it('is the date on the zone’s wall clock, not the UTC date', () => {
    const at = Date.parse('2026-12-03T05:30:00Z');
    expect(todayIn('America/Denver', at)).toBe('2026-12-02');
    expect(todayIn('UTC', at)).toBe('2026-12-03');
  });
});
