import * as z from 'zod';
import { trimmedText, VersionSchema } from '../http/bounds';

// Site visits: the real appointments at the property. Not the same thing as the quote's visits
// (groups of priced items that share a service call, `visitKey` in pricing): a booked site visit
// takes the items of one quoted visit, or every approved item not yet booked.

export const SITE_VISIT_STATUSES = ['booked', 'started', 'finished', 'cancelled'] as const;
export const SiteVisitStatusSchema = z.enum(SITE_VISIT_STATUSES);
export type SiteVisitStatus = z.infer<typeof SiteVisitStatusSchema>;

export const SITE_VISIT_STATUS_LABELS: Record<SiteVisitStatus, string> = {
  booked: 'Booked',
  started: 'On site',
  finished: 'Finished',
  cancelled: 'Cancelled',
};

/** The states of a visit that still happens or happened (a cancelled visit is kept only as history). */
export const PLANNED_VISIT_STATUSES = ['booked', 'started', 'finished'] as const satisfies readonly SiteVisitStatus[];
export type PlannedVisitStatus = (typeof PLANNED_VISIT_STATUSES)[number];

export const CANCEL_REASON_MAX = 500;

/** Calling off a booked visit: why (told to the seller's side and the electrician), and the version the person saw. */
export const CancelSiteVisitSchema = z.object({
  reason: trimmedText(CANCEL_REASON_MAX).pipe(z.string().min(3, 'Say why the visit is cancelled')),
  /** The visit's version as shown: a visit started or moved meanwhile answers 409. */
  version: VersionSchema,
});
export type CancelSiteVisit = z.input<typeof CancelSiteVisitSchema>;

const time = z.string().regex(/^([01]\d|2[0-3]):[0-5]\d$/, 'Enter a time as HH:MM');

export const BookSiteVisitSchema = z
  .object({
    date: z.iso.date({ error: 'Enter a date as YYYY-MM-DD' }),
    arrivalFrom: time,
    arrivalTo: time,
    electricianId: z.number({ error: 'Choose the electrician' }).int().positive('Choose the electrician'),
    /** Lockbox code or occupant contact; shown only to the assigned contractor and the listing agent. */
    accessNotes: trimmedText(1000).default(''),
    /** The quoted visit whose items this site visit takes; null takes every approved item not yet booked. */
    quotedVisitKey: z.string().max(40).nullable().default(null),
  })
  .refine((v) => v.arrivalTo > v.arrivalFrom, { error: 'The window ends after it starts', path: ['arrivalTo'] });
export type BookSiteVisit = z.input<typeof BookSiteVisitSchema>;

export const SiteVisitSchema = z.object({
  id: z.number().int(),
  /** Site visit 1, 2… of the request. */
  number: z.number().int(),
  date: z.string(),
  arrivalFrom: z.string(),
  arrivalTo: z.string(),
  electrician: z.object({ id: z.number().int(), name: z.string() }),
  status: SiteVisitStatusSchema,
  startedAt: z.string().nullable(),
  finishedAt: z.string().nullable(),
  /** Counts the visit's changes (moved, started, finished, cancelled): send it back with a cancellation. */
  version: z.number().int(),
  /** When a cancelled visit was called off, by whom and why (null otherwise). */
  cancellation: z.object({ at: z.string(), byName: z.string().nullable(), reason: z.string() }).nullable(),
  quotedVisitKey: z.string().nullable(),
  /** Items planned for this visit. */
  itemIds: z.array(z.number().int()),
  /** Null when the viewer may not see them (or none were given). */
  accessNotes: z.string().nullable(),
});
export type SiteVisit = z.infer<typeof SiteVisitSchema>;

export const ElectricianSchema = z.object({ id: z.number().int(), name: z.string() });
export type Electrician = z.infer<typeof ElectricianSchema>;
