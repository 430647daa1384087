import * as z from 'zod';
import { trimmedText } from '../http/bounds';

export const IssueLetterSchema = z
  .object({
    /** The permit number, or empty when none was required under local rules. */
    permitNumber: trimmedText(60).default(''),
    /** Confirms that no permit was required under local rules (when there is no permit number). */
    isPermitNotRequired: z.boolean().default(false),
    warranty: trimmedText(1000).default(''),
    /** The typed signature: the name of the person who signs for the contractor. */
    signatureName: trimmedText(120).pipe(z.string().min(2, 'Type the name of the person signing')),
  })
  .refine((l) => l.permitNumber.length > 0 || l.isPermitNotRequired, {
    error: 'Enter the permit number, or confirm that none was required',
    path: ['permitNumber'],
  });
export type IssueLetter = z.input<typeof IssueLetterSchema>;

export const CompletionLetterSchema = z.object({
  number: z.string(),
  revision: z.number().int(),
  issuedAt: z.string(),
  issuedByName: z.string().nullable(),
  itemCount: z.number().int(),
  sha256: z.string(),
  verificationCode: z.string(),
  verificationUrl: z.string(),
  isCurrent: z.boolean(),
  pdfPath: z.string(),
});
export type CompletionLetter = z.infer<typeof CompletionLetterSchema>;

/** What the public verification page shows: no personal data, no address. */
export const LetterVerificationSchema = z.object({
  number: z.string(),
  revision: z.number().int(),
  issuedOn: z.string(),
  itemCount: z.number().int(),
  sha256: z.string(),
  isCurrent: z.boolean(),
  /** The newer revision that replaces this one, if any. */
  supersededBy: z.object({ revision: z.number().int(), issuedOn: z.string() }).nullable(),
  /** Whether the inspector or buyer's agent recorded "re-inspection accepted" for this revision. */
  isAccepted: z.boolean(),
});
export type LetterVerification = z.infer<typeof LetterVerificationSchema>;

export const PdfCheckSchema = z.object({
  /** Whether the uploaded bytes are exactly those of a letter this product issued. */
  isGenuine: z.boolean(),
  /** Whether they are the current revision (false when genuine but superseded, or not genuine). */
  isCurrent: z.boolean(),
  /** Whether they are the letter the verification code names (null when no code was given). */
  matchesCode: z.boolean().nullable(),
  letter: LetterVerificationSchema.nullable(),
  message: z.string(),
});
export type PdfCheck = z.infer<typeof PdfCheckSchema>;

export const ProofReviewSchema = z.discriminatedUnion('decision', [
  z.object({ decision: z.literal('accept'), note: trimmedText(1000).default('') }),
  z.object({
    decision: z.literal('not-accept'),
    note: trimmedText(1000).default(''),
    items: z
      .array(z.object({ itemId: z.number().int().positive(), reason: trimmedText(500).pipe(z.string().min(3, 'Say why the item is not accepted')) }))
      .min(1, 'List at least one item that is not accepted')
      .max(200),
  }),
]);
export type ProofReview = z.input<typeof ProofReviewSchema>;

/** What the public check says of an uploaded file that is not a PDF (the portal says it before sending, the server on refusing). */
export const NOT_A_PDF_MESSAGE = 'This file is not a PDF. Choose the completion letter’s PDF file (it ends in .pdf).';
