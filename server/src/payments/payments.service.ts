import { portalBaseFor } from '../http/portal-origin';
import { actorsOnRequest, amountDue, paymentAccount, requestReference, type CreateRefund, type CurrentUser, type RecordFunds, type SendClosingInvoice, type StartedPayment, type StartPaymentParsed } from '@cc/shared';
import type Stripe from 'stripe';
import type { Db, Trx } from '../db/knex';
import type { ApprovalRepository } from '../approvals/approval.repository';
import type { ApprovedScopeReader } from '../approvals/approved-scope';
import { assertMayAct } from '../flow/flow.service';
import { refusalMessages } from '../approvals/approval-messages';
import type { SellerNotices } from '../approvals/seller-notices';
import { PaymentServiceError, type PaymentGateway } from '../integrations/payments/payment-gateway';
import { invoiceNumber } from '../invoices/invoice-dto';
import type { InvoicesService } from '../invoices/invoices.service';
import { ConflictError, NotFoundError, ValidationError } from '../errors';
import type { RequestsService } from '../requests/requests.service';
import { toPaymentDtos } from './payment-dto';
import type { PaymentRepository, StoredPayment } from './payment.repository';

/** Why a webhook call was refused (400, nothing changed). */
export class WebhookSignatureError extends Error {}

/** What one payment event did. */
export type EventOutcome = 'credited' | 'already-credited' | 'declined' | 'expired' | 'refunded' | 'refund-failed' | 'duplicate' | 'ignored' | 'unknown-payment' | 'amount-mismatch';

const PLAN_PURPOSE = { 'card-deposit': 'deposit', 'card-full': 'full', 'at-closing': 'closing' } as const;
const PURPOSE_TEXT = { deposit: 'Deposit', full: 'Payment in full', balance: 'Balance', closing: 'Payment at closing' } as const;

/**
 * Payments of a request: starting a card payment (one per double click), an invoice payable at
 * closing, recording funds from escrow, refunds, and the payment service's events, the only thing
 * that changes a card payment's state.
 */
export class PaymentsService {
  constructor(
    private readonly db: Db,
    private readonly access: RequestsService,
    private readonly approvals: ApprovalRepository,
    private readonly scopes: ApprovedScopeReader,
    private readonly payments: PaymentRepository,
    private readonly invoices: InvoicesService,
    private readonly gateway: PaymentGateway | null,
    private readonly notices: SellerNotices,
    private readonly publicUrl: string,
  ) {}

  /** `origin`: the Origin header of the request, so the payment page sends the seller back to the address they use. */
  async start(user: CurrentUser, requestId: number, input: StartPaymentParsed, origin?: string): Promise<StartedPayment> {
    const request = await this.access.get(user, requestId);
    assertMayAct(actorsOnRequest(user, request), 'pay', request.status, refusalMessages('pay for the work', request.status));
    if (input.plan !== 'at-closing' && !this.gateway) throw new ConflictError('Card payments are not set up on this server. Choose payment at closing.');
    const result = await this.db.transaction(async (trx) => {
      await this.approvals.lockRequest(requestId, trx);
      const again = await this.payments.findByKey(requestId, input.idempotencyKey, trx);
      if (again) return { payment: again, invoiceNumber: null, isNew: false };
      const scope = await this.scopes.load(requestId, trx);
      if (!scope) throw new ConflictError('Nothing is approved yet: sign the quote first');
      const existing = await this.payments.list(requestId, trx);
      // A second click with another key while a card payment of the same kind is open: the same payment.
      const purpose = PLAN_PURPOSE[input.plan];
      const open = existing.find((p) => p.status === 'pending' && p.method === 'card' && p.purpose === purpose);
      if (open) return { payment: open, invoiceNumber: null, isNew: false };
      const account = paymentAccount(scope.totalCents, scope.cardDepositBp, existing);
      const amountCents = amountDue(input.plan, account);
      if (amountCents === null) throw new ConflictError('This payment option does not apply now. Reload to see what is due.');
      const payment = await this.payments.insert(
        { requestId, organisationId: await this.organisationOf(requestId, trx), method: input.plan === 'at-closing' ? 'closing' : 'card', purpose: account.paidCents > 0 && purpose === 'full' ? 'balance' : purpose, amountCents, idempotencyKey: input.idempotencyKey, createdBy: user.id },
        trx,
      );
      if (input.plan !== 'at-closing') return { payment, invoiceNumber: null, isNew: true };
      const invoice = await this.invoices.issueClosingInvoice(requestId, payment, input.escrow, user.id, trx);
      await this.notices.closingPaymentChosen(trx, { requestId, by: user.id, paymentId: payment.id, invoiceId: invoice.id, escrow: input.escrow });
      return { payment, invoiceNumber: invoiceNumber(invoice.series, invoice.number), isNew: true };
    });
    const payment = result.payment.method === 'card' ? await this.checkoutFor(result.payment, user, portalBaseFor(this.publicUrl, origin)) : result.payment;
    return { payment: toPaymentDtos([payment], [], true)[0], checkoutUrl: payment.method === 'card' ? payment.checkoutUrl : null, invoiceNumber: result.invoiceNumber };
  }

  /** The payment page of a card payment: made once; asking again (same idempotency key) gives the same page. */
  private async checkoutFor(payment: StoredPayment, user: CurrentUser, portalBase: string): Promise<StoredPayment> {
    if (payment.checkoutUrl || payment.status !== 'pending') return payment;
    const back = `${portalBase}/requests/${payment.requestId}/approval`;
    try {
      const session = await this.gateway!.createCheckout({
        paymentId: payment.id,
        requestId: payment.requestId,
        description: `${PURPOSE_TEXT[payment.purpose]} · electrical repairs ${requestReference(payment.requestId)}`,
        amountCents: payment.amountCents,
        successUrl: `${back}?payment=${payment.id}`,
        cancelUrl: `${back}?payment=${payment.id}&cancelled=1`,
        customerEmail: user.email,
        idempotencyKey: `checkout-payment-${payment.id}`,
      });
      await this.payments.setCheckout(payment.id, session.sessionId, session.url);
      return { ...payment, checkoutSessionId: session.sessionId, checkoutUrl: session.url };
    } catch (err) {
      if (!(err instanceof PaymentServiceError)) throw err;
      await this.payments.cancel(payment.id, err.message);
      throw new ConflictError(`The payment service did not open a payment page (${err.message}). Try again in a moment.`);
    }
  }

  private async organisationOf(requestId: number, trx: Trx): Promise<number> {
    const row = await trx('repair_requests').where({ id: requestId }).first('contractor_organisation_id');
    if (!row?.contractor_organisation_id) throw new ConflictError('The request has no contractor');
    return row.contractor_organisation_id;
  }

  /** The seller's side or the contractor e-mails the invoice payable at closing again, to the same or a corrected address. */
  async sendClosingInvoice(user: CurrentUser, requestId: number, invoiceId: number, input: SendClosingInvoice): Promise<void> {
    const request = await this.access.get(user, requestId);
    assertMayAct(actorsOnRequest(user, request), 'send-closing-invoice', request.status, refusalMessages('send the invoice', request.status));
    await this.db.transaction(async (trx) => {
      await this.approvals.lockRequest(requestId, trx);
      const { escrow, sendNumber } = await this.invoices.sendAgain(requestId, invoiceId, input.email, trx);
      await this.notices.closingInvoiceSent(trx, { requestId, by: user.id, invoiceId, escrow, sendNumber });
    });
  }

  /** The contractor records funds paid by the escrow company against an invoice payable at closing. */
  async recordFunds(user: CurrentUser, requestId: number, input: RecordFunds): Promise<void> {
    const request = await this.access.get(user, requestId);
    assertMayAct(actorsOnRequest(user, request), 'record-funds', request.status, refusalMessages('record funds', request.status));
    await this.db.transaction(async (trx) => {
      const p = await this.payments.lock(input.paymentId, trx);
      if (!p || p.requestId !== requestId) throw new NotFoundError('No such payment on this request');
      if (p.method !== 'closing') throw new ConflictError('Card payments are recorded by the payment service, not by hand');
      if (p.status !== 'pending') throw new ConflictError('These funds are recorded already');
      if (p.amountCents !== input.amountCents) throw new ValidationError('The amount differs from the invoice', [{ path: 'amountCents', message: `The invoice payable at closing is for ${p.amountCents} cents` }]);
      await this.payments.markSucceeded(p.id, { paymentIntentId: null, reference: input.reference, receivedOn: input.receivedOn }, trx);
      await this.notices.paymentReceived(trx, { requestId, by: user.id, paymentId: p.id, receiptInvoiceId: null });
    });
  }

  /** The contractor gives money back on a card payment (in full or in part); settled by the service's event. */
  async refund(user: CurrentUser, requestId: number, paymentId: number, input: CreateRefund): Promise<void> {
    const request = await this.access.get(user, requestId);
    assertMayAct(actorsOnRequest(user, request), 'refund', request.status, refusalMessages('refund payments', request.status));
    if (!this.gateway) throw new ConflictError('Card payments are not set up on this server');
    const { refund, payment } = await this.db.transaction(async (trx) => {
      const p = await this.payments.lock(paymentId, trx);
      if (!p || p.requestId !== requestId) throw new NotFoundError('No such payment on this request');
      const again = await this.payments.findRefundByKey(input.idempotencyKey, trx);
      if (again) return { refund: again, payment: p };
      if (p.method !== 'card' || p.status !== 'succeeded' || !p.paymentIntentId) throw new ConflictError('Only a received card payment can be refunded here; funds paid at closing go back through the escrow company');
      const pending = (await this.payments.refunds([p.id], trx)).filter((r) => r.status === 'pending').reduce((s, r) => s + r.amountCents, 0);
      const refundable = p.amountCents - p.refundedCents - pending;
      if (input.amountCents > refundable) throw new ValidationError('That is more than can be refunded', [{ path: 'amountCents', message: `At most ${refundable} cents can be refunded on this payment` }]);
      return { refund: await this.payments.insertRefund({ paymentId: p.id, amountCents: input.amountCents, reason: input.reason, idempotencyKey: input.idempotencyKey, createdBy: user.id }, trx), payment: p };
    });
    if (refund.providerRefundId || refund.status !== 'pending') return;
    try {
      const { providerRefundId } = await this.gateway.refund({ paymentIntentId: payment.paymentIntentId!, amountCents: refund.amountCents, refundId: refund.id, idempotencyKey: `refund-${refund.id}` });
      await this.payments.setProviderRefund(refund.id, providerRefundId);
    } catch (err) {
      if (!(err instanceof PaymentServiceError)) throw err;
      await this.payments.failRefund(refund.id);
      throw new ConflictError(`The payment service refused the refund: ${err.message}`);
    }
  }

  /**
   * One call to the webhook endpoint: the signature over the raw body must verify (else nothing
   * happens); each event id is acted on once; a payment is credited once, only from pending, and
   * only for the amount it was opened for, whatever order the events come in.
   */
  async handleEvent(rawBody: Buffer, signature: string | undefined): Promise<EventOutcome> {
    if (!this.gateway) throw new WebhookSignatureError('Card payments are not set up on this server');
    let event: Stripe.Event;
    try {
      event = this.gateway.verifyEvent(rawBody, signature ?? '');
    } catch (err) {
      throw new WebhookSignatureError((err as Error).message);
    }
    return this.db.transaction(async (trx): Promise<EventOutcome> => {
      if (!(await this.payments.recordEvent(event.id, event.type, trx))) return 'duplicate';
      const result = await this.apply(event, trx);
      await this.payments.setEventOutcome(event.id, result, trx);
      return result;
    });
  }

  private async apply(event: Stripe.Event, trx: Trx): Promise<EventOutcome> {
    switch (event.type) {
      case 'checkout.session.completed': {
        const session = event.data.object;
        if (session.payment_status !== 'paid') return 'ignored';
        return this.credit(session.metadata?.payment_id, session.amount_total, typeof session.payment_intent === 'string' ? session.payment_intent : (session.payment_intent?.id ?? null), trx);
      }
      case 'payment_intent.succeeded': {
        const intent = event.data.object;
        return this.credit(intent.metadata?.payment_id, intent.amount_received, intent.id, trx);
      }
      case 'payment_intent.payment_failed': {
        const intent = event.data.object;
        const payment = await this.paymentOf(intent.metadata?.payment_id, trx);
        if (!payment) return 'unknown-payment';
        // A decline that arrives after the payment succeeded (out of order) changes nothing.
        return (await this.payments.noteDecline(payment.id, intent.last_payment_error?.message ?? 'The card was declined', trx)) ? 'declined' : 'ignored';
      }
      case 'checkout.session.expired': {
        const payment = await this.paymentOf(event.data.object.metadata?.payment_id, trx);
        if (!payment) return 'unknown-payment';
        return (await this.payments.expire(payment.id, trx)) ? 'expired' : 'ignored';
      }
      case 'refund.created':
      case 'refund.updated':
      case 'refund.failed': {
        const refund = event.data.object;
        const id = Number(refund.metadata?.refund_id);
        const stored = Number.isSafeInteger(id) ? await this.payments.findRefund(id, trx) : null;
        if (!stored) return 'unknown-payment';
        if (refund.status === 'succeeded') {
          if (!(await this.payments.settleRefund(stored.id, refund.id, trx))) return 'ignored';
          const payment = await this.payments.find(stored.paymentId, trx);
          await this.notices.refundSettled(trx, { requestId: payment!.requestId, by: null, refundId: stored.id });
          return 'refunded';
        }
        if (refund.status === 'failed' || refund.status === 'canceled') return (await this.payments.markRefundFailed(stored.id, trx)) ? 'refund-failed' : 'ignored';
        return 'ignored';
      }
      default:
        return 'ignored';
    }
  }

  private async paymentOf(id: string | undefined, trx: Trx): Promise<StoredPayment | null> {
    const n = Number(id);
    return Number.isSafeInteger(n) && n > 0 ? this.payments.lock(n, trx) : null;
  }

  private async credit(id: string | undefined, amount: number | null, paymentIntentId: string | null, trx: Trx): Promise<EventOutcome> {
    const payment = await this.paymentOf(id, trx);
    if (!payment) return 'unknown-payment';
    if (payment.status === 'succeeded') return 'already-credited';
    if (amount !== payment.amountCents) return 'amount-mismatch';
    if (!(await this.payments.markSucceeded(payment.id, { paymentIntentId }, trx))) return 'already-credited';
    const receipt = await this.invoices.issueReceipt(payment.requestId, { ...payment, status: 'succeeded', paidAt: new Date(), paymentIntentId }, trx);
    await this.notices.paymentReceived(trx, { requestId: payment.requestId, by: null, paymentId: payment.id, receiptInvoiceId: receipt.id });
    return 'credited';
  }
}
