// The typed call every feature makes when something happens that people are told about by e-mail:
// `notifications.notify(trx, {kind, requestId, ...})`, inside the transaction of the change.
import type { ItemStatus, NotificationKind, PartyRole } from '@cc/shared';

interface Base {
  requestId: number;
  /** Who made the change (not e-mailed about their own action); null for the system. */
  actorUserId: number | null;
}

export type NotifyInput =
  | (Base & { kind: 'invitation'; email: string; role: PartyRole; inviteToken: string })
  | (Base & { kind: 'report-parsed'; reportFileId: number; itemCount: number })
  | (Base & { kind: 'ready-to-price'; itemCount: number })
  | (Base & { kind: 'quote-sent'; version: number; totalCents: number })
  | (Base & { kind: 'items-decided'; approvedCount: number; declinedCount: number; approvedCents: number; decisionRef: string })
  | (Base & { kind: 'payment-received'; paymentId: number; amountCents: number })
  | (Base & { kind: 'visit-scheduled'; visitId: number; startsAt: string; endsAt: string | null })
  | (Base & { kind: 'item-corrected'; itemId: number; outcome: Extract<ItemStatus, 'done' | 'not-done'>; itemLabel: string })
  | (Base & { kind: 'letter-issued'; letterId: number })
  | (Base & { kind: 'closing-at-risk'; day: string; daysLeft: number });

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
    case 'visit-scheduled':
      return `visit-${input.visitId}-${input.startsAt}`;
    case 'item-corrected':
      return `item-${input.itemId}-${input.outcome}`;
    case 'letter-issued':
      return `letter-${input.letterId}`;
    case 'closing-at-risk':
      return input.day;
  }
}
