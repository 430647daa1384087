import * as z from 'zod';
import { CorrectionSchema } from '../corrections/correction.schema';
import { FindingCodeSchema, RoomSchema } from '../findings/finding.schema';
import { ItemStatusSchema } from '../items/item-status';
import { CompletionLetterSchema } from '../letters/completion-letter.schema';
import { READING_KINDS } from '../readings/reading-kinds';
import { RequestStatusSchema } from '../requests/request-status.schema';
import { ElectricianSchema, SiteVisitSchema } from '../visits/site-visit.schema';

export const WorkItemSchema = z.object({
  id: z.number().int(),
  code: FindingCodeSchema,
  room: RoomSchema,
  location: z.string(),
  quantity: z.number().int().nullable(),
  necRefs: z.array(z.string()),
  status: ItemStatusSchema,
  /** The quote's visit (pricing group) the item was priced in. */
  quotedVisitKey: z.string(),
  /** The site visit the item is planned for. */
  siteVisitId: z.number().int().nullable(),
  readingKinds: z.array(z.enum(READING_KINDS)),
  correction: CorrectionSchema.nullable(),
  /** Why the inspector or buyer's agent did not accept it, when that is where it stands. */
  notAcceptedReason: z.string().nullable(),
});
export type WorkItem = z.infer<typeof WorkItemSchema>;

export const ProofReviewRecordSchema = z.object({
  letterRevision: z.number().int(),
  decision: z.enum(['accept', 'not-accept']),
  note: z.string(),
  decidedByName: z.string().nullable(),
  decidedAt: z.string(),
});

/** The proof side of one request in one answer: what the work page shows and what the viewer may do. */
export const WorkOverviewSchema = z.object({
  requestId: z.number().int(),
  reference: z.string(),
  street: z.string(),
  status: RequestStatusSchema,
  closingDate: z.string(),
  closing: z.object({
    businessDaysLeft: z.number().int(),
    approvedCount: z.number().int(),
    resolvedCount: z.number().int(),
    isAtRisk: z.boolean(),
    atRiskBusinessDays: z.number().int(),
  }),
  can: z.object({
    bookVisit: z.boolean(),
    recordCorrections: z.boolean(),
    /** Marking a started visit finished (also once the request moved on to corrected). */
    finishVisit: z.boolean(),
    /** Call off a booked visit (the flow table's `cancel-visit`). */
    cancelVisit: z.boolean(),
    issueLetter: z.boolean(),
    review: z.boolean(),
    resume: z.boolean(),
    seeAccessNotes: z.boolean(),
  }),
  quotedVisitKeys: z.array(z.string()),
  electricians: z.array(ElectricianSchema),
  visits: z.array(SiteVisitSchema),
  items: z.array(WorkItemSchema),
  letters: z.array(CompletionLetterSchema),
  reviews: z.array(ProofReviewRecordSchema),
});
export type WorkOverview = z.infer<typeof WorkOverviewSchema>;
