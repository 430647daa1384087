import * as z from 'zod';
import { VersionSchema } from '../http/bounds';
import { AdderEffectSchema, SiteAdderSchema } from '../pricing/rate-book.schema';
import { RateBookKeySchema } from './rate-book-entry.schema';

/** A site condition ("adder") of a rate book as the API shows it. */
export const SiteAdderRecordSchema = z.object({
  id: z.number().int(),
  key: RateBookKeySchema,
  /** Optimistic-concurrency version: send it back with a change. */
  version: z.number().int(),
  name: z.string(),
  effect: AdderEffectSchema,
  appliesWhenBuiltBefore: z.number().int().nullable(),
  position: z.number().int(),
  updatedAt: z.string(),
});
export type SiteAdderRecord = z.infer<typeof SiteAdderRecordSchema>;

export const CreateSiteAdderSchema = z.object({
  /** Made from the name when left out. */
  key: RateBookKeySchema.optional(),
  name: SiteAdderSchema.shape.name,
  effect: AdderEffectSchema,
  appliesWhenBuiltBefore: SiteAdderSchema.shape.appliesWhenBuiltBefore.default(null),
});
export type CreateSiteAdder = z.infer<typeof CreateSiteAdderSchema>;

export const UpdateSiteAdderSchema = z
  .object({
    version: VersionSchema,
    name: SiteAdderSchema.shape.name.optional(),
    effect: AdderEffectSchema.optional(),
    appliesWhenBuiltBefore: SiteAdderSchema.shape.appliesWhenBuiltBefore.optional(),
  })
  .refine((v) => v.name !== undefined || v.effect !== undefined || v.appliesWhenBuiltBefore !== undefined, {
    error: 'Change at least one field',
    path: ['version'],
  });
export type UpdateSiteAdder = z.infer<typeof UpdateSiteAdderSchema>;
