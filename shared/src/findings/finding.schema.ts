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
  })
  .refine((f) => f.end > f.start && f.end - f.start === f.evidence.length, {
    error: 'end - start must equal the evidence length',
    path: ['end'],
  });
export type Finding = z.infer<typeof FindingSchema>;

export const SECTION_KINDS = ['electrical', 'room', 'general', 'non-electrical', 'none'] as const;
export const SectionKindSchema = z.enum(SECTION_KINDS);
export type SectionKind = z.infer<typeof SectionKindSchema>;

export const SKIP_REASONS = ['non-electrical-section', 'no-electrical-finding', 'negated'] as const;
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
});
export type SkippedText = z.infer<typeof SkippedTextSchema>;

export const ParseResultSchema = z.object({
  findings: z.array(FindingSchema),
  skipped: z.array(SkippedTextSchema),
});
export type ParseResult = z.infer<typeof ParseResultSchema>;
