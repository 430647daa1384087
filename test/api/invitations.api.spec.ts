import request from 'supertest';
import { createTestApp, type TestApp } from '../helpers/test-app';
import { createUser, csrfTokenFor, resetDatabase, signIn, validRequestBody, type SignedIn } from '../helpers/fixtures';

let t: TestApp;
let agent: SignedIn;

beforeAll(async () => {
  t = createTestApp();
  await resetDatabase(t.db);
  agent = await signIn(t.app, await createUser(t.db, 'agent'));
});
afterAll(() => t.close());

async function openRequestInviting(sellerEmail: string): Promise<{ id: number; token: string }> {
  const res = await agent.agent.post('/api/requests').set('x-csrf-token', agent.csrfToken).send(validRequestBody({ sellerEmail }));
  expect(res.status).toBe(201);
  const url: string = res.body.parties.find((p: { role: string }) => p.role === 'seller').inviteUrl;
  return { id: res.body.id, token: url.split('/invite/')[1] };
}

describe('GET /api/invitations/:token', () => {
  it('describes the invitation without a session', async () => {
    const { token } = await openRequestInviting('look.up@people.test');
    const res = await request(t.app).get(`/api/invitations/${token}`).expect(200);
    expect(res.body).toMatchObject({
      email: 'look.up@people.test',
      role: 'seller',
      requestReference: expect.stringMatching(/^CC-/),
      propertyAddress: '14 Test Hollow Road, Marlow Springs, CO 81290',
      invitedByName: agent.user.name,
      hasAccount: false,
    });
  });

  it('responds 404 for an unknown or expired token', async () => {
    await request(t.app).get('/api/invitations/not-a-real-token').expect(404);
    const { token } = await openRequestInviting('expired@people.test');
    await t.db('request_parties').where({ invite_token: token }).update({ invite_expires_at: new Date(Date.now() - 1000) });
    await request(t.app).get(`/api/invitations/${token}`).expect(404);
  });
});

describe('POST /api/invitations/:token/accept', () => {
  it('makes the seller’s account, signs them in and makes them a party', async () => {
    const { id, token } = await openRequestInviting('new.owner@people.test');
    const visitor = request.agent(t.app);
    const csrf = await csrfTokenFor(visitor);
    const res = await visitor.post(`/api/invitations/${token}/accept`).set('x-csrf-token', csrf).send({ name: 'Nell Owner', password: 'a fine long password' });
    expect(res.status).toBe(200);
    expect(res.body.user).toMatchObject({ email: 'new.owner@people.test', role: 'seller', name: 'Nell Owner' });
    expect(res.body.requestId).toBe(id);
    const detail = await visitor.get(`/api/requests/${id}`).expect(200);
    expect(detail.body.myParts).toEqual(['seller']);
    // The link is spent: opening it again says so (and names nobody).
    const again = await request(t.app).get(`/api/invitations/${token}`).expect(409);
    expect(again.body).toEqual({ error: 'This invitation was accepted already. Sign in to open the request.', details: [] });
  });

  it('responds 400 with field details for a short password, and makes no account', async () => {
    const { token } = await openRequestInviting('short.pw@people.test');
    const visitor = request.agent(t.app);
    const csrf = await csrfTokenFor(visitor);
    const res = await visitor.post(`/api/invitations/${token}/accept`).set('x-csrf-token', csrf).send({ name: 'S', password: 'short' });
    expect(res.status).toBe(400);
    expect(res.body.details.map((d: { path: string }) => d.path).sort()).toEqual(['name', 'password']);
    expect(await t.db('users').where({ email: 'short.pw@people.test' }).first()).toBeUndefined();
  });

  it('asks an existing account holder to sign in first, then links them', async () => {
    const existing = await createUser(t.db, 'seller');
    const other = await createUser(t.db, 'agent');
    const res = await agent.agent.post('/api/requests').set('x-csrf-token', agent.csrfToken).send(validRequestBody());
    const id = res.body.id;
    // Invite the e-mail before the account exists, so the party is pending.
    await t.db('request_parties').insert({ request_id: id, role: 'seller', email: 'later@people.test', invite_token: 'token-for-later-account-0001', invite_expires_at: new Date(Date.now() + 86_400_000) });
    await t.db('users').where({ id: existing.id }).update({ email: 'later@people.test' });

    const anon = request.agent(t.app);
    const csrf = await csrfTokenFor(anon);
    await anon.post('/api/invitations/token-for-later-account-0001/accept').set('x-csrf-token', csrf).send({}).expect(409);

    const wrongPerson = await signIn(t.app, other);
    await wrongPerson.agent.post('/api/invitations/token-for-later-account-0001/accept').set('x-csrf-token', wrongPerson.csrfToken).send({}).expect(409);

    const owner = await signIn(t.app, { ...existing, email: 'later@people.test' });
    const accepted = await owner.agent.post('/api/invitations/token-for-later-account-0001/accept').set('x-csrf-token', owner.csrfToken).send({});
    expect(accepted.status).toBe(200);
    await owner.agent.get(`/api/requests/${id}`).expect(200);
  });

  it('responds 403 without a CSRF token', async () => {
    const { token } = await openRequestInviting('no.csrf@people.test');
    await request(t.app).post(`/api/invitations/${token}/accept`).send({ name: 'No Token', password: 'a fine long password' }).expect(403);
  });
});
