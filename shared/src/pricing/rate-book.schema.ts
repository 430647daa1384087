import * as z from 'zod';

/**
 * A contractor organisation's rate book: its visit terms, its priced entries (one or more per
 * finding code, plus custom entries) and its own site conditions ("adders").
 *
 * Integer units, used everywhere in pricing:
 * - money: whole US cents (`…Cents`);
 * - time: whole minutes (`…Minutes`);
 * - shares and multipliers: basis points (`…Bp`), 10,000 bp = 100 % = ×1.
 *   A 35 % markup is 3,500 bp; a ×1.3 labour multiplier is 13,000 bp.
 */

const cents = z.number().int().nonnegative().max(100_000_000);
const minutes = z.number().int().nonnegative().max(10_000);
const slug = z
  .string()
  .regex(/^[a-z0-9]+(-[a-z0-9]+)*$/, 'Use lower-case letters, digits and single hyphens')
  .max(60);

/** Shares of an amount (markup, tax, deposit), 0 bp to 50,000 bp (0 % to 500 %). */
export const ShareBpSchema = z.number().int().nonnegative().max(50_000);
/** Labour multipliers: ×1 (10,000 bp) up to ×4 (40,000 bp). */
export const MultiplierBpSchema = z.number().int().min(10_000).max(40_000);

/** Finding code of an entry (see the finding-code list), or null for a contractor's custom entry. */
export const EntryCodeSchema = slug.nullable();

export const PermitTermsSchema = z.object({
  /** Fee the authority charges, passed through at cost. */
  feeCents: cents,
  /** The contractor's charge for pulling the permit and meeting the inspector. */
  handlingCents: cents,
});
export type PermitTerms = z.infer<typeof PermitTermsSchema>;

export const VisitTermsSchema = z.object({
  /** Trip / service-call charge, once per visit. */
  serviceCallCents: cents,
  /** "Minimum for the first hour": travel plus the first hour of labour, once per visit with hourly work. */
  firstHourMinimumCents: cents,
  /** Labour minutes the first-hour minimum covers (60; some contractors use 30). */
  firstHourCoversMinutes: z.number().int().min(1).max(240).default(60),
  /** Labour after the first hour, per hour. */
  hourlyRateCents: cents.min(1),
  /** Labour after the first hour is billed in these steps, rounded up (15 or 30 are usual). */
  billingIncrementMinutes: z.number().int().min(1).max(60),
  /** Default markup on materials cost. */
  materialsMarkupBp: ShareBpSchema,
  /** Sales tax charged on materials (cost plus markup); 0 where the contractor shows none. */
  materialsTaxBp: z.number().int().nonnegative().max(2_000),
  permit: PermitTermsSchema,
  /** Share of the total taken as deposit when the seller pays by card. */
  cardDepositBp: z.number().int().nonnegative().max(10_000),
  quoteValidityDays: z.number().int().min(1).max(365),
  warrantyText: z.string().trim().min(1).max(2_000),
  /** Longest working visit, for splitting a ballpark into visits (480 = one working day). */
  visitCapacityMinutes: z.number().int().min(60).max(1_440).default(480),
});
export type VisitTerms = z.infer<typeof VisitTermsSchema>;

export const MaterialSchema = z.object({
  name: z.string().trim().min(1).max(120),
  /** How many of this material one unit of the entry uses. */
  quantityPerUnit: z.number().int().min(1).max(1_000),
  unitCostCents: cents,
});
export type Material = z.infer<typeof MaterialSchema>;

export const TimeAndMaterialsPricingSchema = z.object({
  mode: z.literal('time-and-materials'),
  /** Labour for one unit on the site as priced (before adders). */
  labourMinutesPerUnit: minutes,
  /** Materials cost of one unit; equals the materials list when a list is given. */
  materialsCentsPerUnit: cents,
  /** Markup for this entry instead of the rate book's default; null uses the default. */
  markupBp: ShareBpSchema.nullable(),
  materials: z.array(MaterialSchema).max(30),
  /** Ballpark: minutes for one unit on an easy site and on a hard site. */
  minutesLow: minutes,
  minutesHigh: minutes,
});
export type TimeAndMaterialsPricing = z.infer<typeof TimeAndMaterialsPricingSchema>;

export const FlatPricingSchema = z.object({
  mode: z.literal('flat'),
  /** Flat-rate price (labour and small parts) for the first unit of this entry in a visit. */
  firstUnitCents: cents,
  /** Price of each further unit of this entry in the same visit. */
  additionalUnitCents: cents,
  /** Ballpark: a hard site costs the flat price times this multiplier. */
  hardSiteMultiplierBp: MultiplierBpSchema,
});
export type FlatPricing = z.infer<typeof FlatPricingSchema>;

export const EntryPricingSchema = z.discriminatedUnion('mode', [TimeAndMaterialsPricingSchema, FlatPricingSchema]);
export type EntryPricing = z.infer<typeof EntryPricingSchema>;
export type PricingMode = EntryPricing['mode'];

export const RateBookEntrySchema = z
  .object({
    id: slug,
    code: EntryCodeSchema,
    name: z.string().trim().min(1).max(160),
    /** Unit the quantity counts (device, circuit, run, visit). */
    unit: z.string().trim().min(1).max(30),
    pricing: EntryPricingSchema,
  })
  .superRefine((entry, ctx) => {
    const pricing = entry.pricing;
    if (pricing.mode === 'time-and-materials') {
      if (pricing.minutesLow > pricing.minutesHigh) {
        ctx.addIssue({ code: 'custom', path: ['pricing', 'minutesLow'], message: 'Easy-site minutes exceed hard-site minutes' });
      }
      if (pricing.materials.length > 0) {
        const listed = pricing.materials.reduce((sum, m) => sum + m.quantityPerUnit * m.unitCostCents, 0);
        if (listed !== pricing.materialsCentsPerUnit) {
          ctx.addIssue({
            code: 'custom',
            path: ['pricing', 'materialsCentsPerUnit'],
            message: `Materials list adds up to ${listed} cents, not ${pricing.materialsCentsPerUnit}`,
          });
        }
      }
    } else if (pricing.additionalUnitCents > pricing.firstUnitCents) {
      ctx.addIssue({ code: 'custom', path: ['pricing', 'additionalUnitCents'], message: 'Each additional unit costs more than the first' });
    }
  });
export type RateBookEntry = z.infer<typeof RateBookEntrySchema>;

export const AdderEffectSchema = z.discriminatedUnion('kind', [
  /** Extra labour minutes for each unit of a time-and-materials line. */
  z.object({ kind: z.literal('minutes-per-unit'), minutes: minutes.min(1) }),
  /** Multiplies the labour minutes of a time-and-materials line. */
  z.object({ kind: z.literal('labour-multiplier'), multiplierBp: MultiplierBpSchema }),
  /** Extra labour minutes once per visit, however many lines flag it. */
  z.object({ kind: z.literal('minutes-per-visit'), minutes: minutes.min(1) }),
]);
export type AdderEffect = z.infer<typeof AdderEffectSchema>;
export type AdderKind = AdderEffect['kind'];

export const SiteAdderSchema = z.object({
  id: slug,
  /** The contractor's own name for the condition. */
  name: z.string().trim().min(1).max(120),
  effect: AdderEffectSchema,
  /** Ballpark: flag this condition by itself for houses built before this year; null never. */
  appliesWhenBuiltBefore: z.number().int().min(1700).max(2100).nullable(),
});
export type SiteAdder = z.infer<typeof SiteAdderSchema>;

export const RateBookSchema = z
  .object({
    contractorName: z.string().trim().min(1).max(160),
    terms: VisitTermsSchema,
    entries: z.array(RateBookEntrySchema).min(1).max(1_000),
    adders: z.array(SiteAdderSchema).max(100),
  })
  .superRefine((book, ctx) => {
    const duplicate = (ids: string[]) => ids.find((id, i) => ids.indexOf(id) !== i);
    const entryId = duplicate(book.entries.map((e) => e.id));
    if (entryId) ctx.addIssue({ code: 'custom', path: ['entries'], message: `Entry id "${entryId}" is used twice` });
    const adderId = duplicate(book.adders.map((a) => a.id));
    if (adderId) ctx.addIssue({ code: 'custom', path: ['adders'], message: `Adder id "${adderId}" is used twice` });
  });
export type RateBook = z.infer<typeof RateBookSchema>;
/** A rate book as written before defaults are filled in (what a form or a seed supplies). */
export type RateBookInput = z.input<typeof RateBookSchema>;
