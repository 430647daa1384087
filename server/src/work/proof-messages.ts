// The call point for messages about the proof side of a request. Each call is made inside the
// transaction of the change, so that its messages commit or roll back with it; the one implementation
// writes them through `notify()` (notifications/proof-message-mail.ts).
import type { CorrectionOutcome } from '@cc/shared';
import type { Trx } from '../db/knex';

export interface VisitScheduledMessage {
  requestId: number;
  visitNumber: number;
  date: string;
  arrivalFrom: string;
  arrivalTo: string;
  /** Who booked or moved it (not e-mailed about it); null or absent for the system. */
  by?: number | null;
  /** The day and window before, when an existing visit was moved (the message then says so). */
  previous?: { date: string; arrivalFrom: string; arrivalTo: string } | null;
}

/** Who a visit is booked for and when, before or after a change. */
export interface VisitSlot {
  electricianId: number;
  date: string;
  arrivalFrom: string;
  arrivalTo: string;
}

/** A visit booked, moved or handed to another electrician: the electricians concerned are told (not the one who did it). */
export interface VisitAssignedMessage {
  requestId: number;
  visitId: number;
  visitNumber: number;
  /** Null when the visit is new. */
  before: VisitSlot | null;
  after: VisitSlot;
  by?: number | null;
}

/** A booked visit called off: the seller's side and its electrician are told (not the one who cancelled it). */
export interface VisitCancelledMessage {
  requestId: number;
  visitId: number;
  visitNumber: number;
  /** Who the visit was booked for and when. */
  slot: VisitSlot;
  reason: string;
  by?: number | null;
}

export interface ItemCorrectedMessage {
  requestId: number;
  itemId: number;
  /** The correction record written (a reworked item gets a new one, and a new message). */
  correctionId: number;
  outcome: CorrectionOutcome;
  by?: number | null;
}

export interface LetterIssuedMessage {
  requestId: number;
  letterNumber: string;
  revision: number;
  by?: number | null;
}

export interface ProofMessages {
  visitScheduled(trx: Trx, message: VisitScheduledMessage): Promise<void>;
  visitAssigned(trx: Trx, message: VisitAssignedMessage): Promise<void>;
  visitCancelled(trx: Trx, message: VisitCancelledMessage): Promise<void>;
  itemCorrected(trx: Trx, message: ItemCorrectedMessage): Promise<void>;
  letterIssued(trx: Trx, message: LetterIssuedMessage): Promise<void>;
}

/**
 * What each electrician hears of a visit's change: a new visit is booked for its electrician; a visit
 * handed to another electrician is removed from the first and booked for the second; the same
 * electrician's visit on another day or window is moved. Nothing when nothing they see changed.
 */
export function electricianVisitChanges(before: VisitSlot | null, after: VisitSlot): { electricianId: number; change: 'booked' | 'moved' | 'removed'; slot: VisitSlot }[] {
  if (!before) return [{ electricianId: after.electricianId, change: 'booked', slot: after }];
  if (before.electricianId !== after.electricianId) {
    return [
      { electricianId: before.electricianId, change: 'removed', slot: before },
      { electricianId: after.electricianId, change: 'booked', slot: after },
    ];
  }
  const same = before.date === after.date && before.arrivalFrom === after.arrivalFrom && before.arrivalTo === after.arrivalTo;
  return same ? [] : [{ electricianId: after.electricianId, change: 'moved', slot: after }];
}
