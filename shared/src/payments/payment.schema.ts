import * as z from 'zod';
import { BoundedDateSchema, QuantitySchema, RecordIdSchema, trimmedText } from '../http/bounds';
import { FindingCodeSchema, RoomSchema } from '../findings/finding.schema';
import { ItemStatusSchema } from '../items/item-status';
import { QuoteSchema } from '../pricing/pricing-input.schema';
import { QuoteBreakdownSchema } from '../pricing/pricing-breakdown.schema';
import { RateBookSchema } from '../pricing/rate-book.schema';
import { RequestStatusSchema } from '../requests/request-status.schema';
import { QuoteVersionSchema } from '../quotes/quote-version.schema';
import { PAYMENT_PLANS } from './payment-account';
import { SignerCapacitySchema } from './signer-capacity';


const cents = z.number().int().min(1, 'Enter an amount of at least 1 cent').max(100_000_000, 'That amount is too large');
/** A key the client makes once per attempt, so a double submit finds the first one. */
export const IdempotencyKeySchema = z.string().regex(/^[A-Za-z0-9_-]{16,100}$/, 'Send a key of 16 to 100 letters, digits, - or _');

// ---------------------------------------------------------------------------------------------
// Deciding on the quote and signing

export const ITEM_DECISIONS = ['approved', 'declined'] as const;
export const ItemDecisionValueSchema = z.enum(ITEM_DECISIONS);

/** Longest note a seller may leave beside an item decision (the column holds this many; longer is refused, never cut). */
export const DECISION_NOTE_MAX = 500;
export const DecisionNoteSchema = trimmedText(DECISION_NOTE_MAX, `Keep the note to ${DECISION_NOTE_MAX} characters`);

export const ItemDecisionInputSchema = z.object({
  lineItemId: RecordIdSchema,
  decision: ItemDecisionValueSchema,
  note: DecisionNoteSchema.optional(),
});

export const SignApprovalSchema = z.object({
  /** The quote version decided on (a newer version sent meanwhile is a conflict). */
  quoteVersion: z.number().int().min(1).max(1_000),
  decisions: z.array(ItemDecisionInputSchema).min(1, 'Decide on every item').max(500),
  /** The signer's full name, typed. */
  signerName: trimmedText(200).pipe(z.string().min(3, 'Type your full name to sign')),
  /** Whether the signer ticked the box beside the terms. */
  hasConsented: z.literal(true, 'Tick the box to agree to the terms'),
});
export type SignApproval = z.input<typeof SignApprovalSchema>;
export type SignApprovalParsed = z.output<typeof SignApprovalSchema>;

export const SignatureSchema = z.object({
  signerName: z.string(),
  signedByName: z.string(),
  /** In what capacity it was signed: by the seller, or for the seller by the listing agent (or an administrator). */
  signerCapacity: SignerCapacitySchema,
  signedAt: z.string(),
  quoteVersion: z.number().int(),
  /** SHA-256 of the quote version as signed. */
  quoteHash: z.string(),
  consentText: z.string(),
  /** Shown to the seller's side and administrators only. */
  ipAddress: z.string().nullable(),
  userAgent: z.string().nullable(),
});
export type Signature = z.infer<typeof SignatureSchema>;

export const ItemDecisionSchema = z.object({
  lineItemId: z.number().int(),
  decision: ItemDecisionValueSchema,
  note: z.string().nullable(),
  decidedByName: z.string(),
  decidedAt: z.string(),
  /** The change order the decision belongs to (null for the quote). */
  changeOrderNumber: z.number().int().nullable(),
});
export type ItemDecision = z.infer<typeof ItemDecisionSchema>;

/** A line item as the scope shows it: what it is, its state, and its amount in the quote or change order. */
export const ScopeItemSchema = z.object({
  lineItemId: z.number().int(),
  code: FindingCodeSchema,
  room: RoomSchema,
  location: z.string(),
  status: ItemStatusSchema,
  workName: z.string(),
  quantity: z.number().int().nullable(),
  unit: z.string(),
  lineCents: z.number().int(),
  /** The change order that added it (null for an item of the quote). */
  changeOrderNumber: z.number().int().nullable(),
});
export type ScopeItem = z.infer<typeof ScopeItemSchema>;

// ---------------------------------------------------------------------------------------------
// Payments

export const PaymentPlanSchema = z.enum(PAYMENT_PLANS);

export const EscrowCompanySchema = z.object({
  company: trimmedText(200).pipe(z.string().min(2, 'Name the escrow or title company')),
  officer: trimmedText(200).default(''),
  /** Where the invoice is e-mailed: an invoice nobody sends is missed at closing. */
  email: z.string().trim().min(1, 'Enter the e-mail address the invoice is sent to').max(254, 'Use at most 254 characters').pipe(z.email('Enter an e-mail address like name@example.com')),
  fileNumber: trimmedText(80).default(''),
});
export type EscrowCompany = z.infer<typeof EscrowCompanySchema>;

/** E-mail an invoice payable at closing again, to the same or a corrected address. */
export const SendClosingInvoiceSchema = z.object({ email: EscrowCompanySchema.shape.email });
export type SendClosingInvoice = z.infer<typeof SendClosingInvoiceSchema>;

export const StartPaymentSchema = z.discriminatedUnion('plan', [
  z.object({ plan: z.literal('card-deposit'), idempotencyKey: IdempotencyKeySchema }),
  z.object({ plan: z.literal('card-full'), idempotencyKey: IdempotencyKeySchema }),
  z.object({ plan: z.literal('at-closing'), idempotencyKey: IdempotencyKeySchema, escrow: EscrowCompanySchema }),
]);
export type StartPayment = z.input<typeof StartPaymentSchema>;
export type StartPaymentParsed = z.output<typeof StartPaymentSchema>;

export const PAYMENT_STATUSES = ['pending', 'succeeded', 'failed', 'cancelled'] as const;
export const PAYMENT_PURPOSES = ['deposit', 'full', 'balance', 'closing'] as const;

export const PaymentSchema = z.object({
  id: z.number().int(),
  method: z.enum(['card', 'closing']),
  purpose: z.enum(PAYMENT_PURPOSES),
  amountCents: z.number().int(),
  status: z.enum(PAYMENT_STATUSES),
  refundedCents: z.number().int(),
  failureMessage: z.string().nullable(),
  createdAt: z.string(),
  paidAt: z.string().nullable(),
  reference: z.string().nullable(),
  receivedOn: z.string().nullable(),
  /** Where the payer finishes a card payment (only while it is pending, for the seller's side). */
  checkoutUrl: z.string().nullable(),
  refunds: z.array(
    z.object({ id: z.number().int(), amountCents: z.number().int(), reason: z.string(), status: z.enum(['pending', 'succeeded', 'failed']), createdAt: z.string() }),
  ),
});
export type Payment = z.infer<typeof PaymentSchema>;

export const StartedPaymentSchema = z.object({
  payment: PaymentSchema,
  /** Where to send the payer for a card payment; null for a closing invoice. */
  checkoutUrl: z.string().nullable(),
  /** The escrow invoice's number for a payment at closing. */
  invoiceNumber: z.string().nullable(),
});
export type StartedPayment = z.infer<typeof StartedPaymentSchema>;

export const RecordFundsSchema = z.object({
  paymentId: RecordIdSchema,
  amountCents: cents,
  receivedOn: BoundedDateSchema,
  reference: trimmedText(200).pipe(z.string().min(1, 'Enter the wire or cheque reference')),
});
export type RecordFunds = z.infer<typeof RecordFundsSchema>;

export const CreateRefundSchema = z.object({
  amountCents: cents,
  reason: trimmedText(500).pipe(z.string().min(3, 'Say why the money goes back')),
  idempotencyKey: IdempotencyKeySchema,
});
export type CreateRefund = z.infer<typeof CreateRefundSchema>;

// ---------------------------------------------------------------------------------------------
// Change orders

export const ChangeOrderLineInputSchema = z.discriminatedUnion('kind', [
  z.object({
    kind: z.literal('add'),
    code: FindingCodeSchema,
    room: RoomSchema,
    location: trimmedText(300).pipe(z.string().min(1, 'Say where the item is')),
    /** The rate-book entry (engine id of the quote's rate book). */
    entryId: z.string().min(1).max(60),
    quantity: QuantitySchema,
  }),
  z.object({ kind: z.literal('quantity'), lineItemId: RecordIdSchema, quantity: QuantitySchema }),
  z.object({ kind: z.literal('remove'), lineItemId: RecordIdSchema }),
]);
export type ChangeOrderLineInput = z.infer<typeof ChangeOrderLineInputSchema>;

export const CreateChangeOrderSchema = z.object({
  reason: trimmedText(1_000).pipe(z.string().min(3, 'Say what was found or why the work changes')),
  lines: z.array(ChangeOrderLineInputSchema).min(1, 'Add at least one change').max(50),
});
export type CreateChangeOrder = z.input<typeof CreateChangeOrderSchema>;
export type CreateChangeOrderParsed = z.output<typeof CreateChangeOrderSchema>;

export const DecideChangeOrderSchema = z.object({
  decision: z.enum(['approve', 'decline']),
  signerName: trimmedText(200).pipe(z.string().min(3, 'Type your full name to sign')),
  hasConsented: z.literal(true, 'Tick the box to agree to the terms'),
  note: DecisionNoteSchema.optional(),
});
export type DecideChangeOrder = z.input<typeof DecideChangeOrderSchema>;
export type DecideChangeOrderParsed = z.output<typeof DecideChangeOrderSchema>;

export const ChangeOrderLineSchema = z.object({
  kind: z.enum(['add', 'quantity', 'remove']),
  lineItemId: z.number().int(),
  code: FindingCodeSchema,
  location: z.string(),
  workName: z.string(),
  quantityBefore: z.number().int().nullable(),
  quantityAfter: z.number().int().nullable(),
});

export const ChangeOrderSchema = z.object({
  id: z.number().int(),
  number: z.number().int(),
  reason: z.string(),
  status: z.enum(['sent', 'approved', 'declined']),
  createdAt: z.string(),
  createdByName: z.string(),
  lines: z.array(ChangeOrderLineSchema),
  priceCents: z.number().int(),
  scopeBeforeCents: z.number().int(),
  scopeAfterCents: z.number().int(),
  decidedAt: z.string().nullable(),
  signerName: z.string().nullable(),
  /** In what capacity it was decided, as for the quote's approval (null while it waits). */
  signerCapacity: SignerCapacitySchema.nullable(),
  decisionNote: z.string().nullable(),
});
export type ChangeOrder = z.infer<typeof ChangeOrderSchema>;

// ---------------------------------------------------------------------------------------------
// Invoices and receipts

export const InvoiceSummarySchema = z.object({
  id: z.number().int(),
  /** e.g. INV-000012 or RCT-000007 (numbered per contractor organisation). */
  number: z.string(),
  kind: z.enum(['invoice', 'closing-invoice', 'receipt']),
  issuedAt: z.string(),
  totalCents: z.number().int(),
  balanceCents: z.number().int(),
  pdfPath: z.string(),
  /** An invoice payable at closing: the address it was last e-mailed to (null for the others). */
  sentTo: z.string().nullable(),
});
export type InvoiceSummary = z.infer<typeof InvoiceSummarySchema>;

// ---------------------------------------------------------------------------------------------
// The page: decision, scope, money

export const PaymentAccountSchema = z.object({
  scopeTotalCents: z.number().int(),
  depositCents: z.number().int(),
  paidCents: z.number().int(),
  refundedCents: z.number().int(),
  balanceCents: z.number().int(),
  overpaidCents: z.number().int(),
  payableAtClosingCents: z.number().int(),
});

export const ApprovalViewSchema = z.object({
  requestId: z.number().int(),
  requestReference: z.string(),
  requestStatus: RequestStatusSchema,
  property: z.string(),
  /** The quote version the decision is (or was) on. */
  quote: QuoteVersionSchema,
  /** What the portal prices live totals with (the same engine as the server). */
  pricing: z.object({ book: RateBookSchema, input: QuoteSchema }),
  consentText: z.string(),
  signature: SignatureSchema.nullable(),
  decisions: z.array(ItemDecisionSchema),
  items: z.array(ScopeItemSchema),
  /** The approved scope priced now (null before signing or when nothing is approved). */
  scope: QuoteBreakdownSchema.nullable(),
  account: PaymentAccountSchema,
  /** Plans the seller's side may start now, with what each asks. */
  plans: z.array(z.object({ plan: PaymentPlanSchema, amountCents: z.number().int() })),
  payments: z.array(PaymentSchema),
  changeOrders: z.array(ChangeOrderSchema),
  invoices: z.array(InvoiceSummarySchema),
  /** What the signed-in person may do here. */
  can: z.object({
    decide: z.boolean(),
    pay: z.boolean(),
    recordFunds: z.boolean(),
    refund: z.boolean(),
    sendChangeOrder: z.boolean(),
    decideChangeOrder: z.boolean(),
    issueInvoice: z.boolean(),
    sendClosingInvoice: z.boolean(),
  }),
  /** What happens next and who acts, in a sentence. */
  nextStep: z.string(),
});
export type ApprovalView = z.infer<typeof ApprovalViewSchema>;
