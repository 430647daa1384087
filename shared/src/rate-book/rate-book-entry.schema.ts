import * as z from 'zod';
import { VersionSchema } from '../http/bounds';
import { EntryCodeSchema, EntryPricingSchema, RateBookEntrySchema } from '../pricing/rate-book.schema';

/** The contractor's short name of an entry or adder: lower-case words joined by hyphens. */
export const RateBookKeySchema = RateBookEntrySchema.shape.id;

const entryFields = {
  code: EntryCodeSchema,
  name: RateBookEntrySchema.shape.name,
  unit: RateBookEntrySchema.shape.unit,
  pricing: EntryPricingSchema,
};

/**
 * Adds the pricing engine's own rules for an entry (easy-site minutes not above hard-site ones, the
 * materials list adding up, an additional unit not dearer than the first) as issues at their paths.
 */
function entryRules(entry: z.infer<z.ZodObject<typeof entryFields>>, ctx: z.RefinementCtx): void {
  const checked = RateBookEntrySchema.safeParse({ ...entry, id: 'entry' });
  if (checked.success) return;
  for (const issue of checked.error.issues) ctx.addIssue({ code: 'custom', path: issue.path, message: issue.message });
}

/** A rate-book entry as the API shows it: its stable id, its current version and its content. */
export const RateBookEntryRecordSchema = z.object({
  id: z.number().int(),
  key: RateBookKeySchema,
  /** Version of the content; every change makes a new one. Send it back with a change. */
  version: z.number().int(),
  code: EntryCodeSchema,
  name: z.string(),
  unit: z.string(),
  pricing: EntryPricingSchema,
  position: z.number().int(),
  /** Whether the current version is on a sent quote (a change then leaves that quote as it was). */
  isOnSentQuote: z.boolean(),
  updatedAt: z.string(),
});
export type RateBookEntryRecord = z.infer<typeof RateBookEntryRecordSchema>;

export const CreateRateBookEntrySchema = z
  .object({
    /** Made from the name when left out. */
    key: RateBookKeySchema.optional(),
    ...entryFields,
  })
  .superRefine((entry, ctx) => entryRules(entry, ctx));
export type CreateRateBookEntry = z.infer<typeof CreateRateBookEntrySchema>;

/** A change to an entry: the fields given replace the current ones (`pricing` as a whole). */
export const UpdateRateBookEntrySchema = z
  .object({
    version: VersionSchema,
    code: EntryCodeSchema.optional(),
    name: entryFields.name.optional(),
    unit: entryFields.unit.optional(),
    pricing: EntryPricingSchema.optional(),
  })
  .refine((v) => v.code !== undefined || v.name !== undefined || v.unit !== undefined || v.pricing !== undefined, {
    error: 'Change at least one field',
    path: ['version'],
  });
export type UpdateRateBookEntry = z.infer<typeof UpdateRateBookEntrySchema>;

/** The content of an entry as it is checked after a change is merged in. */
export const RateBookEntryContentSchema = z.object(entryFields).superRefine((entry, ctx) => entryRules(entry, ctx));
export type RateBookEntryContent = z.infer<typeof RateBookEntryContentSchema>;

/** One past or current version of an entry. */
export const RateBookEntryVersionSchema = z.object({
  version: z.number().int(),
  code: EntryCodeSchema,
  name: z.string(),
  unit: z.string(),
  pricing: EntryPricingSchema,
  createdAt: z.string(),
  createdByName: z.string().nullable(),
});
export type RateBookEntryVersion = z.infer<typeof RateBookEntryVersionSchema>;
