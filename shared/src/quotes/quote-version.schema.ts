import * as z from 'zod';
import { trimmedText } from '../http/bounds';
import { ItemEditionNoteSchema } from '../items/line-item.schema';
import { QuoteBreakdownSchema } from '../pricing/pricing-breakdown.schema';
import { ClaimedTotalsSchema } from '../pricing/verify-totals';
import { QuoteChangesSchema } from './quote-changes.schema';

export const QUOTE_LINE_KINDS = ['priced', 'out-of-scope'] as const;

/** One line of a sent quote: a line item with the entry it was priced with, or one declined as not in scope. */
export const QuoteVersionLineSchema = z.object({
  lineItemId: z.number().int().nullable(),
  kind: z.enum(QUOTE_LINE_KINDS),
  code: z.string(),
  room: z.string(),
  location: z.string(),
  /** The entry version as priced (null for an out-of-scope line). */
  entry: z
    .object({
      id: z.number().int(),
      key: z.string(),
      version: z.number().int(),
      name: z.string(),
      unit: z.string(),
      mode: z.enum(['time-and-materials', 'flat']),
    })
    .nullable(),
  quantity: z.number().int().nullable(),
  isQuantityAssumed: z.boolean(),
  adders: z.array(z.object({ id: z.number().int(), key: z.string(), name: z.string() })),
  visitKey: z.string().nullable(),
  labourMinutes: z.number().int(),
  labourCents: z.number().int(),
  materialsCents: z.number().int(),
  flatCents: z.number().int(),
  /** labour share + materials + flat; the service call, permit and tax are visit figures. */
  lineCents: z.number().int(),
  outOfScopeReason: z.string().nullable(),
  /** The code in force when the house was built and the adopted edition, as it read when sent (information). */
  editionNote: ItemEditionNoteSchema.nullable(),
});
export type QuoteVersionLine = z.infer<typeof QuoteVersionLineSchema>;

export const QuoteContractorSchema = z.object({
  organisationId: z.number().int(),
  name: z.string(),
  licenceNumber: z.string().nullable(),
  licenceState: z.string().nullable(),
  licenceClass: z.string().nullable(),
  phone: z.string().nullable(),
  address: z.string().nullable(),
});
export type QuoteContractor = z.infer<typeof QuoteContractorSchema>;

/** A sent quote version: immutable once sent. */
export const QuoteVersionSchema = z.object({
  id: z.number().int(),
  requestId: z.number().int(),
  requestReference: z.string(),
  version: z.number().int(),
  /** Whether this is the latest version (the one the seller decides on). */
  isCurrent: z.boolean(),
  sentAt: z.string(),
  sentByName: z.string().nullable(),
  /** Last day the prices hold (YYYY-MM-DD). */
  validUntil: z.string(),
  contractor: QuoteContractorSchema,
  property: z.object({ street: z.string(), city: z.string(), state: z.string(), zip: z.string() }),
  lines: z.array(QuoteVersionLineSchema),
  breakdown: QuoteBreakdownSchema,
  cardDepositBp: z.number().int(),
  warrantyText: z.string(),
  safetyNotice: z.string(),
  note: z.string().nullable(),
  /** What changed against the version before (null for version 1). */
  changes: QuoteChangesSchema.nullable(),
  /** Where to download the PDF of this version. */
  pdfPath: z.string(),
});
export type QuoteVersion = z.infer<typeof QuoteVersionSchema>;

export const QuoteVersionSummarySchema = z.object({
  version: z.number().int(),
  isCurrent: z.boolean(),
  sentAt: z.string(),
  sentByName: z.string().nullable(),
  validUntil: z.string(),
  totalCents: z.number().int(),
  depositCents: z.number().int(),
  lineCount: z.number().int(),
  /** Total against the version before (null for version 1). */
  totalDeltaCents: z.number().int().nullable(),
});
export type QuoteVersionSummary = z.infer<typeof QuoteVersionSummarySchema>;

/** The longest note to the seller a quote may carry (the form counts towards it). */
export const QUOTE_NOTE_MAX = 1_000;

/** Sending the quote: the server prices the request itself and refuses a claim that differs. */
export const SendQuoteSchema = z.object({
  claimedTotals: ClaimedTotalsSchema.optional(),
  /** A note to the seller shown on the quote. */
  note: trimmedText(QUOTE_NOTE_MAX).optional(),
});
export type SendQuote = z.infer<typeof SendQuoteSchema>;
