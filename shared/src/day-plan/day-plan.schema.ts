import * as z from 'zod';
import { BoundedDateSchema, INT4_MAX, RecordIdSchema, trimmedText } from '../http/bounds';
import { US_STATES } from '../requests/us-state';
import { isTimeZone } from '../geo/time-zones';

// The day plan of an electrician: the site visits of one date, ordered to keep driving short, with
// their times against the working day. The settings belong to the contractor organisation.

const clock = z.string().regex(/^([01]\d|2[0-3]):[0-5]\d$/, 'Enter a time as HH:MM');
const whole = (min: number, max: number, what: string) =>
  z.number({ error: `Enter ${what}` }).int(`Enter ${what} as a whole number`).min(min, `Use at least ${min}`).max(max, `Use at most ${max}`);

export const LatitudeSchema = z.number({ error: 'Enter the latitude' }).min(-90, 'A latitude is between -90 and 90').max(90, 'A latitude is between -90 and 90');
export const LongitudeSchema = z.number({ error: 'Enter the longitude' }).min(-180, 'A longitude is between -180 and 180').max(180, 'A longitude is between -180 and 180');

export const ShopAddressSchema = z.object({
  street: trimmedText(200),
  city: trimmedText(100),
  state: z.enum(US_STATES, { error: 'Choose a state' }),
  zip: z.string().trim().regex(/^\d{5}$/, 'Enter a five-digit ZIP code'),
  /** A point typed in or dropped for the shop; null uses the ZIP code's centre. */
  latitude: LatitudeSchema.nullable().default(null),
  longitude: LongitudeSchema.nullable().default(null),
}).refine((shop) => (shop.latitude === null) === (shop.longitude === null), { error: 'Enter both coordinates, or neither', path: ['longitude'] });

const settingsShape = {
  /** Road distance per straight-line distance, in percent (130: roads are 1.3 times the line). */
  roadFactorPercent: whole(100, 300, 'the road factor'),
  averageSpeedMph: whole(5, 80, 'the average speed'),
  /** Minutes added to each visit for parking, greeting, protecting floors and packing up. */
  setupMinutes: whole(0, 120, 'the set-up minutes'),
  /** On-site minutes of a flat-rate item, whose price carries no labour minutes. */
  flatItemMinutes: whole(0, 480, 'the minutes of a flat-rate item'),
  dayStart: clock,
  dayEnd: clock,
  lunchStart: clock,
  lunchMinutes: whole(0, 120, 'the lunch minutes'),
  shop: ShopAddressSchema,
  /** The organisation's time zone (IANA name) for booking and calendars; null: the zone of the shop's state. */
  timeZone: z.string().trim().max(64, 'Choose a time zone from the list').refine(isTimeZone, 'Choose a time zone from the list').nullable().default(null),
};

const dayOrder = (s: { dayStart: string; dayEnd: string; lunchStart: string }, ctx: z.RefinementCtx) => {
  if (s.dayEnd <= s.dayStart) ctx.addIssue({ code: 'custom', message: 'The day ends after it starts', path: ['dayEnd'] });
  if (s.lunchStart < s.dayStart || s.lunchStart >= s.dayEnd) ctx.addIssue({ code: 'custom', message: 'Lunch starts within the working day', path: ['lunchStart'] });
};

/** `version` is the one read (0 while the organisation still has the defaults). */
export const UpdateDayPlanSettingsSchema = z.object({ ...settingsShape, version: z.number().int().min(0).max(INT4_MAX, 'No record has this version') }).superRefine(dayOrder);
export type UpdateDayPlanSettings = z.input<typeof UpdateDayPlanSettingsSchema>;

export const DayPlanSettingsSchema = z.object({
  ...settingsShape,
  version: z.number().int(),
  /** Whether the shop has a place on the map (its ZIP code is known, or a point was entered). */
  isShopLocated: z.boolean(),
  /** The zone in use: the one chosen, else the shop's state's. */
  effectiveTimeZone: z.string(),
});
export type DayPlanSettings = z.infer<typeof DayPlanSettingsSchema>;

/** Defaults until an office user saves the organisation's own settings (common practice; adjust to the area). */
export const DEFAULT_DAY_PLAN_SETTINGS = {
  roadFactorPercent: 130,
  averageSpeedMph: 30,
  setupMinutes: 15,
  flatItemMinutes: 30,
  dayStart: '07:30',
  dayEnd: '16:30',
  lunchStart: '12:00',
  lunchMinutes: 30,
} as const;

export const LOCATION_SOURCES = ['pin', 'zip'] as const;
export type LocationSource = (typeof LOCATION_SOURCES)[number];

export const PlaceSchema = z.object({
  latitude: z.number(),
  longitude: z.number(),
  /** `pin`: coordinates entered for the property; `zip`: the centre of its ZIP code area. */
  source: z.enum(LOCATION_SOURCES),
});
export type Place = z.infer<typeof PlaceSchema>;

/** Coordinates the contractor enters for a property (a dropped pin or typed in); null and null go back to the ZIP code. */
export const SetPropertyLocationSchema = z
  .object({ latitude: LatitudeSchema.nullable(), longitude: LongitudeSchema.nullable() })
  .refine((v) => (v.latitude === null) === (v.longitude === null), { error: 'Enter both coordinates, or neither', path: ['longitude'] });
export type SetPropertyLocation = z.input<typeof SetPropertyLocationSchema>;

export const DayPlanStopSchema = z.object({
  visitId: z.number().int(),
  requestId: z.number().int(),
  visitNumber: z.number().int(),
  address: z.string(),
  /** Cancelled visits are not planned: the day and the week leave them out. */
  status: z.enum(['booked', 'started', 'finished']),
  /** The visit's version, sent back when it is cancelled from the day plan. */
  visitVersion: z.number().int(),
  arrivalFrom: z.string(),
  arrivalTo: z.string(),
  place: PlaceSchema.nullable(),
  itemCount: z.number().int(),
  /** The drive from the shop or the previous stop (null when either has no place). */
  driveMiles: z.number().nullable(),
  driveMinutes: z.number().int().nullable(),
  /** Planned times, HH:MM. */
  arrival: z.string(),
  start: z.string(),
  finish: z.string(),
  /** Minutes waited for the booked window to open. */
  waitMinutes: z.number().int(),
  onSiteMinutes: z.number().int(),
  /** The planned arrival is after the window the seller was given. */
  isLate: z.boolean(),
  /** Lunch is taken before this stop. */
  lunchBefore: z.boolean(),
});
export type DayPlanStop = z.infer<typeof DayPlanStopSchema>;

export const DayPlanSuggestionSchema = z.object({
  requestId: z.number().int(),
  address: z.string(),
  closingDate: z.string(),
  itemCount: z.number().int(),
  onSiteMinutes: z.number().int(),
  /** Extra driving the job adds where it fits best in the route. */
  detourMinutes: z.number().int(),
  /** The arrival window it would be booked with. */
  arrivalFrom: z.string(),
  arrivalTo: z.string(),
});
export type DayPlanSuggestion = z.infer<typeof DayPlanSuggestionSchema>;

export const DayPlanSchema = z.object({
  date: z.string(),
  electrician: z.object({ id: z.number().int(), name: z.string() }),
  dayStart: z.string(),
  dayEnd: z.string(),
  /** Leaving the shop, HH:MM: in time for the first stop's window, never before the day starts. */
  leaveAt: z.string(),
  stops: z.array(DayPlanStopSchema),
  returnDriveMiles: z.number().nullable(),
  returnDriveMinutes: z.number().int().nullable(),
  /** Back at the shop, HH:MM (may be past midnight's 24:00 only in theory: the day is capped in minutes). */
  finish: z.string(),
  lunch: z.object({ from: z.string(), to: z.string() }).nullable(),
  totalDriveMinutes: z.number().int(),
  totalOnSiteMinutes: z.number().int(),
  /** Minutes past the end of the working day (0: the day fits). */
  overflowMinutes: z.number().int(),
  warnings: z.array(z.string()),
  suggestions: z.array(DayPlanSuggestionSchema),
});
export type DayPlan = z.infer<typeof DayPlanSchema>;

export const DayPlanQuerySchema = z.object({
  date: BoundedDateSchema,
  electricianId: z.coerce.number({ error: 'Choose the electrician' }).int().positive().max(2_147_483_647, 'No record has this id'),
});

export const WeekQuerySchema = z.object({ start: BoundedDateSchema });

export const WeekVisitSchema = z.object({
  visitId: z.number().int(),
  requestId: z.number().int(),
  visitNumber: z.number().int(),
  address: z.string(),
  arrivalFrom: z.string(),
  arrivalTo: z.string(),
  status: z.enum(['booked', 'started', 'finished']),
});
export type WeekVisit = z.infer<typeof WeekVisitSchema>;

export const WeekDaySchema = z.object({
  date: z.string(),
  electricianId: z.number().int(),
  visits: z.array(WeekVisitSchema),
  driveMinutes: z.number().int(),
  onSiteMinutes: z.number().int(),
  overflowMinutes: z.number().int(),
});
export type WeekDay = z.infer<typeof WeekDaySchema>;

export const WeekPlanSchema = z.object({
  start: z.string(),
  dates: z.array(z.string()),
  electricians: z.array(z.object({ id: z.number().int(), name: z.string() })),
  days: z.array(WeekDaySchema),
});
export type WeekPlan = z.infer<typeof WeekPlanSchema>;

export const MoveVisitSchema = z
  .object({
    date: BoundedDateSchema,
    electricianId: RecordIdSchema,
    arrivalFrom: clock.optional(),
    arrivalTo: clock.optional(),
  })
  .refine((v) => (v.arrivalFrom === undefined) === (v.arrivalTo === undefined), { error: 'Give both ends of the window, or neither', path: ['arrivalTo'] })
  .refine((v) => v.arrivalFrom === undefined || v.arrivalTo! > v.arrivalFrom, { error: 'The window ends after it starts', path: ['arrivalTo'] });
export type MoveVisit = z.input<typeof MoveVisitSchema>;

export const MoveVisitResultSchema = z.object({ from: DayPlanSchema, to: DayPlanSchema });
export type MoveVisitResult = z.infer<typeof MoveVisitResultSchema>;

export const BookSuggestionSchema = z.object({ requestId: RecordIdSchema, date: BoundedDateSchema, electricianId: RecordIdSchema });
export type BookSuggestion = z.input<typeof BookSuggestionSchema>;

export const CalendarFeedSchema = z.object({ url: z.string() });
export type CalendarFeed = z.infer<typeof CalendarFeedSchema>;
