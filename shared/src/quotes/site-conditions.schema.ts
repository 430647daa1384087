import * as z from 'zod';
import { RecordIdSchema } from '../http/bounds';
import { BallparkSchema } from '../pricing/ballpark.schema';
import { AdderEffectSchema } from '../pricing/rate-book.schema';

const condition = z.object({
  id: z.number().int(),
  name: z.string(),
  effect: AdderEffectSchema,
  appliesWhenBuiltBefore: z.number().int().nullable(),
});

/** The site conditions flagged on a request, and those the assigned contractor's rate book offers. */
export const SiteConditionsSchema = z.object({
  adderIds: z.array(z.number().int()),
  available: z.array(condition),
});
export type SiteConditions = z.infer<typeof SiteConditionsSchema>;

export const UpdateSiteConditionsSchema = z.object({
  adderIds: z
    .array(RecordIdSchema)
    .max(20)
    .refine((ids) => new Set(ids).size === ids.length, { error: 'A condition is listed twice' }),
});
export type UpdateSiteConditions = z.infer<typeof UpdateSiteConditionsSchema>;

/** The ballpark range of a request (an estimate, not a quote) with what it was computed from. */
export const RequestBallparkSchema = BallparkSchema.extend({
  requestId: z.number().int(),
  contractorName: z.string(),
  yearBuilt: z.number().int().nullable(),
  itemCount: z.number().int(),
  siteConditions: z.array(z.object({ id: z.number().int(), name: z.string() })),
});
export type RequestBallpark = z.infer<typeof RequestBallparkSchema>;
