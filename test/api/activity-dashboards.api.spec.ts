import request from 'supertest';
import { FINAL_STATUSES, type ActivityEntry, type ContractorDashboard } from '@cc/shared';
import type { Db } from '../../server/src/db/knex';
import { createOrganisation, createUser, resetDatabase, signIn, validRequestBody, type SignedIn } from '../helpers/fixtures';
import { createPricingCast, type PricingCast } from '../helpers/pricing-fixtures';
import { createTestApp, type TestApp } from '../helpers/test-app';

let t: TestApp;
let cast: PricingCast;
const write = (who: SignedIn, method: 'post' | 'put' | 'patch' | 'delete', path: string) => who.agent[method](path).set('x-csrf-token', who.csrfToken);

beforeAll(async () => {
  t = createTestApp();
  await resetDatabase(t.db);
  cast = await createPricingCast(t.app, t.db);
});
afterAll(() => t.close());

describe('GET /api/requests/:id/activity (the timeline)', () => {
  let requestId: number;
  const timeline = async (query = '', who: SignedIn = cast.s.buyerAgent): Promise<ActivityEntry[]> =>
    (await who.agent.get(`/api/requests/${requestId}/activity${query}`).expect(200)).body.items;

  beforeAll(async () => {
    const res = await write(cast.s.buyerAgent, 'post', '/api/requests').send(validRequestBody({ sellerEmail: cast.users.seller.email, contractorOrganisationId: cast.contractorOrg }));
    requestId = res.body.id;
    await write(cast.s.buyerAgent, 'post', `/api/requests/${requestId}/reports/paste`)
      .send({ text: '1. The receptacle at the hall bathroom vanity is not GFCI protected.\n2. Double-tapped breaker at the main panel.' })
      .expect(201);
  });

  it('records the request opened, the report read and the move to intake, newest first, with who did it', async () => {
    const entries = await timeline();
    expect(entries.map((e) => e.action)).toEqual(['report-parsed', 'add-report', 'party-added', 'open']);
    expect(entries[1]).toMatchObject({ kind: 'status', before: { status: 'draft' }, after: { status: 'intake' }, actorName: cast.users.buyerAgent.name });
    expect(entries[1].summary).toBe('Add the inspection report: Draft → Report in review (Inspection report added)');
    expect(entries[2]).toMatchObject({ kind: 'parties', summary: `${cast.users.seller.name} added as seller` });
    expect(Date.parse(entries[0].at)).toBeGreaterThanOrEqual(Date.parse(entries[3].at));
  });

  it('records an edit of an item with the values before and after, and a removal', async () => {
    const [first, second] = (await cast.s.buyerAgent.agent.get(`/api/requests/${requestId}/items`).expect(200)).body.items;
    await write(cast.s.buyerAgent, 'patch', `/api/requests/${requestId}/items/${first.id}`).send({ version: first.version, quantity: 3, location: 'hall bath, both sinks' }).expect(200);
    await write(cast.s.buyerAgent, 'delete', `/api/requests/${requestId}/items/${second.id}?version=${second.version}`).expect(204);
    const items = await timeline('?kind=items');
    expect(items.map((e) => e.action)).toEqual(['item-remove', 'item-edited']);
    expect(items[1]).toMatchObject({
      action: 'item-edited',
      itemId: first.id,
      before: { quantity: first.quantity, location: first.location },
      after: { quantity: 3, location: 'hall bath, both sinks' },
      actorName: cast.users.buyerAgent.name,
    });
    expect(items[0]).toMatchObject({ itemId: second.id, before: { status: 'proposed' }, after: { status: 'removed' } });
  });

  it('filters by several kinds, pages, and refuses an unknown kind', async () => {
    const entries = await timeline('?kind=status,parties');
    expect(new Set(entries.map((e) => e.kind))).toEqual(new Set(['status', 'parties']));
    const page = (await cast.s.seller.agent.get(`/api/requests/${requestId}/activity?pageSize=2&page=1`).expect(200)).body;
    expect(page).toMatchObject({ page: 1, pageSize: 2, total: 6 });
    expect(page.items).toHaveLength(2);
    await cast.s.buyerAgent.agent.get(`/api/requests/${requestId}/activity?kind=gossip`).expect(400);
  });

  it('is shown only to those who take part (404 otherwise, 401 signed out)', async () => {
    await cast.s.contractor.agent.get(`/api/requests/${requestId}/activity`).expect(200);
    await cast.s.outsiderAgent.agent.get(`/api/requests/${requestId}/activity`).expect(404);
    await cast.s.otherContractor.agent.get(`/api/requests/${requestId}/activity`).expect(404);
    await cast.s.buyerAgent.agent.get('/api/requests/999999/activity').expect(404);
    await request(t.app).get(`/api/requests/${requestId}/activity`).expect(401);
  });
});

describe('dashboards: figures of a seeded scenario, computed by hand', () => {
  const today = new Date().toISOString().slice(0, 10);
  const now = new Date();
  const thisMonth = today.slice(0, 7);
  const lastMonthDate = new Date(Date.UTC(now.getUTCFullYear(), now.getUTCMonth() - 1, 15, 12));
  const lastMonth = lastMonthDate.toISOString().slice(0, 7);
  const inDays = (n: number) => new Date(Date.parse(`${today}T00:00:00Z`) + n * 86_400_000).toISOString().slice(0, 10);
  let org: number;
  let avery: SignedIn;
  let blake: SignedIn;
  let contractor: SignedIn;
  const ids: Record<string, number> = {};

  async function addRequest(db: Db, key: string, o: { agent: number; status: string; closing: string; org?: number }) {
    const [row] = await db('repair_requests')
      .insert({ street: `${key} Quarry Bend`, city: 'Marlow Springs', state: 'CO', zip: '81290', year_built: 1970, closing_date: o.closing, nec_edition: 2023, status: o.status, contractor_organisation_id: o.org ?? org, created_by: o.agent })
      .returning('id');
    await db('request_parties').insert({ request_id: row.id, role: 'buyer-agent', email: `${key}@people.test`, user_id: o.agent });
    ids[key] = row.id;
  }
  const quote = (requestId: number, version: number, totalCents: number, sentAt: Date, organisationId = org) =>
    t.db('quotes').insert({
      request_id: requestId, version, organisation_id: organisationId, sent_at: sentAt, valid_until: '2027-12-31',
      subtotal_cents: totalCents, tax_cents: 0, total_cents: totalCents, deposit_cents: 0, warranty_text: 'w', safety_notice: 's',
      contractor: '{}', property: '{}', rate_book: '{}', pricing_input: '{}', breakdown: '{}',
    });
  const approved = (requestId: number) => t.db('request_status_changes').insert({ request_id: requestId, from_status: 'quoted', to_status: 'approved' });
  const entry = (requestId: number, action: string, amountCents: number, at: Date) =>
    t.db('activity_events').insert({ request_id: requestId, kind: action === 'items-decided' ? 'approvals' : 'payments', action, summary: action, amount_cents: amountCents, created_at: at });
  const items = (requestId: number, statuses: string[]) =>
    t.db('line_items').insert(statuses.map((status) => ({ request_id: requestId, code: 'gfci-missing', room: 'kitchen', severity: 'safety', status })));

  beforeAll(async () => {
    org = await createOrganisation(t.db, 'contractor', 'Quarry Bend Electric');
    const brokerage = await createOrganisation(t.db, 'brokerage');
    const a = await createUser(t.db, 'agent', brokerage);
    await t.db('users').where({ id: a.id }).update({ name: 'Avery Agent' });
    const b = await createUser(t.db, 'agent', brokerage);
    await t.db('users').where({ id: b.id }).update({ name: 'Blake Agent' });
    const c = await createUser(t.db, 'contractor', org);
    [avery, blake, contractor] = [await signIn(t.app, a), await signIn(t.app, b), await signIn(t.app, c)];

    await addRequest(t.db, 'r1', { agent: a.id, status: 'pricing', closing: inDays(5) });
    await addRequest(t.db, 'r2', { agent: a.id, status: 'quoted', closing: inDays(15) });
    await addRequest(t.db, 'r3', { agent: a.id, status: 'approved', closing: inDays(40) });
    await addRequest(t.db, 'r4', { agent: b.id, status: 'in-progress', closing: inDays(3) });
    await addRequest(t.db, 'r5', { agent: b.id, status: 'corrected', closing: inDays(30) });
    await addRequest(t.db, 'r6', { agent: b.id, status: 'declined', closing: inDays(30) });
    await addRequest(t.db, 'other', { agent: a.id, status: 'pricing', closing: inDays(9), org: cast.contractorOrg });

    await quote(ids.r2, 1, 10_000, now);
    await quote(ids.r2, 2, 12_000, now);
    await quote(ids.r3, 1, 50_000, lastMonthDate);
    await quote(ids.r4, 1, 30_000, now);
    await quote(ids.r6, 1, 10_000, now);
    await quote(ids.other, 1, 99_900, now, cast.contractorOrg);
    for (const r of ['r3', 'r4', 'r5']) await approved(ids[r]);
    await entry(ids.r3, 'items-decided', 45_000, now);
    await entry(ids.r4, 'items-decided', 30_000, lastMonthDate);
    await entry(ids.r3, 'payment-received', 20_000, now);
    await entry(ids.other, 'payment-received', 77_700, now);
    await items(ids.r1, ['open', 'open']);
    await items(ids.r2, ['priced', 'out-of-scope']);
    await items(ids.r3, ['approved', 'removed']);
  });

  it('the contractor: pipeline, revenue quoted / approved / paid by month, and the agents who send work', async () => {
    const res = await contractor.agent.get('/api/dashboards/contractor?months=2').expect(200);
    const body = res.body as ContractorDashboard;
    // r1 pricing, r2 quoted, r3 approved, r4 in progress, r5 corrected; r6 declined sits in no stage.
    expect(body.pipeline).toEqual([
      { stage: 'to-price', count: 1 },
      { stage: 'awaiting-approval', count: 1 },
      { stage: 'to-schedule', count: 1 },
      { stage: 'to-correct', count: 1 },
      { stage: 'letters-due', count: 1 },
    ]);
    // Quoted: each request's latest version in the month it was sent: r3 500.00 last month;
    // r2 v2 120.00 + r4 300.00 + r6 100.00 = 520.00 this month. Approved 300.00 then 450.00; paid 200.00.
    expect(body.revenue).toEqual([
      { month: lastMonth, quotedCents: 50_000, approvedCents: 30_000, paidCents: 0 },
      { month: thisMonth, quotedCents: 52_000, approvedCents: 45_000, paidCents: 20_000 },
    ]);
    // Avery: r1-r3, one approved (1/3 = 33 %), quotes 120.00 + 500.00. Blake: r4-r6, two approved
    // (2/3 = 67 %), quotes 300.00 + 100.00. The other contractor's request is not counted.
    expect(body.agents.map(({ email: _e, ...rest }) => rest)).toEqual([
      { name: 'Avery Agent', requests: 3, converted: 1, conversionPercent: 33, quotedCents: 62_000 },
      { name: 'Blake Agent', requests: 3, converted: 2, conversionPercent: 67, quotedCents: 40_000 },
    ]);
  });

  it('the agent: open requests by closing date with days left, risk and who acts next, and items by status', async () => {
    const res = await avery.agent.get('/api/dashboards/agent').expect(200);
    expect(res.body.today).toBe(today);
    // "other" is Avery's too (another contractor); r1 at 5 days is at risk, r2 at 15 days without
    // approval is watched, "other" at 9 days unapproved is watched, r3 approved 40 days out is on track.
    expect(res.body.requests.map((r: { id: number; daysLeft: number; risk: string; nextActor: string }) => [r.id, r.daysLeft, r.risk, r.nextActor])).toEqual([
      [ids.r1, 5, 'high', 'the contractor'],
      [ids.other, 9, 'medium', 'the contractor'],
      [ids.r2, 15, 'medium', 'the seller or the listing agent'],
      [ids.r3, 40, 'low', 'the contractor'],
    ]);
    const counts = Object.fromEntries(res.body.itemsByStatus.map((i: { status: string; count: number }) => [i.status, i.count]));
    expect(counts).toEqual({ open: 2, priced: 1, 'out-of-scope': 1, approved: 1 });
    // Blake's declined request is ended and left out; r4 (3 days, work under way) is at risk.
    const blakes = (await blake.agent.get('/api/dashboards/agent').expect(200)).body.requests;
    // Who acts next is the request page's "Waits for …" (the shared next-step rule): r5's work is
    // finished, so the contractor issues the letter; a change order (a detour) does not name the seller.
    expect(blakes.map((r: { id: number; risk: string; nextActor: string }) => [r.id, r.risk, r.nextActor])).toEqual([
      [ids.r4, 'high', 'the contractor'],
      [ids.r5, 'low', 'the contractor'],
    ]);
    // …and stays findable (review 7, P4-2): the dashboard's "Finished" section pages the request list
    // by the flow's final states, latest closing first (the plan is checked in requests.api.spec.ts).
    const finished = (await blake.agent.get(`/api/requests?status=${FINAL_STATUSES.join(',')}&sort=closingDate&direction=desc&pageSize=6`).expect(200)).body;
    expect(finished.items.map((r: { id: number; status: string }) => [r.id, r.status])).toEqual([[ids.r6, 'declined']]);
    expect(finished.total).toBe(1);
  });

  it('each dashboard answers its own role only, and bounds its query', async () => {
    await contractor.agent.get('/api/dashboards/agent').expect(403);
    await avery.agent.get('/api/dashboards/contractor').expect(403);
    await request(t.app).get('/api/dashboards/agent').expect(401);
    await contractor.agent.get('/api/dashboards/contractor?months=0').expect(400);
    await contractor.agent.get('/api/dashboards/contractor?months=99').expect(400);
  });
});
