import * as z from 'zod';
import { trimmedText } from '../http/bounds';

// Site visits: the real appointments at the property. Not the same thing as the quote's visits
// (groups of priced items that share a service call, `visitKey` in pricing): a booked site visit
// takes the items of one quoted visit, or every approved item not yet booked.

export const SITE_VISIT_STATUSES = ['booked', 'started', 'finished'] as const;
export const SiteVisitStatusSchema = z.enum(SITE_VISIT_STATUSES);
export type SiteVisitStatus = z.infer<typeof SiteVisitStatusSchema>;

export const SITE_VISIT_STATUS_LABELS: Record<SiteVisitStatus, string> = {
  booked: 'Booked',
  started: 'On site',
  finished: 'Finished',
};

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
  quotedVisitKey: z.string().nullable(),
  /** Items planned for this visit. */
  itemIds: z.array(z.number().int()),
  /** Null when the viewer may not see them (or none were given). */
  accessNotes: z.string().nullable(),
});
export type SiteVisit = z.infer<typeof SiteVisitSchema>;

export const ElectricianSchema = z.object({ id: z.number().int(), name: z.string() });
export type Electrician = z.infer<typeof ElectricianSchema>;
