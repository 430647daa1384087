import type { Db } from '../db/knex';
import { planDay } from '../day-plan/plan-day';

/**
 * Drive time comes from the day plan (route order and drive minutes of an electrician's day); this
 * is the one place the economics read it. No second distance or route computation happens here.
 */
export interface PlannedStop {
  siteVisitId: number;
  /** Minutes of driving to this stop from the previous one (or from the shop); the day's last stop also carries the drive back to the shop. */
  driveMinutes: number;
}

/** An electrician's planned day, ordered; null when the day has no plan. */
export type DriveTimeSource = (organisationId: number, electricianId: number, date: string) => Promise<PlannedStop[] | null>;

/** No drive minutes for any day (tests of what the economics do without a plan): the paid-hour rate says so instead of guessing. */
export const noDayPlan: DriveTimeSource = async () => null;

/**
 * Drive minutes from the day plan (server/src/day-plan): the minutes to each stop from the previous one
 * (the first from the shop), and the drive back to the shop added to the day's last stop, so that the
 * stops add up to the day plan's total drive. A day without visits has no plan.
 */
export function dayPlanDriveTime(db: Db): DriveTimeSource {
  return async (organisationId, electricianId, date) => {
    const plan = await planDay(db, organisationId, electricianId, date);
    const last = plan.stops.length - 1;
    return last < 0 ? null : plan.stops.map((s, i) => ({ siteVisitId: s.visitId, driveMinutes: (s.driveMinutes ?? 0) + (i === last ? (plan.returnDriveMinutes ?? 0) : 0) }));
  };
}
