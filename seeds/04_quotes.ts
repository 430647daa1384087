import type { Knex } from 'knex';
import { itemStateAfter, REQUEST_FLOW, signerCapacityOf, type FlowActor } from '@cc/shared';
import { LineItemRepository } from '../server/src/intake/line-item.repository';
import type { StoredPricingItem } from '../server/src/pricing/item-pricing.repository';
import { OrganisationRepository } from '../server/src/organisations/organisation.repository';
import { QuoteRepository } from '../server/src/quotes/quote.repository';
import { RateBookRepository } from '../server/src/rate-book/rate-book.repository';
import { composeQuote, quoteContractorOf } from '../server/src/quotes/quote-composer';
import { RateBookService } from '../server/src/rate-book/rate-book.service';
import { priceRequest } from '../server/src/pricing/request-pricing';
import { ApprovalRepository } from '../server/src/approvals/approval.repository';
import { signedRecord } from '../server/src/approvals/approvals.service';
import { DayPlanRepository } from '../server/src/day-plan/day-plan.repository';
import { historyWriters, markHistoryDelivered } from './data/history';

/** The state a sent quote puts a request in (the flow table's `send-quote`). */
const QUOTED = REQUEST_FLOW.find((m) => m.event === 'send-quote')!.to;
/** The states the seller's signature puts a request in (the flow table's `approve` and `decline`). */
const SIGNED = REQUEST_FLOW.filter((m) => m.event === 'approve' || m.event === 'decline').map((m) => m.to);

// Prices the items of every demo request that reached `quoted` with the suggested entry of its
// contractor's rate book (1 assumed where the report gave no quantity) and stores the quote version
// the contractor sent on the day the request became quoted. Requests still in pricing stay unpriced.
// A request the seller's side approved or declined gets its signature like one signed on the page:
// the decision per item, the approved scope priced by the shared engine, the consent text, so it
// shows how it gets paid.
export async function seed(knex: Knex): Promise<void> {
  await knex('item_decisions').delete();
  await knex('quote_approvals').delete();
  await knex('quotes').delete();
  const approvals = new ApprovalRepository(knex);
  const organisations = new OrganisationRepository(knex);
  const rateBooks = new RateBookService(knex, new RateBookRepository(knex), organisations);
  const entryVersions = new RateBookRepository(knex);
  const quotes = new QuoteRepository(knex);
  const lineItems = new LineItemRepository(knex);
  const dayPlans = new DayPlanRepository(knex);
  const history = historyWriters(knex);

  // Requests whose history shows a quote sent.
  const requests = await knex('repair_requests')
    .whereIn('id', knex('request_status_changes').where({ to_status: QUOTED }).select('request_id'))
    .whereNotNull('contractor_organisation_id')
    .orderBy('id');
  for (const request of requests) {
    const loaded = await rateBooks.load(request.contractor_organisation_id);
    const org = await organisations.findById(request.contractor_organisation_id);
    if (!loaded || !org) continue;
    const sent = await knex('request_status_changes').where({ request_id: request.id, to_status: QUOTED }).first('created_at', 'changed_by');
    const sender = await knex('users').where({ organisation_id: org.id, role: 'contractor' }).orderBy('id').first('id');
    const rows = await lineItems.listForRequest(request.id);
    const items: StoredPricingItem[] = [];
    for (const row of rows) {
      const entry = loaded.entries.find((e) => e.code === row.code);
      if (!entry) continue;
      const isQuantityAssumed = row.quantity === null;
      await knex.transaction((trx) => lineItems.update(row.id, row.version, { entryId: entry.id, pricingQuantity: isQuantityAssumed ? 1 : null, isQuantityAssumed }, trx));
      items.push({
        id: row.id,
        version: row.version + 1,
        code: row.code,
        room: row.room,
        location: row.location,
        quantity: row.quantity,
        // Priced when the quote went out, whatever happened to the item since.
        status: itemStateAfter('price'),
        entryId: entry.id,
        adderIds: [],
        pricingQuantity: isQuantityAssumed ? 1 : null,
        isQuantityAssumed,
        visitKey: 'visit-1',
        outOfScopeReason: null,
      });
    }
    const priced = priceRequest(loaded, items, []);
    const { input, breakdown } = priced;
    if (!input || !breakdown) continue;
    const entryIds = [...new Set(items.map((i) => i.entryId as number))];
    await knex.transaction(async (trx) => {
      await quotes.insert(
        composeQuote({
          requestId: request.id,
          version: 1,
          sentBy: sender?.id ?? null,
          sentAt: sent?.created_at ?? new Date(),
          timeZone: await dayPlans.timeZone(org.id),
          note: null,
          contractor: quoteContractorOf(org),
          property: { street: request.street, city: request.city, state: request.state, zip: request.zip },
          house: { yearBuilt: request.year_built, necEdition: request.nec_edition },
          loaded,
          items,
          priced: { ...priced, input, breakdown },
          entryVersionRowIds: await entryVersions.currentVersionRowIds(entryIds, trx),
        }),
        trx,
      );
    });
    // The signature, once the quote version is stored (it is read back as the page reads it).
    await knex.transaction(async (trx) => {
      const signed = await trx('request_status_changes').where({ request_id: request.id }).whereIn('to_status', SIGNED).first('created_at', 'changed_by', 'actor');
      if (!signed) return;
      const stored = await quotes.find(request.id, 1);
      const pricing = await approvals.quotePricing(request.id, 1, trx);
      const signer = await trx('users').where({ id: signed.changed_by }).first('id', 'name', 'email');
      if (!stored || !pricing || !signer) throw new Error(`Request ${request.id}: the seeded signature has no quote or signer`);
      // Decisions as the items carry them now: declined ones were declined, the rest approved.
      const declined = itemStateAfter('decline');
      const decisions = (await lineItems.listForRequest(request.id, trx)).filter((row) => items.some((i) => i.id === row.id)).map((row) => ({ id: row.id, decision: row.status === declined ? ('declined' as const) : ('approved' as const) }));
      const approvalId = await approvals.insert(
        signedRecord({
          requestId: request.id,
          request,
          stored,
          pricing,
          approvedKeys: decisions.filter((d) => d.decision === 'approved').map((d) => String(d.id)),
          signedBy: signer.id,
          signerName: signer.name ?? signer.email,
          // The part the history credits the move to (the seller, or the listing agent for them).
          signerCapacity: signerCapacityOf([signed.actor as FlowActor]),
          ipAddress: '127.0.0.1',
          userAgent: 'Demo data (seeded)',
        }),
        trx,
      );
      await trx('quote_approvals').where({ id: approvalId }).update({ signed_at: signed.created_at });
      await approvals.insertDecisions(
        decisions.map((d) => ({ requestId: request.id, lineItemId: d.id, approvalId, changeOrderId: null, decision: d.decision, note: null, decidedBy: signer.id })),
        trx,
      );
      // The timeline entry (with the approved amount the contractor's dashboard sums) and messages, as signing writes them.
      await history.sellerNotices.quoteDecided(trx, { requestId: request.id, by: signer.id, approvalId, isApproved: decisions.some((d) => d.decision === 'approved'), at: signed.created_at });
    });
  }
  await markHistoryDelivered(knex);
}
