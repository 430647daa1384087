// Reliability: invitations respect roles, sessions and sign-in hold against guessing, simultaneous
// writes answer 201/409 (never 500), and no malformed input reaches a 500. Loopback only.
import request from 'supertest';
import { createOrganisation, createUser, csrfTokenFor, PASSWORD, resetDatabase, signIn, validRequestBody, type SignedIn } from '../../helpers/fixtures';
import { createTestApp, type TestApp } from '../../helpers/test-app';

let t: TestApp;
let agent: SignedIn;
let contractor: SignedIn;
let admin: SignedIn;
let contractorOrg: number;

beforeAll(async () => {
  t = createTestApp();
  await resetDatabase(t.db);
  contractorOrg = await createOrganisation(t.db, 'contractor');
  agent = await signIn(t.app, await createUser(t.db, 'agent'));
  contractor = await signIn(t.app, await createUser(t.db, 'contractor', contractorOrg));
  admin = await signIn(t.app, await createUser(t.db, 'admin'));
});
afterAll(() => t.close());
afterEach(() => t.db('rate_limit_counters').delete());

const inviteLink = (body: { parties: { role: string; inviteUrl: string | null }[] }, role: string) =>
  body.parties.find((p) => p.role === role)!.inviteUrl!.split('/invite/')[1];

describe('invitations', () => {
  it('refuse a seller account the listing-agent part of another request (no role is raised)', async () => {
    const email = `seller-${Date.now()}@people.test`;
    // The seller's account is made through one request's seller invitation…
    const first = await agent.agent.post('/api/requests').set('x-csrf-token', agent.csrfToken).send(validRequestBody({ sellerEmail: email })).expect(201);
    const anon = request.agent(t.app);
    const csrf = await csrfTokenFor(anon);
    await anon.post(`/api/invitations/${inviteLink(first.body, 'seller')}/accept`).set('x-csrf-token', csrf).send({ name: 'Sam Seller', password: PASSWORD }).expect(200);
    // …and another request invites the same e-mail as its listing agent.
    const second = await agent.agent.post('/api/requests').set('x-csrf-token', agent.csrfToken).send(validRequestBody({ listingAgentEmail: email })).expect(201);
    const row = await t.db('users').where({ email }).first();
    const seller = await signIn(t.app, { id: row.id, email, name: row.name, role: row.role, organisationId: null, organisationName: null });
    const res = await seller.agent.post(`/api/invitations/${inviteLink(second.body, 'listing-agent')}/accept`).set('x-csrf-token', seller.csrfToken).send({});
    expect(res.status).toBe(403);
    expect(res.body.error).toMatch(/invitation is for an agent/);
    await seller.agent.get(`/api/requests/${second.body.id}`).expect(404);
    await seller.agent.put(`/api/requests/${second.body.id}/contractor`).set('x-csrf-token', seller.csrfToken).send({ contractorOrganisationId: contractorOrg }).expect(404);
  });

  it('accepted 10 times at once make one account and answer 409 to the rest', async () => {
    const email = `inspector-${Date.now()}@people.test`;
    const created = await agent.agent.post('/api/requests').set('x-csrf-token', agent.csrfToken).send(validRequestBody({ inspectorEmail: email })).expect(201);
    const token = inviteLink(created.body, 'inspector');
    const people = await Promise.all(Array.from({ length: 10 }, async () => {
      const anon = request.agent(t.app);
      return { anon, csrf: await csrfTokenFor(anon) };
    }));
    const results = await Promise.all(people.map(({ anon, csrf }) => anon.post(`/api/invitations/${token}/accept`).set('x-csrf-token', csrf).send({ name: 'Ivy Inspector', password: PASSWORD })));
    expect(results.map((r) => r.status).sort()).toEqual([200, ...Array(9).fill(409)]);
    expect(Number((await t.db('users').where({ email }).count<{ c: string }[]>({ c: '*' }))[0].c)).toBe(1);
  });
});

describe('sessions and sign-in', () => {
  it('a password change ends the user’s other sessions and keeps the one that made it', async () => {
    const user = await createUser(t.db, 'agent');
    const [here, elsewhere] = [await signIn(t.app, user), await signIn(t.app, user)];
    await here.agent.post('/api/auth/password').set('x-csrf-token', here.csrfToken).send({ currentPassword: PASSWORD, newPassword: 'a far longer new password' }).expect(204);
    await here.agent.get('/api/auth/me').expect(200);
    await elsewhere.agent.get('/api/auth/me').expect(401);
  });

  it('password changes are limited per account (429 after the limit)', async () => {
    const s = await signIn(t.app, await createUser(t.db, 'agent'));
    const statuses: number[] = [];
    for (let i = 0; i < 6; i++) {
      statuses.push((await s.agent.post('/api/auth/password').set('x-csrf-token', s.csrfToken).send({ currentPassword: `guess-${i}`, newPassword: 'a far longer new password' })).status);
    }
    expect(statuses).toEqual([400, 400, 400, 400, 400, 429]);
  });

  it('X-Forwarded-For is ignored unless a proxy is configured: new headers do not reset the address limit', async () => {
    const limited = createTestApp({ SIGN_IN_LIMIT: '3', SIGN_IN_ACCOUNT_LIMIT: '100' });
    try {
      const anon = request.agent(limited.app);
      const csrf = await csrfTokenFor(anon);
      const statuses: number[] = [];
      for (let i = 0; i < 5; i++) {
        statuses.push((await anon.post('/api/auth/sign-in').set('x-csrf-token', csrf).set('x-forwarded-for', `203.0.113.${i + 1}`).send({ email: `nobody${i}@people.test`, password: 'wrong-password' })).status);
      }
      expect(statuses).toEqual([401, 401, 401, 429, 429]);
    } finally {
      await limited.close();
    }
  });

  it('behind a configured proxy, one account is still limited whatever address the attempts come from, and the counters outlast a restart', async () => {
    const user = await createUser(t.db, 'agent');
    const attempt = async (app: TestApp, i: number) => {
      const anon = request.agent(app.app);
      const csrf = await csrfTokenFor(anon);
      return (await anon.post('/api/auth/sign-in').set('x-csrf-token', csrf).set('x-forwarded-for', `198.51.100.${i}`).send({ email: user.email, password: 'wrong-password' })).status;
    };
    const first = createTestApp({ TRUST_PROXY: 'loopback', SIGN_IN_LIMIT: '100', SIGN_IN_ACCOUNT_LIMIT: '3' });
    const before = [await attempt(first, 1), await attempt(first, 2)];
    await first.close();
    const second = createTestApp({ TRUST_PROXY: 'loopback', SIGN_IN_LIMIT: '100', SIGN_IN_ACCOUNT_LIMIT: '3' });
    try {
      const after = [await attempt(second, 3), await attempt(second, 4)];
      expect([...before, ...after]).toEqual([401, 401, 401, 429]);
    } finally {
      await second.close();
    }
  });
});

describe('simultaneous rate-book entries with one name', () => {
  it('are all created (201), each with its own key', async () => {
    const entry = { code: 'cover-plate-missing', name: 'Install cover plate', unit: 'plate', pricing: { mode: 'flat', firstUnitCents: 1_500, additionalUnitCents: 900, hardSiteMultiplierBp: 12_000 } };
    const results = await Promise.all(Array.from({ length: 10 }, () => contractor.agent.post('/api/rate-book/entries').set('x-csrf-token', contractor.csrfToken).send(entry)));
    expect(results.map((r) => r.status)).toEqual(Array(10).fill(201));
    expect(new Set(results.map((r) => r.body.key)).size).toBe(10);
  });
});

// Every route with a body or a query, the user whose role reaches its schema, and a body shape for it.
const INT4_OVERFLOW = 2 ** 31;
const ROUTES: [string, string, 'agent' | 'contractor' | 'admin', Record<string, unknown>][] = [
  ['post', '/api/requests', 'agent', validRequestBody({ contractorOrganisationId: 1 })],
  ['get', '/api/requests', 'agent', {}],
  ['post', '/api/requests/1/parties', 'agent', { role: 'seller', email: 'x@people.test' }],
  ['put', '/api/requests/1/contractor', 'agent', { contractorOrganisationId: 1 }],
  ['post', '/api/requests/1/reports/paste', 'agent', { text: 'ELECTRICAL open junction box in the garage ceiling.', name: 'n' }],
  ['post', '/api/requests/1/reports/1/reparse', 'agent', {}],
  ['get', '/api/requests/1/reports/1/text', 'agent', {}],
  ['post', '/api/requests/1/items', 'agent', { code: 'open-junction-box', room: 'garage', location: 'l', quantity: 1, reportFileId: 1, evidenceStart: 0, evidenceEnd: 4 }],
  ['patch', '/api/requests/1/items/1', 'agent', { version: 1, location: 'l', necRefs: ['210.8'] }],
  ['delete', '/api/requests/1/items/1', 'agent', {}],
  ['post', '/api/requests/1/items/merge', 'agent', { items: [{ id: 1, version: 1 }, { id: 2, version: 1 }] }],
  ['post', '/api/requests/1/items/1/split', 'agent', { version: 1, quantities: [1, 1] }],
  ['post', '/api/requests/1/items/confirm', 'agent', { items: [{ id: 1, version: 1 }] }],
  ['patch', '/api/requests/1/pricing', 'contractor', { items: [{ id: 1, version: 1 }], set: { entryId: 1, adderIds: [1], quantity: 1, visitKey: 'visit-1' } }],
  ['post', '/api/requests/1/pricing/auto-price', 'contractor', { items: [{ id: 1, version: 1 }] }],
  ['post', '/api/requests/1/pricing/out-of-scope', 'contractor', { items: [{ id: 1, version: 1 }], reason: 'not ours' }],
  ['put', '/api/requests/1/pricing/visits', 'contractor', { visits: [{ key: 'visit-1', adderIds: [1], hasPermit: false }] }],
  ['put', '/api/requests/1/site-conditions', 'agent', { adderIds: [1] }],
  ['post', '/api/requests/1/quotes', 'contractor', { note: 'n', claimedTotals: { totalCents: 1 } }],
  ['put', '/api/rate-book/terms', 'contractor', { version: 1, terms: {} }],
  ['post', '/api/rate-book/entries', 'contractor', { name: 'n', unit: 'u', code: null, pricing: { mode: 'flat', firstUnitCents: 1, additionalUnitCents: 1, hardSiteMultiplierBp: 10_000 } }],
  ['patch', '/api/rate-book/entries/1', 'contractor', { version: 1, name: 'n' }],
  ['delete', '/api/rate-book/entries/1', 'contractor', {}],
  ['post', '/api/rate-book/entries/import', 'contractor', { csv: 'key,name\nx,y' }],
  ['get', '/api/rate-book/changes', 'contractor', {}],
  ['post', '/api/rate-book/adders', 'contractor', { name: 'n', effect: { kind: 'minutes-per-unit', minutes: 5 }, appliesWhenBuiltBefore: 1950 }],
  ['patch', '/api/rate-book/adders/1', 'contractor', { version: 1, name: 'n' }],
  ['post', '/api/admin/organisations', 'admin', { name: 'n', kind: 'brokerage' }],
  ['post', '/api/admin/users', 'admin', { email: 'x@people.test', name: 'n', role: 'agent', organisationId: 1, password: 'long enough password' }],
  ['get', '/api/admin/users', 'admin', {}],
  ['post', '/api/auth/password', 'agent', { currentPassword: 'x', newPassword: 'long enough password' }],
  ['post', '/api/invitations/abc/accept', 'agent', { name: 'n', password: 'long enough password' }],
  ['put', '/api/admin/organisations/1', 'admin', { name: 'n', kind: 'brokerage' }],
  ['patch', '/api/admin/users/1', 'admin', { name: 'n' }],
  ['put', '/api/admin/users/1/active', 'admin', { isActive: true }],
  ['post', '/api/requests/1/approval', 'agent', { quoteVersion: 1, decisions: [{ lineItemId: 1, decision: 'approved', note: 'n' }], signerName: 'Pat Seller', hasConsented: true }],
  ['post', '/api/requests/1/change-orders', 'contractor', { reason: 'found behind the wall', lines: [{ kind: 'quantity', lineItemId: 1, quantity: 2 }] }],
  ['post', '/api/requests/1/change-orders/1/decision', 'agent', { decision: 'approve', signerName: 'Pat Seller', hasConsented: true, note: 'n' }],
  ['post', '/api/requests/1/payments', 'agent', { plan: 'card-deposit', idempotencyKey: 'probe-key-0123456789' }],
  ['post', '/api/requests/1/payments/funds', 'contractor', { paymentId: 1, amountCents: 100, receivedOn: '2027-01-15', reference: 'wire 1' }],
  ['post', '/api/requests/1/payments/1/refunds', 'contractor', { amountCents: 100, reason: 'could not be done', idempotencyKey: 'probe-key-0123456789' }],
  ['post', '/api/requests/1/invoices', 'contractor', {}],
  ['get', '/api/requests/1/activity', 'agent', {}],
  ['get', '/api/dashboards/agent', 'agent', {}],
  ['get', '/api/dashboards/contractor', 'contractor', {}],
  ['put', '/api/notifications/preferences', 'agent', { preferences: [{ kind: 'quote-sent', delivery: 'digest' }] }],
  ['post', '/api/notifications/unsubscribe/abc', 'agent', {}],
  ['get', '/api/mailbox', 'admin', {}],
  ['post', '/api/requests/1/visits', 'contractor', { date: '2027-01-12', arrivalFrom: '08:00', arrivalTo: '10:00', electricianId: 1, accessNotes: 'lockbox 1234' }],
  ['post', '/api/requests/1/visits/1/start', 'contractor', {}],
  ['post', '/api/requests/1/visits/1/finish', 'contractor', {}],
  ['post', '/api/requests/1/items/1/correction', 'contractor', { record: JSON.stringify({ outcome: 'corrected', workPerformed: 'w', visitId: 1 }) }],
  ['get', '/api/requests/1/work', 'contractor', {}],
  ['post', '/api/requests/1/work/resume', 'contractor', {}],
  ['post', '/api/requests/1/letters', 'contractor', { permitNumber: 'P-1', isPermitNotRequired: false, warranty: 'one year', signatureName: 'Sam Okafor' }],
  ['get', '/api/requests/1/letters/1.pdf', 'agent', {}],
  ['post', '/api/requests/1/proof-review', 'agent', { decision: 'not-accept', note: 'n', items: [{ itemId: 1, reason: 'still reversed' }] }],
  ['get', '/api/verify/abc', 'agent', {}],
];

/** The body with every string, number or date replaced as `bad` decides (recursively). */
function spoil(value: unknown, bad: (v: unknown, key: string) => unknown, key = ''): unknown {
  if (Array.isArray(value)) return value.map((v) => spoil(v, bad, key));
  if (value !== null && typeof value === 'object') return Object.fromEntries(Object.entries(value).map(([k, v]) => [k, spoil(v, bad, k)]));
  return bad(value, key);
}

const PROBES: [string, (body: Record<string, unknown>) => { body?: unknown; query?: Record<string, string>; path?: (p: string) => string; raw?: string }][] = [
  ['NUL in every text field', (b) => ({ body: spoil(b, (v) => (typeof v === 'string' ? `${v}\u0000x` : v)) })],
  ['2^31 in every number (ids, versions, counts)', (b) => ({ body: spoil(b, (v) => (typeof v === 'number' ? INT4_OVERFLOW : v)) })],
  ['extreme dates', (b) => ({ body: { ...b, closingDate: '0000-01-01', appliesWhenBuiltBefore: -1e308 } })],
  ['NUL and 2^31 in the query', () => ({ query: { q: 'a\u0000b', page: String(INT4_OVERFLOW * 1e6), version: String(INT4_OVERFLOW), status: '\u0000' } })],
  ['NUL and 2^31 in the path', () => ({ path: (p) => p.replace(/\/1(\/|$)/, `/${INT4_OVERFLOW}$1`).replace(/abc/, '%00') })],
  ['a body over the size limit', () => ({ raw: JSON.stringify({ text: 'x'.repeat(1_200_000) }) })],
  ['malformed JSON', () => ({ raw: '{"text": "unterminated' })],
  ['nesting deeper than any form', () => ({ raw: `${'{"a":'.repeat(500)}1${'}'.repeat(500)}` })],
];

describe('malformed input never answers 500', () => {
  const cases = ROUTES.flatMap(([method, path, who, body]) => PROBES.map(([probe, make]) => [`${method.toUpperCase()} ${path}: ${probe}`, method, path, who, body, make] as const));

  it.each(cases)('%s', async (_name, method, path, who, body, make) => {
    const s = { agent, contractor, admin }[who];
    const probe = make(body);
    const url = probe.path ? probe.path(path) : path;
    let req = (s.agent as unknown as Record<string, (url: string) => request.Test>)[method](url).set('x-csrf-token', s.csrfToken);
    if (probe.query) req = req.query(probe.query);
    if (probe.raw !== undefined) req = req.set('content-type', 'application/json').send(probe.raw);
    else if (method !== 'get' && method !== 'delete') req = req.send((probe.body ?? body) as object);
    const res = await req;
    // A probe that does not apply to a route (no date in its body, no id in its path) may succeed;
    // what must never happen is a 500, and every refusal has the API's error shape.
    expect(res.status).toBeLessThan(500);
    if (res.status >= 400) expect(res.body).toEqual({ error: expect.any(String), details: expect.any(Array) });
  });
});
