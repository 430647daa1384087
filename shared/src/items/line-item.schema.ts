import * as z from 'zod';
import { FindingCodeSchema, RoomSchema, SeveritySchema } from '../findings/finding.schema';
import { BUILT_UNDER } from '../code-editions/protection-history';
import { ItemStatusSchema } from './item-status';

/**
 * Information about when the NEC began to require a protection at this place, against the year the
 * house was built and the adopted edition (never a ruling). Built by `editionNote`.
 */
export const ItemEditionNoteSchema = z.object({
  requiredSince: z.number().int().nullable(),
  requiredByAdoptedEdition: z.boolean(),
  firstRequired: z.number().int().nullable(),
  builtUnder: z.enum(BUILT_UNDER).nullable(),
  reference: z.string(),
  summary: z.string(),
  text: z.string(),
});
export type ItemEditionNote = z.infer<typeof ItemEditionNoteSchema>;

export const LineItemSchema = z.object({
  id: z.number().int(),
  requestId: z.number().int(),
  code: FindingCodeSchema,
  room: RoomSchema,
  location: z.string(),
  quantity: z.number().int().nullable(),
  evidence: z.string().nullable(),
  page: z.number().int().nullable(),
  reportFileId: z.number().int().nullable(),
  /** Character offsets of `evidence` in the report's joined text (pages joined with "\f"). */
  evidenceStart: z.number().int().nullable(),
  evidenceEnd: z.number().int().nullable(),
  severity: SeveritySchema,
  necRefs: z.array(z.string()),
  status: ItemStatusSchema,
  /** Whether a person changed what the reader proposed (re-reading the report keeps it then). */
  isEdited: z.boolean(),
  /** Optimistic-concurrency version: send it back with every change. */
  version: z.number().int(),
  editionNote: ItemEditionNoteSchema.nullable(),
});
export type LineItem = z.infer<typeof LineItemSchema>;

const quantity = z.number().int().min(1, 'Use a whole number of 1 or more').max(999).nullable();

export const UpdateLineItemSchema = z.object({
  version: z.number().int().min(1),
  code: FindingCodeSchema.optional(),
  room: RoomSchema.optional(),
  location: z.string().trim().max(300).optional(),
  quantity: quantity.optional(),
  severity: SeveritySchema.optional(),
  necRefs: z.array(z.string().trim().min(1).max(40)).max(12).optional(),
});
export type UpdateLineItem = z.infer<typeof UpdateLineItemSchema>;

/** An item a person adds, optionally anchored to text they selected in the report. */
export const CreateLineItemSchema = z
  .object({
    code: FindingCodeSchema,
    room: RoomSchema,
    location: z.string().trim().max(300).default(''),
    quantity: quantity.default(null),
    severity: SeveritySchema.optional(),
    reportFileId: z.number().int().positive().nullable().default(null),
    evidenceStart: z.number().int().min(0).nullable().default(null),
    evidenceEnd: z.number().int().min(1).nullable().default(null),
  })
  .refine((v) => (v.evidenceStart === null) === (v.evidenceEnd === null) && (v.evidenceStart === null || v.reportFileId !== null), {
    error: 'A text selection needs its report and both ends',
    path: ['evidenceStart'],
  })
  .refine((v) => v.evidenceStart === null || v.evidenceEnd === null || v.evidenceEnd > v.evidenceStart, {
    error: 'The selection ends before it starts',
    path: ['evidenceEnd'],
  });
export type CreateLineItem = z.input<typeof CreateLineItemSchema>;

const itemRef = z.object({ id: z.number().int().positive(), version: z.number().int().min(1) });

/** Two items that describe the same defect become one (the first keeps its id). */
export const MergeLineItemsSchema = z.object({
  items: z.tuple([itemRef, itemRef]).refine(([a, b]) => a.id !== b.id, { error: 'Choose two different items' }),
});
export type MergeLineItems = z.infer<typeof MergeLineItemsSchema>;

/** One item with a quantity becomes several, e.g. 3 receptacles in two rooms → [2, 1]. */
export const SplitLineItemSchema = z.object({
  version: z.number().int().min(1),
  quantities: z.array(z.number().int().min(1)).min(2, 'Split into at least two parts').max(20),
});
export type SplitLineItem = z.infer<typeof SplitLineItemSchema>;

export const ConfirmItemsSchema = z.object({
  /** The proposed items the agent reviewed; each must still be at this version. */
  items: z.array(itemRef).min(1, 'There are no items to confirm'),
});
export type ConfirmItems = z.infer<typeof ConfirmItemsSchema>;
