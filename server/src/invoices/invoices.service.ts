import { actorsOnRequest, ITEM_STATUS_LABELS, paymentAccount, requestReference, signedInCapacity, type CurrentUser, type EscrowCompany, type InvoiceSummary, type QuoteContractor } from '@cc/shared';
import { billRows } from '@cc/shared';
import type { Db, Trx } from '../db/knex';
import { renderInvoicePdf } from '../integrations/pdf/invoice-pdf';
import type { MailAttachment } from '../integrations/mail/mail-transport';
import { formatCents } from '@cc/shared';
import type { ApprovalRepository } from '../approvals/approval.repository';
import type { ApprovedScope, ApprovedScopeReader } from '../approvals/approved-scope';
import { assertMayAct } from '../flow/flow.service';
import { refusalMessages } from '../approvals/approval-messages';
import type { PaymentRepository, StoredPayment } from '../payments/payment.repository';
import { ConflictError, ForbiddenError, NotFoundError } from '../errors';
import type { RequestsService } from '../requests/requests.service';
import { invoiceNumber, toInvoiceSummary } from './invoice-dto';
import type { InvoiceKind, InvoiceRepository, InvoiceSeries, StoredInvoice } from './invoice.repository';

/** What an invoice or receipt shows, frozen when it is issued. */
export interface InvoiceContent {
  title: string;
  number: string;
  requestReference: string;
  property: string;
  /** The day it was issued, the sale's closing day and the seller, as an escrow officer matches the paper to the file (absent on papers issued before they were shown). */
  issuedOn?: string;
  closingDate?: string;
  sellerName?: string | null;
  /** An invoice payable at closing: the escrow company as the seller's side named it (for sending it again). */
  escrow?: EscrowCompany;
  contractor: QuoteContractor;
  addressedTo: { name: string; lines: string[] };
  lines: { description: string; quantity: number | null; state: string; amountCents: number }[];
  /** Service calls, once per visit (the first-hour minimum is in the lines). */
  serviceCallsCents: number;
  /** Labour of site conditions counted once per visit (e.g. a panel shutoff); absent on papers issued before it was billed. */
  visitConditionsCents?: number;
  permitCents: number;
  subtotalCents: number;
  taxCents: number;
  totalCents: number;
  payments: { date: string; description: string; amountCents: number }[];
  paidCents: number;
  balanceCents: number;
  /** For a receipt: the payment it acknowledges. */
  receiptFor: { date: string; description: string; amountCents: number } | null;
  instructions: string | null;
}

const PURPOSE_LABELS: Record<StoredPayment['purpose'], string> = { deposit: 'Card payment (deposit)', full: 'Card payment (in full)', balance: 'Card payment (balance)', closing: 'Funds received at closing' };
const dateOf = (d: Date | null) => (d ?? new Date()).toISOString().slice(0, 10);

/** How many times one invoice payable at closing may be e-mailed (each send can go to a new address). */
export const MAX_CLOSING_INVOICE_SENDS = 10;

/** Numbered invoices and receipts of a request, and their PDFs. */
export class InvoicesService {
  constructor(
    private readonly db: Db,
    private readonly access: RequestsService,
    private readonly scopes: ApprovedScopeReader,
    private readonly approvals: ApprovalRepository,
    private readonly payments: PaymentRepository,
    private readonly invoices: InvoiceRepository,
  ) {}

  /** The contractor issues an invoice for the request as it stands: items and their state, payments, tax, balance. */
  async issue(user: CurrentUser, requestId: number): Promise<InvoiceSummary> {
    const request = await this.access.get(user, requestId);
    assertMayAct(actorsOnRequest(user, request), 'issue-invoice', request.status, refusalMessages('issue invoices', request.status));
    const invoice = await this.db.transaction(async (trx) => {
      await this.approvals.lockRequest(requestId, trx);
      const seller = request.parties.find((p) => p.role === 'seller');
      return this.write(requestId, { kind: 'invoice', series: 'invoice', addressedTo: { name: seller?.name ?? seller?.email ?? 'The seller', lines: [request.street, `${request.city}, ${request.state} ${request.zip}`] }, issuedBy: user.id }, trx);
    });
    return toInvoiceSummary(invoice);
  }

  /** The invoice addressed to the escrow or title company for a payment at closing (in the caller's transaction). */
  async issueClosingInvoice(requestId: number, payment: StoredPayment, escrow: EscrowCompany, issuedBy: number, trx: Trx): Promise<StoredInvoice> {
    const lines = [escrow.officer && `Attention: ${escrow.officer}`, escrow.fileNumber && `Escrow / file number: ${escrow.fileNumber}`, escrow.email].filter(Boolean) as string[];
    return this.write(requestId, { kind: 'closing-invoice', series: 'invoice', addressedTo: { name: escrow.company, lines }, issuedBy, payment, sentTo: escrow.email, escrow }, trx);
  }

  /**
   * Invoice `id` payable at closing, to be e-mailed again to `email` (in the caller's transaction):
   * the escrow company as named, with the address, and which send this is. Refused once its funds are recorded.
   */
  async sendAgain(requestId: number, id: number, email: string, trx: Trx): Promise<{ escrow: EscrowCompany; sendNumber: number }> {
    const invoice = await this.invoices.find(requestId, id, trx);
    if (!invoice || invoice.kind !== 'closing-invoice') throw new NotFoundError('No such invoice payable at closing on this request');
    const payment = invoice.paymentId === null ? null : await this.payments.lock(invoice.paymentId, trx);
    if (payment?.status !== 'pending') throw new ConflictError('The funds for this invoice are recorded: there is nothing left to ask the escrow company for');
    if (invoice.sendCount >= MAX_CLOSING_INVOICE_SENDS) throw new ConflictError(`This invoice was e-mailed ${MAX_CLOSING_INVOICE_SENDS} times already; download the PDF and send it yourself`);
    const content = invoice.content as InvoiceContent;
    const escrow: EscrowCompany = { company: content.escrow?.company ?? content.addressedTo.name, officer: content.escrow?.officer ?? '', fileNumber: content.escrow?.fileNumber ?? '', email };
    return { escrow, sendNumber: await this.invoices.markSent(id, email, trx) };
  }

  /** A receipt after a card payment was credited (in the caller's transaction). */
  async issueReceipt(requestId: number, payment: StoredPayment, trx: Trx): Promise<StoredInvoice> {
    // To the seller, whoever signed: a listing agent who signed for them is named with that capacity.
    const approval = await this.approvals.find(requestId, trx);
    const signedFor = approval && approval.signerCapacity !== 'seller' ? [`Approval signed by ${signedInCapacity(approval.signerName, approval.signerCapacity)}`] : [];
    const seller = (await this.sellerName(requestId, trx)) ?? approval?.signerName ?? 'The seller';
    return this.write(requestId, { kind: 'receipt', series: 'receipt', addressedTo: { name: seller, lines: signedFor }, issuedBy: null, payment }, trx);
  }

  async list(user: CurrentUser, requestId: number): Promise<InvoiceSummary[]> {
    await this.readable(user, requestId);
    return (await this.invoices.list(requestId)).map(toInvoiceSummary);
  }

  async pdf(user: CurrentUser, requestId: number, id: number): Promise<{ fileName: string; pdf: Buffer }> {
    await this.readable(user, requestId);
    const invoice = await this.invoices.find(requestId, id);
    if (!invoice) throw new NotFoundError('No such invoice');
    const content = invoice.content as InvoiceContent;
    return { fileName: `${content.requestReference}-${content.number}.pdf`, pdf: await renderInvoicePdf(content) };
  }

  /** The PDF of invoice `id` as the mail worker attaches it (no person asks: the outbox row named it). */
  async attachment(id: number): Promise<MailAttachment> {
    const invoice = await this.invoices.find(null, id);
    if (!invoice) throw new NotFoundError('No such invoice');
    const content = invoice.content as InvoiceContent;
    return { fileName: `${content.requestReference}-${content.number}.pdf`, contentType: 'application/pdf', content: await renderInvoicePdf(content) };
  }

  /** The seller named on the request (their account's name, or the address they were invited at), if any. */
  private async sellerName(requestId: number, trx: Trx): Promise<string | null> {
    const row: { name: string } | undefined = await trx('request_parties as p')
      .leftJoin('users as u', 'u.id', 'p.user_id')
      .where({ 'p.request_id': requestId, 'p.role': 'seller' })
      .orderBy('p.id')
      .first(trx.raw('coalesce(u.name, p.email) AS name'));
    return row?.name ?? null;
  }

  /** Money papers are for the seller's side, the contractor and administrators. */
  private async readable(user: CurrentUser, requestId: number): Promise<void> {
    const request = await this.access.get(user, requestId);
    const actors = actorsOnRequest(user, request);
    if (!actors.some((a) => a === 'seller' || a === 'listing-agent' || a === 'contractor' || a === 'admin')) throw new ForbiddenError('Invoices are shown to the seller’s side and the contractor');
  }

  private async write(
    requestId: number,
    w: { kind: InvoiceKind; series: InvoiceSeries; addressedTo: InvoiceContent['addressedTo']; issuedBy: number | null; payment?: StoredPayment; sentTo?: string; escrow?: EscrowCompany },
    trx: Trx,
  ): Promise<StoredInvoice> {
    const scope = await this.scopes.load(requestId, trx);
    if (!scope) throw new ConflictError('Nothing is approved yet: there is nothing to invoice');
    const organisationId = scope.contractor.organisationId;
    const number = await this.invoices.nextNumber(organisationId, w.series, trx);
    const payments = await this.payments.list(requestId, trx);
    const content = await this.compose(requestId, scope, scope.contractor, payments, w, invoiceNumber(w.series, number), trx);
    return this.invoices.insert(
      { organisationId, series: w.series, number, requestId, kind: w.kind, paymentId: w.payment?.id ?? null, addressedTo: w.addressedTo, content, sentTo: w.sentTo ?? null, totalCents: w.kind === 'receipt' ? content.receiptFor!.amountCents : content.totalCents, balanceCents: content.balanceCents, issuedBy: w.issuedBy },
      trx,
    );
  }

  private async compose(
    requestId: number,
    scope: ApprovedScope,
    contractor: QuoteContractor,
    payments: readonly StoredPayment[],
    w: { kind: InvoiceKind; addressedTo: InvoiceContent['addressedTo']; payment?: StoredPayment; escrow?: EscrowCompany },
    number: string,
    trx: Trx,
  ): Promise<InvoiceContent> {
    const items = new Map((await this.approvals.lineItems(requestId, trx)).map((i) => [i.id, i]));
    const request = await trx('repair_requests').where({ id: requestId }).first('street', 'city', 'state', 'zip', 'closing_date');
    const sellerName = await this.sellerName(requestId, trx);
    const entries = new Map(scope.book.entries.map((e) => [e.id, e]));
    // The rows come from the shared engine and add up to the subtotal (the first-hour minimum is in the lines).
    const bill = billRows(scope.breakdown);
    const lines = bill.lines.map((l) => {
      const item = items.get(Number(l.key));
      const where = item?.location ? ` — ${item.location}` : '';
      return { description: `${entries.get(l.entryId)?.name ?? l.entryName}${where}`, quantity: l.quantity, state: item ? ITEM_STATUS_LABELS[item.status] : '', amountCents: l.amountCents };
    });
    const account = paymentAccount(scope.totalCents, scope.cardDepositBp, payments);
    const received = payments.filter((p) => p.status === 'succeeded');
    const title = w.kind === 'receipt' ? 'Receipt' : w.kind === 'closing-invoice' ? 'Invoice — payable at closing' : 'Invoice';
    const reference = requestReference(requestId);
    return {
      title,
      number,
      requestReference: reference,
      property: `${request.street}, ${request.city}, ${request.state} ${request.zip}`,
      issuedOn: dateOf(null),
      closingDate: String(request.closing_date).slice(0, 10),
      sellerName,
      ...(w.escrow ? { escrow: w.escrow } : {}),
      contractor,
      addressedTo: w.addressedTo,
      lines,
      serviceCallsCents: bill.serviceCallCents,
      visitConditionsCents: bill.visitConditionsCents,
      permitCents: bill.permitCents,
      subtotalCents: bill.subtotalCents,
      taxCents: bill.taxCents,
      totalCents: bill.totalCents,
      payments: received.map((p) => ({ date: dateOf(p.paidAt), description: PURPOSE_LABELS[p.purpose] + (p.refundedCents ? ` (${formatCents(p.refundedCents)} refunded)` : ''), amountCents: p.amountCents - p.refundedCents })),
      paidCents: account.paidCents,
      balanceCents: account.balanceCents,
      receiptFor: w.kind === 'receipt' && w.payment ? { date: dateOf(w.payment.paidAt), description: PURPOSE_LABELS[w.payment.purpose], amountCents: w.payment.amountCents } : null,
      instructions:
        w.kind === 'closing-invoice'
          ? `Payable at closing from the seller's proceeds: ${formatCents(w.payment?.amountCents ?? account.balanceCents)} to ${contractor.name}${contractor.address ? `, ${contractor.address}` : ''}, by wire or check, quoting ${number} and request ${reference}. The contractor records the funds when received.`
          : null,
    };
  }
}
