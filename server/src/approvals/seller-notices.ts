// Where the product tells people that something happened on the seller's side. E-mail is connected
// here later (one implementation of this interface); until then every call point is in place and
// the default does nothing. Calls happen after the change is committed.

export interface SellerNoticeEvent {
  requestId: number;
  /** Who did it (user id; null for the payment service). */
  by: number | null;
}

export interface SellerNotices {
  /** The seller's side signed: the contractor and the agents hear that the quote was approved (or declined). */
  quoteDecided(e: SellerNoticeEvent & { approvalId: number; isApproved: boolean }): Promise<void>;
  /** A card payment was credited or funds at closing recorded: the seller gets the receipt, the contractor the news. */
  paymentReceived(e: SellerNoticeEvent & { paymentId: number; receiptInvoiceId: number | null }): Promise<void>;
  /** The contractor sent a change order: the seller's side is asked to decide. */
  changeOrderSent(e: SellerNoticeEvent & { changeOrderId: number }): Promise<void>;
  /** The seller's side decided on a change order: the contractor hears it. */
  changeOrderDecided(e: SellerNoticeEvent & { changeOrderId: number; isApproved: boolean }): Promise<void>;
  /** Money went back to the payer. */
  refundSettled(e: SellerNoticeEvent & { refundId: number }): Promise<void>;
}

/** The default until e-mail is connected: every notice is accepted and nothing is sent. */
export const NO_NOTICES_YET: SellerNotices = {
  quoteDecided: async () => undefined,
  paymentReceived: async () => undefined,
  changeOrderSent: async () => undefined,
  changeOrderDecided: async () => undefined,
  refundSettled: async () => undefined,
};
