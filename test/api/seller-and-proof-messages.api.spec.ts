// The e-mails of the seller's side (decision, payments, change orders, refunds) and of the proof side
// (visit, item outcome, completion letter), each made through the API as people make them, read back
// from the product's SMTP sink with mailparser: who got it, what it says, which page it links to.
import { DEMO_RATE_BOOK, requestReference, type ApprovalView, type StartedPayment } from '@cc/shared';
import { extractPdfPages } from '../../server/src/integrations/pdf-text';
import { resetDatabase, type SignedIn } from '../helpers/fixtures';
import { startMailCapture, testWorker, type MailCapture } from '../helpers/mail-capture';
import { createPaymentsTestApp, gfciFoundOnSite, newKey, payOnFakePage, quotedRequest, sign, signBody, write, type PaymentsTestApp } from '../helpers/payment-fixtures';
import { gfciRecord } from '../helpers/proof-fixtures';
import { createPricedRequest, createPricingCast, storeRateBook, type CastKey, type PricingCast, type StoredBook } from '../helpers/pricing-fixtures';
import type { OutboxWorker } from '../../server/src/notifications/outbox-worker';
import { proofMessagesByMail } from '../../server/src/notifications/proof-message-mail';

// Each test carries a request through several steps over HTTP, some with the fake payment service.
jest.setTimeout(60_000);

const PORTAL = 'http://portal.test';
// The payment service's published test card that succeeds ("Testing", docs.stripe.com/testing).
const PAID_CARD = '4242424242424242';
// docs/pricing.md, Example 1 (computed by hand from the demo rate book): one `gfci-replace` alone on a
// visit is $314.34, with a 50 % card deposit of $157.17.
const EXAMPLE_1_TOTAL = '$314.34';
const EXAMPLE_1_DEPOSIT = '$157.17';

const GFCI = { code: 'gfci-inoperative', quantity: 1, location: 'hall bath vanity', entry: 'gfci-replace' };
const PLATE = { code: 'cover-plate-missing', quantity: 2, location: 'garage', entry: 'cover-plate' };
const CAST_KEYS: CastKey[] = ['buyerAgent', 'listingAgent', 'seller', 'inspector', 'contractor', 'colleague', 'otherContractor', 'outsiderAgent', 'admin'];

let t: PaymentsTestApp;
let cast: PricingCast;
let book: StoredBook;
let mail: MailCapture;
let worker: OutboxWorker;

const emailOf = (k: CastKey) => cast.users[k].email;
/** Who got a message, by their part in the cast, sorted. */
const receivers = () => CAST_KEYS.filter((k) => mail.to(emailOf(k)).length > 0).sort();
/** Sends what the outbox holds, to the sink. */
const deliver = async () => {
  await worker.drain();
};
const inDays = (days: number) => new Date(Date.now() + days * 86_400_000).toISOString().slice(0, 10);
const dayWords = (date: string) => new Date(`${date}T12:00:00Z`).toLocaleDateString('en-US', { weekday: 'long', month: 'long', day: 'numeric', year: 'numeric', timeZone: 'UTC' });

/** Every recipient's one message says `subjectPart` and links (text and HTML) to `path` of the portal. */
function expectOneMessageEach(who: CastKey[], subjectPart: string, path: string): void {
  expect(receivers()).toEqual([...who].sort());
  for (const k of who) {
    const messages = mail.to(emailOf(k));
    expect(messages).toHaveLength(1);
    const [m] = messages;
    expect(m.subject).toContain(subjectPart);
    expect(m.text).toContain(`Hello ${cast.users[k].name},`);
    expect(m.text).toContain(`: ${PORTAL}${path}\n`);
    expect(m.html).toContain(`href="${PORTAL}${path}"`);
  }
}

/** A request whose quote (GFCI + cover plates) the seller signed, approving the GFCI only (Example 1), mail cleared. */
async function signedRequest(): Promise<{ requestId: number; gfci: number }> {
  const { requestId, itemIds } = await quotedRequest(cast, t, book, [GFCI, PLATE]);
  await sign(cast.s.seller, requestId, signBody(itemIds, ['approved', 'declined']));
  await deliver();
  mail.clear();
  return { requestId, gfci: itemIds[0] };
}

/** A signed request whose deposit the seller paid by card on the fake payment page, the events delivered, mail cleared. */
async function paidDeposit(): Promise<{ requestId: number; paymentId: number }> {
  const { requestId } = await signedRequest();
  const started: StartedPayment = (await write(cast.s.seller, 'post', `/api/requests/${requestId}/payments`).send({ plan: 'card-deposit', idempotencyKey: newKey() }).expect(201)).body;
  expect((await payOnFakePage(started.checkoutUrl!, PAID_CARD)).status).toBe(303);
  await t.fake.settle();
  await deliver();
  mail.clear();
  return { requestId, paymentId: started.payment.id };
}

// Booked by the contractor for themself, so only the seller's side is e-mailed here (an electrician's own
// messages about visits booked for them: electrician-visit-mail.api.spec.ts).
const visitBody = (overrides: object = {}) => ({ date: inDays(3), arrivalFrom: '08:00', arrivalTo: '10:30', electricianId: cast.users.contractor.id, accessNotes: 'Key in the lockbox by the side gate', ...overrides });

/** An approved request with a GFCI and a double tap to correct, mail cleared. */
async function approvedWork(): Promise<{ requestId: number; gfci: number; panel: number }> {
  const { requestId, itemIds } = await createPricedRequest(cast, t.db, {
    status: 'approved',
    items: [
      { code: 'gfci-inoperative', quantity: 1, location: 'hall bath vanity', status: 'approved' },
      { code: 'double-tap', quantity: 1, location: 'main panel, breaker 14', status: 'approved' },
    ],
  });
  await deliver();
  mail.clear();
  return { requestId, gfci: itemIds[0], panel: itemIds[1] };
}

const panelNotCorrected = { outcome: 'not-corrected', reason: 'The breaker is not listed for two conductors and the panel maker no longer supplies one; a panel change is quoted separately.' };
const recordOutcome = (requestId: number, itemId: number, record: object, who: SignedIn = cast.s.contractor) =>
  write(who, 'post', `/api/requests/${requestId}/items/${itemId}/correction`).field('record', JSON.stringify(record));

beforeAll(async () => {
  t = await createPaymentsTestApp();
  await resetDatabase(t.db);
  cast = await createPricingCast(t.app, t.db);
  book = await storeRateBook(t.db, cast.contractorOrg, DEMO_RATE_BOOK);
  mail = await startMailCapture();
  worker = testWorker(t, mail.transport);
});
afterAll(async () => {
  await mail.close();
  await t.close();
});
beforeEach(async () => {
  await deliver();
  mail.clear();
});

describe('the seller’s side', () => {
  it('quote approved: the contractor’s people and both agents hear it, linked to the approval page', async () => {
    const { requestId, itemIds } = await quotedRequest(cast, t, book, [GFCI, PLATE]);
    await deliver();
    mail.clear();
    await sign(cast.s.seller, requestId, signBody(itemIds, ['approved', 'declined']));
    await deliver();
    expectOneMessageEach(['buyerAgent', 'colleague', 'contractor', 'listingAgent'], 'the quote was approved — 1 approved, 1 declined', `/requests/${requestId}/approval`);
    expect(mail.to(emailOf('contractor'))[0].text).toContain(`The seller approved and signed 1 item for 14 Test Hollow Road, Marlow Springs, CO 81290, ${EXAMPLE_1_TOTAL} in total, and declined 1.`);
  });

  it('quote declined: the same people hear that nothing is booked', async () => {
    const { requestId, itemIds } = await quotedRequest(cast, t, book, [GFCI, PLATE]);
    await deliver();
    mail.clear();
    // The listing agent signs for the seller and, having made the change, is not e-mailed about it; the
    // seller is, and every message names who signed and in what capacity.
    await sign(cast.s.listingAgent, requestId, signBody(itemIds, ['declined', 'declined']));
    await deliver();
    expectOneMessageEach(['buyerAgent', 'colleague', 'contractor', 'seller'], 'the quote was declined — 2 items declined', `/requests/${requestId}/approval`);
    expect(mail.to(emailOf('buyerAgent'))[0].text).toContain('No work is booked on this request.');
    expect(mail.to(emailOf('seller'))[0].text).toMatch(/, listing agent, for the seller, declined every item of the quote/);
  });

  it('card payment credited: the seller gets receipt RCT-…, the contractor’s people and the listing agent the news', async () => {
    const { requestId } = await signedRequest();
    const started: StartedPayment = (await write(cast.s.seller, 'post', `/api/requests/${requestId}/payments`).send({ plan: 'card-deposit', idempotencyKey: newKey() }).expect(201)).body;
    await deliver();
    expect(receivers()).toEqual([]); // opening a payment page is not a payment
    await payOnFakePage(started.checkoutUrl!, PAID_CARD);
    await t.fake.settle();
    await deliver();
    const view: ApprovalView = (await cast.s.seller.agent.get(`/api/requests/${requestId}/approval`).expect(200)).body;
    const receipt = view.invoices.find((i) => i.kind === 'receipt')!;
    expectOneMessageEach(['colleague', 'contractor', 'listingAgent', 'seller'], `payment of ${EXAMPLE_1_DEPOSIT} received`, `/requests/${requestId}/approval`);
    const [toSeller] = mail.to(emailOf('seller'));
    expect(toSeller.text).toContain(`Receipt ${receipt.number} is on the approval and payment page`);
    expect(toSeller.text).toContain(`See the receipt: ${PORTAL}/requests/${requestId}/approval`);
    // A replayed event, or the same session under a new event id, credits nothing more and e-mails nobody again.
    const [completed] = t.fake.delivered.filter((e) => e.type === 'checkout.session.completed' && JSON.parse(e.payload).data.object.metadata.payment_id === String(started.payment.id));
    mail.clear();
    expect(await t.fake.redeliver(completed.id)).toBe(200);
    expect((await t.fake.emit('checkout.session.completed', JSON.parse(completed.payload).data.object)).status).toBe(200);
    await deliver();
    expect(receivers()).toEqual([]);
  });

  it('payment at closing chosen: the escrow officer gets the invoice PDF; the contractor’s people and both agents hear the amount and where it went; funds recorded later: the seller, the listing agent and the colleague', async () => {
    const { requestId } = await signedRequest();
    const officer = 'r.lindqvist@quarrybend-title.test';
    const started = (await write(cast.s.seller, 'post', `/api/requests/${requestId}/payments`).send({ plan: 'at-closing', idempotencyKey: newKey(), escrow: { company: 'Quarry Bend Title & Escrow', officer: 'R. Lindqvist', email: officer, fileNumber: 'QB-2027-0114' } }).expect(201)).body as StartedPayment;
    await deliver();
    // The escrow officer, who has no account: the invoice as a PDF, the amount, the file number, no portal link.
    const [toEscrow, ...more] = mail.to(officer);
    expect(more).toEqual([]);
    expect(toEscrow.subject).toContain(`Invoice ${started.invoiceNumber} payable at closing`);
    expect(toEscrow.subject).toContain('(file QB-2027-0114)');
    expect(toEscrow.text).toContain('Hello R. Lindqvist,');
    expect(toEscrow.text).toContain(`Please pay ${EXAMPLE_1_TOTAL} to `);
    expect(toEscrow.text).not.toContain(PORTAL);
    expect(toEscrow.attachments.map((a) => [a.fileName, a.contentType])).toEqual([[`${requestReference(requestId)}-${started.invoiceNumber}.pdf`, 'application/pdf']]);
    const pdfText = (await extractPdfPages(toEscrow.attachments[0].content)).pages.join('\n').replace(/\s+/g, ' ');
    expect(pdfText).toContain(`Invoice — payable at closing ${started.invoiceNumber}`);
    expect(pdfText).toContain(EXAMPLE_1_TOTAL);
    // Everyone else: who chose, how much, and where the invoice went. The seller chose it, so is not told.
    expectOneMessageEach(['buyerAgent', 'colleague', 'contractor', 'listingAgent'], `${EXAMPLE_1_TOTAL} to be paid at closing`, `/requests/${requestId}/approval`);
    expect(mail.to(emailOf('contractor'))[0].text).toContain(`Invoice ${started.invoiceNumber} was e-mailed with its PDF to R. Lindqvist at Quarry Bend Title & Escrow (${officer})`);
    mail.clear();
    await write(cast.s.contractor, 'post', `/api/requests/${requestId}/payments/funds`).send({ paymentId: started.payment.id, amountCents: 31_434, receivedOn: '2027-01-15', reference: 'Wire 88214' }).expect(200);
    await deliver();
    expectOneMessageEach(['colleague', 'listingAgent', 'seller'], `payment of ${EXAMPLE_1_TOTAL} received`, `/requests/${requestId}/approval`);
  });

  it('payment at closing chosen by the listing agent: the seller hears it too', async () => {
    const { requestId } = await signedRequest();
    await write(cast.s.listingAgent, 'post', `/api/requests/${requestId}/payments`).send({ plan: 'at-closing', idempotencyKey: newKey(), escrow: { company: 'Quarry Bend Title & Escrow', email: 'closings@quarrybend-title.test' } }).expect(201);
    await deliver();
    expectOneMessageEach(['buyerAgent', 'colleague', 'contractor', 'seller'], `${EXAMPLE_1_TOTAL} to be paid at closing`, `/requests/${requestId}/approval`);
    expect(mail.to(emailOf('seller'))[0].text).toContain('e-mailed with its PDF to Quarry Bend Title & Escrow (closings@quarrybend-title.test)');
    expect(mail.to('closings@quarrybend-title.test')[0].text).toContain('Hello,');
  });

  it('change order sent to the seller’s side to decide; its decision to the contractor’s people', async () => {
    const { requestId } = await signedRequest();
    const sent = await write(cast.s.contractor, 'post', `/api/requests/${requestId}/change-orders`).send(gfciFoundOnSite(book));
    expect(sent.status).toBe(201);
    const co = (sent.body as ApprovalView).changeOrders[0];
    await deliver();
    // docs/pricing.md rules, computed by hand in payments.api.spec.ts: this change order is +$34.35.
    expectOneMessageEach(['listingAgent', 'seller'], 'change order 1 to decide — +$34.35', `/requests/${requestId}/approval`);
    expect(mail.to(emailOf('seller'))[0].text).toContain('Metal box without a ground path found behind the vanity');

    mail.clear();
    await write(cast.s.seller, 'post', `/api/requests/${requestId}/change-orders/${co.id}/decision`).send({ decision: 'approve', signerName: 'Pat Seller', hasConsented: true }).expect(200);
    await deliver();
    expectOneMessageEach(['colleague', 'contractor'], 'change order 1 approved', `/requests/${requestId}/approval`);
  });

  it('refund paid back: the payer’s side and the contractor’s people hear it once the payment service settles it', async () => {
    const { requestId, paymentId } = await paidDeposit();
    await write(cast.s.contractor, 'post', `/api/requests/${requestId}/payments/${paymentId}/refunds`).send({ amountCents: 5_000, reason: 'Cover plates declined after the deposit', idempotencyKey: newKey() }).expect(202);
    await t.fake.settle();
    await deliver();
    expectOneMessageEach(['colleague', 'contractor', 'listingAgent', 'seller'], 'refund of $50.00 paid back', `/requests/${requestId}/approval`);
  });
});

describe('the proof side', () => {
  it('visit booked: the seller, the listing agent and the buyer’s agent get the day and the arrival window, linked to the visits page', async () => {
    const { requestId } = await approvedWork();
    const date = inDays(3);
    await write(cast.s.contractor, 'post', `/api/requests/${requestId}/visits`).send(visitBody({ date })).expect(201);
    await deliver();
    expectOneMessageEach(['buyerAgent', 'listingAgent', 'seller'], `electrician's visit on ${dayWords(date)}`, `/requests/${requestId}/work`);
    const [m] = mail.to(emailOf('seller'));
    expect(m.text).toContain(`booked visit 1 to 14 Test Hollow Road, Marlow Springs, CO 81290 on ${dayWords(date)}, arriving between 8:00 AM and 10:30 AM.`);
    expect(m.html).toContain('arriving between 8:00 AM and 10:30 AM');
    // The access notes (lockbox) are not e-mailed.
    expect(m.text).not.toContain('lockbox');
  });

  it('visit moved (as the day plan calls it, in its transaction): a new message says so; the same move again writes nothing', async () => {
    const { requestId } = await approvedWork();
    const date = inDays(3);
    await write(cast.s.contractor, 'post', `/api/requests/${requestId}/visits`).send(visitBody({ date })).expect(201);
    await deliver();
    mail.clear();
    const messages = proofMessagesByMail(t.services.notifications);
    const later = inDays(5);
    const move = () =>
      t.db.transaction((trx) =>
        messages.visitScheduled(trx, { requestId, visitNumber: 1, date: later, arrivalFrom: '13:00', arrivalTo: '15:00', by: cast.users.contractor.id, previous: { date, arrivalFrom: '08:00', arrivalTo: '10:30' } }),
      );
    await move();
    await move();
    await deliver();
    expectOneMessageEach(['buyerAgent', 'listingAgent', 'seller'], `electrician's visit moved to ${dayWords(later)}`, `/requests/${requestId}/work`);
    expect(mail.to(emailOf('seller'))[0].text).toContain(`is now on ${dayWords(later)}, arriving between 1:00 PM and 3:00 PM. It was on ${dayWords(date)}, arriving between 8:00 AM and 10:30 AM.`);
  });

  it('item outcomes go to both agents and the seller; the completion letter to the inspector and both agents; the acceptance to everyone who acted', async () => {
    const { requestId, gfci, panel } = await approvedWork();
    await write(cast.s.contractor, 'post', `/api/requests/${requestId}/visits`).send(visitBody()).expect(201);
    await deliver();
    mail.clear();

    await recordOutcome(requestId, gfci, gfciRecord()).expect(201);
    await deliver();
    expectOneMessageEach(['buyerAgent', 'listingAgent', 'seller'], 'GFCI does not trip, will not reset, or is worn (Kitchen, hall bath vanity) — corrected', `/requests/${requestId}/work`);
    expect(mail.to(emailOf('seller'))[0].text).toContain('as corrected, with photos and test readings');

    mail.clear();
    await recordOutcome(requestId, panel, panelNotCorrected).expect(201);
    await deliver();
    expectOneMessageEach(['buyerAgent', 'listingAgent', 'seller'], 'Two conductors under one breaker terminal not listed for it (Kitchen, main panel, breaker 14) — could not correct', `/requests/${requestId}/work`);

    mail.clear();
    await write(cast.s.contractor, 'post', `/api/requests/${requestId}/letters`).send({ isPermitNotRequired: true, signatureName: 'Sam Okafor' }).expect(201);
    await deliver();
    const number = `CL-${String(requestId).padStart(5, '0')}`;
    expectOneMessageEach(['buyerAgent', 'inspector', 'listingAgent', 'seller'], `completion letter ${number} issued for 14 Test Hollow Road`, `/requests/${requestId}/work`);

    // The re-inspection is the last step: the contractor's people, the seller and both agents hear it.
    mail.clear();
    await write(cast.s.inspector, 'post', `/api/requests/${requestId}/proof-review`).send({ decision: 'accept', note: 'Re-inspected on site' }).expect(204);
    await deliver();
    expectOneMessageEach(['buyerAgent', 'colleague', 'contractor', 'listingAgent', 'seller'], 'electrical corrections accepted at 14 Test Hollow Road', `/requests/${requestId}/work`);
    expect(mail.to(emailOf('contractor'))[0].text).toContain('The repairs on this request are done.');
  });
});

describe('in the transaction of the change', () => {
  it('writes no message when the change fails at its commit (rolled back), and one when it is made again', async () => {
    const { requestId } = await approvedWork();
    const before = Number((await t.db('outbox_messages').where({ request_id: requestId }).count({ n: '*' }))[0].n);
    // A visit whose access notes say so fails when its transaction commits, after the booking, the
    // request's move and the messages were written: as a lost race at commit would (409).
    await t.db.raw(`CREATE OR REPLACE FUNCTION fail_marked_visit() RETURNS trigger LANGUAGE plpgsql AS $$
      BEGIN IF NEW.access_notes = 'fail at commit' THEN RAISE EXCEPTION 'refused at commit' USING ERRCODE = '40001'; END IF; RETURN NEW; END $$`);
    await t.db.raw(`CREATE CONSTRAINT TRIGGER fail_marked_visit AFTER INSERT ON site_visits DEFERRABLE INITIALLY DEFERRED FOR EACH ROW EXECUTE FUNCTION fail_marked_visit()`);
    try {
      await write(cast.s.contractor, 'post', `/api/requests/${requestId}/visits`).send(visitBody({ accessNotes: 'fail at commit' })).expect(409);
    } finally {
      await t.db.raw('DROP TRIGGER fail_marked_visit ON site_visits');
      await t.db.raw('DROP FUNCTION fail_marked_visit()');
    }
    expect(Number((await t.db('outbox_messages').where({ request_id: requestId }).count({ n: '*' }))[0].n)).toBe(before);
    expect(await t.db('site_visits').where({ request_id: requestId })).toHaveLength(0);
    await deliver();
    expect(receivers()).toEqual([]);

    await write(cast.s.contractor, 'post', `/api/requests/${requestId}/visits`).send(visitBody()).expect(201);
    await deliver();
    expect(receivers()).toEqual(['buyerAgent', 'listingAgent', 'seller']);
  });

  it('a refused change (the second decision on a change order) writes nothing', async () => {
    const { requestId } = await signedRequest();
    const sent = await write(cast.s.contractor, 'post', `/api/requests/${requestId}/change-orders`).send({ reason: 'Cover plate for the new box', lines: [{ kind: 'add', code: 'cover-plate-missing', room: 'garage', location: 'garage wall', entryId: String(book.entry['cover-plate']), quantity: 1 }] }).expect(201);
    const co = (sent.body as ApprovalView).changeOrders[0];
    await write(cast.s.seller, 'post', `/api/requests/${requestId}/change-orders/${co.id}/decision`).send({ decision: 'decline', signerName: 'Pat Seller', hasConsented: true }).expect(200);
    await deliver();
    expect(mail.to(emailOf('contractor')).map((m) => m.subject)).toEqual([expect.stringContaining('change order 1 declined')]);
    mail.clear();
    await write(cast.s.listingAgent, 'post', `/api/requests/${requestId}/change-orders/${co.id}/decision`).send({ decision: 'approve', signerName: 'Lee Agent', hasConsented: true }).expect(409);
    await deliver();
    expect(receivers()).toEqual([]);
  });
});

describe('preferences', () => {
  const put = (who: SignedIn, preferences: object[]) => write(who, 'put', '/api/notifications/preferences').send({ preferences });

  it('lists the new messages once each to the people who receive them', async () => {
    const kindsOf = async (who: SignedIn) => ((await who.agent.get('/api/notifications/preferences').expect(200)).body as { kind: string }[]).map((p) => p.kind);
    const seller = await kindsOf(cast.s.seller);
    const listingAgent = await kindsOf(cast.s.listingAgent);
    const contractor = await kindsOf(cast.s.contractor);
    for (const kind of ['change-order-sent', 'refund-settled', 'payment-received', 'visit-scheduled', 'item-corrected']) {
      expect(seller.filter((k) => k === kind)).toHaveLength(1);
    }
    for (const kind of ['items-decided', 'visit-scheduled', 'item-corrected', 'letter-issued']) {
      expect(listingAgent.filter((k) => k === kind)).toHaveLength(1);
    }
    for (const kind of ['change-order-decided', 'refund-settled', 'items-decided', 'payment-received']) {
      expect(contractor.filter((k) => k === kind)).toHaveLength(1);
    }
  });

  it('holds a visit message for the digest of whoever chose it, sends none to whoever turned it off', async () => {
    await put(cast.s.seller, [{ kind: 'visit-scheduled', delivery: 'digest' }]).expect(200);
    await put(cast.s.listingAgent, [{ kind: 'visit-scheduled', delivery: 'off' }]).expect(200);
    await put(cast.s.buyerAgent, [{ kind: 'visit-scheduled', delivery: 'off' }]).expect(200);
    try {
      const { requestId } = await approvedWork();
      const date = inDays(4);
      await write(cast.s.contractor, 'post', `/api/requests/${requestId}/visits`).send(visitBody({ date })).expect(201);
      await deliver();
      expect(receivers()).toEqual([]);
      const rows = await t.db('outbox_messages').where({ request_id: requestId, kind: 'visit-scheduled' }).select('recipient_user_id', 'status');
      expect(rows).toEqual([{ recipient_user_id: cast.users.seller.id, status: 'held' }]);

      expect(await t.services.digest.run('2027-06-15')).toMatchObject({ ran: true });
      await deliver();
      const digests = mail.to(emailOf('seller'));
      expect(digests).toHaveLength(1);
      expect(digests[0].subject).toMatch(/^Closing Circuit: your daily summary for 2027-06-15/);
      expect(digests[0].text).toContain(`electrician's visit on ${dayWords(date)}`);
      expect(digests[0].text).toContain(`${PORTAL}/requests/${requestId}/work`);
      // The listing agent may get the day's summary of closings at risk, but not this visit.
      expect(mail.to(emailOf('listingAgent')).filter((m) => m.text.includes(`/requests/${requestId}/work`))).toEqual([]);
    } finally {
      await put(cast.s.seller, [{ kind: 'visit-scheduled', delivery: 'immediate' }]).expect(200);
      await put(cast.s.listingAgent, [{ kind: 'visit-scheduled', delivery: 'immediate' }]).expect(200);
      await put(cast.s.buyerAgent, [{ kind: 'visit-scheduled', delivery: 'immediate' }]).expect(200);
    }
  });
});
