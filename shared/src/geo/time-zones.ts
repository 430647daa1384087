import { TZDate } from '@date-fns/tz';
import type { UsState } from '../requests/us-state';

// Local time where a contractor works: visits are booked, planned and written to calendars in the
// organisation's time zone (an IANA time zone database name). Until an office user chooses one,
// the zone is the one that covers most of the shop's state (from memory of the IANA tz database's
// zone.tab; states split between zones take their most populous part: adjust it in the settings).

export const STATE_TIME_ZONES: Record<UsState, string> = {
  AL: 'America/Chicago', AK: 'America/Anchorage', AZ: 'America/Phoenix', AR: 'America/Chicago', CA: 'America/Los_Angeles',
  CO: 'America/Denver', CT: 'America/New_York', DE: 'America/New_York', DC: 'America/New_York', FL: 'America/New_York',
  GA: 'America/New_York', HI: 'Pacific/Honolulu', ID: 'America/Boise', IL: 'America/Chicago', IN: 'America/Indiana/Indianapolis',
  IA: 'America/Chicago', KS: 'America/Chicago', KY: 'America/New_York', LA: 'America/Chicago', ME: 'America/New_York',
  MD: 'America/New_York', MA: 'America/New_York', MI: 'America/Detroit', MN: 'America/Chicago', MS: 'America/Chicago',
  MO: 'America/Chicago', MT: 'America/Denver', NE: 'America/Chicago', NV: 'America/Los_Angeles', NH: 'America/New_York',
  NJ: 'America/New_York', NM: 'America/Denver', NY: 'America/New_York', NC: 'America/New_York', ND: 'America/Chicago',
  OH: 'America/New_York', OK: 'America/Chicago', OR: 'America/Los_Angeles', PA: 'America/New_York', RI: 'America/New_York',
  SC: 'America/New_York', SD: 'America/Chicago', TN: 'America/Chicago', TX: 'America/Chicago', UT: 'America/Denver',
  VT: 'America/New_York', VA: 'America/New_York', WA: 'America/Los_Angeles', WV: 'America/New_York', WI: 'America/Chicago',
  WY: 'America/Denver',
};

/** The zones offered in the settings: those of the table, plus the few US zones it leaves out. */
export const US_TIME_ZONES: readonly string[] = [
  ...new Set([...Object.values(STATE_TIME_ZONES), 'America/Indiana/Knox', 'America/Kentucky/Louisville', 'America/North_Dakota/Center', 'America/Adak', 'America/Puerto_Rico']),
].sort();

/** Used when an organisation has neither a chosen zone nor a state to take one from. */
export const FALLBACK_TIME_ZONE = 'UTC';

/** Whether `name` is a time zone this runtime knows (its Intl data is the IANA database). */
export function isTimeZone(name: string): boolean {
  if (!/^[A-Za-z_]+(\/[A-Za-z0-9_+-]+){0,2}$/.test(name)) return false;
  try {
    new Intl.DateTimeFormat('en-US', { timeZone: name });
    return true;
  } catch {
    return false;
  }
}

/** The organisation's zone: the one chosen, else its shop's (or licence's) state's, else UTC. */
export function effectiveTimeZone(chosen: string | null, ...states: (string | null | undefined)[]): string {
  if (chosen && isTimeZone(chosen)) return chosen;
  for (const state of states) if (state && state in STATE_TIME_ZONES) return STATE_TIME_ZONES[state as UsState];
  return FALLBACK_TIME_ZONE;
}

/** The date (YYYY-MM-DD) and time of day (HH:MM) on the wall clock of `zone` at instant `at`. */
export function wallClock(zone: string, at: Date | number): { date: string; clock: string } {
  const local = new TZDate(typeof at === 'number' ? at : at.getTime(), zone);
  const two = (n: number) => String(n).padStart(2, '0');
  return { date: `${local.getFullYear()}-${two(local.getMonth() + 1)}-${two(local.getDate())}`, clock: `${two(local.getHours())}:${two(local.getMinutes())}` };
}

/** Today's date (YYYY-MM-DD) in `zone`: where bookings, quote validity and day plans begin and end. */
export function todayIn(zone: string, now: number = Date.now()): string {
  return wallClock(zone, now).date;
}

/** The instant at which the wall clock of `zone` shows `date` (YYYY-MM-DD) at `clock` (HH:MM). */
export function instantOf(zone: string, date: string, clock: string): Date {
  const [y, m, d] = date.split('-').map(Number);
  const [h, min] = clock.split(':').map(Number);
  return new Date(new TZDate(y, m - 1, d, h, min, zone).getTime());
}

/** The calendar date `days` after `date` (both YYYY-MM-DD; no time zone involved). */
export function addDays(date: string, days: number): string {
  return new Date(Date.parse(`${date}T00:00:00Z`) + days * 86_400_000).toISOString().slice(0, 10);
}
