// Where the product tells people that something happened on the seller's side. Each call is made
// inside the transaction of the change, so that its messages commit or roll back with it; the one
// implementation writes them through `notify()` (notifications/seller-notice-mail.ts).
import type { EscrowCompany } from '@cc/shared';
import type { Trx } from '../db/knex';

export interface SellerNoticeEvent {
  requestId: number;
  /** Who did it (user id; null for the payment service). */
  by: number | null;
  /** When it happened: now, unless demo data backdates its history. */
  at?: Date;
}

export interface SellerNotices {
  /** The seller's side signed: the contractor and the agents hear that the quote was approved (or declined). */
  quoteDecided(trx: Trx, e: SellerNoticeEvent & { approvalId: number; isApproved: boolean }): Promise<void>;
  /** A card payment was credited or funds at closing recorded: the seller gets the receipt, the contractor the news. */
  paymentReceived(trx: Trx, e: SellerNoticeEvent & { paymentId: number; receiptInvoiceId: number | null }): Promise<void>;
  /**
   * The seller's side chose to pay from the proceeds at closing: the invoice goes to the escrow
   * company with its PDF, and the contractor, the seller's side and the agents hear how, how much and
   * where the invoice went.
   */
  closingPaymentChosen(trx: Trx, e: SellerNoticeEvent & { paymentId: number; invoiceId: number; escrow: EscrowCompany }): Promise<void>;
  /** The invoice payable at closing is e-mailed again (to the same or a corrected address); `sendNumber` counts the sends. */
  closingInvoiceSent(trx: Trx, e: SellerNoticeEvent & { invoiceId: number; escrow: EscrowCompany; sendNumber: number }): Promise<void>;
  /** The contractor sent a change order: the seller's side is asked to decide. */
  changeOrderSent(trx: Trx, e: SellerNoticeEvent & { changeOrderId: number }): Promise<void>;
  /** The seller's side decided on a change order: the contractor hears it. */
  changeOrderDecided(trx: Trx, e: SellerNoticeEvent & { changeOrderId: number; isApproved: boolean }): Promise<void>;
  /** Money went back to the payer. */
  refundSettled(trx: Trx, e: SellerNoticeEvent & { refundId: number }): Promise<void>;
}
