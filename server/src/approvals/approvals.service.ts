import { createHash } from 'node:crypto';
import {
  amountDue,
  approvalConsentText,
  actorsOnRequest,
  mayAct,
  mayMoveRequest,
  PAYMENT_PLANS,
  paymentAccount,
  priceScope,
  requestReference,
  signedInCapacity,
  signerCapacityOf,
  whoActsNextWords,
  type ApprovalView,
  type CurrentUser,
  type FindingCode,
  type FlowActor,
  type Quote,
  type RateBook,
  type RepairRequestDetail,
  type Room,
  type ScopeItem,
  type SignerCapacity,
  type SignApprovalParsed,
} from '@cc/shared';
import { lineCents, todayIn } from '@cc/shared';
import type { Db } from '../db/knex';
import type { QuoteRepository, StoredQuote } from '../quotes/quote.repository';
import type { ChangeOrderRepository } from '../change-orders/change-order.repository';
import { toChangeOrderDto } from '../change-orders/change-order-dto';
import type { InvoiceRepository } from '../invoices/invoice.repository';
import { toInvoiceSummary } from '../invoices/invoice-dto';
import type { PaymentRepository } from '../payments/payment.repository';
import { toPaymentDtos } from '../payments/payment-dto';
import { ConflictError, NotFoundError, ValidationError } from '../errors';
import type { QuotesService } from '../quotes/quotes.service';
import type { RequestsService } from '../requests/requests.service';
import type { ApprovalRepository, StoredApproval } from './approval.repository';
import { ApprovedScopeReader } from './approved-scope';
import { assertMayMoveRequest, type FlowService } from '../flow/flow.service';
import { refusalMessages } from './approval-messages';
import type { SellerNotices } from './seller-notices';

/** Where a signature was given from (kept with it). */
export interface SigningContext {
  ipAddress: string;
  userAgent: string;
}

const SELLER_SIDE_PARTS: readonly FlowActor[] = ['seller', 'listing-agent', 'admin'];

/** The seller's decision on the quote: the page that shows it, and signing it. */
export class ApprovalsService {
  constructor(
    private readonly db: Db,
    private readonly access: RequestsService,
    private readonly quotes: QuotesService,
    private readonly quoteRows: QuoteRepository,
    private readonly flow: FlowService,
    private readonly approvals: ApprovalRepository,
    private readonly scopes: ApprovedScopeReader,
    private readonly changeOrders: ChangeOrderRepository,
    private readonly payments: PaymentRepository,
    private readonly invoices: InvoiceRepository,
    private readonly notices: SellerNotices,
    /** An organisation's time zone: a quote holds until the end of its last day there. */
    private readonly timeZoneOf: (organisationId: number) => Promise<string>,
  ) {}

  async view(user: CurrentUser, requestId: number): Promise<ApprovalView> {
    const request = await this.access.get(user, requestId);
    const actors = actorsOnRequest(user, request);
    const approval = await this.approvals.find(requestId);
    const quote = approval ? await this.quotes.get(user, requestId, approval.quoteVersion) : await this.quotes.current(user, requestId);
    const pricing = await this.approvals.quotePricing(requestId, quote.version);
    if (!pricing) throw new NotFoundError('No quote has been sent for this request yet');
    const [scope, decisions, items, changeOrders, payments] = await Promise.all([
      this.scopes.load(requestId),
      this.approvals.decisions(requestId),
      this.approvals.lineItems(requestId),
      this.changeOrders.list(requestId),
      this.payments.list(requestId),
    ]);
    const seesMoney = user.role === 'admin' || actors.some((a) => a === 'seller' || a === 'listing-agent' || a === 'contractor');
    const account = paymentAccount(scope?.totalCents ?? 0, pricing.book.terms.cardDepositBp, payments);
    const status = request.status;
    const can = {
      decide: !approval && mayMoveRequest(actors, 'approve', status),
      pay: !!approval && mayAct(actors, 'pay', status),
      recordFunds: !!approval && mayAct(actors, 'record-funds', status),
      refund: !!approval && mayAct(actors, 'refund', status),
      sendChangeOrder: !!approval && mayAct(actors, 'send-change-order', status),
      decideChangeOrder: !!approval && mayAct(actors, 'decide-change-order', status),
      issueInvoice: !!approval && mayAct(actors, 'issue-invoice', status),
      sendClosingInvoice: !!approval && account.payableAtClosingCents > 0 && mayAct(actors, 'send-closing-invoice', status),
    };
    const plans = can.pay ? PAYMENT_PLANS.flatMap((plan) => {
      const amountCents = amountDue(plan, account);
      return amountCents === null ? [] : [{ plan, amountCents }];
    }) : [];
    const showsSigningDetails = actors.some((a) => SELLER_SIDE_PARTS.includes(a));
    const reference = requestReference(requestId);
    const property = `${request.street}, ${request.city}, ${request.state} ${request.zip}`;

    return {
      requestId,
      requestReference: reference,
      requestStatus: status,
      property,
      quote,
      pricing: { book: pricing.book, input: pricing.input },
      consentText: approval?.consentText ?? approvalConsentText({ contractorName: quote.contractor.name, requestReference: reference, quoteVersion: quote.version, property }),
      signature: approval && {
        signerName: approval.signerName,
        signedByName: approval.signedByName,
        signerCapacity: approval.signerCapacity,
        signedAt: approval.signedAt.toISOString(),
        quoteVersion: approval.quoteVersion,
        quoteHash: approval.quoteHash,
        consentText: approval.consentText,
        ipAddress: showsSigningDetails ? approval.ipAddress : null,
        userAgent: showsSigningDetails ? approval.userAgent : null,
      },
      decisions: decisions.map((d) => ({ ...d, decidedAt: d.decidedAt.toISOString() })),
      items: this.scopeItems(quote, items, changeOrders, scope ? priceScope(scope) : null),
      scope: scope?.breakdown ?? null,
      account,
      plans,
      payments: seesMoney ? toPaymentDtos(payments, await this.payments.refunds(payments.map((p) => p.id)), can.pay) : [],
      changeOrders: changeOrders.map(toChangeOrderDto),
      invoices: seesMoney ? (await this.invoices.list(requestId)).map(toInvoiceSummary) : [],
      can,
      nextStep: nextStep(request, actors, !!approval, account, changeOrders.some((c) => c.status === 'sent')),
    };
  }

  /** Items with their amounts: the scope's price for those in it, the quote's (or change order's) for the rest. */
  private scopeItems(
    quote: ApprovalView['quote'],
    items: Awaited<ReturnType<ApprovalRepository['lineItems']>>,
    changeOrders: Awaited<ReturnType<ChangeOrderRepository['list']>>,
    scope: ReturnType<typeof priceScope>,
  ): ScopeItem[] {
    const scopeLines = new Map((scope?.visits ?? []).flatMap((v) => v.lines.map((l) => [Number(l.key), l] as const)));
    const quoteLines = new Map(quote.lines.filter((l) => l.kind === 'priced').map((l) => [l.lineItemId, l]));
    const coLines = new Map(changeOrders.flatMap((c) => c.lines.filter((l) => l.kind === 'add').map((l) => [l.lineItemId, { line: l, number: c.number }] as const)));
    return items.flatMap((item): ScopeItem[] => {
      const quoted = quoteLines.get(item.id);
      const added = coLines.get(item.id);
      if (!quoted && !added) return [];
      const inScope = scopeLines.get(item.id);
      return [
        {
          lineItemId: item.id,
          code: item.code as FindingCode,
          room: item.room as Room,
          location: item.location,
          status: item.status,
          workName: quoted?.entry?.name ?? added?.line.workName ?? item.code,
          quantity: inScope?.quantity ?? quoted?.quantity ?? added?.line.quantityAfter ?? null,
          unit: quoted?.entry?.unit ?? '',
          lineCents: inScope ? lineCents(inScope) : quoted?.lineCents ?? 0,
          changeOrderNumber: added?.number ?? null,
        },
      ];
    });
  }

  /**
   * Signs the seller's decision on the current quote version: every priced item approved or
   * declined (each move checked against the item flow), the approved scope priced by the shared
   * engine and frozen with a hash of the quote version, the request moved to approved (or declined
   * when nothing is approved), all in one transaction.
   */
  async sign(user: CurrentUser, requestId: number, input: SignApprovalParsed, context: SigningContext): Promise<ApprovalView> {
    const request = await this.access.get(user, requestId);
    const actors = actorsOnRequest(user, request);
    assertMayMoveRequest(actors, 'approve', request.status, refusalMessages('approve or decline the quote', request.status));
    const isApproved = input.decisions.some((d) => d.decision === 'approved');
    const capacity = signerCapacityOf(actors);

    // Sent versions never change: the one decided on is read before the transaction.
    const stored = await this.quoteRows.find(requestId, input.quoteVersion);
    // The quote's contractor (as it was sent) decides in which time zone its last day ends.
    const today = stored ? todayIn(await this.timeZoneOf(stored.contractor.organisationId)) : null;
    await this.db.transaction(async (trx) => {
      const status = await this.approvals.lockRequest(requestId, trx);
      if (status !== request.status || (await this.approvals.find(requestId, trx))) throw new ConflictError('The quote was decided on meanwhile. Reload to see the decision.');
      const latest = await this.quoteRows.latestVersion(requestId, trx);
      if (latest !== input.quoteVersion) throw new ConflictError(`Quote version ${latest} is the current one now. Reload and decide on it.`);
      const pricing = await this.approvals.quotePricing(requestId, latest, trx);
      if (!stored || !pricing) throw new NotFoundError('No quote has been sent for this request yet');
      if (today !== null && stored.validUntil < today) throw new ConflictError(`The prices of this quote held until ${stored.validUntil}. Ask the contractor for a new version.`);

      const pricedIds = stored.lines.filter((l) => l.kind === 'priced' && l.lineItemId !== null).map((l) => l.lineItemId as number);
      const decided = new Map<number, (typeof input.decisions)[number]>();
      input.decisions.forEach((d, i) => {
        if (!pricedIds.includes(d.lineItemId)) throw new ValidationError('Decide only on the items of the quote', [{ path: `decisions.${i}.lineItemId`, message: `Item #${d.lineItemId} is not in this quote` }]);
        if (decided.has(d.lineItemId)) throw new ValidationError('Each item is decided once', [{ path: `decisions.${i}.lineItemId`, message: `Item #${d.lineItemId} is listed twice` }]);
        decided.set(d.lineItemId, d);
      });
      const missing = pricedIds.filter((id) => !decided.has(id));
      if (missing.length) throw new ValidationError('Approve or decline every item', missing.map((id) => ({ path: `decisions.${id}`, message: `Item #${id} has no decision` })));

      const items = new Map((await this.approvals.lineItems(requestId, trx)).map((i) => [i.id, i]));
      const mover = { userId: user.id, actors };
      for (const d of decided.values()) {
        const item = items.get(d.lineItemId)!;
        await this.flow.moveItem(trx, { id: item.id, requestId, status: item.status, version: item.version }, d.decision === 'approved' ? 'approve' : 'decline', mover, {
          notYours: 'Your part on this request does not decide on items',
          notNow: `Item #${item.id} cannot be ${d.decision} now (it is ${item.status})`,
          stale: `Item #${item.id} changed meanwhile. Reload and decide again.`,
        });
      }

      const approvedKeys = [...decided.values()].filter((d) => d.decision === 'approved').map((d) => String(d.lineItemId));
      const id = await this.approvals.insert(
        signedRecord({ requestId, request, stored, pricing, approvedKeys, signedBy: user.id, signerName: input.signerName, signerCapacity: capacity, ipAddress: context.ipAddress, userAgent: context.userAgent }),
        trx,
      );
      await this.approvals.insertDecisions(
        [...decided.values()].map((d) => ({ requestId, lineItemId: d.lineItemId, approvalId: id, changeOrderId: null, decision: d.decision, note: d.note || null, decidedBy: user.id })),
        trx,
      );
      // The history (every party's Activity) says who signed and in what capacity.
      const signer = signedInCapacity(input.signerName, capacity);
      const note = isApproved ? `Quote version ${latest} approved and signed by ${signer}` : `Every item of quote version ${latest} declined by ${signer}`;
      await this.flow.moveRequest(trx, requestId, isApproved ? 'approve' : 'decline', mover, note, refusalMessages('approve or decline the quote', request.status));
      await this.notices.quoteDecided(trx, { requestId, by: user.id, approvalId: id, isApproved });
      return id;
    });
    return this.view(user, requestId);
  }
}

/**
 * The record of a signature on a quote version: the approved scope priced by the shared engine, the
 * consent text word for word, and a hash of the version as sent (also used by the demo seeds, so a
 * seeded approved request is signed like one signed on the page).
 */
export function signedRecord(s: {
  requestId: number;
  request: Pick<RepairRequestDetail, 'street' | 'city' | 'state' | 'zip'>;
  stored: Pick<StoredQuote, 'version' | 'contractor'>;
  pricing: { quoteId: number; book: RateBook; input: Quote };
  approvedKeys: string[];
  signedBy: number;
  signerName: string;
  signerCapacity: SignerCapacity;
  ipAddress: string;
  userAgent: string;
}): Omit<StoredApproval, 'id' | 'signedAt' | 'signedByName'> {
  const breakdown = priceScope({ book: s.pricing.book, input: s.pricing.input, approvedKeys: s.approvedKeys });
  const totalCents = breakdown?.totalCents ?? 0;
  const property = `${s.request.street}, ${s.request.city}, ${s.request.state} ${s.request.zip}`;
  return {
    requestId: s.requestId,
    quoteId: s.pricing.quoteId,
    quoteVersion: s.stored.version,
    signedBy: s.signedBy,
    signerName: s.signerName,
    signerCapacity: s.signerCapacity,
    consentText: approvalConsentText({ contractorName: s.stored.contractor.name, requestReference: requestReference(s.requestId), quoteVersion: s.stored.version, property }),
    ipAddress: s.ipAddress.slice(0, 64),
    userAgent: s.userAgent.slice(0, 500),
    quoteHash: createHash('sha256').update(JSON.stringify(s.stored)).digest('hex'),
    approvedTotalCents: totalCents,
    approvedTaxCents: breakdown?.materialsTaxCents ?? 0,
    depositCents: paymentAccount(totalCents, s.pricing.book.terms.cardDepositBp, []).depositCents,
  };
}

/** What happens next on the seller's side of the request, and who acts, in one sentence (addressed to `viewer` when it is their step). */
function nextStep(request: RepairRequestDetail, viewer: readonly FlowActor[], isSigned: boolean, account: ReturnType<typeof paymentAccount>, hasOpenChangeOrder: boolean): string {
  if (!isSigned) {
    if (request.status === 'quoted' && mayMoveRequest(viewer, 'approve', 'quoted')) return 'Next: approve or decline each item and sign (you, or the other person on the seller’s side).';
    if (request.status === 'quoted') return `Waiting for ${whoActsNextWords('quoted')} to approve or decline each item and sign.`;
    return 'No decision is due: the quote is not with the seller.';
  }
  if (request.status === 'declined') return 'The seller declined every item. Nothing more happens on this quote.';
  if (hasOpenChangeOrder) return 'A change order waits for the seller or the listing agent to approve or decline it.';
  if (account.payableAtClosingCents > 0) return 'The balance is on an invoice payable at closing; the contractor records the funds when the escrow company pays.';
  if (account.overpaidCents > 0) return 'More was paid than the approved work costs: the contractor refunds the difference.';
  if (account.balanceCents > 0 && account.paidCents === 0) {
    return mayAct(viewer, 'pay', request.status)
      ? 'Next: choose how to pay: by card now, a deposit now, or at closing.'
      : // Payment is the seller side's matter, beside the work: who the request waits for is the shared
        // next-step rule's answer, as on the request page and the dashboard.
        `To pay: the seller or the listing agent chooses how (by card now, a deposit now, or at closing). The work waits for ${whoActsNextWords(request.status) || 'nobody'}.`;
  }
  if (account.balanceCents > 0) return `The balance is due on completion; the contractor books and does the work.`;
  const next = whoActsNextWords(request.status) || 'nobody';
  return `Paid in full. ${next.charAt(0).toUpperCase()}${next.slice(1)} acts next on the work.`;
}
