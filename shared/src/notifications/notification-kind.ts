import * as z from 'zod';
import type { Role } from '../auth/role';
import { RecordIdSchema } from '../http/bounds';
import { PageQuerySchema } from '../http/page';
import { actorsForRole, REQUEST_ACTIONS, type FlowActor } from '../requests/request-flow';

/** Every message the product sends by e-mail. */
export const NOTIFICATION_KINDS = [
  'invitation',
  'report-parsed',
  'ready-to-price',
  'quote-sent',
  'items-decided',
  'payment-received',
  'closing-payment-chosen',
  'closing-invoice',
  'change-order-sent',
  'change-order-decided',
  'refund-settled',
  'visit-scheduled',
  'visit-cancelled',
  'electrician-visit',
  'item-corrected',
  'letter-issued',
  'proof-reviewed',
  'closing-at-risk',
] as const;
export const NotificationKindSchema = z.enum(NOTIFICATION_KINDS);
export type NotificationKind = z.infer<typeof NotificationKindSchema>;

export const DELIVERIES = ['immediate', 'digest', 'off'] as const;
export const DeliverySchema = z.enum(DELIVERIES);
export type Delivery = z.infer<typeof DeliverySchema>;

export interface NotificationKindRule {
  /** What the message is called on the preferences screen. */
  readonly label: string;
  /** Who receives it on a request (parties by their part, `contractor` = the assigned contractor's people). */
  readonly to: readonly FlowActor[];
  /** How it is delivered when the person chose nothing. */
  readonly defaultDelivery: Exclude<Delivery, 'off'>;
  /** Whether a person may turn it off or into the digest (invitations always go out at once). */
  readonly isAdjustable: boolean;
  /** Whether it can only come in the daily digest. */
  readonly isDigestOnly?: boolean;
}

/** Who hears of a visit's day: the buyer's agent too, as the visit decides whether the repairs are done before closing. */
const TOLD_OF_VISITS: readonly FlowActor[] = ['seller', 'listing-agent', 'buyer-agent'];

export const NOTIFICATION_RULES: Record<NotificationKind, NotificationKindRule> = {
  invitation: { label: 'Invitation to a request', to: [], defaultDelivery: 'immediate', isAdjustable: false },
  'report-parsed': { label: 'Inspection report read', to: ['buyer-agent'], defaultDelivery: 'immediate', isAdjustable: true },
  'ready-to-price': { label: 'Request ready to price', to: ['contractor'], defaultDelivery: 'immediate', isAdjustable: true },
  'quote-sent': { label: 'Quote sent', to: ['seller', 'buyer-agent', 'listing-agent'], defaultDelivery: 'immediate', isAdjustable: true },
  // The seller too: the listing agent may sign for them.
  'items-decided': { label: 'Items approved or declined', to: ['contractor', 'seller', 'buyer-agent', 'listing-agent'], defaultDelivery: 'immediate', isAdjustable: true },
  'payment-received': { label: 'Payment received', to: ['contractor', 'seller', 'listing-agent'], defaultDelivery: 'immediate', isAdjustable: true },
  // The seller too: the listing agent may choose it for them.
  'closing-payment-chosen': { label: 'Payment at closing chosen', to: ['contractor', 'seller', 'buyer-agent', 'listing-agent'], defaultDelivery: 'immediate', isAdjustable: true },
  // To the escrow officer named when payment at closing was chosen (not a party: no account, no preferences).
  'closing-invoice': { label: 'Invoice to the escrow company', to: [], defaultDelivery: 'immediate', isAdjustable: false },
  // Who decides a change order, who sends it, who pays and who refunds: as the flow table says.
  'change-order-sent': { label: 'Change order to decide', to: REQUEST_ACTIONS['decide-change-order'].by, defaultDelivery: 'immediate', isAdjustable: true },
  'change-order-decided': { label: 'Change order approved or declined', to: REQUEST_ACTIONS['send-change-order'].by, defaultDelivery: 'immediate', isAdjustable: true },
  'refund-settled': { label: 'Refund paid back', to: [...REQUEST_ACTIONS.pay.by, ...REQUEST_ACTIONS.refund.by], defaultDelivery: 'immediate', isAdjustable: true },
  'visit-scheduled': { label: 'Visit scheduled', to: TOLD_OF_VISITS, defaultDelivery: 'immediate', isAdjustable: true },
  // Whoever was told of the booking hears that it is called off.
  'visit-cancelled': { label: 'Visit cancelled', to: TOLD_OF_VISITS, defaultDelivery: 'immediate', isAdjustable: true },
  // Only the electrician the visit is booked for, moved for or taken from (one of the contractor's people;
  // notify() narrows `to` to that one person), never the person who made the change.
  'electrician-visit': { label: 'Your visits booked, moved, cancelled or taken off your day', to: ['contractor'], defaultDelivery: 'immediate', isAdjustable: true },
  'item-corrected': { label: 'Item corrected', to: ['buyer-agent', 'listing-agent', 'seller'], defaultDelivery: 'immediate', isAdjustable: true },
  // The seller too: the letter is the proof of the repairs they paid for.
  'letter-issued': { label: 'Completion letter issued', to: ['inspector', 'buyer-agent', 'listing-agent', 'seller'], defaultDelivery: 'immediate', isAdjustable: true },
  // The last step of the work: the contractor learns it is signed off (or what to take back), the seller's side and the agents that the repairs are done.
  'proof-reviewed': { label: 'Corrections accepted or not accepted', to: ['contractor', 'seller', 'buyer-agent', 'listing-agent'], defaultDelivery: 'immediate', isAdjustable: true },
  'closing-at-risk': {
    label: 'Closing at risk (daily digest)',
    to: ['buyer-agent', 'listing-agent', 'contractor'],
    defaultDelivery: 'digest',
    isAdjustable: true,
    isDigestOnly: true,
  },
};

/**
 * The parties of a request a message of `kind` goes to: those with an account in a part the rule names
 * (as the server picks them; each may still have turned the message off). The assigned contractor's
 * people are not parties, so they are not in it.
 */
export function partiesTold<P extends { role: FlowActor; userId: number | null }>(kind: NotificationKind, parties: readonly P[]): P[] {
  const to = NOTIFICATION_RULES[kind].to;
  return parties.filter((p) => p.userId !== null && to.includes(p.role));
}

/** The adjustable kinds an account of `role` can receive (the only ones its preferences screen lists). */
export function kindsForRole(role: Role): NotificationKind[] {
  const parts = actorsForRole(role);
  return ADJUSTABLE_KINDS.filter((kind) => NOTIFICATION_RULES[kind].to.some((part) => parts.includes(part)));
}

/** The kinds a person sets on the preferences screen. */
export const ADJUSTABLE_KINDS: readonly NotificationKind[] = NOTIFICATION_KINDS.filter((k) => NOTIFICATION_RULES[k].isAdjustable);

export const NotificationPreferenceSchema = z.object({
  kind: NotificationKindSchema,
  label: z.string(),
  delivery: DeliverySchema,
  isDigestOnly: z.boolean(),
});
export type NotificationPreference = z.infer<typeof NotificationPreferenceSchema>;

export const UpdatePreferencesSchema = z
  .object({
    preferences: z
      .array(z.object({ kind: NotificationKindSchema, delivery: DeliverySchema }))
      .max(NOTIFICATION_KINDS.length),
  })
  .superRefine((value, ctx) => {
    value.preferences.forEach((p, i) => {
      const rule = NOTIFICATION_RULES[p.kind];
      if (!rule.isAdjustable) ctx.addIssue({ code: 'custom', path: ['preferences', i, 'kind'], message: 'Invitations are always sent' });
      else if (rule.isDigestOnly && p.delivery === 'immediate')
        ctx.addIssue({ code: 'custom', path: ['preferences', i, 'delivery'], message: 'This message comes only in the daily digest' });
    });
  });
export type UpdatePreferences = z.infer<typeof UpdatePreferencesSchema>;

/** A message the development mailbox captured. */
export const CapturedMailSchema = z.object({
  id: z.number().int(),
  messageId: z.string().nullable(),
  from: z.string(),
  to: z.array(z.string()),
  subject: z.string(),
  text: z.string(),
  html: z.string(),
  /** What the message carried as files (names and sizes; the mailbox keeps no file content). */
  attachments: z.array(z.object({ fileName: z.string(), contentType: z.string(), bytes: z.number().int() })),
  receivedAt: z.string(),
});
export type CapturedMail = z.infer<typeof CapturedMailSchema>;

/**
 * A page of the development mailbox, newest first: every message, or those of one request (`requestId`)
 * or to one address (`to`, any case), or both.
 */
export const MailboxQuerySchema = PageQuerySchema.extend({
  to: z.email('Type a whole e-mail address, such as name@example.com').max(254).optional(),
  requestId: z.coerce.number().pipe(RecordIdSchema).optional(),
});
export type MailboxQuery = z.input<typeof MailboxQuerySchema>;

/** How the outbox stands, for the development mailbox page. */
export const OutboxCountsSchema = z.record(z.string(), z.number().int());
