import request from 'supertest';
import { DEMO_RATE_BOOK } from '@cc/shared';
import type { NotifyInput } from '../../server/src/notifications/notify-input';
import { csrfTokenFor, resetDatabase, type SignedIn } from '../helpers/fixtures';
import { startMailCapture, testWorker, type MailCapture } from '../helpers/mail-capture';
import { createPricedRequest, createPricingCast, storeRateBook, type CastKey, type PricingCast, type StoredBook } from '../helpers/pricing-fixtures';
import { createTestApp, type TestApp } from '../helpers/test-app';
import type { OutboxWorker } from '../../server/src/notifications/outbox-worker';

let t: TestApp;
let cast: PricingCast;
let book: StoredBook;
let mail: MailCapture;
let worker: OutboxWorker;
const PORTAL = 'http://portal.test';

const write = (who: SignedIn, method: 'post' | 'put' | 'patch', path: string) => who.agent[method](path).set('x-csrf-token', who.csrfToken);
const emailOf = (k: CastKey) => cast.users[k].email;
/** Who got a message, by their part in the cast, sorted. */
const receivers = () =>
  CAST_KEYS.filter((k) => mail.to(emailOf(k)).length > 0).sort();
const CAST_KEYS: CastKey[] = ['buyerAgent', 'listingAgent', 'seller', 'inspector', 'contractor', 'colleague', 'otherContractor', 'outsiderAgent', 'admin'];
const notify = (input: NotifyInput) => t.db.transaction((trx) => t.services.notifications.notify(trx, input));

beforeAll(async () => {
  t = createTestApp();
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
  await worker.drain();
  mail.clear();
});

describe('each step of the flow e-mails the right people, with a link to the page', () => {
  let requestId: number;

  it('invitation: a person without an account gets the invitation link by e-mail', async () => {
    const res = await write(cast.s.buyerAgent, 'post', '/api/requests').send({
      street: '9 Quarry Bend Lane',
      city: 'Marlow Springs',
      state: 'CO',
      zip: '81290',
      yearBuilt: 1964,
      closingDate: '2027-03-01',
      sellerEmail: 'new.seller@people.test',
      listingAgentEmail: emailOf('listingAgent'),
      inspectorEmail: emailOf('inspector'),
      contractorOrganisationId: cast.contractorOrg,
    });
    expect(res.status).toBe(201);
    requestId = res.body.id;
    expect(await worker.drain()).toBe(1);
    const [message] = mail.to('new.seller@people.test');
    const { invite_token: token } = await t.db('request_parties').where({ request_id: requestId, email: 'new.seller@people.test' }).first('invite_token');
    const link = `${PORTAL}/invite/${token}`;
    expect(message.subject).toBe('You are invited to the electrical repairs for 9 Quarry Bend Lane, Marlow Springs, CO 81290');
    expect(message.text).toContain(`Open the invitation: ${link}`);
    expect(message.html).toContain(`href="${link}"`);
    expect(message.text).toContain('named seller on repair request');
    // The page shows the agent the same link it e-mailed.
    expect(res.body.parties.find((p: { email: string }) => p.email === 'new.seller@people.test').inviteUrl).toBe(link);
    // People who have accounts are linked at once and not invited.
    expect(receivers()).toEqual([]);
  });

  it('report read: the buyer’s agent hears when the inspector adds the report', async () => {
    await write(cast.s.inspector, 'post', `/api/requests/${requestId}/reports/paste`)
      .send({ text: '1. The receptacle at the hall bathroom vanity is not GFCI protected.\n2. Double-tapped breaker at the main panel.' })
      .expect(201);
    await worker.drain();
    expect(receivers()).toEqual(['buyerAgent']);
    const [message] = mail.to(emailOf('buyerAgent'));
    expect(message.subject).toMatch(/^CC-\d+: the inspection report was read — \d+ items to review$/);
    expect(message.text).toContain(`Review the items: ${PORTAL}/requests/${requestId}`);
    expect(message.html).toContain(`href="${PORTAL}/requests/${requestId}"`);
  });

  it('ready to price: the assigned contractor’s people hear when the agent confirms the items', async () => {
    const items = (await cast.s.buyerAgent.agent.get(`/api/requests/${requestId}/items`).expect(200)).body.items as { id: number; version: number }[];
    await write(cast.s.buyerAgent, 'post', `/api/requests/${requestId}/items/confirm`)
      .send({ items: items.map((i) => ({ id: i.id, version: i.version })) })
      .expect(200);
    await worker.drain();
    expect(receivers()).toEqual(['colleague', 'contractor']);
    const [message] = mail.to(emailOf('contractor'));
    expect(message.subject).toContain(`ready to price — ${items.length} items`);
    expect(message.text).toContain(`${PORTAL}/requests/${requestId}/pricing`);
  });

  it('quote sent: the seller and both agents get the quote link', async () => {
    const { requestId: id, itemIds } = await createPricedRequest(cast, t.db, { items: [{ code: 'gfci-inoperative', quantity: 1 }] });
    await worker.drain();
    mail.clear();
    const pricing = (await cast.s.contractor.agent.get(`/api/requests/${id}/pricing`).expect(200)).body;
    await write(cast.s.contractor, 'patch', `/api/requests/${id}/pricing`)
      .send({ items: [{ id: itemIds[0], version: pricing.items[0].version }], set: { entryId: book.entry['gfci-replace'] } })
      .expect(200);
    await write(cast.s.contractor, 'post', `/api/requests/${id}/quotes`).send({}).expect(201);
    const quote = await t.db('quotes').where({ request_id: id, version: 1 }).first('total_cents');
    await worker.drain();
    expect(receivers()).toEqual(['buyerAgent', 'listingAgent', 'seller']);
    const [message] = mail.to(emailOf('seller'));
    const dollars = `$${(quote.total_cents / 100).toLocaleString('en-US', { minimumFractionDigits: 2 })}`;
    expect(message.subject).toContain(`quote for 14 Test Hollow Road, Marlow Springs, CO 81290 — ${dollars}`);
    expect(message.text).toContain(`Read the quote: ${PORTAL}/requests/${id}/quotes/1`);
    expect(message.html).toContain(`href="${PORTAL}/requests/${id}/quotes/1"`);
  });

  // The later steps call notify() at their own call points (test/api/seller-and-proof-messages.api.spec.ts
  // drives them through the API); here each kind's recipients and page, called directly.
  it.each<[string, (id: number, itemId: number) => NotifyInput, CastKey[], string, string]>([
    ['items approved or declined', (id) => ({ kind: 'items-decided', requestId: id, actorUserId: cast.users.seller.id, approvedCount: 2, declinedCount: 1, approvedCents: 48_000, decisionRef: 'approval-1', signedBy: null }), ['buyerAgent', 'colleague', 'contractor', 'listingAgent'], '2 approved, 1 declined', 'approval'],
    ['payment received', (id) => ({ kind: 'payment-received', requestId: id, actorUserId: null, paymentId: 7, amountCents: 12_345, receiptNumber: 'RCT-000007' }), ['colleague', 'contractor', 'listingAgent', 'seller'], 'payment of $123.45 received', 'approval'],
    ['payment at closing chosen', (id) => ({ kind: 'closing-payment-chosen', requestId: id, actorUserId: cast.users.seller.id, paymentId: 9, amountCents: 36_321, invoiceNumber: 'INV-000009', escrow: { company: 'Quarry Bend Title & Escrow', officer: '', email: 'closings@quarrybend-title.test', fileNumber: '' } }), ['buyerAgent', 'colleague', 'contractor', 'listingAgent'], '$363.21 to be paid at closing', 'approval'],
    ['visit scheduled', (id) => ({ kind: 'visit-scheduled', requestId: id, actorUserId: cast.users.contractor.id, visitNumber: 3, date: '2027-02-10', arrivalFrom: '08:00', arrivalTo: '10:00', previous: null }), ['buyerAgent', 'listingAgent', 'seller'], 'visit on Wednesday, February 10, 2027', 'work'],
    ['item corrected', (id, itemId) => ({ kind: 'item-corrected', requestId: id, actorUserId: cast.users.contractor.id, itemId, correctionId: 1, outcome: 'corrected', itemLabel: 'Hall bath GFCI' }), ['buyerAgent', 'listingAgent', 'seller'], 'Hall bath GFCI — corrected', 'work'],
    ['completion letter issued', (id) => ({ kind: 'letter-issued', requestId: id, actorUserId: cast.users.contractor.id, letterNumber: 'CL-00001', revision: 1 }), ['buyerAgent', 'inspector', 'listingAgent', 'seller'], 'completion letter CL-00001 issued', 'work'],
    ['corrections accepted', (id) => ({ kind: 'proof-reviewed', requestId: id, actorUserId: null, isAccepted: true, notAcceptedCount: 0, reviewRef: '1' }), ['buyerAgent', 'colleague', 'contractor', 'listingAgent', 'seller'], 'electrical corrections accepted', 'work'],
    ['items not accepted', (id) => ({ kind: 'proof-reviewed', requestId: id, actorUserId: null, isAccepted: false, notAcceptedCount: 2, reviewRef: '2' }), ['buyerAgent', 'colleague', 'contractor', 'listingAgent', 'seller'], '2 items not accepted', 'work'],
  ])('%s: e-mails the right people with the link to its page', async (_name, input, expected, subjectPart, page) => {
    const { requestId: id, itemIds } = await createPricedRequest(cast, t.db, { items: [{ code: 'gfci-inoperative', quantity: 1 }] });
    await worker.drain();
    mail.clear();
    await notify(input(id, itemIds[0]));
    await worker.drain();
    expect(receivers()).toEqual(expected);
    for (const who of expected) {
      const [message] = mail.to(emailOf(who));
      expect(message.subject).toContain(subjectPart);
      expect(message.text).toContain(`${PORTAL}/requests/${id}/${page}`);
      expect(message.html).toContain(`href="${PORTAL}/requests/${id}/${page}"`);
      expect(message.text).toContain(`Hello ${cast.users[who].name},`);
    }
  });

  it('writes nothing when the change rolls back, and the same occurrence only once', async () => {
    const { requestId: id } = await createPricedRequest(cast, t.db, { items: [{ code: 'gfci-inoperative', quantity: 1 }] });
    const before = Number((await t.db('outbox_messages').count({ n: '*' }))[0].n);
    await expect(
      t.db.transaction(async (trx) => {
        await t.services.notifications.notify(trx, { kind: 'letter-issued', requestId: id, actorUserId: null, letterNumber: 'CL-1', revision: 1 });
        throw new Error('the change failed');
      }),
    ).rejects.toThrow('the change failed');
    expect(Number((await t.db('outbox_messages').count({ n: '*' }))[0].n)).toBe(before);
    expect(await notify({ kind: 'letter-issued', requestId: id, actorUserId: null, letterNumber: 'CL-1', revision: 2 })).toBe(4);
    expect(await notify({ kind: 'letter-issued', requestId: id, actorUserId: null, letterNumber: 'CL-1', revision: 2 })).toBe(0);
  });
});

describe('the outbox worker', () => {
  it('records each attempt, retries a temporary failure after a backoff, and gives up on a permanent one', async () => {
    const { requestId: id } = await createPricedRequest(cast, t.db, { items: [{ code: 'gfci-inoperative', quantity: 1 }] });
    await worker.drain();
    const busy = await startMailCapture({ reject: () => Object.assign(new Error('mailbox busy'), { responseCode: 451 }) });
    const refusing = await startMailCapture({ reject: () => Object.assign(new Error('no such mailbox'), { responseCode: 550 }) });
    try {
      await notify({ kind: 'visit-scheduled', requestId: id, actorUserId: null, visitNumber: 1, date: '2027-02-11', arrivalFrom: '09:00', arrivalTo: '11:00', previous: null });
      const rows = () => t.db('outbox_messages').where({ request_id: id, kind: 'visit-scheduled' }).orderBy('id');
      const [seller] = await rows();
      const startedAt = Date.now();
      expect(await testWorker(t, busy.transport).sendOne()).toBe(true);
      const afterBusy = (await rows()).find((r) => r.id === seller.id);
      expect(afterBusy).toMatchObject({ status: 'pending', attempts: 1 });
      expect(afterBusy.last_error).toContain('451');
      // Backoff: the first retry waits the configured 60 s (the clock only moves forward meanwhile).
      expect(afterBusy.next_attempt_at.getTime()).toBeGreaterThanOrEqual(startedAt + 60_000 - 1_000);
      // Not due yet: another worker finds the second message instead.
      expect(await testWorker(t, refusing.transport).sendOne()).toBe(true);
      const second = (await rows())[1];
      expect(second).toMatchObject({ status: 'failed', attempts: 1 });
      expect(second.last_error).toContain('550');
      // Due again: the next attempt goes through and is recorded.
      await t.db('outbox_messages').where({ id: seller.id }).update({ next_attempt_at: t.db.fn.now() });
      mail.clear();
      await worker.drain();
      expect((await rows()).find((r) => r.id === seller.id)).toMatchObject({ status: 'sent', attempts: 2 });
      const attempts = await t.db('outbox_attempts').where({ message_id: seller.id }).orderBy('attempt');
      expect(attempts.map((a) => [a.attempt, a.outcome])).toEqual([
        [1, 'failed'],
        [2, 'sent'],
      ]);
      expect(mail.messages.filter((m) => m.messageId === seller.message_id)).toHaveLength(1);
    } finally {
      await busy.close();
      await refusing.close();
    }
  });
});

describe('preferences', () => {
  const put = (who: SignedIn, preferences: object[]) => write(who, 'put', '/api/notifications/preferences').send({ preferences });

  const kindsOf = async (who: SignedIn) => ((await who.agent.get('/api/notifications/preferences').expect(200)).body as { kind: string }[]).map((p) => p.kind);

  it('lists the messages a person can receive, with their default delivery', async () => {
    const agent = (await cast.s.listingAgent.agent.get('/api/notifications/preferences').expect(200)).body;
    expect(agent).toContainEqual({ kind: 'quote-sent', label: 'Quote sent', delivery: 'immediate', isDigestOnly: false });
    expect(agent).toContainEqual({ kind: 'closing-at-risk', label: 'Closing at risk (daily digest)', delivery: 'digest', isDigestOnly: true });
    expect(agent.map((p: { kind: string }) => p.kind)).not.toContain('invitation');
    await request(t.app).get('/api/notifications/preferences').expect(401);
  });

  it('lists only the messages of the parts a role can play', async () => {
    const seller = await kindsOf(cast.s.seller);
    expect(seller).toEqual(expect.arrayContaining(['quote-sent', 'payment-received', 'visit-scheduled', 'item-corrected', 'letter-issued']));
    expect(seller).not.toContain('closing-at-risk');
    expect(seller).not.toContain('ready-to-price');
    expect(await kindsOf(cast.s.inspector)).toEqual(['letter-issued']);
    const contractor = await kindsOf(cast.s.contractor);
    expect(contractor).toEqual(expect.arrayContaining(['ready-to-price', 'items-decided', 'closing-at-risk']));
    expect(contractor).not.toContain('quote-sent');
    expect(await kindsOf(cast.s.admin)).toEqual([]);
  });

  it('refuses settings that cannot be (400 with the field)', async () => {
    const res = await put(cast.s.listingAgent, [{ kind: 'closing-at-risk', delivery: 'immediate' }]).expect(400);
    expect(res.body.details).toEqual([{ path: 'preferences.0.delivery', message: 'This message comes only in the daily digest' }]);
    await put(cast.s.seller, [{ kind: 'invitation', delivery: 'off' }]).expect(400);
    await put(cast.s.seller, [{ kind: 'quote-sent', delivery: 'weekly' }]).expect(400);
    const foreign = await put(cast.s.seller, [{ kind: 'quote-sent', delivery: 'off' }, { kind: 'ready-to-price', delivery: 'off' }]).expect(400);
    expect(foreign.body.details).toEqual([{ path: 'preferences.1.kind', message: 'Your account never receives this message' }]);
    expect(await t.db('notification_preferences').where({ user_id: cast.users.seller.id, kind: 'quote-sent' }).first()).toBeUndefined();
  });

  it('sends nothing to a deactivated account', async () => {
    const { requestId: id } = await createPricedRequest(cast, t.db, { items: [{ code: 'gfci-inoperative', quantity: 1 }] });
    await worker.drain();
    mail.clear();
    await t.db('users').where({ id: cast.users.seller.id }).update({ is_active: false });
    try {
      await notify({ kind: 'payment-received', requestId: id, actorUserId: null, paymentId: 98, amountCents: 4_000, receiptNumber: null });
      await worker.drain();
      expect(receivers()).not.toContain('seller');
      expect(receivers()).toEqual(expect.arrayContaining(['contractor', 'listingAgent']));
    } finally {
      await t.db('users').where({ id: cast.users.seller.id }).update({ is_active: true });
    }
  });

  it('honours “off” and “digest”; the digest folds what waited into one message with an unsubscribe link', async () => {
    await put(cast.s.seller, [{ kind: 'payment-received', delivery: 'off' }]).expect(200);
    const res = await put(cast.s.listingAgent, [{ kind: 'payment-received', delivery: 'digest' }]).expect(200);
    expect(res.body).toContainEqual(expect.objectContaining({ kind: 'payment-received', delivery: 'digest' }));
    const { requestId: id } = await createPricedRequest(cast, t.db, { items: [{ code: 'gfci-inoperative', quantity: 1 }] });
    await worker.drain();
    mail.clear();
    await notify({ kind: 'payment-received', requestId: id, actorUserId: null, paymentId: 99, amountCents: 5_000, receiptNumber: null });
    await worker.drain();
    expect(receivers()).toEqual(['colleague', 'contractor']);

    mail.clear();
    const day = '2026-12-02';
    expect(await t.services.digest.run(day)).toMatchObject({ ran: true });
    expect(await t.services.digest.run(day)).toMatchObject({ ran: false });
    await worker.drain();
    const digests = mail.to(emailOf('listingAgent'));
    expect(digests).toHaveLength(1);
    expect(digests[0].subject).toMatch(/^Closing Circuit: your daily summary for 2026-12-02 \(\d+ updates?\)$/);
    expect(digests[0].text).toContain('payment of $50.00 received');
    const link = /Stop the daily digest: (\S+)/.exec(digests[0].text)![1];
    expect(digests[0].html).toContain(`href="${link}"`);
    const token = link.replace(`${PORTAL}/unsubscribe/`, '');

    // The link works without signing in (the portal page asks for a CSRF token first).
    const anonymous = request.agent(t.app);
    expect((await anonymous.get(`/api/notifications/unsubscribe/${token}`).expect(200)).body.email).toMatch(/^[a-z]{2}•+@people\.test$/);
    const csrf = await csrfTokenFor(anonymous);
    const done = await anonymous.post(`/api/notifications/unsubscribe/${token}`).set('x-csrf-token', csrf).expect(200);
    expect(done.body.turnedOff).toEqual(['payment-received', 'closing-at-risk']);
    const after = (await cast.s.listingAgent.agent.get('/api/notifications/preferences').expect(200)).body;
    expect(after).toContainEqual(expect.objectContaining({ kind: 'payment-received', delivery: 'off' }));
    expect(after).toContainEqual(expect.objectContaining({ kind: 'closing-at-risk', delivery: 'off' }));
    await anonymous.get(`/api/notifications/unsubscribe/${token.slice(0, -1)}x`).expect(404);
    await anonymous.get('/api/notifications/unsubscribe/not-a-token').expect(404);
  });

  it('the daily digest warns the agents and the contractor of a closing at risk, by the request list’s rule', async () => {
    // Open approved work 2 business days (Sat 1 May → Tue 4 May) before closing: at risk, as the request list flags it.
    const { requestId: id } = await createPricedRequest(cast, t.db, { status: 'approved', items: [{ code: 'gfci-inoperative', quantity: 1, status: 'approved' }] });
    await t.db('repair_requests').where({ id }).update({ closing_date: '2027-05-04' });
    // Work finished, no open approved work, the same closing: not at risk on the list, so not in the digest either.
    const { requestId: finished } = await createPricedRequest(cast, t.db, { status: 'corrected', items: [{ code: 'gfci-inoperative', quantity: 1, status: 'corrected' }] });
    await t.db('repair_requests').where({ id: finished }).update({ closing_date: '2027-05-04' });
    await worker.drain();
    mail.clear();
    await t.services.digest.run('2027-05-01');
    await worker.drain();
    // The listing agent turned the digest off above; the buyer's agent and the contractor's people get it.
    expect(receivers()).toEqual(['buyerAgent', 'colleague', 'contractor']);
    const text = mail.to(emailOf('buyerAgent'))[0].text;
    expect(text).toContain(`CC-${String(id).padStart(5, '0')}: closing at risk`);
    expect(text).not.toContain(`CC-${String(finished).padStart(5, '0')}: closing at risk`);
  });
});

describe('GET /api/mailbox (development mailbox)', () => {
  it('lists captured messages to administrators only', async () => {
    await t.services.mailbox!.keep({ messageId: '<m1@test>', from: 'a@closing-circuit.test', to: ['b@people.test'], subject: 'Hello', text: 'Plain words', html: '<p>Plain words</p>', attachments: [{ fileName: 'CC-00001-INV-000001.pdf', contentType: 'application/pdf', content: Buffer.from('%PDF-1.7') }], raw: Buffer.from('') });
    const res = await cast.s.admin.agent.get('/api/mailbox?to=b@people.test').expect(200);
    expect(res.body.items[0]).toMatchObject({ subject: 'Hello', to: ['b@people.test'], text: 'Plain words', html: '<p>Plain words</p>' });
    // The files a message carried are named with their sizes; their content is not kept.
    expect(res.body.items[0].attachments).toEqual([{ fileName: 'CC-00001-INV-000001.pdf', contentType: 'application/pdf', bytes: 8 }]);
    expect(res.body.outbox).toEqual(expect.objectContaining({ sent: expect.any(Number) }));
    const one = await cast.s.admin.agent.get(`/api/mailbox/${res.body.items[0].id}`).expect(200);
    expect(one.body.subject).toBe('Hello');
    await cast.s.admin.agent.get('/api/mailbox/999999').expect(404);
    await cast.s.buyerAgent.agent.get('/api/mailbox').expect(403);
    await request(t.app).get('/api/mailbox').expect(401);
    await cast.s.admin.agent.get('/api/mailbox?pageSize=1000').expect(400);
  });

  // Review 7, P5-5: one request's messages, or one person's, found by an index, a page at a time.
  it('filters by request and by recipient (any case), both at once, a page at a time; refuses a bad filter with the field', async () => {
    const keep = (messageId: string, to: string, subject: string) =>
      t.services.mailbox!.keep({ messageId, from: 'a@closing-circuit.test', to: [to], subject, text: subject, html: `<p>${subject}</p>`, attachments: [], raw: Buffer.from('') });
    const { requestId: first } = await createPricedRequest(cast, t.db, { items: [{ code: 'gfci-inoperative', quantity: 1 }] });
    const { requestId: second } = await createPricedRequest(cast, t.db, { items: [{ code: 'gfci-inoperative', quantity: 1 }] });
    // Two messages of the first request (as the outbox wrote them) and one of the second; their Message-IDs name the request.
    await notify({ kind: 'letter-issued', requestId: first, actorUserId: null, letterNumber: 'CL-7', revision: 1 });
    await notify({ kind: 'letter-issued', requestId: second, actorUserId: null, letterNumber: 'CL-8', revision: 1 });
    const idOf = async (requestId: number, email: string) => (await t.db('outbox_messages').where({ request_id: requestId, recipient_email: email, kind: 'letter-issued' }).first('message_id')).message_id as string;
    await keep(await idOf(first, emailOf('seller')), emailOf('seller').toUpperCase(), 'First, to the seller');
    await keep(await idOf(first, emailOf('inspector')), emailOf('inspector'), 'First, to the inspector');
    await keep(await idOf(second, emailOf('seller')), emailOf('seller'), 'Second, to the seller');
    await keep('<digest@test>', emailOf('seller'), 'A digest of no one request');
    const subjects = async (query: string) => ((await cast.s.admin.agent.get(`/api/mailbox?${query}`).expect(200)).body as { items: { subject: string }[]; total: number });

    const byRequest = await subjects(`requestId=${first}`);
    expect(byRequest.items.map((m) => m.subject)).toEqual(['First, to the inspector', 'First, to the seller']);
    expect(byRequest.total).toBe(2);
    expect((await subjects(`to=${encodeURIComponent(emailOf('seller').toUpperCase())}`)).items.map((m) => m.subject)).toEqual(['A digest of no one request', 'Second, to the seller', 'First, to the seller']);
    expect((await subjects(`requestId=${first}&to=${encodeURIComponent(emailOf('seller'))}`)).items.map((m) => m.subject)).toEqual(['First, to the seller']);
    const secondPage = await subjects(`requestId=${first}&page=1&pageSize=1`);
    expect(secondPage).toMatchObject({ total: 2, items: [{ subject: 'First, to the seller' }] });
    expect((await subjects(`requestId=${second + 1000}`)).items).toEqual([]);

    const bad = await cast.s.admin.agent.get('/api/mailbox?to=not-an-address').expect(400);
    expect(bad.body.details).toEqual([{ path: 'to', message: 'Type a whole e-mail address, such as name@example.com' }]);
    expect((await cast.s.admin.agent.get('/api/mailbox?requestId=0').expect(400)).body.details[0].path).toBe('requestId');
    await cast.s.admin.agent.get('/api/mailbox?requestId=abc').expect(400);
    // Bounds: an id past PostgreSQL's integer, a NUL byte, an address longer than any mailbox (never a 500).
    expect((await cast.s.admin.agent.get('/api/mailbox?requestId=2147483648').expect(400)).body.details[0].path).toBe('requestId');
    expect((await cast.s.admin.agent.get('/api/mailbox?to=a%00b@people.test').expect(400)).body.error).toEqual(expect.any(String));
    expect((await cast.s.admin.agent.get(`/api/mailbox?to=${'a'.repeat(250)}@people.test`).expect(400)).body.details[0].path).toBe('to');
    await cast.s.buyerAgent.agent.get(`/api/mailbox?requestId=${first}`).expect(403);

    // Each filter is answered by its index, not by reading every message.
    const planOf = (filters: { to: string | null; requestId: number | null }) =>
      t.db.transaction(async (trx) => {
        await trx.raw('SET LOCAL enable_seqscan = off');
        const query = t.services.mailbox!.listQuery(0, 20, filters).toSQL().toNative();
        const rows: { 'QUERY PLAN': string }[] = (await trx.raw(`EXPLAIN ${query.sql.replace(/\$(\d+)/g, '?')}`, query.bindings as never[])).rows;
        return rows.map((r) => r['QUERY PLAN']).join('\n');
      });
    expect(await planOf({ to: null, requestId: first })).toContain('captured_mail_request_id_id_index');
    expect(await planOf({ to: emailOf('seller'), requestId: null })).toContain('captured_mail_to_addresses_index');
  });

  it('is not there when real SMTP is configured', async () => {
    const withSmtp = createTestApp({ SMTP_HOST: 'smtp.example.test' });
    try {
      const { signIn } = await import('../helpers/fixtures');
      const admin = await signIn(withSmtp.app, cast.users.admin);
      await admin.agent.get('/api/mailbox').expect(404);
    } finally {
      await withSmtp.close();
    }
  });
});
