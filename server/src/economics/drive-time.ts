/**
 * Drive time comes from the day plan (route order and drive minutes of an electrician's day); this
 * is the one place the economics read it. No second distance or route computation happens here.
 */
export interface PlannedStop {
  siteVisitId: number;
  /** Minutes of driving to this stop from the previous one (or from the start of the day). */
  driveMinutes: number;
}

/** An electrician's planned day, ordered; null when the day has no plan. */
export type DriveTimeSource = (organisationId: number, electricianId: number, date: string) => Promise<PlannedStop[] | null>;

/** Until a day plan exists, no day has drive minutes: the paid-hour rate says so instead of guessing. */
export const noDayPlan: DriveTimeSource = async () => null;
