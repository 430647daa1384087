import * as z from 'zod';
import { FINDING_CODES, SEVERITIES, type FindingCode } from './finding-code';
import { ROOMS } from './room';

export const FindingCodeSchema = z.enum(FINDING_CODES as [FindingCode, ...FindingCode[]]);
export const RoomSchema = z.enum(ROOMS);
export const SeveritySchema = z.enum(SEVERITIES);

/**
 * One electrical finding read from a report. Offsets refer to the joined report text, i.e. the
 * pages joined with a form feed ("\f"): `evidence === joined.slice(start, end)`, so evidence is an
 * exact substring even when the sentence runs across a page break. `page` is 1-based and is the
 * page on which the evidence starts.
 */
/**
 * How a finding was read: `exact` (a phrase of the table as written), `normalised` (the phrase
 * matched only after shorthand, a misspelling or a number word was normalised), `composed` (no
 * phrase: a device word and a condition word in one clause, see device-condition.ts) or `inferred`
 * (its room or its code rests on context: a heading, an earlier sentence, a computation).
 */
export const CONFIDENCES = ['exact', 'normalised', 'composed', 'inferred'] as const;
export const ConfidenceSchema = z.enum(CONFIDENCES);
export type Confidence = z.infer<typeof ConfidenceSchema>;

export const FindingSchema = z
  .object({
    code: FindingCodeSchema,
    room: RoomSchema,
    /** The place as the report wrote it (e.g. "primary bath, left of sink"); empty when none given. */
    location: z.string(),
    /** A whole number when the report gives one, else null. */
    quantity: z.number().int().positive().nullable(),
    evidence: z.string().min(1),
    page: z.number().int().min(1),
    start: z.number().int().min(0),
    end: z.number().int().min(1),
    severity: SeveritySchema,
    necRefs: z.array(z.string()),
    confidence: ConfidenceSchema,
    /** Follow-up or recommendation text of the report that belongs to this finding, or null. */
    recommendation: z.string().nullable(),
    /** For a computed finding, the computation ("40 A breaker on 10 AWG copper; 240.4(D) allows 30 A"). */
    computation: z.string().nullable(),
  })
  .refine((f) => f.end > f.start && f.end - f.start === f.evidence.length, {
    error: 'end - start must equal the evidence length',
    path: ['end'],
  });
export type Finding = z.infer<typeof FindingSchema>;

export const SECTION_KINDS = ['electrical', 'room', 'general', 'non-electrical', 'none'] as const;
export const SectionKindSchema = z.enum(SECTION_KINDS);
export type SectionKind = z.infer<typeof SectionKindSchema>;

/**
 * `not-itemised`: the passage names electrical things (a receptacle, a breaker...) but gave no
 * finding; the review screen lists it as "read but not itemised", one click from adding it.
 */
export const SKIP_REASONS = ['non-electrical-section', 'no-electrical-finding', 'negated', 'not-itemised'] as const;
export const SkipReasonSchema = z.enum(SKIP_REASONS);
export type SkipReason = z.infer<typeof SkipReasonSchema>;

/** A block of report text that produced no finding, with the section it sat in and why. */
export const SkippedTextSchema = z.object({
  /** The section heading as written, or null before the first heading. */
  section: z.string().nullable(),
  sectionKind: SectionKindSchema,
  reason: SkipReasonSchema,
  text: z.string(),
  page: z.number().int().min(1),
  start: z.number().int().min(0),
  end: z.number().int().min(1),
  /** For a `not-itemised` passage, the item the parser would suggest if a person adds it. */
  suggestion: z.object({ code: FindingCodeSchema, room: RoomSchema }).optional(),
});
export type SkippedText = z.infer<typeof SkippedTextSchema>;

export const ParseResultSchema = z.object({
  findings: z.array(FindingSchema),
  skipped: z.array(SkippedTextSchema),
});
export type ParseResult = z.infer<typeof ParseResultSchema>;
