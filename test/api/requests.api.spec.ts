import request from 'supertest';
import * as z from 'zod';
import { FINAL_STATUSES, RepairRequestSummarySchema, type CurrentUser, type RepairRequestDetail, type RequestStatus } from '@cc/shared';
import type { Statement } from '../../server/src/db/read-pool';
import { LineItemRepository } from '../../server/src/intake/line-item.repository';
import { LIST_COUNT_CAPS, RequestRepository, type RequestListFilter, type Viewer } from '../../server/src/requests/request.repository';
import { createTestApp, type TestApp } from '../helpers/test-app';
import { createOrganisation, createUser, csrfTokenFor, resetDatabase, signIn, validRequestBody, type SignedIn } from '../helpers/fixtures';

let t: TestApp;
let contractorOrg: number;
let otherContractorOrg: number;
/** One request with every kind of party, and the people around it. */
let cast: Record<'buyerAgent' | 'listingAgent' | 'seller' | 'inspector' | 'contractor' | 'otherContractor' | 'otherAgent' | 'otherSeller' | 'otherInspector' | 'admin', CurrentUser>;
let sessions: Record<keyof typeof cast, SignedIn>;
let ownRequest: RepairRequestDetail;

beforeAll(async () => {
  t = createTestApp();
  await resetDatabase(t.db);
  const brokerage = await createOrganisation(t.db, 'brokerage');
  contractorOrg = await createOrganisation(t.db, 'contractor', 'Assigned Electric');
  otherContractorOrg = await createOrganisation(t.db, 'contractor', 'Unassigned Electric');
  cast = {
    buyerAgent: await createUser(t.db, 'agent', brokerage),
    listingAgent: await createUser(t.db, 'agent', brokerage),
    seller: await createUser(t.db, 'seller'),
    inspector: await createUser(t.db, 'inspector'),
    contractor: await createUser(t.db, 'contractor', contractorOrg),
    otherContractor: await createUser(t.db, 'contractor', otherContractorOrg),
    otherAgent: await createUser(t.db, 'agent', brokerage),
    otherSeller: await createUser(t.db, 'seller'),
    otherInspector: await createUser(t.db, 'inspector'),
    admin: await createUser(t.db, 'admin'),
  };
  sessions = Object.fromEntries(await Promise.all(Object.entries(cast).map(async ([k, u]) => [k, await signIn(t.app, u)]))) as typeof sessions;
  const res = await sessions.buyerAgent.agent
    .post('/api/requests')
    .set('x-csrf-token', sessions.buyerAgent.csrfToken)
    .send(
      validRequestBody({
        listingAgentEmail: cast.listingAgent.email,
        sellerEmail: cast.seller.email,
        inspectorEmail: cast.inspector.email,
        contractorOrganisationId: contractorOrg,
      }),
    );
  expect(res.status).toBe(201);
  ownRequest = res.body;
});
afterAll(() => t.close());

const PARTIES = ['buyerAgent', 'listingAgent', 'seller', 'inspector', 'contractor', 'admin'] as const;
const OUTSIDERS = ['otherAgent', 'otherSeller', 'otherInspector', 'otherContractor'] as const;

describe('POST /api/requests', () => {
  it('creates a draft with the agent as buyer’s agent, parties linked, state default edition and history', () => {
    expect(ownRequest).toMatchObject({
      status: 'draft',
      necEdition: 2023, // CO in the state defaults table
      reference: expect.stringMatching(/^CC-\d{5}$/),
      contractor: { id: contractorOrg, name: 'Assigned Electric', licenceState: 'CO' },
      myParts: ['buyer-agent'],
    });
    expect(ownRequest.parties.map((p) => [p.role, p.userId, p.isPending])).toEqual([
      ['buyer-agent', cast.buyerAgent.id, false],
      ['listing-agent', cast.listingAgent.id, false],
      ['seller', cast.seller.id, false],
      ['inspector', cast.inspector.id, false],
    ]);
    expect(ownRequest.history).toEqual([expect.objectContaining({ from: null, to: 'draft', byName: cast.buyerAgent.name })]);
  });

  it('keeps an edition the agent chose', async () => {
    const res = await sessions.buyerAgent.agent.post('/api/requests').set('x-csrf-token', sessions.buyerAgent.csrfToken).send(validRequestBody({ necEdition: 2017 }));
    expect(res.status).toBe(201);
    expect(res.body.necEdition).toBe(2017);
  });

  it('invites by link a seller who has no account yet', async () => {
    const res = await sessions.buyerAgent.agent
      .post('/api/requests')
      .set('x-csrf-token', sessions.buyerAgent.csrfToken)
      .send(validRequestBody({ sellerEmail: 'New.Seller@People.test' }));
    expect(res.status).toBe(201);
    const seller = res.body.parties.find((p: { role: string }) => p.role === 'seller');
    expect(seller).toMatchObject({ email: 'new.seller@people.test', isPending: true, userId: null });
    expect(seller.inviteUrl).toMatch(/^http:\/\/portal\.test\/invite\/[\w-]{20,}$/);
  });

  it('responds 400 with every bad field named, and writes nothing', async () => {
    const before = await t.db('repair_requests').count<{ count: string }[]>({ count: '*' });
    const res = await sessions.buyerAgent.agent
      .post('/api/requests')
      .set('x-csrf-token', sessions.buyerAgent.csrfToken)
      .send({ street: '', city: 'X', state: 'ZZ', zip: '123', yearBuilt: 'old', closingDate: '15/01/2027', necEdition: 2014, sellerEmail: 'nope' });
    expect(res.status).toBe(400);
    expect(res.body.error).toEqual(expect.any(String));
    expect(res.body.details.map((d: { path: string }) => d.path).sort()).toEqual(
      ['city', 'closingDate', 'necEdition', 'sellerEmail', 'state', 'street', 'yearBuilt', 'zip'].sort(),
    );
    const after = await t.db('repair_requests').count<{ count: string }[]>({ count: '*' });
    expect(after).toEqual(before);
  });

  it('invites by link an e-mail whose account has another role, answering as for an unknown e-mail (no account is revealed)', async () => {
    const unknownEmail = `nobody-${Date.now()}@people.test`;
    const asKnown = await sessions.buyerAgent.agent
      .post('/api/requests')
      .set('x-csrf-token', sessions.buyerAgent.csrfToken)
      .send(validRequestBody({ sellerEmail: cast.inspector.email }));
    const asUnknown = await sessions.buyerAgent.agent
      .post('/api/requests')
      .set('x-csrf-token', sessions.buyerAgent.csrfToken)
      .send(validRequestBody({ sellerEmail: unknownEmail }));
    expect(asKnown.status).toBe(201);
    expect(asUnknown.status).toBe(201);
    const sellerOf = (body: { parties: { role: string; isPending: boolean; name: string | null; inviteUrl: string | null }[] }) => {
      const { isPending, name, inviteUrl } = body.parties.find((p) => p.role === 'seller')!;
      return { isPending, name, hasLink: inviteUrl !== null };
    };
    expect(sellerOf(asKnown.body)).toEqual({ isPending: true, name: null, hasLink: true });
    expect(sellerOf(asKnown.body)).toEqual(sellerOf(asUnknown.body));
  });

  it('responds 400 when the contractor is not a contractor organisation', async () => {
    const brokerage = await createOrganisation(t.db, 'brokerage');
    const res = await sessions.buyerAgent.agent
      .post('/api/requests')
      .set('x-csrf-token', sessions.buyerAgent.csrfToken)
      .send(validRequestBody({ contractorOrganisationId: brokerage }));
    expect(res.status).toBe(400);
    expect(res.body.details[0].path).toBe('contractorOrganisationId');
  });

  it.each(['seller', 'inspector', 'contractor'] as const)('responds 403 to a %s', async (who) => {
    const s = sessions[who];
    await s.agent.post('/api/requests').set('x-csrf-token', s.csrfToken).send(validRequestBody()).expect(403);
  });

  it('responds 401 without a session and 403 without a CSRF token', async () => {
    const anon = request.agent(t.app);
    const token = await csrfTokenFor(anon);
    await anon.post('/api/requests').set('x-csrf-token', token).send(validRequestBody()).expect(401);
    await sessions.buyerAgent.agent.post('/api/requests').send(validRequestBody()).expect(403);
  });

  it('lets an admin open one for a named buyer’s agent', async () => {
    const missing = await sessions.admin.agent.post('/api/requests').set('x-csrf-token', sessions.admin.csrfToken).send(validRequestBody());
    expect(missing.status).toBe(400);
    expect(missing.body.details[0].path).toBe('buyerAgentEmail');
    const res = await sessions.admin.agent
      .post('/api/requests')
      .set('x-csrf-token', sessions.admin.csrfToken)
      .send(validRequestBody({ buyerAgentEmail: cast.otherAgent.email }));
    expect(res.status).toBe(201);
    expect(res.body.parties[0]).toMatchObject({ role: 'buyer-agent', userId: cast.otherAgent.id });
  });
});

describe('GET /api/requests/:id', () => {
  it.each(PARTIES)('shows the request to its %s', async (who) => {
    const res = await sessions[who].agent.get(`/api/requests/${ownRequest.id}`);
    expect(res.status).toBe(200);
    expect(res.body.id).toBe(ownRequest.id);
  });

  it.each(OUTSIDERS)('responds 404 (not 403) to %s, who is not a party', async (who) => {
    const res = await sessions[who].agent.get(`/api/requests/${ownRequest.id}`);
    expect(res.status).toBe(404);
    expect(res.body).toEqual({ error: expect.any(String), details: [] });
  });

  it('responds 404 for an id that does not exist or is not a number', async () => {
    await sessions.admin.agent.get('/api/requests/999999').expect(404);
    await sessions.admin.agent.get('/api/requests/abc').expect(404);
  });

  it('responds 401 without a session', async () => {
    await request(t.app).get(`/api/requests/${ownRequest.id}`).expect(401);
  });
});

describe('GET /api/requests', () => {
  it.each([...PARTIES, ...OUTSIDERS])('lists for %s only the requests they are party to', async (who) => {
    const res = await sessions[who].agent.get('/api/requests?pageSize=100');
    expect(res.status).toBe(200);
    const ids: number[] = res.body.items.map((r: { id: number }) => r.id);
    const isParty = (PARTIES as readonly string[]).includes(who);
    expect(ids.includes(ownRequest.id)).toBe(isParty);
    // Every listed request must also open for this user: the list never shows more than detail allows.
    for (const id of ids) await sessions[who].agent.get(`/api/requests/${id}`).expect(200);
  });

  it('pages, sorts, filters by status and text', async () => {
    const s = sessions.otherAgent;
    const cities = ['Alder Flat', 'Birch Gap', 'Cinder Vale'];
    for (const [i, city] of cities.entries()) {
      await s.agent.post('/api/requests').set('x-csrf-token', s.csrfToken).send(validRequestBody({ city, closingDate: `2027-0${i + 2}-01` })).expect(201);
    }
    const page0 = await s.agent.get('/api/requests?pageSize=2&page=0&sort=closingDate&direction=desc');
    expect(page0.body.total).toBeGreaterThanOrEqual(3);
    expect(page0.body.items).toHaveLength(2);
    expect(page0.body.items[0].closingDate >= page0.body.items[1].closingDate).toBe(true);
    const byText = await s.agent.get('/api/requests?q=birch');
    expect(byText.body.items.map((r: { city: string }) => r.city)).toEqual(['Birch Gap']);
    // Whatever the case typed or stored (the searched text is kept in lower case).
    const shouted = await s.agent.get('/api/requests?q=BIRCH%20gAP');
    expect(shouted.body.items.map((r: { city: string }) => r.city)).toEqual(['Birch Gap']);
    const byReference = await s.agent.get(`/api/requests?q=${byText.body.items[0].reference}`);
    expect(byReference.body.items.map((r: { id: number }) => r.id)).toEqual([byText.body.items[0].id]);
    const drafts = await s.agent.get('/api/requests?status=draft,intake');
    expect(drafts.body.items.every((r: { status: string }) => r.status === 'draft')).toBe(true);
    const none = await s.agent.get('/api/requests?status=accepted');
    expect(none.body).toMatchObject({ items: [], total: 0 });
  });

  it('filters by the year the house was built ("built before 1975"), on an index, within what the user may see', async () => {
    const agent = await signIn(t.app, await createUser(t.db, 'agent', await createOrganisation(t.db, 'brokerage')));
    const years = [1960, 1974, 1975, 1976, 1988];
    for (const yearBuilt of years) {
      await agent.agent.post('/api/requests').set('x-csrf-token', agent.csrfToken).send(validRequestBody({ yearBuilt, city: `Built ${yearBuilt}` })).expect(201);
    }
    const before1975 = await agent.agent.get('/api/requests?builtBefore=1975&sort=street').expect(200);
    expect(before1975.body.items.map((r: { yearBuilt: number }) => r.yearBuilt).sort()).toEqual([1960, 1974]);
    expect(before1975.body.total).toBe(2);
    const withStatus = await agent.agent.get('/api/requests?builtBefore=1990&status=draft').expect(200);
    expect(withStatus.body.total).toBe(5);
    // Another agent's houses stay out of the list whatever the filter.
    const outsider = await sessions.otherAgent.agent.get('/api/requests?builtBefore=1975&pageSize=100').expect(200);
    expect(outsider.body.items.some((r: { city: string }) => r.city.startsWith('Built 19'))).toBe(false);
    const indexes: { indexdef: string }[] = (await t.db.raw("SELECT indexdef FROM pg_indexes WHERE tablename = 'repair_requests'")).rows;
    expect(indexes.some((i) => /\(year_built\)/.test(i.indexdef))).toBe(true);
  });

  it('keeps each person’s list in step with the request and its parties, whoever writes them', async () => {
    const agent = await signIn(t.app, await createUser(t.db, 'agent', await createOrganisation(t.db, 'brokerage')));
    const seller = await signIn(t.app, await createUser(t.db, 'seller'));
    const created = await agent.agent
      .post('/api/requests')
      .set('x-csrf-token', agent.csrfToken)
      .send(validRequestBody({ street: '3 Viewer Lane', sellerEmail: seller.user.email }))
      .expect(201);
    const id: number = created.body.id;
    const listed = async (s: SignedIn, query: string) => ((await s.agent.get(`/api/requests?pageSize=100&${query}`).expect(200)).body.items as { id: number; street: string; status: string; closingDate: string; yearBuilt: number }[]).find((r) => r.id === id);

    expect(await listed(seller, 'q=viewer%20lane')).toMatchObject({ street: '3 Viewer Lane', status: 'draft' });
    // Any writer of the request's columns (here plain SQL): status, street, closing date and build year follow at once.
    await t.db('repair_requests').where({ id }).update({ status: 'intake', street: '5 Moved Court', closing_date: '2031-05-01', year_built: 1950 });
    for (const s of [agent, seller]) {
      expect(await listed(s, 'status=intake&sort=street')).toMatchObject({ street: '5 Moved Court', status: 'intake', closingDate: '2031-05-01' });
      expect(await listed(s, 'status=draft')).toBeUndefined();
      expect(await listed(s, 'q=moved%20court&builtBefore=1951')).toBeDefined();
      expect(await listed(s, 'q=viewer%20lane')).toBeUndefined();
    }
    const [first] = (await seller.agent.get('/api/requests?sort=closingDate&direction=desc&pageSize=1').expect(200)).body.items;
    expect(first.id).toBe(id);
    // A party who leaves the request leaves the list; one who comes back (an accepted invitation) is in it again.
    const [party] = await t.db('request_parties').where({ request_id: id, user_id: seller.user.id }).delete().returning('*');
    expect(await listed(seller, '')).toBeUndefined();
    await seller.agent.get(`/api/requests/${id}`).expect(404);
    await t.db('request_parties').insert({ ...party, id: undefined });
    expect(await listed(seller, '')).toMatchObject({ street: '5 Moved Court' });
    const viewers = await t.db('request_viewers').where({ request_id: id }).orderBy('user_id').select('user_id');
    expect(viewers.map((v: { user_id: number }) => v.user_id)).toEqual([agent.user.id, seller.user.id].sort((a, b) => a - b));
  });

  it('responds 400 for a build year that is not a year', async () => {
    for (const bad of ['soon', '1500', '1975.5', '99999']) {
      const res = await sessions.buyerAgent.agent.get(`/api/requests?builtBefore=${bad}`);
      expect(res.status).toBe(400);
      expect(res.body.details.map((d: { path: string }) => d.path)).toEqual(['builtBefore']);
    }
  });

  it.each([
    ['buyerAgent', 'closingDate', 'asc', ''],
    ['buyerAgent', 'createdAt', 'desc', ''],
    ['buyerAgent', 'street', 'desc', 'q=road'],
    ['admin', 'status', 'asc', ''],
    ['admin', 'street', 'asc', ''],
    ['admin', 'closingDate', 'desc', 'status=draft,pricing'],
  ] as const)('pages the %s’s list by key (%s %s %s): cursor by cursor, the same rows as page by page', async (who, sort, direction, filter) => {
    const s = sessions[who];
    const base = `/api/requests?pageSize=2&sort=${sort}&direction=${direction}${filter ? `&${filter}` : ''}`;
    const byOffset: number[] = [];
    for (let page = 0; ; page++) {
      const res = await s.agent.get(`${base}&page=${page}`).expect(200);
      byOffset.push(...res.body.items.map((r: { id: number }) => r.id));
      if (res.body.items.length < 2) break;
    }
    const byKey: number[] = [];
    let after: string | null = null;
    for (let page = 0; page < 100; page++) {
      const res: { body: { items: { id: number }[]; nextCursor: string | null } } = await s.agent.get(`${base}&page=${page}${after ? `&after=${after}` : ''}`).expect(200);
      byKey.push(...res.body.items.map((r: { id: number }) => r.id));
      after = res.body.nextCursor;
      if (!after) break;
    }
    expect(byOffset.length).toBeGreaterThan(2);
    expect(byKey).toEqual(byOffset);
  });

  it('refuses a cursor that is not one, or that belongs to another sort, with 400 on `after`', async () => {
    const s = sessions.buyerAgent;
    const { body } = await s.agent.get('/api/requests?pageSize=1&sort=street').expect(200);
    expect(body.nextCursor).toEqual(expect.any(String));
    for (const bad of [`sort=closingDate&after=${body.nextCursor}`, `sort=street&direction=desc&after=${body.nextCursor}`, 'after=bm90LWEtY3Vyc29y', 'after=%00', `sort=closingDate&after=${Buffer.from(JSON.stringify(['closingDate', 'asc', 'not a date', 1])).toString('base64url')}`,
      `sort=closingDate&after=${Buffer.from(JSON.stringify(['closingDate', 'asc', '2027-13-45', 1])).toString('base64url')}`,
      `sort=createdAt&after=${Buffer.from(JSON.stringify(['createdAt', 'asc', '2026-12-04 25:61:00+00', 1])).toString('base64url')}`,
      `sort=street&after=${Buffer.from(JSON.stringify(['street', 'asc', 'Elm', 2 ** 31])).toString('base64url')}`]) {
      const res = await s.agent.get(`/api/requests?pageSize=1&${bad}`);
      expect(res.status).toBe(400);
      expect(res.body.details[0].path).toMatch(/^(query\.)?after$/);
    }
  });

  // PostgreSQL writes each page's summaries as JSON (RequestRepository.list); a request's own page
  // writes its summary in Node (toSummary, and the at-risk rule of closingProgress). Field by field
  // the two must agree, in the shared schema, for every scope.
  it('answers pages in the shared schema, each summary as the request’s own page writes it (at-risk flag included)', async () => {
    // A new agent's requests, given to the file's contractor (whose list the searches narrow to them).
    const org = contractorOrg;
    const agent = await signIn(t.app, await createUser(t.db, 'agent', await createOrganisation(t.db, 'brokerage')));
    const contractor = sessions.contractor;
    const today = new Date().toISOString().slice(0, 10);
    const ids: number[] = [];
    for (const street of ['1 Parity Row', '2 Parity Row', '3 Parity Row']) {
      ids.push((await agent.agent.post('/api/requests').set('x-csrf-token', agent.csrfToken).send(validRequestBody({ street, contractorOrganisationId: org })).expect(201)).body.id);
    }
    // Open approved work on the first two; the first closes today (at risk), the second far off; the
    // third closes today without open work (not at risk).
    await t.db('line_items').insert(ids.slice(0, 2).map((request_id) => ({ request_id, code: 'gfci-missing', room: 'kitchen', quantity: 1, severity: 'safety', status: 'approved' })));
    await t.db('repair_requests').whereIn('id', [ids[0], ids[2]]).update({ closing_date: today });
    const PageOfSummaries = z.strictObject({
      items: z.array(RepairRequestSummarySchema.strict()),
      total: z.number().int(),
      isTotalCapped: z.boolean(),
      page: z.number().int(),
      pageSize: z.number().int(),
      nextCursor: z.string().nullable(),
    });
    for (const [s, query] of [[agent, 'sort=closingDate'], [contractor, 'q=parity%20row&sort=street&direction=desc'], [contractor, 'q=parity'], [sessions.admin, 'q=parity%20row&sort=createdAt']] as const) {
      const res = await s.agent.get(`/api/requests?pageSize=10&${query}`).expect(200);
      expect(res.headers['content-type']).toBe('application/json; charset=utf-8');
      const page = PageOfSummaries.parse(res.body);
      expect(page.items.map((r) => r.id).sort((a, b) => a - b)).toEqual(ids);
      for (const item of page.items) {
        const detail = (await s.agent.get(`/api/requests/${item.id}`).expect(200)).body;
        expect(item).toEqual(Object.fromEntries(Object.keys(RepairRequestSummarySchema.shape).map((k) => [k, detail[k]])));
      }
      expect(page.items.map((r) => [r.id, r.openWorkCount, r.isAtRisk]).sort()).toEqual([[ids[0], 1, true], [ids[1], 1, false], [ids[2], 0, false]].sort());
    }
  });

  it('tells the whole total on a page past the end', async () => {
    const s = sessions.buyerAgent;
    const first = await s.agent.get('/api/requests?pageSize=5&page=0').expect(200);
    const past = await s.agent.get('/api/requests?pageSize=5&page=500').expect(200);
    expect(past.body.items).toEqual([]);
    expect(past.body.total).toBe(first.body.total);
    expect(first.body.total).toBeGreaterThan(0);
    expect(first.body.isTotalCapped).toBe(false);
  });

  it('stops counting a list filtered by build year at the cap and says the total is at least that', async () => {
    const viewer = { id: cast.admin.id, role: 'admin' as const, organisationId: null };
    const filter = { page: 0, pageSize: 1, sort: 'closingDate' as const, direction: 'asc' as const, statuses: [], text: '', id: null, builtBefore: 2100 };
    const all = await new RequestRepository(t.db).list(viewer, filter, '2000-01-01');
    expect(all.total).toBeGreaterThan(2);
    const capped = await new RequestRepository(t.db, { list: 2, search: 2 }).list(viewer, filter, '2000-01-01');
    expect(capped).toMatchObject({ total: 2, isTotalCapped: true });
    expect(JSON.parse(capped.itemsJson)).toHaveLength(1);
  });

  // Lists filtered only by status read their total from request_list_counts (kept by triggers,
  // migration 20261205130000), so it is exact past any cap and follows every kind of change.
  describe('kept totals', () => {
    /** Rows of request_list_counts that differ from a count made now from the tables themselves. */
    async function keptTotalsOff(): Promise<unknown[]> {
      const { rows } = await t.db.raw(`
        WITH kept AS (SELECT scope, scope_id, status, n FROM request_list_counts WHERE n <> 0),
        fresh AS (SELECT 'viewer' AS scope, user_id AS scope_id, status, count(*)::int AS n FROM request_viewers GROUP BY user_id, status
          UNION ALL SELECT 'contractor', contractor_organisation_id, status, count(*)::int FROM repair_requests WHERE contractor_organisation_id IS NOT NULL GROUP BY contractor_organisation_id, status
          UNION ALL SELECT 'all', 0, status, count(*)::int FROM repair_requests GROUP BY status)
        SELECT scope, scope_id, status, kept.n AS kept, fresh.n AS fresh FROM kept FULL JOIN fresh USING (scope, scope_id, status)
        WHERE kept.n IS DISTINCT FROM fresh.n`);
      return rows;
    }
    const filter = (statuses: RequestStatus[] = []): RequestListFilter => ({ page: 0, pageSize: 1, sort: 'closingDate', direction: 'asc', statuses, text: '', id: null });
    const viewerOf = (user: CurrentUser): Viewer => ({ id: user.id, role: user.role, organisationId: user.organisationId });

    it('tells the exact total past the cap for the administrator, a contractor and a person named on requests', async () => {
      const capped = new RequestRepository(t.db, { list: 1, search: 1 });
      for (const who of ['admin', 'contractor', 'buyerAgent'] as const) {
        const page = await capped.list(viewerOf(cast[who]), filter(), '2000-01-01');
        const fresh = await new RequestRepository(t.db).list(viewerOf(cast[who]), { ...filter(), builtBefore: 3000 }, '2000-01-01');
        expect(page).toMatchObject({ total: fresh.total, isTotalCapped: false });
        expect(page.total).toBeGreaterThan(1);
      }
    });

    it('follows new requests, moves, a change of contractor, a party leaving and a request deleted', async () => {
      const created = await sessions.buyerAgent.agent.post('/api/requests').set('x-csrf-token', sessions.buyerAgent.csrfToken).send(validRequestBody()).expect(201);
      const id: number = created.body.id;
      expect(await keptTotalsOff()).toEqual([]);
      const before = await new RequestRepository(t.db).list(viewerOf(cast.buyerAgent), filter(['intake']), '2000-01-01');
      await t.db('repair_requests').where({ id }).update({ status: 'intake' });
      expect(await keptTotalsOff()).toEqual([]);
      const after = await new RequestRepository(t.db).list(viewerOf(cast.buyerAgent), filter(['intake']), '2000-01-01');
      expect(after.total).toBe(before.total + 1);
      await t.db.transaction(async (trx) => {
        await trx('repair_requests').where({ id }).update({ contractor_organisation_id: otherContractorOrg });
        await trx('request_parties').where({ request_id: id, user_id: cast.buyerAgent.id }).update({ user_id: null });
      });
      expect(await keptTotalsOff()).toEqual([]);
      await t.db('request_parties').where({ request_id: id }).delete();
      await t.db('request_status_changes').where({ request_id: id }).delete();
      await t.db('repair_requests').where({ id }).delete();
      expect(await keptTotalsOff()).toEqual([]);
    });
  });

  // Every list reads its page through the index of its sort within the viewer's scope, not by
  // sorting every visible row (PostgreSQL documentation, "Using EXPLAIN" and "Indexes and ORDER
  // BY"). The server prepares list statements once per connection with a generic plan
  // (db/read-pool.ts), so that is the plan checked; sequential scans are switched off so that the
  // small test tables show the plan the planner takes at scale.
  async function genericPlan({ text: sql, values: bindings }: Statement, { sortsPricedOut = true } = {}): Promise<string> {
    const literal = (v: unknown): string =>
      v === null ? 'NULL' : Array.isArray(v) ? `ARRAY[${v.map(literal).join(', ')}]` : typeof v === 'number' ? String(v) : `'${String(v).replace(/'/g, "''")}'`;
    return t.db.transaction(async (trx) => {
      // On a test-sized table the planner may prefer any index plus a sort; with sequential scans and
      // sorts priced out, it takes the index that gives a list's order, as it does at scale.
      await trx.raw('SET LOCAL enable_seqscan = off');
      if (sortsPricedOut) await trx.raw('SET LOCAL enable_sort = off');
      await trx.raw('SET LOCAL plan_cache_mode = force_generic_plan');
      await trx.raw(`PREPARE list_plan AS ${sql}`);
      const res = await trx.raw(`EXPLAIN EXECUTE list_plan(${(bindings as unknown[]).map(literal).join(', ')})`);
      await trx.raw('DEALLOCATE list_plan');
      return (res.rows as { 'QUERY PLAN': string }[]).map((r) => r['QUERY PLAN']).join('\n');
    });
  }

  const SORT_INDEXES: [string, RequestListFilter['sort'], 'asc' | 'desc', RequestStatus[], string][] = [
    ['buyerAgent', 'closingDate', 'asc', [], 'request_viewers_closing_index'],
    ['buyerAgent', 'createdAt', 'desc', [], 'request_viewers_created_index'],
    ['buyerAgent', 'street', 'asc', [], 'request_viewers_street_index'],
    ['buyerAgent', 'status', 'asc', [], 'request_viewers_status_index'],
    ['seller', 'closingDate', 'desc', ['draft'], 'request_viewers_status_index'],
    // The agent's dashboard lists the finished requests (the final states), latest closing first.
    ['buyerAgent', 'closingDate', 'desc', [...FINAL_STATUSES], 'request_viewers_status_index'],
    ['admin', 'closingDate', 'desc', [...FINAL_STATUSES], 'repair_requests_status_id_index'],
    ['contractor', 'closingDate', 'asc', [], 'repair_requests_contractor_closing_index'],
    ['contractor', 'createdAt', 'desc', [], 'repair_requests_contractor_created_index'],
    ['contractor', 'street', 'asc', [], 'repair_requests_contractor_street_index'],
    ['contractor', 'closingDate', 'asc', ['pricing'], 'repair_requests_contractor_status_index'],
    ['admin', 'closingDate', 'asc', [], 'repair_requests_closing_id_index'],
    ['admin', 'createdAt', 'desc', [], 'repair_requests_created_index'],
    ['admin', 'street', 'asc', [], 'repair_requests_street_index'],
    ['admin', 'status', 'asc', [], 'repair_requests_status_id_index'],
  ];
  it.each(SORT_INDEXES)('reads the %s’s list sorted by %s %s (statuses %j) through an index of its scope (at scale: %s)', async (who, sort, direction, statuses, index) => {
    const user = cast[who as keyof typeof cast];
    const viewer: Viewer = { id: user.id, role: user.role, organisationId: user.organisationId };
    const plan = await genericPlan(new RequestRepository(t.db).listStatement(viewer, { page: 3, pageSize: 25, sort, direction, statuses, text: '', id: null }, '2027-01-01'));
    // Which of several fitting indexes the planner takes on a test-sized table depends on its
    // statistics (the one named is what it takes at scale: bench/api.bench.ts); at any size the
    // visible rows are found through an index of the list's table, never by a sequential scan.
    const table = index.startsWith('request_viewers') ? 'request_viewers' : 'repair_requests';
    expect(plan).toMatch(new RegExp(`Index (Only )?Scan (Backward )?using ${table}_\\w+`));
    expect(plan).not.toMatch(/Seq Scan on (repair_requests|request_viewers|request_parties|line_items)/);
    // The page's rows are read by key, row by row, and their item counts with them (kept on the
    // request by status), without reading any item; the total by key from the kept totals.
    expect(plan).toContain('repair_requests_pkey');
    expect(plan).toContain('request_list_counts_pkey');
    expect(plan).not.toContain('line_items');
  });

  // A first page of a contractor's or the administrator's list skips no row, so its rows come with
  // the walk of the sort's index (an index scan that reads each row it passes, not the primary key).
  it.each([
    ['contractor', 'createdAt', 'desc'],
    ['admin', 'street', 'asc'],
  ] as const)('reads the %s’s first page (%s %s) with its index walk, not row by row by key', async (who, sort, direction) => {
    const user = cast[who];
    const viewer: Viewer = { id: user.id, role: user.role, organisationId: user.organisationId };
    const plan = await genericPlan(new RequestRepository(t.db).listStatement(viewer, { page: 0, pageSize: 25, sort, direction, statuses: [], text: '', id: null }, '2027-01-01'));
    expect(plan).toMatch(/Index Scan (Backward )?using repair_requests_\w+/);
    expect(plan).not.toContain('repair_requests_pkey');
    expect(plan).not.toMatch(/Seq Scan on (repair_requests|request_viewers|line_items)/);
  });

  // Keyset paging (PostgreSQL documentation, "Row Constructor Comparison" and "Indexes and ORDER
  // BY"): the page after a cursor starts in the sort's index at the cursor's row, instead of reading
  // and skipping every row of the pages before it.
  it.each([
    ['buyerAgent', 'closingDate', 'asc'],
    ['buyerAgent', 'createdAt', 'desc'],
    ['contractor', 'street', 'asc'],
    ['admin', 'status', 'desc'],
  ] as const)('starts the %s’s page after a cursor (%s %s) inside the sort’s index', async (who, sort, direction) => {
    const user = cast[who];
    const viewer: Viewer = { id: user.id, role: user.role, organisationId: user.organisationId };
    const after = { sortKey: sort === 'closingDate' ? '2027-01-01' : sort === 'createdAt' ? '2026-12-04 05:17:37.123456+00' : 'm', id: 5 };
    const plan = await genericPlan(new RequestRepository(t.db).listStatement(viewer, { page: 7, pageSize: 25, sort, direction, statuses: [], text: '', id: null, after }, '2027-01-01'));
    expect(plan).toMatch(/Index (Only )?Scan (Backward )?using (request_viewers|repair_requests)_\w+/);
    expect(plan).toMatch(/Index Cond: .*ROW\(/);
    expect(plan).not.toMatch(/Seq Scan on (repair_requests|request_viewers)/);
  });

  it.each(['buyerAgent', 'contractor', 'admin'] as const)('reads a request’s items for the %s through the index of their request, the request by its key', async (who) => {
    // Items are few per request and sorted in memory: only the way to them is checked.
    const user = cast[who];
    const viewer: Viewer = { id: user.id, role: user.role, organisationId: user.organisationId };
    for (const statement of [new LineItemRepository(t.db).listStatement(ownRequest.id), new LineItemRepository(t.db).listVisibleAsJsonStatement(viewer, ownRequest.id)]) {
      const plan = await genericPlan(statement, { sortsPricedOut: false });
      expect(plan).toContain('line_items_request_id_status_index');
      expect(plan).not.toMatch(/Seq Scan on (line_items|repair_requests|request_parties)/);
    }
  });

  // A text search counts no further than LIST_COUNT_CAPS.search (100) and pages on past it by cursor.
  describe('search past its count cap', () => {
    const CAP = LIST_COUNT_CAPS.search;
    let people: Record<'agent' | 'contractor' | 'admin', SignedIn>;
    /** The ids of the requests whose street holds "Capped Lane" (more than the cap) and "Exact Row" (the cap exactly). */
    let cappedIds: number[];

    beforeAll(async () => {
      // The file's contractor organisation (the contractors' list of this file names only its own two).
      const org = contractorOrg;
      const agent = await createUser(t.db, 'agent', await createOrganisation(t.db, 'brokerage'));
      people = { agent: await signIn(t.app, agent), contractor: await signIn(t.app, await createUser(t.db, 'contractor', org)), admin: sessions.admin };
      // Written in bulk (the list's tables are kept by triggers whoever writes them); closing dates
      // repeat so that paging by key must order ties by id.
      const insert = async (street: string, count: number): Promise<number[]> => {
        const rows: { id: number }[] = (
          await t.db.raw(
            `INSERT INTO repair_requests (street, city, state, zip, year_built, closing_date, nec_edition, status, contractor_organisation_id, created_by)
             SELECT g || ' ' || ?, 'Marlow Springs', 'CO', '81290', 1960, date '2027-03-01' + g % 9, 2020, 'draft', ?, ? FROM generate_series(1, ?) g RETURNING id`,
            [street, org, agent.id, count],
          )
        ).rows;
        await t.db('request_parties').insert(rows.map((r) => ({ request_id: r.id, role: 'buyer-agent', email: agent.email, user_id: agent.id, joined_at: new Date() })));
        return rows.map((r) => r.id);
      };
      cappedIds = await insert('Capped Lane', CAP + 30);
      addedIds = [...cappedIds, ...(await insert('Exact Row', CAP))];
    });
    // Other lists of this file (the contractor's, the administrator's) see none of these rows.
    let addedIds: number[] = [];
    afterAll(async () => {
      await t.db('request_parties').whereIn('request_id', addedIds).delete();
      await t.db('repair_requests').whereIn('id', addedIds).delete();
    });

    it.each(['agent', 'contractor', 'admin'] as const)('tells the %s the exact total up to the cap and "more than the cap" above it', async (who) => {
      const s = people[who];
      const few = await s.agent.get('/api/requests?q=7%20exact%20row&pageSize=5').expect(200);
      // 7, 17, 27 … 97 Exact Row
      expect(few.body).toMatchObject({ total: 10, isTotalCapped: false });
      const exact = await s.agent.get('/api/requests?q=exact%20row&pageSize=100').expect(200);
      expect(exact.body).toMatchObject({ total: CAP, isTotalCapped: false, nextCursor: null });
      expect(exact.body.items).toHaveLength(CAP);
      const capped = await s.agent.get('/api/requests?q=capped%20lane&pageSize=10').expect(200);
      expect(capped.body).toMatchObject({ total: CAP, isTotalCapped: true, nextCursor: expect.any(String) });
      expect(capped.body.items).toHaveLength(10);
    });

    it.each([
      ['agent', 'closingDate', 'asc'],
      ['contractor', 'street', 'desc'],
      ['admin', 'createdAt', 'asc'],
    ] as const)('pages the %s’s search past the cap by cursor (%s %s): every match once, in order, and no cursor after the last', async (who, sort, direction) => {
      const s = people[who];
      const seen: { id: number; street: string }[] = [];
      let after: string | null = null;
      let pages = 0;
      do {
        const res: { body: { items: { id: number; street: string }[]; total: number; isTotalCapped: boolean; nextCursor: string | null } } = await s.agent
          .get(`/api/requests?q=capped%20lane&pageSize=25&sort=${sort}&direction=${direction}&page=${pages}${after ? `&after=${after}` : ''}`)
          .expect(200);
        expect(res.body).toMatchObject({ total: CAP, isTotalCapped: true });
        seen.push(...res.body.items);
        after = res.body.nextCursor;
        pages++;
      } while (after && pages < 20);
      // 130 rows: five full pages and a sixth of five, after which no cursor is given.
      expect(pages).toBe(6);
      expect(seen.map((r) => r.id).sort((a, b) => a - b)).toEqual([...cappedIds].sort((a, b) => a - b));
      const all = await s.agent.get(`/api/requests?q=capped%20lane&pageSize=100&sort=${sort}&direction=${direction}`).expect(200);
      const next = await s.agent.get(`/api/requests?q=capped%20lane&pageSize=100&sort=${sort}&direction=${direction}&page=1&after=${all.body.nextCursor}`).expect(200);
      expect(seen.map((r) => r.id)).toEqual([...all.body.items, ...next.body.items].map((r: { id: number }) => r.id));
    });

    it('gives no cursor after a full last page of a list', async () => {
      const s = people.agent;
      const last = await s.agent.get('/api/requests?q=exact%20row&pageSize=25&page=3').expect(200);
      expect(last.body.items).toHaveLength(25);
      expect(last.body.nextCursor).toBeNull();
      const before = await s.agent.get('/api/requests?q=exact%20row&pageSize=25&page=2').expect(200);
      expect(before.body.nextCursor).toEqual(expect.any(String));
    });

    // The page of a search with more matches than the cap walks the sort's index and tests each row
    // as it passes; the plan made once for every pattern must keep that index (it cannot know how
    // many rows a pattern matches). In this file's data nearly every request is the one contractor's,
    // so for its walk the planner may take the created-at index of all requests with the contractor
    // as a filter, or the contractor's own: both walk in the sort's order and stop after the page
    // (which of the two it takes depends on the table's statistics at the moment).
    it.each([
      ['agent', 'closingDate', 'asc', 'request_viewers_closing_index'],
      ['agent', 'street', 'desc', 'request_viewers_street_index'],
      ['contractor', 'createdAt', 'desc', 'repair_requests_(contractor_)?created_index'],
      ['admin', 'street', 'asc', 'repair_requests_street_index'],
    ] as const)('walks the %s’s search in the sort’s index (%s %s: %s)', async (who, sort, direction, index) => {
      const user = people[who].user;
      const viewer: Viewer = { id: user.id, role: user.role, organisationId: user.organisationId };
      const filter: RequestListFilter = { page: 0, pageSize: 25, sort, direction, statuses: [], text: 'lane', id: null };
      const plan = await genericPlan(new RequestRepository(t.db).listStatement(viewer, filter, '2027-01-01'));
      expect(plan).toMatch(new RegExp(`Index Scan (Backward )?using ${index} `));
      expect(plan).not.toMatch(/Seq Scan on (repair_requests|request_viewers)/);
    });
  });

  it('responds 400 for an unknown status or sort', async () => {
    const res = await sessions.buyerAgent.agent.get('/api/requests?status=finished&sort=price&pageSize=1000');
    expect(res.status).toBe(400);
    expect(res.body.details.map((d: { path: string }) => d.path.split('.')[0]).sort()).toEqual(['pageSize', 'sort', 'status']);
  });
});

describe('POST /api/requests/:id/parties', () => {
  it.each(['buyerAgent', 'listingAgent', 'admin'] as const)('lets the %s invite a party', async (who) => {
    const email = `invitee-${who.toLowerCase()}@people.test`;
    const res = await sessions[who].agent.post(`/api/requests/${ownRequest.id}/parties`).set('x-csrf-token', sessions[who].csrfToken).send({ role: 'seller', email });
    expect(res.status).toBe(201);
    expect(res.body.parties.find((p: { email: string }) => p.email === email)).toMatchObject({ isPending: true, inviteUrl: expect.any(String) });
  });

  it.each(['seller', 'inspector', 'contractor'] as const)('responds 403 to the request’s %s', async (who) => {
    await sessions[who].agent.post(`/api/requests/${ownRequest.id}/parties`).set('x-csrf-token', sessions[who].csrfToken).send({ role: 'seller', email: 'x@people.test' }).expect(403);
  });

  it.each(OUTSIDERS)('responds 404 to %s', async (who) => {
    await sessions[who].agent.post(`/api/requests/${ownRequest.id}/parties`).set('x-csrf-token', sessions[who].csrfToken).send({ role: 'seller', email: 'x@people.test' }).expect(404);
  });

  it('hides invite links from parties who are not agents', async () => {
    const res = await sessions.seller.agent.get(`/api/requests/${ownRequest.id}`);
    const pending = res.body.parties.filter((p: { isPending: boolean }) => p.isPending);
    expect(pending.length).toBeGreaterThan(0);
    expect(pending.every((p: { inviteUrl: string | null }) => p.inviteUrl === null)).toBe(true);
  });

  it('responds 400 for a bad role or e-mail', async () => {
    const res = await sessions.buyerAgent.agent.post(`/api/requests/${ownRequest.id}/parties`).set('x-csrf-token', sessions.buyerAgent.csrfToken).send({ role: 'buyer-agent', email: 'bad' });
    expect(res.status).toBe(400);
    expect(res.body.details.map((d: { path: string }) => d.path).sort()).toEqual(['email', 'role']);
  });
});

describe('PUT /api/requests/:id/contractor', () => {
  it('lets an agent of the request assign another contractor, who then sees it', async () => {
    const res = await sessions.buyerAgent.agent.post('/api/requests').set('x-csrf-token', sessions.buyerAgent.csrfToken).send(validRequestBody());
    const id = res.body.id;
    await sessions.otherContractor.agent.get(`/api/requests/${id}`).expect(404);
    const put = await sessions.buyerAgent.agent.put(`/api/requests/${id}/contractor`).set('x-csrf-token', sessions.buyerAgent.csrfToken).send({ contractorOrganisationId: otherContractorOrg });
    expect(put.status).toBe(200);
    expect(put.body.contractor.id).toBe(otherContractorOrg);
    await sessions.otherContractor.agent.get(`/api/requests/${id}`).expect(200);
  });

  it('clears what the previous contractor set while pricing, and refuses once a quote was sent', async () => {
    const res = await sessions.buyerAgent.agent.post('/api/requests').set('x-csrf-token', sessions.buyerAgent.csrfToken).send(validRequestBody({ contractorOrganisationId: contractorOrg }));
    const id = res.body.id;
    await t.db('repair_requests').where({ id }).update({ status: 'pricing' });
    const [item] = await t.db('line_items')
      .insert({ request_id: id, code: 'double-tap', room: 'panel', severity: 'repair', status: 'out-of-scope', out_of_scope_reason: 'panel work we do not do', adder_ids: [1], visit_key: 'visit-2' })
      .returning('*');
    const put = await sessions.buyerAgent.agent.put(`/api/requests/${id}/contractor`).set('x-csrf-token', sessions.buyerAgent.csrfToken).send({ contractorOrganisationId: otherContractorOrg });
    expect(put.status).toBe(200);
    const after = await t.db('line_items').where({ id: item.id }).first();
    expect(after).toMatchObject({ status: 'open', out_of_scope_reason: null, adder_ids: [], entry_id: null, visit_key: 'visit-1', version: item.version + 1 });

    await t.db('repair_requests').where({ id }).update({ status: 'quoted' });
    const late = await sessions.buyerAgent.agent.put(`/api/requests/${id}/contractor`).set('x-csrf-token', sessions.buyerAgent.csrfToken).send({ contractorOrganisationId: contractorOrg });
    expect(late.status).toBe(409);
    expect(late.body.error).toMatch(/quote was sent/);
  });

  it('responds 403 to the assigned contractor and 404 to an outsider', async () => {
    await sessions.contractor.agent.put(`/api/requests/${ownRequest.id}/contractor`).set('x-csrf-token', sessions.contractor.csrfToken).send({ contractorOrganisationId: contractorOrg }).expect(403);
    await sessions.otherAgent.agent.put(`/api/requests/${ownRequest.id}/contractor`).set('x-csrf-token', sessions.otherAgent.csrfToken).send({ contractorOrganisationId: contractorOrg }).expect(404);
  });
});

describe('GET /api/contractors', () => {
  it('lists contractor organisations to agents', async () => {
    const res = await sessions.buyerAgent.agent.get('/api/contractors').expect(200);
    expect(res.body.map((o: { name: string }) => o.name)).toEqual(['Assigned Electric', 'Unassigned Electric']);
  });

  it.each(['seller', 'inspector', 'contractor'] as const)('responds 403 to a %s', async (who) => {
    await sessions[who].agent.get('/api/contractors').expect(403);
  });
});
