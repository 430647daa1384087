import * as z from 'zod';
import { BoundedDateSchema, plainText, RecordIdSchema, wholeNumber } from '../http/bounds';

// Day economics: the pick list for a planned day or one visit, the first-visit outcome of each
// corrected item, and what a visit, a day, a week or a month earned.

/** Why an item needed another visit (recorded on its correction when it was not finished on the first). */
export const RETURN_CAUSES = ['part-not-on-truck', 'site-condition', 'no-access', 'change-order', 'rework-after-review', 'out-of-time', 'other'] as const;
export const ReturnCauseSchema = z.enum(RETURN_CAUSES);
export type ReturnCause = z.infer<typeof ReturnCauseSchema>;
export const RETURN_CAUSE_LABELS: Record<ReturnCause, string> = {
  'part-not-on-truck': 'Part not on the truck',
  'site-condition': 'Site condition found on arrival',
  'no-access': 'No access to the property',
  'change-order': 'Change order needed',
  'rework-after-review': 'Rework after the inspector’s review',
  'out-of-time': 'Ran out of time',
  other: 'Other',
};

/** Kinds a pick list is grouped by, in loading order. */
export const PICK_KINDS = ['devices', 'breakers', 'covers', 'boxes', 'wire-hardware', 'labels', 'other'] as const;
export type PickKind = (typeof PICK_KINDS)[number];
export const PICK_KIND_LABELS: Record<PickKind, string> = {
  devices: 'Devices',
  breakers: 'Breakers',
  covers: 'Covers and plates',
  boxes: 'Boxes and extensions',
  'wire-hardware': 'Wire, connectors and hardware',
  labels: 'Labels',
  other: 'Other',
};

export const PickListLineSchema = z.object({
  /** Stable key of the line (kind and material), what a tick names. */
  key: z.string(),
  kind: z.enum(PICK_KINDS),
  name: z.string(),
  /** Units the booked items need. */
  quantity: z.number().int(),
  /** Spare units from the entries' spare allowance. */
  spare: z.number().int(),
  /** quantity + spare: what goes on the truck. */
  total: z.number().int(),
  /** Whether a site condition (not the entry's own materials) adds it. */
  isSiteCondition: z.boolean(),
  /** Where it goes: "Site visit 1 · 14 Quarry Rd" … */
  forVisits: z.array(z.string()),
  isTicked: z.boolean(),
});
export type PickListLine = z.infer<typeof PickListLineSchema>;

export const PickListSchema = z.object({
  date: z.string(),
  electrician: z.object({ id: z.number().int(), name: z.string() }),
  /** Null for a whole day's list; the visit's id for one visit's. */
  siteVisitId: z.number().int().nullable(),
  visits: z.array(z.object({ id: z.number().int(), requestId: z.number().int(), reference: z.string(), street: z.string(), number: z.number().int(), itemCount: z.number().int() })),
  lines: z.array(PickListLineSchema),
  /** Booked items whose rate-book entry lists no materials (nothing to load for them, or not yet priced). */
  itemsWithoutMaterials: z.array(z.object({ itemId: z.number().int(), code: z.string(), reason: z.string() })),
  tickedCount: z.number().int(),
});
export type PickList = z.infer<typeof PickListSchema>;

export const DayQuerySchema = z.object({
  date: BoundedDateSchema,
  electricianId: z.coerce.number().int().positive().max(2_147_483_647, 'No record has this id'),
  siteVisitId: z.coerce.number().int().positive().max(2_147_483_647, 'No record has this id').optional(),
});
export type DayQuery = z.infer<typeof DayQuerySchema>;

export const TickPickLineSchema = z.object({
  date: BoundedDateSchema,
  electricianId: RecordIdSchema,
  lineKey: plainText(200).min(1),
  isTicked: z.boolean(),
});
export type TickPickLine = z.infer<typeof TickPickLineSchema>;

export const SpareAllowanceSchema = z.object({
  entryKey: plainText(60).min(1),
  spareUnits: wholeNumber(0, 20, 'a number of spare units'),
});
export const SpareSettingsSchema = z.object({ spares: z.array(SpareAllowanceSchema).max(1_000) });
export type SpareSettings = z.infer<typeof SpareSettingsSchema>;
export const SpareSettingsViewSchema = z.object({
  entries: z.array(z.object({ entryKey: z.string(), name: z.string(), hasMaterials: z.boolean(), spareUnits: z.number().int() })),
});
export type SpareSettingsView = z.infer<typeof SpareSettingsViewSchema>;

/** One site visit's money and minutes. Amounts in cents; rates in cents per hour (null: no minutes). */
export const VisitEconomicsSchema = z.object({
  siteVisitId: z.number().int(),
  requestId: z.number().int(),
  reference: z.string(),
  street: z.string(),
  date: z.string(),
  electrician: z.object({ id: z.number().int(), name: z.string() }),
  correctedCount: z.number().int(),
  /** What the corrected items billed, before tax (their share of their quoted visit's charges). */
  billedCents: z.number().int(),
  materialsCostCents: z.number().int(),
  /** billed − materials cost. */
  earningsCents: z.number().int(),
  /** From the visit's start to its finish; null while it is not finished. */
  onSiteMinutes: z.number().int().nullable(),
  /** From the day plan (to this visit; the day's last visit also the drive back to the shop); null when the day has no plan yet. */
  driveMinutes: z.number().int().nullable(),
  perOnSiteHourCents: z.number().int().nullable(),
  /** Per hour of on-site plus drive time. */
  perPaidHourCents: z.number().int().nullable(),
});
export type VisitEconomics = z.infer<typeof VisitEconomicsSchema>;

export const EconomicsTotalsSchema = z.object({
  visitCount: z.number().int(),
  correctedCount: z.number().int(),
  billedCents: z.number().int(),
  materialsCostCents: z.number().int(),
  earningsCents: z.number().int(),
  onSiteMinutes: z.number().int(),
  driveMinutes: z.number().int(),
  perOnSiteHourCents: z.number().int().nullable(),
  perPaidHourCents: z.number().int().nullable(),
  /** Visits not finished yet or without a day plan: their minutes are left out. */
  visitsWithoutMinutes: z.number().int(),
});
export type EconomicsTotals = z.infer<typeof EconomicsTotalsSchema>;

export const DayEconomicsSchema = z.object({
  date: z.string(),
  electrician: z.object({ id: z.number().int(), name: z.string() }),
  hasDayPlan: z.boolean(),
  visits: z.array(VisitEconomicsSchema),
  totals: EconomicsTotalsSchema,
  /** The rate book's first-hour minimum, for comparison. */
  firstHourMinimumCents: z.number().int(),
});
export type DayEconomics = z.infer<typeof DayEconomicsSchema>;

export const PeriodQuerySchema = z
  .object({
    from: BoundedDateSchema,
    to: BoundedDateSchema,
    electricianId: z.coerce.number().int().positive().max(2_147_483_647, 'No record has this id').optional(),
  })
  .refine((q) => q.to >= q.from, { error: 'The period ends before it starts', path: ['to'] })
  .refine((q) => Date.parse(q.to) - Date.parse(q.from) <= 92 * 86_400_000, { error: 'Choose at most 93 days', path: ['to'] });
export type PeriodQuery = z.infer<typeof PeriodQuerySchema>;

export const SingleVisitRateSchema = z.object({
  /** The code, the electrician's name or the month (YYYY-MM). */
  group: z.string(),
  items: z.number().int(),
  firstVisit: z.number().int(),
  /** firstVisit / items in basis points (10,000 = 100 %). */
  rateBp: z.number().int(),
});
export type SingleVisitRate = z.infer<typeof SingleVisitRateSchema>;

export const MinutesVsBookRowSchema = z.object({
  code: z.string(),
  entryKey: z.string(),
  entryName: z.string(),
  /** The rate book's labour minutes per unit (null for a flat-rate entry, which names none). */
  bookMinutesPerUnit: z.number().int().nullable(),
  samples: z.number().int(),
  medianMinutesPerUnit: z.number().int(),
  /** median − book (positive: takes longer than priced). */
  differenceMinutes: z.number().int().nullable(),
  verdict: z.enum(['priced-low', 'priced-high', 'about-right', 'no-book-minutes']),
});
export type MinutesVsBookRow = z.infer<typeof MinutesVsBookRowSchema>;

export const PeriodEconomicsSchema = z.object({
  from: z.string(),
  to: z.string(),
  hasDayPlan: z.boolean(),
  days: z.array(z.object({ date: z.string(), totals: EconomicsTotalsSchema })),
  visits: z.array(VisitEconomicsSchema),
  totals: EconomicsTotalsSchema,
  singleVisit: z.object({
    overall: SingleVisitRateSchema,
    byCode: z.array(SingleVisitRateSchema),
    byElectrician: z.array(SingleVisitRateSchema),
    byMonth: z.array(SingleVisitRateSchema),
    causes: z.array(z.object({ cause: ReturnCauseSchema, count: z.number().int() })),
  }),
  minutesVsBook: z.array(MinutesVsBookRowSchema),
});
export type PeriodEconomics = z.infer<typeof PeriodEconomicsSchema>;

/** A photo attached at intake by the agent or the seller. */
export const IntakePhotoSchema = z.object({
  id: z.number().int(),
  itemId: z.number().int().nullable(),
  caption: z.string(),
  width: z.number().int(),
  height: z.number().int(),
  uploadedByName: z.string().nullable(),
  url: z.string(),
});
export type IntakePhoto = z.infer<typeof IntakePhotoSchema>;

export const IntakePhotoFieldsSchema = z.object({
  itemId: z.coerce.number().int().positive().max(2_147_483_647, 'No record has this id').optional(),
  caption: plainText(200).default(''),
});

/** What the electrician reads before the truck rolls: intake photos and the report's evidence per item. */
export const VisitPrepSchema = z.object({
  photos: z.array(IntakePhotoSchema),
  evidence: z.array(z.object({ itemId: z.number().int(), evidence: z.string(), page: z.number().int().nullable() })),
  canAddPhotos: z.boolean(),
});
export type VisitPrep = z.infer<typeof VisitPrepSchema>;
export const MAX_INTAKE_PHOTOS = 12;
