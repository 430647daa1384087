// Money the seller sees must hold together: a receipt's rows add up to its subtotal (read back from
// the PDF), the prices of the items after signing are the prices signed, and every approved request
// of the demo data shows how it gets paid. Figures come from the shared engine (docs/pricing.md,
// "The model": one service call and one first-hour minimum per visit, the minimum shared by the
// visit's items by minutes); the checks are that nothing is billed twice and nothing moves.
import { DEMO_RATE_BOOK, lineAmountsOf, mayAct, priceScope, whoActsNextWords, type ApprovalView, type StartedPayment } from '@cc/shared';
import { extractPdfPages } from '../../server/src/integrations/pdf-text';
import { DEMO_PASSWORD } from '../../seeds/data/demo-scenario';
import { seed as seedPeople } from '../../seeds/01_organisations_and_people';
import { seed as seedRequests } from '../../seeds/02_repair_requests';
import { seed as seedRateBooks } from '../../seeds/03_rate_books';
import { seed as seedQuotes } from '../../seeds/04_quotes';
import { seed as seedDayPlan } from '../../seeds/05_day_plan';
import { seed as seedSiteVisits } from '../../seeds/05_site_visits';
import { seed as seedProof } from '../../seeds/06_proof';
import { createHash } from 'node:crypto';
import request from 'supertest';
import { loadConfig } from '../../server/src/config/config';
import { LocalFileStorage } from '../../server/src/integrations/storage/local-file-storage';
import { resetDatabase, signIn, type SignedIn } from '../helpers/fixtures';
import { createPaymentsTestApp, newKey, payOnFakePage, quotedRequest, sign, signBody, write, type PaymentsTestApp } from '../helpers/payment-fixtures';
import { createPricingCast, storeRateBook, type PricingCast, type StoredBook } from '../helpers/pricing-fixtures';

jest.setTimeout(120_000);

let t: PaymentsTestApp;
let cast: PricingCast;
let book: StoredBook;

// The items of the reviewer's request: a GFCI at the first device, a reversed-polarity receptacle and a
// smoke alarm, on one visit; the seller approves the first two and declines the alarm.
const GFCI = { code: 'gfci-missing', quantity: 1, location: 'hall bathroom vanity', entry: 'gfci-receptacle-first-device' };
const POLARITY = { code: 'reversed-polarity', quantity: 1, location: 'northeast bedroom, east wall', entry: 'polarity-correct' };
const SMOKE = { code: 'smoke-co-alarm', quantity: 1, location: 'upstairs hallway', entry: 'smoke-alarm-sealed' };
const PAID_CARD = '4242424242424242'; // the payment service's published test card ("Testing", docs.stripe.com/testing)

const view = async (requestId: number, who: SignedIn = cast.s.seller): Promise<ApprovalView> => (await who.agent.get(`/api/requests/${requestId}/approval`).expect(200)).body;
const cents = (money: string) => Math.round(Number(money.replace(/[$,]/g, '')) * 100);
const MONEY = /\$[\d,]+\.\d{2}/g;

async function pdfText(who: SignedIn, path: string): Promise<string> {
  const res = await who.agent.get(path).buffer(true).parse((r, done) => {
    const chunks: Buffer[] = [];
    r.on('data', (c: Buffer) => chunks.push(c));
    r.on('end', () => done(null, Buffer.concat(chunks)));
  });
  expect(res.status).toBe(200);
  return (await extractPdfPages(res.body as Buffer)).pages.join('\n');
}

/** The amounts of the rows between the "Work" heading and "Subtotal", and the subtotal, tax and total. */
function workSection(text: string): { rows: number[]; subtotal: number; tax: number; total: number } {
  const start = text.indexOf('Item');
  const end = text.indexOf('Subtotal');
  expect(start).toBeGreaterThan(-1);
  expect(end).toBeGreaterThan(start);
  const [subtotal, tax, total] = (text.slice(end).match(MONEY) ?? []).map(cents);
  return { rows: (text.slice(start, end).match(MONEY) ?? []).map(cents), subtotal, tax, total };
}

/** The reviewer's request: quoted, the amounts the seller's form shows for the decisions, then signed. */
async function signedAsShown(): Promise<{ requestId: number; itemIds: number[]; shown: Map<number, number>; quoted: Map<number, number> }> {
  const { requestId, itemIds } = await quotedRequest(cast, t, book, [GFCI, POLARITY, SMOKE]);
  const before = await view(requestId);
  const decisions = ['approved', 'approved', 'declined'] as const;
  // What the decision form shows beside each approved item: the approved scope priced by the shared engine.
  const approvedKeys = itemIds.filter((_, i) => decisions[i] === 'approved').map(String);
  const amounts = lineAmountsOf(priceScope({ book: before.pricing.book, input: before.pricing.input, approvedKeys }));
  const shown = new Map(approvedKeys.map((k) => [Number(k), amounts.get(k)!]));
  const quoted = new Map(before.quote.lines.filter((l) => l.lineItemId !== null).map((l) => [l.lineItemId!, l.lineCents]));
  await sign(cast.s.seller, requestId, signBody(itemIds, [...decisions]));
  return { requestId, itemIds, shown, quoted };
}

beforeAll(async () => {
  t = await createPaymentsTestApp();
  await resetDatabase(t.db);
  cast = await createPricingCast(t.app, t.db);
  book = await storeRateBook(t.db, cast.contractorOrg, DEMO_RATE_BOOK);
});
afterAll(() => t.close());

describe('the receipt', () => {
  it('adds up: its item rows plus service call equal its subtotal, and subtotal plus tax its total (read from the PDF)', async () => {
    const { requestId, shown } = await signedAsShown();
    const started: StartedPayment = (await write(cast.s.seller, 'post', `/api/requests/${requestId}/payments`).send({ plan: 'card-full', idempotencyKey: newKey() }).expect(201)).body;
    expect((await payOnFakePage(started.checkoutUrl!, PAID_CARD)).status).toBe(303);
    await t.fake.settle();
    const v = await view(requestId);
    const receipt = v.invoices.find((i) => i.kind === 'receipt');
    expect(receipt).toBeDefined();
    const text = await pdfText(cast.s.seller, receipt!.pdfPath);
    const work = workSection(text);
    expect(work.rows.reduce((s, c) => s + c, 0)).toBe(work.subtotal);
    expect(work.subtotal + work.tax).toBe(work.total);
    expect(work.total).toBe(v.scope!.totalCents);
    // Two item rows at the prices signed, then the one service call of the one visit (demo rate book: $95).
    expect(work.rows).toEqual([...shown.values(), DEMO_RATE_BOOK.terms.serviceCallCents]);
    expect(text).not.toContain('first-hour minimums');
  });
});

describe('prices after signing', () => {
  it('are the prices signed: on the approval page, on an invoice and with the scope total', async () => {
    const { requestId, shown, quoted } = await signedAsShown();
    // Declining the alarm leaves the first-hour minimum to the two approved items: their amounts are
    // not the quote's, which is why the form shows the amounts of the scope being signed.
    expect([...shown.entries()].some(([id, c]) => quoted.get(id) !== c)).toBe(true);
    const v = await view(requestId);
    const after = new Map(v.items.filter((i) => i.status === 'approved').map((i) => [i.lineItemId, i.lineCents]));
    expect(after).toEqual(shown);
    const issued = await write(cast.s.contractor, 'post', `/api/requests/${requestId}/invoices`).send({});
    expect(issued.status).toBe(201);
    const work = workSection(await pdfText(cast.s.contractor, issued.body.pdfPath));
    expect(work.rows.slice(0, shown.size)).toEqual([...shown.values()]);
    expect(work.total).toBe(v.scope!.totalCents);
  });
});

describe('the demo data', () => {
  let saved: string | undefined;
  beforeAll(async () => {
    saved = process.env.BCRYPT_ROUNDS;
    process.env.BCRYPT_ROUNDS = '4';
    await resetDatabase(t.db);
    for (const seed of [seedPeople, seedRequests, seedRateBooks, seedQuotes, seedSiteVisits, seedDayPlan, seedProof]) await seed(t.db);
  });
  afterAll(() => {
    if (saved === undefined) delete process.env.BCRYPT_ROUNDS;
    else process.env.BCRYPT_ROUNDS = saved;
  });

  it('gives every approved request a signature and a way to pay (card or at closing) on the seller’s page', async () => {
    const requests: { id: number; status: string }[] = await t.db('repair_requests').orderBy('id').select('id', 'status');
    const payable = requests.filter((r) => mayAct(['seller'], 'pay', r.status as never));
    expect(payable.length).toBeGreaterThan(5);
    const sellers = new Map<number, SignedIn>();
    for (const r of payable) {
      const party = await t.db('request_parties as p').join('users as u', 'u.id', 'p.user_id').where({ 'p.request_id': r.id, 'p.role': 'seller' }).first('u.*');
      expect(party).toBeDefined();
      if (!sellers.has(party.id)) sellers.set(party.id, await signIn(t.app, { id: party.id, email: party.email, name: party.name, role: party.role, organisationId: null, organisationName: null }, DEMO_PASSWORD));
      const v = await view(r.id, sellers.get(party.id)!);
      expect({ id: r.id, signed: v.signature !== null, canPay: v.can.pay }).toEqual({ id: r.id, signed: true, canPay: true });
      expect(v.nextStep).not.toContain('No decision is due');
      if (v.payments.length) {
        // The finished demo work: the seller chose payment at closing (seeds/06_proof.ts), shown as that invoice.
        expect(v.payments.map((p) => p.method)).toEqual(['closing']);
        continue;
      }
      expect(v.account.balanceCents).toBe(v.scope!.totalCents);
      expect(v.plans.map((p) => p.plan)).toEqual(expect.arrayContaining(['card-full', 'at-closing']));
      // The seller is told it is their step, not about "the seller" in the third person.
      expect(v.nextStep).toBe('Next: choose how to pay: by card now, a deposit now, or at closing.');
      // The buyer's agent reads the same page: the payment is the seller side's, and the work waits for
      // the people the request page and the dashboard name (review 7, P4-1).
      const agent = await t.db('request_parties as p').join('users as u', 'u.id', 'p.user_id').where({ 'p.request_id': r.id, 'p.role': 'buyer-agent' }).first('u.*');
      if (!sellers.has(agent.id)) sellers.set(agent.id, await signIn(t.app, { id: agent.id, email: agent.email, name: agent.name, role: agent.role, organisationId: null, organisationName: null }, DEMO_PASSWORD));
      expect((await view(r.id, sellers.get(agent.id)!)).nextStep).toBe(
        `To pay: the seller or the listing agent chooses how (by card now, a deposit now, or at closing). The work waits for ${whoActsNextWords(r.status as never)}.`,
      );
    }
  });

  it('shows the declined request with the seller’s signature', async () => {
    const declined = await t.db('repair_requests').where({ status: 'declined' }).first('id');
    const approval = await t.db('quote_approvals').where({ request_id: declined.id }).first();
    expect(approval).toMatchObject({ approved_total_cents: 0 });
    const decisions = await t.db('item_decisions').where({ request_id: declined.id });
    expect(decisions.length).toBeGreaterThan(0);
    expect(decisions.every((d: { decision: string }) => d.decision === 'declined')).toBe(true);
  });

  it('proves the finished demo work: each letter is a stored PDF that verifies by its code, the accepted one as accepted', async () => {
    const storage = new LocalFileStorage(loadConfig(process.env).storageDir);
    const letters: { request_id: number; verification_code: string; sha256: string; storage_key: string; status: string }[] = await t
      .db('completion_letters as l')
      .join('repair_requests as r', 'r.id', 'l.request_id')
      .orderBy('l.request_id')
      .select('l.request_id', 'l.verification_code', 'l.sha256', 'l.storage_key', 'r.status');
    expect(letters.map((l) => l.status).sort()).toEqual(['accepted', 'letter-issued']);
    for (const letter of letters) {
      const pdf = await storage.get(letter.storage_key);
      expect(pdf.subarray(0, 5).toString()).toBe('%PDF-');
      expect(createHash('sha256').update(pdf).digest('hex')).toBe(letter.sha256);
      const verified = await request(t.app).get(`/api/verify/${letter.verification_code}`).expect(200);
      expect(verified.body).toMatchObject({ sha256: letter.sha256, isCurrent: true, isAccepted: letter.status === 'accepted' });
    }
    // Every approved item of a corrected (or later) request has its recorded correction.
    const uncorrected = await t
      .db('line_items as i')
      .join('repair_requests as r', 'r.id', 'i.request_id')
      .whereIn('r.status', ['corrected', 'letter-issued', 'accepted'])
      .whereNotExists(t.db('item_corrections as c').whereRaw('c.line_item_id = i.id').select(t.db.raw('1')))
      .whereIn('i.status', ['corrected', 'accepted'])
      .count({ n: '*' });
    expect(Number(uncorrected[0].n)).toBe(0);
  });

  it('gives the demo requests a history: each move in the Activity panel, credited to who made it, and the approvals in money', async () => {
    const moves: { request_id: number; to_status: string; changed_by: number }[] = await t.db('request_status_changes').select('request_id', 'to_status', 'changed_by');
    const entries: { request_id: number; actor_user_id: number; after: { status?: string } | null; kind: string }[] = await t
      .db('activity_events')
      .where({ kind: 'status' })
      .select('request_id', 'actor_user_id', 'after', 'kind');
    expect(moves.length).toBeGreaterThan(50);
    // One timeline entry per status change, by the same person.
    const key = (r: number, to: string | undefined, by: number) => `${r}|${to}|${by}`;
    expect(entries.map((e) => key(e.request_id, e.after?.status, e.actor_user_id)).sort()).toEqual(moves.map((m) => key(m.request_id, m.to_status, m.changed_by)).sort());
    // The approvals' timeline entries carry the signed amounts the contractor's dashboard sums by month.
    const signed = await t.db('quote_approvals').sum({ cents: 'approved_total_cents' });
    const decided = await t.db('activity_events').where({ action: 'items-decided' }).sum({ cents: 'amount_cents' });
    expect(Number(decided[0].cents)).toBe(Number(signed[0].cents));
    expect(Number(signed[0].cents)).toBeGreaterThan(0);
    // The closed sale's funds from escrow are recorded: the dashboard's Paid figure has them.
    const paid = await t.db('payments').where({ status: 'succeeded', method: 'closing' }).sum({ cents: 'amount_cents' });
    const received = await t.db('activity_events').where({ action: 'payment-received' }).sum({ cents: 'amount_cents' });
    expect(Number(paid[0].cents)).toBeGreaterThan(0);
    expect(Number(received[0].cents)).toBe(Number(paid[0].cents));
    // Old news is not e-mailed again when the server starts.
    expect(await t.db('outbox_messages').whereIn('status', ['pending', 'held']).count({ n: '*' })).toEqual([{ n: '0' }]);
  });
});
