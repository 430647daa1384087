// The times of an ordered day: drive, wait for the booked window, work, lunch, drive back. Pure
// computation on whole minutes; times are HH:MM strings of the day.

export const minutesOfDay = (clock: string): number => Number(clock.slice(0, 2)) * 60 + Number(clock.slice(3, 5));

/** HH:MM of minutes since midnight (a day that runs past midnight shows hours past 24). */
export function clockOf(minutes: number): string {
  const whole = Math.max(0, Math.round(minutes));
  return `${String(Math.floor(whole / 60)).padStart(2, '0')}:${String(whole % 60).padStart(2, '0')}`;
}

export interface WorkingDay {
  dayStart: string;
  dayEnd: string;
  lunchStart: string;
  lunchMinutes: number;
}

export interface StopToSchedule {
  /** Drive from the shop or the previous stop (0 when it cannot be known). */
  driveMinutes: number;
  onSiteMinutes: number;
  /** The arrival window the seller was given. */
  arrivalFrom: string;
  arrivalTo: string;
}

export interface ScheduledStop {
  arrival: string;
  start: string;
  finish: string;
  waitMinutes: number;
  isLate: boolean;
  lunchBefore: boolean;
}

export interface DaySchedule {
  /** Leaving the shop. */
  leaveAt: string;
  stops: ScheduledStop[];
  lunch: { from: string; to: string } | null;
  /** Back at the shop. */
  finish: string;
  overflowMinutes: number;
}

/**
 * Leaves the shop in time to reach the first stop as its window opens, never before the start of the
 * day, and takes the stops in order. At a later stop reached before its window opens the electrician
 * waits; one reached after it closes is late. Lunch is taken at the first departure at or after lunch
 * time (before driving on); a day whose work ends before lunch time has none.
 */
export function scheduleDay(day: WorkingDay, stops: readonly StopToSchedule[], returnDriveMinutes: number): DaySchedule {
  const lunchAt = minutesOfDay(day.lunchStart);
  const first = stops[0];
  let clock = Math.max(minutesOfDay(day.dayStart), first ? minutesOfDay(first.arrivalFrom) - first.driveMinutes : 0);
  const leaveAt = clockOf(clock);
  let lunch: DaySchedule['lunch'] = null;
  const takeLunchIfDue = (): boolean => {
    if (lunch || day.lunchMinutes === 0 || clock < lunchAt) return false;
    lunch = { from: clockOf(clock), to: clockOf(clock + day.lunchMinutes) };
    clock += day.lunchMinutes;
    return true;
  };
  const scheduled = stops.map((stop): ScheduledStop => {
    const lunchBefore = takeLunchIfDue();
    clock += stop.driveMinutes;
    const arrival = clock;
    const waitMinutes = Math.max(0, minutesOfDay(stop.arrivalFrom) - arrival);
    const start = arrival + waitMinutes;
    clock = start + stop.onSiteMinutes;
    return { arrival: clockOf(arrival), start: clockOf(start), finish: clockOf(clock), waitMinutes, isLate: arrival > minutesOfDay(stop.arrivalTo), lunchBefore };
  });
  if (stops.length) takeLunchIfDue();
  const back = clock + (stops.length ? returnDriveMinutes : 0);
  return { leaveAt, stops: scheduled, lunch, finish: clockOf(back), overflowMinutes: Math.max(0, back - minutesOfDay(day.dayEnd)) };
}

/** Common practice for short pre-closing visits: 3–5 a day per electrician, each within about 20–30 minutes' drive. */
export const USUAL_MAX_VISITS_PER_DAY = 5;
export const USUAL_MAX_DRIVE_MINUTES = 30;

export interface PlanFacts {
  dayEnd: string;
  overflowMinutes: number;
  stops: readonly { address: string; driveMinutes: number | null; isLate: boolean; arrival: string; arrivalFrom: string; arrivalTo: string; hasPlace: boolean }[];
  isShopLocated: boolean;
}

/** What the office should know about a planned day, in plain sentences, most pressing first. */
export function dayPlanWarnings(facts: PlanFacts): string[] {
  const warnings: string[] = [];
  if (facts.overflowMinutes > 0) {
    warnings.push(`The day runs ${facts.overflowMinutes} minutes past ${facts.dayEnd}: move a visit to another day or electrician.`);
  }
  for (const stop of facts.stops) {
    if (stop.isLate) warnings.push(`${stop.address}: the planned arrival ${stop.arrival} is after the window ${stop.arrivalFrom}–${stop.arrivalTo} the seller was given.`);
  }
  if (!facts.isShopLocated) warnings.push('The shop has no place on the map: enter its ZIP code or coordinates in the day-plan settings. Drives are not counted.');
  for (const stop of facts.stops) {
    if (!stop.hasPlace) warnings.push(`${stop.address}: its ZIP code is not in the ZIP-code list. Enter the property's coordinates; until then its drive is not counted.`);
  }
  if (facts.stops.length > USUAL_MAX_VISITS_PER_DAY) {
    warnings.push(`${facts.stops.length} visits: more than the usual 3–5 short visits a day for one electrician.`);
  }
  for (const stop of facts.stops) {
    if (stop.driveMinutes !== null && stop.driveMinutes > USUAL_MAX_DRIVE_MINUTES) {
      warnings.push(`${stop.address}: ${stop.driveMinutes} minutes' drive, longer than the 20–30 minutes that keep short visits worthwhile.`);
    }
  }
  return warnings;
}
