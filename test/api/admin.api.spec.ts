import request from 'supertest';
import { createTestApp, type TestApp } from '../helpers/test-app';
import { createOrganisation, createUser, resetDatabase, signIn, type SignedIn } from '../helpers/fixtures';

let t: TestApp;
let admin: SignedIn;

beforeAll(async () => {
  t = createTestApp();
  await resetDatabase(t.db);
  admin = await signIn(t.app, await createUser(t.db, 'admin'));
});
afterAll(() => t.close());

describe('admin routes', () => {
  it.each(['agent', 'seller', 'contractor', 'inspector'] as const)('respond 403 to a %s', async (role) => {
    const org = role === 'contractor' ? await createOrganisation(t.db, 'contractor') : null;
    const s = await signIn(t.app, await createUser(t.db, role, org));
    await s.agent.get('/api/admin/users').expect(403);
    await s.agent.get('/api/admin/organisations').expect(403);
    await s.agent.post('/api/admin/users').set('x-csrf-token', s.csrfToken).send({}).expect(403);
    await s.agent.post('/api/admin/organisations').set('x-csrf-token', s.csrfToken).send({}).expect(403);
  });

  it('respond 401 without a session', async () => {
    await request(t.app).get('/api/admin/users').expect(401);
  });
});

describe('POST /api/admin/organisations', () => {
  it('creates a contractor with its licence', async () => {
    const res = await admin.agent
      .post('/api/admin/organisations')
      .set('x-csrf-token', admin.csrfToken)
      .send({ name: 'Sparrow Wiring LLC', kind: 'contractor', licenceNumber: 'EC-777', licenceState: 'co', licenceClass: 'Master', phone: '' });
    expect(res.status).toBe(201);
    expect(res.body).toMatchObject({ name: 'Sparrow Wiring LLC', kind: 'contractor', licenceNumber: 'EC-777', licenceState: 'CO', phone: null });
  });

  it('responds 400 when a contractor has no licence', async () => {
    const res = await admin.agent.post('/api/admin/organisations').set('x-csrf-token', admin.csrfToken).send({ name: 'No Licence Electric', kind: 'contractor' });
    expect(res.status).toBe(400);
    expect(res.body.details.map((d: { path: string }) => d.path).sort()).toEqual(['licenceNumber', 'licenceState']);
  });
});

describe('POST /api/admin/users', () => {
  it('creates a user who can then sign in', async () => {
    const org = await createOrganisation(t.db, 'inspection-company');
    const res = await admin.agent
      .post('/api/admin/users')
      .set('x-csrf-token', admin.csrfToken)
      .send({ email: 'Fresh.Inspector@People.test', name: 'Fresh Inspector', role: 'inspector', organisationId: org, password: 'inspector password' });
    expect(res.status).toBe(201);
    expect(res.body).toMatchObject({ email: 'fresh.inspector@people.test', role: 'inspector', organisationId: org });
    await signIn(t.app, res.body, 'inspector password');
  });

  it('responds 400 for a taken e-mail, a mismatched organisation, or bad fields', async () => {
    const existing = await createUser(t.db, 'seller');
    const taken = await admin.agent.post('/api/admin/users').set('x-csrf-token', admin.csrfToken).send({ email: existing.email, name: 'Dup', role: 'seller', organisationId: null, password: 'long enough pw' });
    expect(taken.status).toBe(400);
    expect(taken.body.details[0].path).toBe('email');
    const brokerage = await createOrganisation(t.db, 'brokerage');
    const mismatch = await admin.agent.post('/api/admin/users').set('x-csrf-token', admin.csrfToken).send({ email: 'c@people.test', name: 'Con Tractor', role: 'contractor', organisationId: brokerage, password: 'long enough pw' });
    expect(mismatch.status).toBe(400);
    expect(mismatch.body.details[0].path).toBe('organisationId');
    const bad = await admin.agent.post('/api/admin/users').set('x-csrf-token', admin.csrfToken).send({ email: 'x', name: '', role: 'boss', organisationId: null, password: 'x' });
    expect(bad.status).toBe(400);
    expect(bad.body.details.map((d: { path: string }) => d.path).sort()).toEqual(['email', 'name', 'password', 'role']);
  });
});

describe('GET /api/admin/users and /organisations', () => {
  it('page the lists', async () => {
    const users = await admin.agent.get('/api/admin/users?pageSize=2&page=0').expect(200);
    expect(users.body.items).toHaveLength(2);
    expect(users.body.total).toBeGreaterThan(2);
    expect(users.body.items[0].passwordHash).toBeUndefined();
    const orgs = await admin.agent.get('/api/admin/organisations?pageSize=1').expect(200);
    expect(orgs.body.items).toHaveLength(1);
    expect(orgs.body.total).toBeGreaterThan(1);
  });
});
