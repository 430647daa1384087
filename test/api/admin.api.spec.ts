import request from 'supertest';
import { createTestApp, type TestApp } from '../helpers/test-app';
import { createOrganisation, createUser, csrfTokenFor, resetDatabase, signIn, type SignedIn } from '../helpers/fixtures';

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

describe('changing a person (admin only)', () => {
  const write = (s: SignedIn, method: 'patch' | 'put' | 'post', path: string) => s.agent[method](path).set('x-csrf-token', s.csrfToken);

  it('respond 403 to other roles, 401 without a session and 404 for an unknown account', async () => {
    const target = await createUser(t.db, 'seller');
    const agent = await signIn(t.app, await createUser(t.db, 'agent', await createOrganisation(t.db, 'brokerage')));
    await write(agent, 'patch', `/api/admin/users/${target.id}`).send({ name: 'X Y', email: target.email, organisationId: null }).expect(403);
    await write(agent, 'put', `/api/admin/users/${target.id}/active`).send({ isActive: false }).expect(403);
    await write(agent, 'post', `/api/admin/users/${target.id}/password-reset`).expect(403);
    await write(agent, 'put', `/api/admin/organisations/1`).send({}).expect(403);
    const visitor = request.agent(t.app);
    const visitorToken = await csrfTokenFor(visitor);
    await visitor.post(`/api/admin/users/${target.id}/password-reset`).set('x-csrf-token', visitorToken).expect(401);
    await write(admin, 'post', '/api/admin/users/999999/password-reset').expect(404);
    await write(admin, 'put', '/api/admin/users/999999/active').send({ isActive: false }).expect(404);
    await write(admin, 'patch', '/api/admin/users/abc').send({ name: 'X Y', email: 'x@y.test', organisationId: null }).expect(404);
  });

  it('edits the name, e-mail and organisation, with field errors for a taken e-mail or a wrong organisation', async () => {
    const brokerage = await createOrganisation(t.db, 'brokerage');
    const agent = await createUser(t.db, 'agent', brokerage);
    const other = await createUser(t.db, 'seller');
    const res = await write(admin, 'patch', `/api/admin/users/${agent.id}`).send({ name: '  Renamed Agent ', email: 'Renamed.Agent@People.test', organisationId: brokerage });
    expect(res.status).toBe(200);
    expect(res.body).toMatchObject({ id: agent.id, name: 'Renamed Agent', email: 'renamed.agent@people.test', role: 'agent', isActive: true });

    const taken = await write(admin, 'patch', `/api/admin/users/${agent.id}`).send({ name: 'Renamed Agent', email: other.email, organisationId: brokerage });
    expect(taken.status).toBe(400);
    expect(taken.body.details).toEqual([{ path: 'email', message: expect.any(String) }]);
    const contractorOrg = await createOrganisation(t.db, 'contractor');
    const misfit = await write(admin, 'patch', `/api/admin/users/${agent.id}`).send({ name: 'Renamed Agent', email: 'renamed.agent@people.test', organisationId: contractorOrg });
    expect(misfit.status).toBe(400);
    expect(misfit.body.details[0].path).toBe('organisationId');
    const bad = await write(admin, 'patch', `/api/admin/users/${agent.id}`).send({ name: 'x', email: 'nope' });
    expect(bad.status).toBe(400);
    expect(bad.body.details.map((d: { path: string }) => d.path).sort()).toEqual(['email', 'name', 'organisationId']);
  });

  it('deactivates an account: its open session ends at once and it can no longer sign in; reactivating lets it back', async () => {
    const seller = await createUser(t.db, 'seller');
    const session = await signIn(t.app, seller);
    await session.agent.get('/api/auth/me').expect(200);

    const off = await write(admin, 'put', `/api/admin/users/${seller.id}/active`).send({ isActive: false });
    expect(off.status).toBe(200);
    expect(off.body.isActive).toBe(false);
    await session.agent.get('/api/auth/me').expect(401);
    await session.agent.get('/api/requests').expect(401);
    await expect(signIn(t.app, seller)).rejects.toThrow();

    await write(admin, 'put', `/api/admin/users/${seller.id}/active`).send({ isActive: true }).expect(200);
    await signIn(t.app, seller);
    await write(admin, 'put', `/api/admin/users/${seller.id}/active`).send({ isActive: 'no' }).expect(400);
  });

  it('will not let administrators deactivate themselves (409)', async () => {
    const me = await admin.agent.get('/api/auth/me').expect(200);
    await write(admin, 'put', `/api/admin/users/${me.body.user.id}/active`).send({ isActive: false }).expect(409);
  });

  it('resets a password: answers a temporary one once, ends the sessions, and the old password stops working', async () => {
    const inspector = await createUser(t.db, 'inspector', await createOrganisation(t.db, 'inspection-company'));
    const session = await signIn(t.app, inspector);
    const res = await write(admin, 'post', `/api/admin/users/${inspector.id}/password-reset`);
    expect(res.status).toBe(200);
    expect(res.body.temporaryPassword).toMatch(/^[a-z2-9]{4}(-[a-z2-9]{4}){3}$/);
    await session.agent.get('/api/auth/me').expect(401);
    await expect(signIn(t.app, inspector)).rejects.toThrow();
    await signIn(t.app, inspector, res.body.temporaryPassword);
  });
});

describe('PUT /api/admin/organisations/:id', () => {
  it('edits an organisation’s name, phone and licence but not its kind', async () => {
    const id = await createOrganisation(t.db, 'contractor');
    const body = { name: 'Renamed Electric', kind: 'contractor', phone: '555-0100', licenceNumber: 'EC-9', licenceState: 'CO', licenceClass: 'Master' };
    const res = await admin.agent.put(`/api/admin/organisations/${id}`).set('x-csrf-token', admin.csrfToken).send(body);
    expect(res.status).toBe(200);
    expect(res.body).toMatchObject({ id, name: 'Renamed Electric', phone: '555-0100', licenceNumber: 'EC-9', licenceState: 'CO' });
    const kind = await admin.agent.put(`/api/admin/organisations/${id}`).set('x-csrf-token', admin.csrfToken).send({ ...body, kind: 'brokerage' });
    expect(kind.status).toBe(400);
    expect(kind.body.details[0].path).toBe('kind');
    await admin.agent.put('/api/admin/organisations/999999').set('x-csrf-token', admin.csrfToken).send(body).expect(404);
    await admin.agent.put(`/api/admin/organisations/${id}`).set('x-csrf-token', admin.csrfToken).send({ ...body, licenceNumber: '' }).expect(400);
  });
});
