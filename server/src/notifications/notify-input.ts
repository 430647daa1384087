// The typed call every feature makes when something happens that people are told about by e-mail:
// `notifications.notify(trx, {kind, requestId, ...})`, inside the transaction of the change.
import type { CorrectionOutcome, NotificationKind, PartyRole } from '@cc/shared';

interface Base {
  requestId: number;
  /** Who made the change (not e-mailed about their own action); null for the system. */
  actorUserId: number | null;
  /** When it happened (the activity entry's time): now, unless demo data backdates its history. */
  at?: Date;
}

export type NotifyInput =
  | (Base & { kind: 'invitation'; email: string; role: PartyRole; inviteToken: string })
  | (Base & { kind: 'report-parsed'; reportFileId: number; itemCount: number })
  | (Base & { kind: 'ready-to-price'; itemCount: number })
  | (Base & { kind: 'quote-sent'; version: number; totalCents: number })
  | (Base & { kind: 'items-decided'; approvedCount: number; declinedCount: number; approvedCents: number; decisionRef: string; /** Who signed for the seller ("Robert Hale, listing agent, for the seller"); null when the seller signed. */ signedBy: string | null })
  | (Base & { kind: 'payment-received'; paymentId: number; amountCents: number; /** The receipt issued for it (card payments), e.g. RCT-000012. */ receiptNumber: string | null })
  | (Base & { kind: 'closing-payment-chosen'; paymentId: number; amountCents: number; invoiceNumber: string; /** Where the invoice was e-mailed. */ escrow: EscrowRecipient })
  | (Base & { kind: 'closing-invoice'; invoiceId: number; invoiceNumber: string; amountCents: number; /** The contractor the funds are paid to. */ payee: string; escrow: EscrowRecipient; /** Counts the sends of one invoice (a second send to a corrected address is a new message). */ sendNumber: number })
  | (Base & { kind: 'change-order-sent'; changeOrderId: number; number: number; priceCents: number; reason: string })
  | (Base & { kind: 'change-order-decided'; changeOrderId: number; number: number; priceCents: number; isApproved: boolean; /** Who decided, with the capacity ("Robert Hale, listing agent, for the seller"). */ signedBy: string })
  | (Base & { kind: 'refund-settled'; refundId: number; amountCents: number })
  | (Base & { kind: 'visit-scheduled' } & VisitWindow & { visitNumber: number; /** The window before, when the visit was moved. */ previous: VisitWindow | null })
  | (Base & { kind: 'visit-cancelled' } & VisitWindow & { visitNumber: number; /** Why it was called off, as the contractor wrote it. */ reason: string })
  | (Base & { kind: 'electrician-visit' } & VisitWindow & ElectricianVisitChange)
  | (Base & { kind: 'item-corrected'; itemId: number; correctionId: number; outcome: CorrectionOutcome; itemLabel: string })
  | (Base & { kind: 'letter-issued'; letterNumber: string; revision: number })
  | (Base & { kind: 'proof-reviewed'; isAccepted: boolean; /** Items listed as not accepted (0 when accepted). */ notAcceptedCount: number; /** The review's timeline entry: one message per review. */ reviewRef: string })
  | (Base & { kind: 'closing-at-risk'; day: string; daysLeft: number });

/** What changed for one electrician about one visit (`electrician-visit`: e-mailed to that electrician only). */
export interface ElectricianVisitChange {
  /** The electrician told (a user of the request's contractor organisation). */
  electricianUserId: number;
  visitId: number;
  visitNumber: number;
  /** booked for them (new, or handed over from a colleague), moved (their visit, another day or window), removed (handed to a colleague), cancelled (called off). */
  change: 'booked' | 'moved' | 'removed' | 'cancelled';
  /** The window before, when their visit was moved. */
  previous: VisitWindow | null;
  /** The colleague a removed visit went to. */
  handedTo: string | null;
  /** Why a cancelled visit was called off. */
  reason?: string | null;
  /** The change's transaction: each change is one message, even when a visit comes back to the same day. */
  changeRef: string;
}

/** The escrow or title company an invoice payable at closing is e-mailed to. */
export interface EscrowRecipient {
  company: string;
  officer: string;
  email: string;
  fileNumber: string;
}

/** A visit's day and arrival window, in the property's local time (`YYYY-MM-DD`, `HH:MM`). */
export interface VisitWindow {
  date: string;
  arrivalFrom: string;
  arrivalTo: string;
}

export type NotifyInputOf<K extends NotificationKind> = Extract<NotifyInput, { kind: K }>;

/** What makes one occurrence of a message distinct: the same occurrence is written once per person. */
export function occurrenceOf(input: NotifyInput): string {
  switch (input.kind) {
    case 'invitation':
      return input.inviteToken.slice(0, 16);
    case 'report-parsed':
      return `report-${input.reportFileId}-${input.itemCount}`;
    case 'ready-to-price':
      return 'confirmed';
    case 'quote-sent':
      return `v${input.version}`;
    case 'items-decided':
      return input.decisionRef;
    case 'payment-received':
      return `payment-${input.paymentId}`;
    case 'closing-payment-chosen':
      return `closing-payment-${input.paymentId}`;
    case 'closing-invoice':
      return `invoice-${input.invoiceId}-send-${input.sendNumber}`;
    case 'change-order-sent':
      return `change-order-${input.changeOrderId}`;
    case 'change-order-decided':
      return `change-order-${input.changeOrderId}-${input.isApproved ? 'approved' : 'declined'}`;
    case 'refund-settled':
      return `refund-${input.refundId}`;
    case 'visit-scheduled':
      // A visit moved to another day or window is a new message.
      return `visit-${input.visitNumber}-${input.date}-${input.arrivalFrom}-${input.arrivalTo}`;
    case 'visit-cancelled':
      // A visit is cancelled once.
      return `visit-${input.visitNumber}-cancelled`;
    case 'electrician-visit':
      return `electrician-visit-${input.visitId}-${input.change}-${input.electricianUserId}-${input.changeRef}`;
    case 'item-corrected':
      return `item-${input.itemId}-correction-${input.correctionId}`;
    case 'letter-issued':
      return `letter-${input.revision}`;
    case 'proof-reviewed':
      return `proof-review-${input.reviewRef}`;
    case 'closing-at-risk':
      return input.day;
  }
}
