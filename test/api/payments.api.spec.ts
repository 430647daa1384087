import request from 'supertest';
import { ApprovalViewSchema, DEMO_RATE_BOOK, type ActivityEntry, type ApprovalView, type StartedPayment } from '@cc/shared';
import { extractPdfPages } from '../../server/src/integrations/pdf-text';
import { TEST_CARDS } from '../../server/src/integrations/payments/fake-payment-service';
import { InvoiceRepository } from '../../server/src/invoices/invoice.repository';
import { resetDatabase, type SignedIn } from '../helpers/fixtures';
import { createPaymentsTestApp, gfciFoundOnSite, newKey, payOnFakePage, quotedRequest, sign, signBody, write, type PaymentsTestApp } from '../helpers/payment-fixtures';
import { createPricingCast, storeRateBook, type PricingCast, type StoredBook } from '../helpers/pricing-fixtures';

// Test card numbers are the payment service's published ones ("Testing", docs.stripe.com/testing):
// 4242 4242 4242 4242 succeeds, 4000 0000 0000 0002 is declined (generic decline).
const PAID_CARD = '4242424242424242';
const DECLINED_CARD = '4000000000000002';

// Expected money comes from docs/pricing.md, Example 1 (computed by hand from the demo rate book):
// one `gfci-replace` alone on a visit is $314.34 with a 50 % card deposit of $157.17.
const EXAMPLE_1_TOTAL = 31_434;
const EXAMPLE_1_DEPOSIT = 15_717;

// Each test carries a request through pricing, quote and signature over HTTP: longer than the default.
jest.setTimeout(30_000);

let t: PaymentsTestApp;
let cast: PricingCast;
let book: StoredBook;

const GFCI = { code: 'gfci-inoperative', quantity: 1, location: 'hall bath vanity', entry: 'gfci-replace' };
const PLATE = { code: 'cover-plate-missing', quantity: 2, location: 'garage', entry: 'cover-plate' };

const view = async (requestId: number, who: SignedIn = cast.s.seller): Promise<ApprovalView> => (await who.agent.get(`/api/requests/${requestId}/approval`).expect(200)).body;
const startPayment = (requestId: number, body: object, who: SignedIn = cast.s.seller) => write(who, 'post', `/api/requests/${requestId}/payments`).send(body);
const paymentRows = (requestId: number) => t.db('payments').where({ request_id: requestId }).orderBy('id');

/** A request whose quote (GFCI + cover plates) the seller signed, approving the GFCI only: Example 1's scope. */
async function signedRequest(): Promise<{ requestId: number; gfci: number; plate: number }> {
  const { requestId, itemIds } = await quotedRequest(cast, t, book, [GFCI, PLATE]);
  await sign(cast.s.seller, requestId, signBody(itemIds, ['approved', 'declined']));
  return { requestId, gfci: itemIds[0], plate: itemIds[1] };
}

/** A signed request with its deposit paid by card on the fake payment page. */
async function paidDeposit(): Promise<{ requestId: number; paymentId: number }> {
  const { requestId } = await signedRequest();
  const started: StartedPayment = (await startPayment(requestId, { plan: 'card-deposit', idempotencyKey: newKey() }).expect(201)).body;
  const page = await payOnFakePage(started.checkoutUrl!, PAID_CARD);
  expect(page.status).toBe(303);
  return { requestId, paymentId: started.payment.id };
}

beforeAll(async () => {
  t = await createPaymentsTestApp();
  await resetDatabase(t.db);
  cast = await createPricingCast(t.app, t.db);
  book = await storeRateBook(t.db, cast.contractorOrg, DEMO_RATE_BOOK);
});
afterAll(() => t.close());

describe('the payment page sends the seller back', () => {
  it('to the portal address the payment was started from, and never to another host named in the Origin header', async () => {
    const { requestId } = await signedRequest();
    const publicUrl = 'http://portal.test'; // PUBLIC_URL of the test app (test/helpers/test-app.ts)
    const forged = (await startPayment(requestId, { plan: 'card-deposit', idempotencyKey: newKey() }).set('Origin', 'http://elsewhere.test').expect(201)).body as StartedPayment;
    const page = await payOnFakePage(forged.checkoutUrl!, PAID_CARD);
    expect(page.status).toBe(303);
    expect(page.location).toBe(`${publicUrl}/requests/${requestId}/approval?payment=${forged.payment.id}`);
  });
});

describe('POST /api/requests/:id/approval', () => {
  it('refuses a decline note longer than 500 characters with its field path, and stores nothing (never a cut note)', async () => {
    const { requestId, itemIds } = await quotedRequest(cast, t, book, [GFCI, PLATE]);
    const longNote = 'The buyer will have this done after closing by their own electrician. '.repeat(16).slice(0, 1_100);
    expect(longNote).toHaveLength(1_100);
    const res = await write(cast.s.seller, 'post', `/api/requests/${requestId}/approval`)
      .send(signBody(itemIds, ['approved', 'declined'], { decisions: [{ lineItemId: itemIds[0], decision: 'approved' }, { lineItemId: itemIds[1], decision: 'declined', note: longNote }] }));
    expect(res.status).toBe(400);
    expect(res.body.details).toContainEqual({ path: 'decisions.1.note', message: 'Keep the note to 500 characters' });
    expect(await t.db('item_decisions').where({ request_id: requestId })).toHaveLength(0);
    expect((await view(requestId)).signature).toBeNull();
  });

  it('signs: items approved and declined, scope priced like docs/pricing.md Example 1, the request approved', async () => {
    const { requestId, itemIds } = await quotedRequest(cast, t, book, [GFCI, PLATE]);
    const res = await write(cast.s.seller, 'post', `/api/requests/${requestId}/approval`)
      .set('user-agent', 'PhoneBrowser/1.0')
      .send(signBody(itemIds, ['approved', 'declined'], { signerName: 'Ellen Q. Seller', decisions: [{ lineItemId: itemIds[0], decision: 'approved' }, { lineItemId: itemIds[1], decision: 'declined', note: 'The buyer will do this' }] }));
    expect(res.status).toBe(201);
    // The answer has the shape the portal parses before showing money.
    const v: ApprovalView = ApprovalViewSchema.parse(res.body);
    expect(v.requestStatus).toBe('approved');
    expect(v.scope?.totalCents).toBe(EXAMPLE_1_TOTAL);
    expect(v.account).toMatchObject({ scopeTotalCents: EXAMPLE_1_TOTAL, depositCents: EXAMPLE_1_DEPOSIT, paidCents: 0, balanceCents: EXAMPLE_1_TOTAL });
    expect(v.items.map((i) => [i.lineItemId, i.status])).toEqual([[itemIds[0], 'approved'], [itemIds[1], 'declined']]);
    expect(v.decisions.find((d) => d.lineItemId === itemIds[1])?.note).toBe('The buyer will do this');
    expect(v.signature).toMatchObject({ signerName: 'Ellen Q. Seller', quoteVersion: 1, userAgent: 'PhoneBrowser/1.0', ipAddress: expect.stringMatching(/127\.0\.0\.1/) });
    expect(v.signature?.quoteHash).toMatch(/^[0-9a-f]{64}$/);
    expect(v.signature?.consentText).toContain(`quote ${v.requestReference} version 1`);
    expect(v.plans).toEqual([
      { plan: 'card-deposit', amountCents: EXAMPLE_1_DEPOSIT },
      { plan: 'card-full', amountCents: EXAMPLE_1_TOTAL },
      { plan: 'at-closing', amountCents: EXAMPLE_1_TOTAL },
    ]);
  });

  it('shows the contractor and the buyer’s agent the decision per item, without the signer’s address', async () => {
    const { requestId, plate } = await signedRequest();
    for (const who of [cast.s.contractor, cast.s.buyerAgent]) {
      const v = await view(requestId, who);
      expect(v.items.find((i) => i.lineItemId === plate)?.status).toBe('declined');
      expect(v.signature?.ipAddress).toBeNull();
      expect(v.can.decide).toBe(false);
    }
    expect((await view(requestId, cast.s.buyerAgent)).payments).toEqual([]);
  });

  // Review 7, P2-1: the record must say who signed and in what capacity, for every party to read.
  it('lets the listing agent sign for the seller, and records and shows that capacity to every party', async () => {
    const { requestId, itemIds } = await quotedRequest(cast, t, book, [GFCI]);
    const signed = await sign(cast.s.listingAgent, requestId, signBody(itemIds, ['approved'], { signerName: 'Robert Hale' }));
    expect(signed.requestStatus).toBe('approved');
    expect(await t.db('quote_approvals').where({ request_id: requestId }).first('signer_capacity')).toEqual({ signer_capacity: 'listing-agent' });
    for (const who of [cast.s.seller, cast.s.listingAgent, cast.s.buyerAgent, cast.s.inspector, cast.s.contractor]) {
      expect((await view(requestId, who)).signature).toMatchObject({ signerName: 'Robert Hale', signerCapacity: 'listing-agent' });
      // The history every party reads names the signer with the capacity.
      const entries: ActivityEntry[] = (await who.agent.get(`/api/requests/${requestId}/activity?kind=status`).expect(200)).body.items;
      expect(entries.find((e) => e.action === 'approve')?.summary).toContain('approved and signed by Robert Hale, listing agent, for the seller');
    }
    // The deposit's receipt is the seller's, and says who signed for them.
    const started: StartedPayment = (await startPayment(requestId, { plan: 'card-deposit', idempotencyKey: newKey() }, cast.s.listingAgent).expect(201)).body;
    expect((await payOnFakePage(started.checkoutUrl!, PAID_CARD)).status).toBe(303);
    const receipt = (await view(requestId)).invoices.find((i) => i.kind === 'receipt')!;
    const pdf = await cast.s.seller.agent.get(receipt.pdfPath).buffer(true).parse((r, done) => {
      const chunks: Buffer[] = [];
      r.on('data', (c: Buffer) => chunks.push(c));
      r.on('end', () => done(null, Buffer.concat(chunks)));
    });
    const text = (await extractPdfPages(pdf.body as Buffer)).pages.join('\n').replace(/\s+/g, ' ');
    expect(text).toContain(`To ${cast.users.seller.name}`);
    expect(text).toContain('Approval signed by Robert Hale, listing agent, for the seller');
  });

  it('records the seller’s own signature as the seller’s', async () => {
    const { requestId, itemIds } = await quotedRequest(cast, t, book, [GFCI]);
    expect((await sign(cast.s.seller, requestId, signBody(itemIds, ['approved']))).signature?.signerCapacity).toBe('seller');
  });

  it('declines the request when every item is declined', async () => {
    const { requestId, itemIds } = await quotedRequest(cast, t, book, [GFCI, PLATE]);
    const v = await sign(cast.s.seller, requestId, signBody(itemIds, ['declined', 'declined']));
    expect(v.requestStatus).toBe('declined');
    expect(v.plans).toEqual([]);
  });

  it('responds 403 to the contractor (its own quote), the buyer’s agent and the inspector; 404 to outsiders; 401 signed out', async () => {
    const { requestId, itemIds } = await quotedRequest(cast, t, book, [GFCI]);
    for (const who of ['contractor', 'colleague', 'buyerAgent', 'inspector'] as const) {
      await write(cast.s[who], 'post', `/api/requests/${requestId}/approval`).send(signBody(itemIds, ['approved'])).expect(403);
    }
    for (const who of ['otherContractor', 'outsiderAgent'] as const) {
      await write(cast.s[who], 'post', `/api/requests/${requestId}/approval`).send(signBody(itemIds, ['approved'])).expect(404);
      await cast.s[who].agent.get(`/api/requests/${requestId}/approval`).expect(404);
    }
    await request(t.app).get(`/api/requests/${requestId}/approval`).expect(401);
    expect((await view(requestId)).requestStatus).toBe('quoted');
  });

  it('responds 400 with field details for a missing decision, no consent, a NUL byte in the name', async () => {
    const { requestId, itemIds } = await quotedRequest(cast, t, book, [GFCI, PLATE]);
    const missing = await write(cast.s.seller, 'post', `/api/requests/${requestId}/approval`).send(signBody(itemIds.slice(0, 1), ['approved']));
    expect(missing.status).toBe(400);
    expect(missing.body.details).toEqual([{ path: `decisions.${itemIds[1]}`, message: `Item #${itemIds[1]} has no decision` }]);
    const noConsent = await write(cast.s.seller, 'post', `/api/requests/${requestId}/approval`).send({ ...signBody(itemIds, ['approved', 'approved']), hasConsented: false });
    expect(noConsent.status).toBe(400);
    expect(noConsent.body.details[0].path).toBe('hasConsented');
    const nul = await write(cast.s.seller, 'post', `/api/requests/${requestId}/approval`).send(signBody(itemIds, ['approved', 'approved'], { signerName: 'Pat\u0000Seller' }));
    expect(nul.status).toBe(400);
    expect(nul.body.details[0].path).toBe('signerName');
    expect((await view(requestId)).signature).toBeNull();
  });

  it('responds 409 to a second signature and to a version that is no longer current', async () => {
    const { requestId, itemIds } = await quotedRequest(cast, t, book, [GFCI]);
    const stale = await write(cast.s.seller, 'post', `/api/requests/${requestId}/approval`).send(signBody(itemIds, ['approved'], { quoteVersion: 2 }));
    expect(stale.status).toBe(409);
    await sign(cast.s.seller, requestId, signBody(itemIds, ['approved']));
    await write(cast.s.listingAgent, 'post', `/api/requests/${requestId}/approval`).send(signBody(itemIds, ['declined'])).expect(409);
  });
});

describe('POST /api/requests/:id/payments (card)', () => {
  it('opens one payment for a double submit: same key → the same payment and payment page', async () => {
    const { requestId } = await signedRequest();
    const key = newKey();
    const [a, b] = await Promise.all([startPayment(requestId, { plan: 'card-deposit', idempotencyKey: key }), startPayment(requestId, { plan: 'card-deposit', idempotencyKey: key })]);
    expect([a.status, b.status]).toEqual([201, 201]);
    expect(a.body.payment.id).toBe(b.body.payment.id);
    expect(a.body.checkoutUrl).toBe(b.body.checkoutUrl);
    // A second click that made a new key still finds the open deposit payment.
    const c = await startPayment(requestId, { plan: 'card-deposit', idempotencyKey: newKey() }).expect(201);
    expect(c.body.payment.id).toBe(a.body.payment.id);
    const rows = await paymentRows(requestId);
    expect(rows).toHaveLength(1);
    expect(rows[0]).toMatchObject({ amount_cents: EXAMPLE_1_DEPOSIT, status: 'pending', purpose: 'deposit' });
    expect(t.fake.sessions.size).toBeGreaterThan(0);
    expect([...t.fake.sessions.values()].filter((s) => s.metadata.payment_id === String(a.body.payment.id))).toHaveLength(1);
  });

  it('credits the deposit from the verified event, issues receipt RCT-… and shows the contractor the payment', async () => {
    const { requestId, paymentId } = await paidDeposit();
    const v = await view(requestId, cast.s.contractor);
    expect(v.payments).toEqual([expect.objectContaining({ id: paymentId, status: 'succeeded', amountCents: EXAMPLE_1_DEPOSIT })]);
    expect(v.account).toMatchObject({ paidCents: EXAMPLE_1_DEPOSIT, balanceCents: EXAMPLE_1_TOTAL - EXAMPLE_1_DEPOSIT });
    expect(v.invoices).toEqual([expect.objectContaining({ kind: 'receipt', number: expect.stringMatching(/^RCT-\d{6}$/), totalCents: EXAMPLE_1_DEPOSIT })]);
    // The deposit is taken: the seller may pay the rest by card or at closing, not a second deposit.
    expect((await view(requestId)).plans.map((p) => p.plan)).toEqual(['card-full', 'at-closing']);
  });

  it('keeps the payment open with the decline message when the card is declined, and credits nothing', async () => {
    const { requestId } = await signedRequest();
    const started: StartedPayment = (await startPayment(requestId, { plan: 'card-full', idempotencyKey: newKey() }).expect(201)).body;
    expect(TEST_CARDS[DECLINED_CARD].succeeds).toBe(false);
    const page = await payOnFakePage(started.checkoutUrl!, DECLINED_CARD);
    expect(page.status).toBe(402);
    expect(page.html).toContain('Your card was declined.');
    const v = await view(requestId);
    expect(v.payments[0]).toMatchObject({ status: 'pending', failureMessage: 'Your card was declined.' });
    expect(v.account.paidCents).toBe(0);
    // The payer tries again on the same page with a card that works.
    expect((await payOnFakePage(started.checkoutUrl!, PAID_CARD)).status).toBe(303);
    expect((await view(requestId)).account.paidCents).toBe(EXAMPLE_1_TOTAL);
  });

  it('responds 403 to the contractor and the buyer’s agent, 409 before the quote is signed, 400 for a bad key', async () => {
    const { requestId } = await signedRequest();
    for (const who of ['contractor', 'buyerAgent', 'inspector'] as const) await startPayment(requestId, { plan: 'card-full', idempotencyKey: newKey() }, cast.s[who]).expect(403);
    await startPayment(requestId, { plan: 'card-full', idempotencyKey: newKey() }, cast.s.otherContractor).expect(404);
    const bad = await startPayment(requestId, { plan: 'card-full', idempotencyKey: 'short' });
    expect(bad.status).toBe(400);
    expect(bad.body.details[0].path).toBe('idempotencyKey');
    const { requestId: quoted } = await quotedRequest(cast, t, book, [GFCI]);
    await startPayment(quoted, { plan: 'card-full', idempotencyKey: newKey() }).expect(409);
    expect(await paymentRows(requestId)).toHaveLength(0);
  });
});

describe('POST /api/payments/webhook', () => {
  const postEvent = (payload: string, signature: string) => request(t.app).post('/api/payments/webhook').set('content-type', 'application/json').set('stripe-signature', signature).send(payload);

  it('responds 400 to a forged signature and changes nothing', async () => {
    const { requestId } = await signedRequest();
    const started: StartedPayment = (await startPayment(requestId, { plan: 'card-deposit', idempotencyKey: newKey() }).expect(201)).body;
    const session = [...t.fake.sessions.values()].find((s) => s.metadata.payment_id === String(started.payment.id))!;
    const forged = JSON.stringify({ id: 'evt_forged_1', object: 'event', type: 'checkout.session.completed', data: { object: { ...session, payment_status: 'paid', payment_intent: 'pi_forged' } } });
    const res = await postEvent(forged, t.fake.signatureFor(forged, 'whsec_not_the_real_secret_0000'));
    expect(res.status).toBe(400);
    expect(res.body.error).toBe('The event signature does not verify');
    await postEvent(forged, 'not a signature').expect(400);
    await postEvent(forged, t.fake.signatureFor(forged.replace('evt_forged_1', 'evt_forged_2'))).expect(400);
    expect((await t.db('payment_events').where('event_id', 'like', 'evt_forged%')).length).toBe(0);
    expect((await paymentRows(requestId))[0].status).toBe('pending');
  });

  it('acts on a replayed event once and on a second event for the same payment not at all: no double credit', async () => {
    const { requestId, paymentId } = await paidDeposit();
    const completed = t.fake.delivered.filter((e) => e.type === 'checkout.session.completed' && JSON.parse(e.payload).data.object.metadata.payment_id === String(paymentId));
    expect(completed).toHaveLength(1);
    expect(await t.fake.redeliver(completed[0].id)).toBe(200);
    const replay = JSON.parse(completed[0].payload);
    const again = await postEvent(completed[0].payload, t.fake.signatureFor(completed[0].payload)).expect(200);
    expect(again.body.outcome).toBe('duplicate');
    // The same session reported again under a new event id (the service may send both kinds).
    const second = await t.fake.emit('checkout.session.completed', replay.data.object);
    expect(second.status).toBe(200);
    const outcome = await t.db('payment_events').where({ event_id: second.id }).first('outcome');
    expect(outcome.outcome).toBe('already-credited');
    const v = await view(requestId);
    expect(v.account.paidCents).toBe(EXAMPLE_1_DEPOSIT);
    expect(v.invoices.filter((i) => i.kind === 'receipt')).toHaveLength(1);
  });

  it('ignores a decline that arrives after the payment succeeded (out of order)', async () => {
    const { requestId, paymentId } = await paidDeposit();
    const intentId = (await paymentRows(requestId))[0].payment_intent_id;
    const late = await t.fake.emit('payment_intent.payment_failed', { id: intentId, object: 'payment_intent', amount: EXAMPLE_1_DEPOSIT, amount_received: 0, metadata: { payment_id: String(paymentId) }, last_payment_error: { message: 'Your card was declined.' } });
    expect(late.status).toBe(200);
    const v = await view(requestId);
    expect(v.payments[0]).toMatchObject({ status: 'succeeded', failureMessage: null });
    expect(v.account.paidCents).toBe(EXAMPLE_1_DEPOSIT);
  });

  it('credits nothing for an event whose amount is not the payment’s', async () => {
    const { requestId } = await signedRequest();
    const started: StartedPayment = (await startPayment(requestId, { plan: 'card-deposit', idempotencyKey: newKey() }).expect(201)).body;
    const session = [...t.fake.sessions.values()].find((s) => s.metadata.payment_id === String(started.payment.id))!;
    await t.fake.emit('checkout.session.completed', { ...session, amount_total: 1, payment_status: 'paid', payment_intent: 'pi_other' });
    expect((await paymentRows(requestId))[0].status).toBe('pending');
  });
});

describe('POST /api/requests/:id/payments/:paymentId/refunds', () => {
  it('refunds part of a card payment; the money goes back when the service reports it', async () => {
    const { requestId, paymentId } = await paidDeposit();
    const res = await write(cast.s.contractor, 'post', `/api/requests/${requestId}/payments/${paymentId}/refunds`).send({ amountCents: 5_000, reason: 'Cover plates declined after the deposit', idempotencyKey: newKey() });
    expect(res.status).toBe(202);
    await t.fake.settle();
    const v = await view(requestId);
    expect(v.payments[0]).toMatchObject({ refundedCents: 5_000, refunds: [expect.objectContaining({ amountCents: 5_000, status: 'succeeded' })] });
    expect(v.account).toMatchObject({ paidCents: EXAMPLE_1_DEPOSIT - 5_000, refundedCents: 5_000 });
    const intentId = (await paymentRows(requestId))[0].payment_intent_id;
    expect([...t.fake.refunds.values()].filter((r) => r.payment_intent === intentId)).toHaveLength(1);
  });

  it('refunds the rest in full, and refuses more than is left (400), the seller (403) and a second submit (one refund)', async () => {
    const { requestId, paymentId } = await paidDeposit();
    const path = `/api/requests/${requestId}/payments/${paymentId}/refunds`;
    const tooMuch = await write(cast.s.contractor, 'post', path).send({ amountCents: EXAMPLE_1_DEPOSIT + 1, reason: 'Too much', idempotencyKey: newKey() });
    expect(tooMuch.status).toBe(400);
    expect(tooMuch.body.details).toEqual([{ path: 'amountCents', message: `At most ${EXAMPLE_1_DEPOSIT} cents can be refunded on this payment` }]);
    await write(cast.s.seller, 'post', path).send({ amountCents: 100, reason: 'Mine', idempotencyKey: newKey() }).expect(403);
    const key = newKey();
    await Promise.all([
      write(cast.s.contractor, 'post', path).send({ amountCents: EXAMPLE_1_DEPOSIT, reason: 'The work cannot be done', idempotencyKey: key }).expect(202),
      write(cast.s.contractor, 'post', path).send({ amountCents: EXAMPLE_1_DEPOSIT, reason: 'The work cannot be done', idempotencyKey: key }).expect(202),
    ]);
    await t.fake.settle();
    const v = await view(requestId);
    expect(v.payments[0].refunds).toHaveLength(1);
    expect(v.account.paidCents).toBe(0);
  });
});

describe('change orders', () => {
  it('prices an item found on site by the shared engine; approved by the seller it joins the scope and the balance', async () => {
    const { requestId } = await signedRequest();
    const sent = await write(cast.s.contractor, 'post', `/api/requests/${requestId}/change-orders`).send(gfciFoundOnSite(book));
    expect(sent.status).toBe(201);
    const co = (sent.body as ApprovalView).changeOrders[0];
    // Computed by hand from docs/pricing.md's rules: a second gfci-replace on Example 1's visit adds
    // its materials with markup (3,240) and their tax (389 − 194 = 195); 40 minutes stay inside the
    // first hour. 31,434 → 34,869: the change order's price is 3,435.
    expect(co).toMatchObject({ number: 1, status: 'sent', scopeBeforeCents: EXAMPLE_1_TOTAL, scopeAfterCents: 34_869, priceCents: 3_435 });
    await write(cast.s.seller, 'post', `/api/requests/${requestId}/change-orders/${co.id}/decision`).send({ decision: 'approve', signerName: 'x', hasConsented: true }).expect(400);
    await write(cast.s.contractor, 'post', `/api/requests/${requestId}/change-orders/${co.id}/decision`).send({ decision: 'approve', signerName: 'Sam Contractor', hasConsented: true }).expect(403);
    const decided = await write(cast.s.seller, 'post', `/api/requests/${requestId}/change-orders/${co.id}/decision`).send({ decision: 'approve', signerName: 'Pat Seller', hasConsented: true });
    expect(decided.status).toBe(200);
    const v: ApprovalView = decided.body;
    expect(v.changeOrders[0]).toMatchObject({ status: 'approved', signerName: 'Pat Seller', signerCapacity: 'seller' });
    expect(v.account.scopeTotalCents).toBe(34_869);
    expect(v.items.find((i) => i.lineItemId === co.lines[0].lineItemId)).toMatchObject({ status: 'approved', changeOrderNumber: 1 });
  });

  // As for the quote's approval (review 7, P2-1): the listing agent decides for the seller, and every
  // record of the decision says so.
  it('records the capacity of whoever decides a change order, and shows it on the page, in the history and in the e-mail', async () => {
    const { requestId } = await signedRequest();
    const co = ((await write(cast.s.contractor, 'post', `/api/requests/${requestId}/change-orders`).send(gfciFoundOnSite(book)).expect(201)).body as ApprovalView).changeOrders[0];
    expect(co).toMatchObject({ signerName: null, signerCapacity: null });
    await write(cast.s.listingAgent, 'post', `/api/requests/${requestId}/change-orders/${co.id}/decision`).send({ decision: 'approve', signerName: 'Robert Hale', hasConsented: true }).expect(200);
    expect(await t.db('change_orders').where({ id: co.id }).first('signer_capacity')).toEqual({ signer_capacity: 'listing-agent' });
    for (const who of [cast.s.seller, cast.s.listingAgent, cast.s.buyerAgent, cast.s.contractor]) {
      expect((await view(requestId, who)).changeOrders[0]).toMatchObject({ signerName: 'Robert Hale', signerCapacity: 'listing-agent' });
      const entries: ActivityEntry[] = (await who.agent.get(`/api/requests/${requestId}/activity?kind=approvals`).expect(200)).body.items;
      expect(entries.find((e) => e.action === 'change-order-decided')?.summary).toContain('change order 1 approved by Robert Hale, listing agent, for the seller');
    }
    const mail = await t.db('outbox_messages').where({ request_id: requestId, kind: 'change-order-decided', recipient_user_id: cast.users.contractor.id }).first('subject', 'text_body');
    expect(mail.subject).toContain('change order 1 approved by Robert Hale, listing agent, for the seller');
    expect(mail.text_body).toContain('Robert Hale, listing agent, for the seller, approved and signed change order 1');
  });

  it('takes an approved item out (it cannot be done): the payment above the scope is to be refunded', async () => {
    const { requestId, paymentId } = await paidDeposit();
    await startPayment(requestId, { plan: 'card-full', idempotencyKey: newKey() }).expect(201).then((r) => payOnFakePage(r.body.checkoutUrl, PAID_CARD));
    const gfci = (await view(requestId)).items.find((i) => i.status === 'approved')!.lineItemId;
    const sent = await write(cast.s.contractor, 'post', `/api/requests/${requestId}/change-orders`).send({ reason: 'The receptacle box is inside a sealed wall', lines: [{ kind: 'remove', lineItemId: gfci }] });
    expect((sent.body as ApprovalView).changeOrders[0]).toMatchObject({ priceCents: -EXAMPLE_1_TOTAL, scopeAfterCents: 0 });
    const v: ApprovalView = (await write(cast.s.seller, 'post', `/api/requests/${requestId}/change-orders/${(sent.body as ApprovalView).changeOrders[0].id}/decision`).send({ decision: 'approve', signerName: 'Pat Seller', hasConsented: true }).expect(200)).body;
    expect(v.account).toMatchObject({ scopeTotalCents: 0, paidCents: EXAMPLE_1_TOTAL, overpaidCents: EXAMPLE_1_TOTAL, balanceCents: 0 });
    expect(v.items.find((i) => i.lineItemId === gfci)?.status).toBe('declined');
    await write(cast.s.contractor, 'post', `/api/requests/${requestId}/payments/${paymentId}/refunds`).send({ amountCents: EXAMPLE_1_DEPOSIT, reason: 'Item cannot be done', idempotencyKey: newKey() }).expect(202);
    await t.fake.settle();
    expect((await view(requestId)).account.overpaidCents).toBe(EXAMPLE_1_TOTAL - EXAMPLE_1_DEPOSIT);
  });

  it('responds 400 for work not in the quote’s rate book and for an item not in the approved scope', async () => {
    const { requestId, plate } = await signedRequest();
    const res = await write(cast.s.contractor, 'post', `/api/requests/${requestId}/change-orders`).send({
      reason: 'Two changes',
      lines: [
        { kind: 'add', code: 'gfci-inoperative', room: 'bathroom', location: 'bath', entryId: '999999', quantity: 1 },
        { kind: 'quantity', lineItemId: plate, quantity: 3 },
      ],
    });
    expect(res.status).toBe(400);
    expect(res.body.details.map((d: { path: string }) => d.path)).toEqual(['lines.0.entryId', 'lines.1.lineItemId']);
  });
});

describe('payment at closing', () => {
  it('issues an invoice to the escrow company payable at closing; the contractor records the funds', async () => {
    const { requestId } = await signedRequest();
    const res = await startPayment(requestId, { plan: 'at-closing', idempotencyKey: newKey(), escrow: { company: 'Quarry Bend Title & Escrow', officer: 'R. Lindqvist', email: 'r.lindqvist@quarrybend-title.test', fileNumber: 'QB-2027-0113' } });
    expect(res.status).toBe(201);
    expect(res.body.checkoutUrl).toBeNull();
    expect(res.body.invoiceNumber).toMatch(/^INV-\d{6}$/);
    let v = await view(requestId);
    expect(v.account).toMatchObject({ payableAtClosingCents: EXAMPLE_1_TOTAL, paidCents: 0 });
    expect(v.plans).toEqual([]);
    const invoice = v.invoices.find((i) => i.kind === 'closing-invoice')!;
    expect(invoice.sentTo).toBe('r.lindqvist@quarrybend-title.test');
    const pdf = await cast.s.seller.agent.get(invoice.pdfPath).buffer(true).parse((r, done) => {
      const chunks: Buffer[] = [];
      r.on('data', (c: Buffer) => chunks.push(c));
      r.on('end', () => done(null, Buffer.concat(chunks)));
    });
    expect(pdf.headers['content-type']).toBe('application/pdf');
    const text = (await extractPdfPages(pdf.body as Buffer)).pages.join('\n').replace(/\s+/g, ' ');
    expect(text).toContain(`Invoice — payable at closing ${res.body.invoiceNumber}`);
    expect(text).toContain('Quarry Bend Title & Escrow');
    expect(text).toContain('QB-2027-0113');
    expect(text).toContain('$314.34');
    // What an escrow officer matches the paper to the file by: issue day, seller, closing day; US "check".
    expect(text).toMatch(/Issued [A-Z][a-z]{2} \d{1,2}, \d{4} · Seller: \S+/);
    expect(text).toMatch(/Closing [A-Z][a-z]{2} \d{1,2}, \d{4}/);
    expect(text).toContain('by wire or check');
    const body = { paymentId: res.body.payment.id, amountCents: EXAMPLE_1_TOTAL, receivedOn: '2027-01-15', reference: 'Wire 88213' };
    await write(cast.s.seller, 'post', `/api/requests/${requestId}/payments/funds`).send(body).expect(403);
    const wrong = await write(cast.s.contractor, 'post', `/api/requests/${requestId}/payments/funds`).send({ ...body, amountCents: 100 });
    expect(wrong.status).toBe(400);
    v = (await write(cast.s.contractor, 'post', `/api/requests/${requestId}/payments/funds`).send(body).expect(200)).body;
    expect(v.account).toMatchObject({ payableAtClosingCents: 0, paidCents: EXAMPLE_1_TOTAL, balanceCents: 0 });
    await write(cast.s.contractor, 'post', `/api/requests/${requestId}/payments/funds`).send(body).expect(409);
  });
});

describe('payment at closing: the invoice goes to the escrow company', () => {
  const escrow = { company: 'Quarry Bend Title & Escrow', officer: '', email: 'closings@quarrybend-title.test', fileNumber: '' };

  it('refuses payment at closing without an e-mail address for the invoice, naming the field', async () => {
    const { requestId } = await signedRequest();
    const res = await startPayment(requestId, { plan: 'at-closing', idempotencyKey: newKey(), escrow: { ...escrow, email: '' } });
    expect(res.status).toBe(400);
    expect(res.body.details).toEqual([{ path: 'escrow.email', message: 'Enter the e-mail address the invoice is sent to' }]);
    expect(await paymentRows(requestId)).toEqual([]);
  });

  it('sends the invoice again to a corrected address (seller side or contractor), refusing a bad address, other parties and after the funds are recorded', async () => {
    const { requestId } = await signedRequest();
    const started: StartedPayment = (await startPayment(requestId, { plan: 'at-closing', idempotencyKey: newKey(), escrow }).expect(201)).body;
    const invoice = (await view(requestId)).invoices.find((i) => i.kind === 'closing-invoice')!;
    const send = (who: SignedIn, email: string, id = invoice.id) => write(who, 'post', `/api/requests/${requestId}/invoices/${id}/send`).send({ email });
    expect((await view(requestId)).can.sendClosingInvoice).toBe(true);
    expect((await view(requestId, cast.s.contractor)).can.sendClosingInvoice).toBe(true);

    // An empty body, a NUL byte, a number too large for an id and a non-number: field errors or 404, never a 500.
    const empty = await write(cast.s.seller, 'post', `/api/requests/${requestId}/invoices/${invoice.id}/send`).send({});
    expect(empty.status).toBe(400);
    expect(empty.body.details).toEqual([expect.objectContaining({ path: 'email' })]);
    expect((await send(cast.s.seller, 'closings\u0000@quarrybend-title.test')).status).toBe(400);
    await write(cast.s.seller, 'post', `/api/requests/${requestId}/invoices/2147483648/send`).send({ email: 'x@quarrybend-title.test' }).expect(404);
    await write(cast.s.seller, 'post', `/api/requests/${requestId}/invoices/abc/send`).send({ email: 'x@quarrybend-title.test' }).expect(404);
    const bad = await send(cast.s.seller, 'closings at quarrybend');
    expect(bad.status).toBe(400);
    expect(bad.body.details).toEqual([{ path: 'email', message: 'Enter an e-mail address like name@example.com' }]);
    await send(cast.s.buyerAgent, 'x@quarrybend-title.test').expect(403);
    await send(cast.s.otherContractor, 'x@quarrybend-title.test').expect(404);
    // A receipt or another request's invoice is not an invoice payable at closing of this request.
    await send(cast.s.seller, 'x@quarrybend-title.test', invoice.id + 100_000).expect(404);

    const again: ApprovalView = (await send(cast.s.listingAgent, 'r.lindqvist@quarrybend-title.test').expect(200)).body;
    expect(again.invoices.find((i) => i.id === invoice.id)!.sentTo).toBe('r.lindqvist@quarrybend-title.test');
    const messages = await t.db('outbox_messages').where({ kind: 'closing-invoice', attachment_invoice_id: invoice.id }).orderBy('id').pluck('recipient_email');
    expect(messages).toEqual(['closings@quarrybend-title.test', 'r.lindqvist@quarrybend-title.test']);

    await write(cast.s.contractor, 'post', `/api/requests/${requestId}/payments/funds`).send({ paymentId: started.payment.id, amountCents: EXAMPLE_1_TOTAL, receivedOn: '2027-01-15', reference: 'Wire 88215' }).expect(200);
    expect((await view(requestId)).can.sendClosingInvoice).toBe(false);
    await send(cast.s.seller, 'r.lindqvist@quarrybend-title.test').expect(409);
  });
});

describe('invoice numbers', () => {
  it('gives concurrent invoices distinct consecutive numbers per contractor organisation', async () => {
    const { requestId } = await signedRequest();
    const before = await t.db('invoice_counters').where({ organisation_id: cast.contractorOrg, series: 'invoice' }).first('last_number');
    const start = before?.last_number ?? 0;
    const answers = await Promise.all(Array.from({ length: 8 }, () => write(cast.s.contractor, 'post', `/api/requests/${requestId}/invoices`).send({})));
    expect(answers.map((a) => a.status)).toEqual(Array(8).fill(201));
    const numbers = answers.map((a) => Number(a.body.number.slice(4))).sort((a, b) => a - b);
    expect(numbers).toEqual(Array.from({ length: 8 }, (_, i) => start + 1 + i));
  });

  it('leaves no gap when a transaction that took a number rolls back', async () => {
    const repo = new InvoiceRepository(t.db);
    const first = await t.db.transaction((trx) => repo.nextNumber(cast.otherContractorOrg, 'receipt', trx));
    await expect(
      t.db.transaction(async (trx) => {
        await repo.nextNumber(cast.otherContractorOrg, 'receipt', trx);
        throw new Error('rolled back');
      }),
    ).rejects.toThrow('rolled back');
    const next = await t.db.transaction((trx) => repo.nextNumber(cast.otherContractorOrg, 'receipt', trx));
    expect(next).toBe(first + 1);
  });

  it('downloads the contractor’s invoice as a PDF with the items, payments, tax and balance', async () => {
    const { requestId } = await paidDeposit();
    const issued = await write(cast.s.contractor, 'post', `/api/requests/${requestId}/invoices`).send({}).expect(201);
    await write(cast.s.seller, 'post', `/api/requests/${requestId}/invoices`).send({}).expect(403);
    await cast.s.buyerAgent.agent.get(issued.body.pdfPath).expect(403);
    const pdf = await cast.s.seller.agent.get(issued.body.pdfPath).buffer(true).parse((r, done) => {
      const chunks: Buffer[] = [];
      r.on('data', (c: Buffer) => chunks.push(c));
      r.on('end', () => done(null, Buffer.concat(chunks)));
    });
    expect(pdf.body.toString('latin1')).toMatch(/\/FontName \/[A-Z]{6}\+SourceSans3-Regular/);
    const text = (await extractPdfPages(pdf.body as Buffer)).pages.join('\n').replace(/\s+/g, ' ');
    expect(text).toContain(`Invoice ${issued.body.number}`);
    expect(text).toContain('Replace inoperative GFCI receptacle');
    expect(text).toContain('Sales tax on materials $1.94');
    expect(text).toContain('Paid $157.17');
    expect(text).toContain('Balance due $157.17');
  });
});
