import * as z from 'zod';
import { trimmedText } from '../http/bounds';
import { ReadingEvaluationSchema, ReadingsSchema, type ReadingEvaluation, type Readings } from '../readings/readings.schema';
import { evaluateReadings } from '../readings/evaluate-readings';
import { CORRECTION_LABELS } from '../readings/reading-kinds';
import { ReturnCauseSchema } from '../economics/economics.schema';

export const CORRECTION_OUTCOMES = ['corrected', 'not-corrected', 'declined-on-site'] as const;
export const CorrectionOutcomeSchema = z.enum(CORRECTION_OUTCOMES);
export type CorrectionOutcome = z.infer<typeof CorrectionOutcomeSchema>;

export const CORRECTION_OUTCOME_LABELS: Record<CorrectionOutcome, string> = {
  corrected: 'Corrected',
  'not-corrected': 'Could not correct',
  'declined-on-site': 'Declined on site',
};

/** Photos per correction: before and after, each at most this many, each at most MAX_PHOTO_BYTES. */
export const MAX_PHOTOS_PER_KIND = 4;
export const MAX_PHOTO_BYTES = 8 * 1024 * 1024;
export const PHOTO_KINDS = ['before', 'after'] as const;
export type PhotoKind = (typeof PHOTO_KINDS)[number];

/**
 * The readings of a correction that are outside their expected range. An item with one of these is
 * recorded as corrected only with a note (the `reason` field) saying why; otherwise its outcome is
 * "Could not correct".
 */
export function readingsOutside(readings: Readings, labels: readonly string[] = []): ReadingEvaluation[] {
  return evaluateReadings(readings, { labels }).filter((e) => e.status === 'outside');
}

export const OUTSIDE_READING_NOTE_MESSAGE = 'A reading is outside its expected range: explain why the item counts as corrected, or choose “Could not correct”';

/** The correction record of one item, sent as the `record` field (JSON) of a multipart form with photos. */
export const RecordCorrectionSchema = z
  .object({
    outcome: CorrectionOutcomeSchema,
    reason: trimmedText(1000).default(''),
    workPerformed: trimmedText(2000).default(''),
    materials: trimmedText(1000).default(''),
    deviceMake: trimmedText(80).default(''),
    deviceModel: trimmedText(80).default(''),
    /** Lot or date code where known. */
    deviceLot: trimmedText(80).default(''),
    labels: z.array(z.enum(CORRECTION_LABELS)).max(CORRECTION_LABELS.length).default([]),
    readings: ReadingsSchema.default({ gfci: null, receptacle: null, groundPath: null, voltageDrop: null }),
    /** The site visit on which the work was done. */
    siteVisitId: z.number().int().positive().nullable().default(null),
    /** Finished on the first visit (the usual case); false when it took a return visit. */
    finishedOnFirstVisit: z.boolean().default(true),
    /** Why a return visit was (or will be) needed: required when not finished on the first visit or not corrected. */
    returnCause: ReturnCauseSchema.nullable().default(null),
  })
  .refine((c) => c.outcome !== 'corrected' || c.workPerformed.length > 0, { error: 'Describe the work performed', path: ['workPerformed'] })
  .refine((c) => c.outcome === 'corrected' || c.reason.length > 0, { error: 'Give the reason', path: ['reason'] })
  .refine((c) => c.outcome !== 'corrected' || c.reason.length > 0 || readingsOutside(c.readings, c.labels).length === 0, {
    error: OUTSIDE_READING_NOTE_MESSAGE,
    path: ['reason'],
  })
  .refine((c) => c.returnCause !== null || c.outcome !== 'corrected' || c.finishedOnFirstVisit, {
    error: 'Say why it took another visit',
    path: ['returnCause'],
  });
export type RecordCorrection = z.input<typeof RecordCorrectionSchema>;
export type RecordCorrectionParsed = z.output<typeof RecordCorrectionSchema>;

export const CorrectionPhotoSchema = z.object({
  id: z.number().int(),
  kind: z.enum(PHOTO_KINDS),
  width: z.number().int(),
  height: z.number().int(),
  url: z.string(),
});
export type CorrectionPhoto = z.infer<typeof CorrectionPhotoSchema>;

export const CorrectionSchema = z.object({
  itemId: z.number().int(),
  outcome: CorrectionOutcomeSchema,
  reason: z.string(),
  workPerformed: z.string(),
  materials: z.string(),
  deviceMake: z.string(),
  deviceModel: z.string(),
  deviceLot: z.string(),
  labels: z.array(z.string()),
  readings: ReadingsSchema,
  evaluations: z.array(ReadingEvaluationSchema),
  siteVisitId: z.number().int().nullable(),
  siteVisitNumber: z.number().int().nullable(),
  /** Finished on the first visit (false for a return visit or rework). */
  isFirstVisit: z.boolean(),
  returnCause: ReturnCauseSchema.nullable(),
  recordedByName: z.string().nullable(),
  recordedAt: z.string(),
  photos: z.array(CorrectionPhotoSchema),
});
export type Correction = z.infer<typeof CorrectionSchema>;
