import * as z from 'zod';
import { SessionSchema } from '../auth/auth.schema';
import { BoundedDateSchema, plainText, RecordIdSchema } from '../http/bounds';
import { PageQuerySchema } from '../http/page';
import { NecEditionSchema } from './nec-edition';
import { RequestStatusSchema } from './request-status.schema';
import { UsStateSchema } from './us-state';

/** The part a person plays on one request (not the same thing as their account role). */
export const PARTY_ROLES = ['buyer-agent', 'listing-agent', 'seller', 'inspector'] as const;
export const PartyRoleSchema = z.enum(PARTY_ROLES);
export type PartyRole = z.infer<typeof PartyRoleSchema>;

export const PARTY_ROLE_LABELS: Record<PartyRole, string> = {
  'buyer-agent': "Buyer's agent",
  'listing-agent': 'Listing agent',
  seller: 'Seller',
  inspector: 'Home inspector',
};


const optionalEmail = z
  .union([z.literal(''), z.email('Enter a valid e-mail address')])
  .optional()
  .nullable()
  .transform((v) => (v ? v.trim().toLowerCase() : null));

export const CreateRepairRequestSchema = z.object({
  street: plainText(200).trim().min(3, 'Enter the street address'),
  city: plainText(100).trim().min(2, 'Enter the city'),
  state: UsStateSchema,
  zip: z
    .string()
    .trim()
    .regex(/^\d{5}(-\d{4})?$/, 'Enter a 5-digit ZIP code (or ZIP+4)'),
  yearBuilt: z.coerce
    .number({ error: 'Enter the year the house was built' })
    .int('Enter a whole year')
    .min(1700, 'Enter a year after 1700')
    .max(2100, 'Enter a year before 2100'),
  closingDate: BoundedDateSchema,
  /** Omitted: the state's default edition is used. */
  necEdition: NecEditionSchema.optional().nullable(),
  listingAgentEmail: optionalEmail,
  sellerEmail: optionalEmail,
  inspectorEmail: optionalEmail,
  /** Only an administrator names the buyer's agent; an agent who creates a request is its buyer's agent. */
  buyerAgentEmail: optionalEmail,
  contractorOrganisationId: RecordIdSchema.nullable().optional().transform((v) => v ?? null),
});
export type CreateRepairRequest = z.input<typeof CreateRepairRequestSchema>;
export type CreateRepairRequestParsed = z.output<typeof CreateRepairRequestSchema>;

export const REQUEST_SORTS = ['closingDate', 'createdAt', 'status', 'street'] as const;
export type RequestSort = (typeof REQUEST_SORTS)[number];

export const RepairRequestListQuerySchema = PageQuerySchema.extend({
  sort: z.enum(REQUEST_SORTS).default('closingDate'),
  direction: z.enum(['asc', 'desc']).default('asc'),
  /** One status or several, comma-separated. */
  status: z
    .string()
    .optional()
    .transform((v) => (v ? v.split(',').filter(Boolean) : []))
    .pipe(z.array(RequestStatusSchema)),
  q: plainText(100).trim().optional().default(''),
  /** Only houses built before this year ("built before 1975"). */
  builtBefore: z.coerce
    .number({ error: 'Enter a year' })
    .int('Enter a whole year')
    .min(1700, 'Enter a year after 1700')
    .max(2100, 'Enter a year before 2100')
    .optional(),
  /** Keyset paging: the `nextCursor` of the page before; `page` then only numbers the page. */
  after: z.string().max(400).regex(/^[A-Za-z0-9_-]+$/, 'This page link is out of date: start again from the first page').optional(),
});
export type RepairRequestListQuery = z.input<typeof RepairRequestListQuerySchema>;

export const RepairRequestSummarySchema = z.object({
  id: z.number().int(),
  reference: z.string(),
  street: z.string(),
  city: z.string(),
  state: z.string(),
  zip: z.string(),
  yearBuilt: z.number().int(),
  closingDate: z.string(),
  necEdition: NecEditionSchema,
  status: RequestStatusSchema,
  contractorName: z.string().nullable(),
  itemCount: z.number().int(),
  /** Approved items without an outcome yet (and items not accepted, back to be reworked). */
  openWorkCount: z.number().int(),
  /** Whether open approved work is this close to closing (a setting in business days). */
  isAtRisk: z.boolean(),
  createdAt: z.string(),
  updatedAt: z.string(),
});
export type RepairRequestSummary = z.infer<typeof RepairRequestSummarySchema>;

export const PartySchema = z.object({
  role: PartyRoleSchema,
  email: z.string(),
  name: z.string().nullable(),
  userId: z.number().int().nullable(),
  /** Whether the person was invited and has not yet made an account. */
  isPending: z.boolean(),
  /** Shown only to the agents of the request while the invitation is pending. */
  inviteUrl: z.string().nullable(),
});
export type Party = z.infer<typeof PartySchema>;

export const StatusChangeSchema = z.object({
  from: RequestStatusSchema.nullable(),
  to: RequestStatusSchema,
  at: z.string(),
  byName: z.string().nullable(),
  /** The part the person played (a flow actor: `seller`, `contractor`…); absent for older changes. */
  actor: z.string().nullable().optional(),
  note: z.string().nullable(),
});
export type StatusChange = z.infer<typeof StatusChangeSchema>;

export const RepairRequestDetailSchema = RepairRequestSummarySchema.extend({
  contractor: z
    .object({
      id: z.number().int(),
      name: z.string(),
      licenceNumber: z.string().nullable(),
      licenceState: z.string().nullable(),
      licenceClass: z.string().nullable(),
    })
    .nullable(),
  parties: z.array(PartySchema),
  history: z.array(StatusChangeSchema),
  /** The signed-in user's parts on this request (empty for the contractor and admin). */
  myParts: z.array(PartyRoleSchema),
});
export type RepairRequestDetail = z.infer<typeof RepairRequestDetailSchema>;

export const InvitePartySchema = z.object({
  role: PartyRoleSchema.exclude(['buyer-agent']),
  email: z.email('Enter a valid e-mail address').trim().toLowerCase(),
});
export type InviteParty = z.infer<typeof InvitePartySchema>;

export const AssignContractorSchema = z.object({
  contractorOrganisationId: RecordIdSchema,
});

export const InvitationSchema = z.object({
  email: z.string(),
  role: PartyRoleSchema,
  requestReference: z.string(),
  propertyAddress: z.string(),
  invitedByName: z.string(),
  /** Whether an account for this e-mail exists already (then the person only signs in). */
  hasAccount: z.boolean(),
});
export type Invitation = z.infer<typeof InvitationSchema>;

export const AcceptInvitationSchema = z.object({
  name: plainText(120).trim().min(2, 'Enter your full name'),
  password: z.string().min(10, 'Use at least 10 characters').max(200),
});
export type AcceptInvitation = z.infer<typeof AcceptInvitationSchema>;

/** Answer of accepting an invitation: the new session and the request the invitation was for. */
export const AcceptedInvitationSchema = SessionSchema.extend({ requestId: z.number().int() });
export type AcceptedInvitation = z.infer<typeof AcceptedInvitationSchema>;
