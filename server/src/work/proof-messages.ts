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
  itemCorrected(trx: Trx, message: ItemCorrectedMessage): Promise<void>;
  letterIssued(trx: Trx, message: LetterIssuedMessage): Promise<void>;
}
