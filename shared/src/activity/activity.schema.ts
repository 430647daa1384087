import * as z from 'zod';
import { PageQuerySchema } from '../http/page';

/** The groups the activity timeline filters by. */
export const ACTIVITY_KINDS = ['status', 'items', 'parties', 'reports', 'quotes', 'approvals', 'payments', 'visits', 'letters'] as const;
export const ActivityKindSchema = z.enum(ACTIVITY_KINDS);
export type ActivityKind = z.infer<typeof ActivityKindSchema>;

export const ACTIVITY_KIND_LABELS: Record<ActivityKind, string> = {
  status: 'Status',
  items: 'Items',
  parties: 'People',
  reports: 'Reports',
  quotes: 'Quotes',
  approvals: 'Approvals',
  payments: 'Payments',
  visits: 'Visits',
  letters: 'Letters',
};

/** A value before or after a change: a few named fields. */
export const ActivityValuesSchema = z.record(z.string(), z.union([z.string(), z.number(), z.boolean(), z.null(), z.array(z.string())]));
export type ActivityValues = z.infer<typeof ActivityValuesSchema>;

export const ActivityEntrySchema = z.object({
  id: z.number().int(),
  kind: ActivityKindSchema,
  action: z.string(),
  summary: z.string(),
  actorName: z.string().nullable(),
  itemId: z.number().int().nullable(),
  before: ActivityValuesSchema.nullable(),
  after: ActivityValuesSchema.nullable(),
  at: z.string(),
});
export type ActivityEntry = z.infer<typeof ActivityEntrySchema>;

export const ActivityQuerySchema = PageQuerySchema.extend({
  /** One kind or several, comma-separated. */
  kind: z
    .string()
    .max(200)
    .optional()
    .transform((v) => (v ? v.split(',').filter(Boolean) : []))
    .pipe(z.array(ActivityKindSchema)),
});
export type ActivityQuery = z.input<typeof ActivityQuerySchema>;
