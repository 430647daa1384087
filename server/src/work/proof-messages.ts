// The call point for messages about the proof side of a request. The e-mail notifications plug in
// here; until then nothing is sent. Each call happens after its transaction committed.

export interface VisitScheduledMessage {
  requestId: number;
  visitNumber: number;
  date: string;
  arrivalFrom: string;
  arrivalTo: string;
}

export interface ItemCorrectedMessage {
  requestId: number;
  itemId: number;
  outcome: string;
}

export interface LetterIssuedMessage {
  requestId: number;
  letterNumber: string;
  revision: number;
}

export interface ProofMessages {
  visitScheduled(message: VisitScheduledMessage): Promise<void>;
  itemCorrected(message: ItemCorrectedMessage): Promise<void>;
  letterIssued(message: LetterIssuedMessage): Promise<void>;
}

/** Sends nothing: the default until the notifications are wired in. */
export const noProofMessages: ProofMessages = {
  visitScheduled: async () => undefined,
  itemCorrected: async () => undefined,
  letterIssued: async () => undefined,
};
