import * as z from 'zod';
import { INT4_MAX, plainText, QuantitySchema, RecordIdSchema, VersionSchema } from '../http/bounds';
import { MAX_FINDINGS_PER_REPORT } from '../reports/report-file.schema';
import { ConfidenceSchema, FindingCodeSchema, RoomSchema, SeveritySchema } from '../findings/finding.schema';
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
  /** How the report reader found a proposed item (null for items a person added). */
  confidence: ConfidenceSchema.nullable(),
  /** The report's follow-up or recommendation text for this defect, or null. */
  recommendation: z.string().nullable(),
  /** For a computed finding, the computation shown on the item, or null. */
  computation: z.string().nullable(),
});
export type LineItem = z.infer<typeof LineItemSchema>;

/**
 * A request's items as `GET /api/requests/:id/items` answers them: each distinct edition note once,
 * in `editionNotes` by key, and each item with the key of its note (null when it has none). A
 * request's notes depend only on the item's code and room (the house is the request's), so a list
 * of 16 items carries a handful of notes instead of 16 copies. `itemsWithNotes` gives the items back
 * with their notes in place.
 */
export const LineItemListSchema = z.object({
  items: z.array(LineItemSchema.omit({ editionNote: true }).extend({ editionNoteKey: z.string().nullable() })),
  editionNotes: z.record(z.string(), ItemEditionNoteSchema),
});
export type LineItemList = z.infer<typeof LineItemListSchema>;

/** The key of an item's edition note within one request: the note depends on the code and the room only. */
export function editionNoteKey(item: Pick<LineItem, 'code' | 'room'>): string {
  return `${item.code}/${item.room}`;
}

/** Items with their notes (each note once, under its key), as the item list is sent. */
export function toLineItemList(items: readonly LineItem[]): LineItemList {
  const editionNotes: LineItemList['editionNotes'] = {};
  const listed = items.map(({ editionNote, ...item }) => {
    if (editionNote === null) return { ...item, editionNoteKey: null };
    const key = editionNoteKey(item);
    editionNotes[key] ??= editionNote;
    return { ...item, editionNoteKey: key };
  });
  return { items: listed, editionNotes };
}

/** The items of a list with their notes in place (items of one note share the one object). */
export function itemsWithNotes(list: LineItemList): LineItem[] {
  return list.items.map(({ editionNoteKey: key, ...item }) => ({ ...item, editionNote: key === null ? null : (list.editionNotes[key] ?? null) }));
}

const quantity = QuantitySchema.nullable();

export const UpdateLineItemSchema = z.object({
  version: VersionSchema,
  code: FindingCodeSchema.optional(),
  room: RoomSchema.optional(),
  location: plainText(300).trim().optional(),
  quantity: quantity.optional(),
  severity: SeveritySchema.optional(),
  necRefs: z.array(plainText(40).trim().min(1)).max(12).optional(),
});
export type UpdateLineItem = z.infer<typeof UpdateLineItemSchema>;

/** An item a person adds, optionally anchored to text they selected in the report. */
export const CreateLineItemSchema = z
  .object({
    code: FindingCodeSchema,
    room: RoomSchema,
    location: plainText(300).trim().default(''),
    quantity: quantity.default(null),
    severity: SeveritySchema.optional(),
    reportFileId: RecordIdSchema.nullable().default(null),
    evidenceStart: z.number().int().min(0).max(INT4_MAX).nullable().default(null),
    evidenceEnd: z.number().int().min(1).max(INT4_MAX).nullable().default(null),
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

const itemRef = z.object({ id: RecordIdSchema, version: VersionSchema });

/** Two items that describe the same defect become one (the first keeps its id). */
export const MergeLineItemsSchema = z.object({
  items: z.tuple([itemRef, itemRef]).refine(([a, b]) => a.id !== b.id, { error: 'Choose two different items' }),
});
export type MergeLineItems = z.infer<typeof MergeLineItemsSchema>;

/** One item with a quantity becomes several, e.g. 3 receptacles in two rooms → [2, 1]. */
export const SplitLineItemSchema = z.object({
  version: VersionSchema,
  quantities: z.array(QuantitySchema).min(2, 'Split into at least two parts').max(20),
});
export type SplitLineItem = z.infer<typeof SplitLineItemSchema>;

export const ConfirmItemsSchema = z.object({
  /** The proposed items the agent reviewed; each must still be at this version. */
  items: z.array(itemRef).min(1, 'There are no items to confirm').max(MAX_FINDINGS_PER_REPORT * 4),
});
export type ConfirmItems = z.infer<typeof ConfirmItemsSchema>;
