import { formatCents, itemStateAfter, MAX_QUOTE_TOTAL_CENTS, requestReference, type CurrentUser, type QuoteVersion, type QuoteVersionSummary, type SendQuote } from '@cc/shared';
import type { Db } from '../db/knex';
import type { ItemPricingRepository } from '../pricing/item-pricing.repository';
import type { OrganisationRepository } from '../organisations/organisation.repository';
import type { QuoteRepository, StoredQuote } from './quote.repository';
import type { RateBookRepository } from '../rate-book/rate-book.repository';
import type { RequestRepository } from '../requests/request.repository';
import { renderQuotePdf } from '../integrations/pdf/quote-pdf';
import { ConflictError, NotFoundError, UnprocessableError } from '../errors';
import { assertMayAct, type FlowService } from '../flow/flow.service';
import { assertClaimedTotals, describeItem, staleItem, type PricingService } from '../pricing/pricing.service';
import { composeQuote, quoteContractorOf } from './quote-composer';
import { compareQuotes } from './quote-changes';
import type { RateBookService } from '../rate-book/rate-book.service';
import { priceRequest } from '../pricing/request-pricing';
import type { RequestsService } from '../requests/requests.service';

/** Sending quote versions and showing them (and their PDF) to the parties of the request. */
export class QuotesService {
  constructor(
    private readonly db: Db,
    private readonly access: RequestsService,
    private readonly pricing: PricingService,
    private readonly rateBookService: RateBookService,
    private readonly rateBooks: RateBookRepository,
    private readonly requests: RequestRepository,
    private readonly organisations: OrganisationRepository,
    private readonly items: ItemPricingRepository,
    private readonly quotes: QuoteRepository,
    private readonly flow: FlowService,
    /** An organisation's time zone (day-plan settings, else its state's): quotes hold for days there. */
    private readonly timeZoneOf: (organisationId: number) => Promise<string>,
  ) {}

  /**
   * Sends the next quote version: the server prices the request itself (and refuses a client claim
   * that differs), stores the version with everything it was priced with, prices the items on the
   * quote and sends the request to the seller (flow moves), all in one transaction.
   */
  async send(user: CurrentUser, requestId: number, input: SendQuote): Promise<QuoteVersion> {
    const { request, mover } = await this.pricing.assertPricer(user, requestId);
    const refused = { notYours: 'Only the assigned contractor prices this request', notNow: 'This request is not awaiting prices any more. Reload to see where it is.' };
    const organisationId = request.contractor!.id;
    const org = await this.organisations.findById(organisationId);
    if (!org) throw new NotFoundError('No such contractor');
    const timeZone = await this.timeZoneOf(organisationId);
    const version = await this.db.transaction(async (trx) => {
      const status = await this.requests.lockStatus(requestId, trx);
      if (!status) throw new ConflictError(refused.notNow);
      assertMayAct(mover.actors, 'price', status, refused);
      const loaded = await this.rateBookService.load(organisationId, trx);
      if (!loaded) throw new ConflictError('Your organisation has no rate book yet: save its terms first');
      const items = await this.items.listForRequest(requestId, trx, true);
      const priced = priceRequest(loaded, items, await this.items.listVisits(requestId, trx));
      if (priced.problem) {
        const item = items.find((i) => i.id === priced.problem!.itemId);
        throw new ConflictError(item ? `Item ${describeItem(item)}: ${priced.problem.message}` : priced.problem.message);
      }
      const unpriced = items.filter((i) => priced.unpricedItemIds.includes(i.id));
      if (unpriced.length) {
        throw new ConflictError(
          `Every item needs a price or "not our scope" before the quote is sent: ${unpriced.map(describeItem).join(', ')}`,
          unpriced.map((i) => ({ path: `items.${i.id}`, message: `Item ${describeItem(i)} has no entry${i.entryId !== null ? ' in the current rate book' : ''}` })),
        );
      }
      if (!priced.input || !priced.breakdown) throw new ConflictError('Price at least one item before sending a quote');
      assertClaimedTotals(priced, input.claimedTotals);
      assertStorableTotal(priced.breakdown.totalCents);

      const next = ((await this.quotes.latestVersion(requestId, trx)) ?? 0) + 1;
      const entryIds = [...new Set(items.flatMap((i) => (priced.lineByItem.has(i.id) && i.entryId !== null ? [i.entryId] : [])))];
      await this.quotes.insert(
        composeQuote({
          requestId,
          version: next,
          sentBy: user.id,
          sentAt: new Date(),
          timeZone,
          note: input.note || null,
          contractor: quoteContractorOf(org),
          property: { street: request.street, city: request.city, state: request.state, zip: request.zip },
          house: request,
          loaded,
          items,
          priced: { ...priced, input: priced.input, breakdown: priced.breakdown },
          entryVersionRowIds: await this.rateBooks.currentVersionRowIds(entryIds, trx),
        }),
        trx,
      );
      await this.flow.moveRequest(trx, requestId, 'send-quote', mover, `Quote version ${next} sent`, refused);
      for (const item of items) {
        if (!priced.lineByItem.has(item.id) || item.status === itemStateAfter('price')) continue;
        await this.flow.moveItem(trx, { ...item, requestId }, 'price', mover, { ...refused, stale: staleItem(item, 'Reload and send again.') });
      }
      return next;
    });
    return this.get(user, requestId, version);
  }

  async list(user: CurrentUser, requestId: number): Promise<QuoteVersionSummary[]> {
    await this.access.get(user, requestId);
    return this.quotes.summaries(requestId);
  }

  async current(user: CurrentUser, requestId: number): Promise<QuoteVersion> {
    await this.access.get(user, requestId);
    const latest = await this.quotes.latestVersion(requestId);
    if (latest === null) throw new NotFoundError('No quote has been sent for this request yet');
    return this.get(user, requestId, latest);
  }

  /** One version, with what changed against the version before it. */
  async get(user: CurrentUser, requestId: number, version: number): Promise<QuoteVersion> {
    await this.access.get(user, requestId);
    const [quote, previous, latest] = await Promise.all([
      this.quotes.find(requestId, version),
      version > 1 ? this.quotes.find(requestId, version - 1) : null,
      this.quotes.latestVersion(requestId),
    ]);
    if (!quote) throw new NotFoundError(`No quote version ${version} for this request`);
    return this.toDto(quote, previous, latest);
  }

  async pdf(user: CurrentUser, requestId: number, version: number): Promise<{ fileName: string; pdf: Buffer }> {
    const quote = await this.get(user, requestId, version);
    return { fileName: `${quote.requestReference}-quote-v${quote.version}.pdf`, pdf: await renderQuotePdf(quote) };
  }

  private toDto(quote: StoredQuote, previous: StoredQuote | null, latest: number | null): QuoteVersion {
    const comparable = (q: StoredQuote) => ({ version: q.version, totalCents: q.breakdown.totalCents, lines: q.lines });
    return {
      ...quote,
      requestReference: requestReference(quote.requestId),
      isCurrent: quote.version === latest,
      changes: previous ? compareQuotes(comparable(previous), comparable(quote)) : null,
      pdfPath: `/api/requests/${quote.requestId}/quotes/${quote.version}.pdf`,
    };
  }
}

/** A quote whose total is beyond any real repair cannot be sent (and would not fit its columns). */
function assertStorableTotal(totalCents: number): void {
  if (totalCents > MAX_QUOTE_TOTAL_CENTS) {
    throw new UnprocessableError(
      `The quote total ${formatCents(totalCents)} is more than ${formatCents(MAX_QUOTE_TOTAL_CENTS)}: check the rate-book prices and the quantities`,
      [{ path: 'claimedTotals.totalCents', message: `A quote can total at most ${formatCents(MAX_QUOTE_TOTAL_CENTS)}` }],
    );
  }
}
