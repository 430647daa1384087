import request from 'supertest';
import { createTestApp, type TestApp } from '../helpers/test-app';
import { createUser, csrfTokenFor, PASSWORD, resetDatabase, signIn } from '../helpers/fixtures';

let t: TestApp;

beforeAll(async () => {
  t = createTestApp({ SIGN_IN_LIMIT: '5' });
  await resetDatabase(t.db);
});
afterAll(() => t.close());

describe('GET /api/health', () => {
  it('responds ok after a database round trip', async () => {
    const res = await request(t.app).get('/api/health').expect(200);
    expect(res.body).toEqual({ ok: true });
  });
});

describe('GET /api/auth/session', () => {
  it('answers 200 with no user for a visitor (a signed-out page load logs no failed request), and a usable CSRF token', async () => {
    const user = await createUser(t.db, 'agent');
    const agent = request.agent(t.app);
    const visitor = await agent.get('/api/auth/session').expect(200);
    expect(visitor.body.user).toBeNull();
    expect(typeof visitor.body.csrfToken).toBe('string');
    // The visitor's token is the one sign-in accepts.
    await agent.post('/api/auth/sign-in').set('x-csrf-token', visitor.body.csrfToken).send({ email: user.email, password: PASSWORD }).expect(200);
    const signedIn = await agent.get('/api/auth/session').expect(200);
    expect(signedIn.body.user).toMatchObject({ id: user.id, role: 'agent' });
    expect(signedIn.body.user.passwordHash).toBeUndefined();
  });
});

describe('POST /api/auth/sign-in', () => {
  describe('without a CSRF token', () => {
    it('responds 403 and does not sign in', async () => {
      const user = await createUser(t.db, 'agent');
      const agent = request.agent(t.app);
      const res = await agent.post('/api/auth/sign-in').send({ email: user.email, password: PASSWORD });
      expect(res.status).toBe(403);
      expect(res.body.error).toMatch(/csrf/i);
      await agent.get('/api/auth/me').expect(401);
    });
  });

  describe('with bad input', () => {
    it('responds 400 listing the fields', async () => {
      const agent = request.agent(t.app);
      const token = await csrfTokenFor(agent);
      const res = await agent.post('/api/auth/sign-in').set('x-csrf-token', token).send({ email: 'not-an-email' });
      expect(res.status).toBe(400);
      expect(res.body.details.map((d: { path: string }) => d.path).sort()).toEqual(['email', 'password']);
    });
  });

  describe('with the right password', () => {
    it('signs in, regenerates the session and issues a new CSRF token', async () => {
      const user = await createUser(t.db, 'seller');
      const agent = request.agent(t.app);
      const before = await agent.get('/api/auth/csrf');
      const cookieBefore = before.headers['set-cookie']?.[0]?.split(';')[0];
      const res = await agent.post('/api/auth/sign-in').set('x-csrf-token', before.body.csrfToken).send({ email: user.email.toUpperCase(), password: PASSWORD });
      expect(res.status).toBe(200);
      expect(res.body.user).toMatchObject({ id: user.id, role: 'seller', email: user.email });
      expect(res.body.user.passwordHash).toBeUndefined();
      const cookieAfter = res.headers['set-cookie']?.[0]?.split(';')[0];
      expect(cookieAfter).toBeDefined();
      expect(cookieAfter).not.toEqual(cookieBefore);
      expect(res.body.csrfToken).not.toEqual(before.body.csrfToken);
      expect(res.headers['set-cookie']?.[0]).toMatch(/HttpOnly/i);
      expect(res.headers['set-cookie']?.[0]).toMatch(/SameSite=Lax/i);
      const me = await agent.get('/api/auth/me').expect(200);
      expect(me.body.user.id).toBe(user.id);
    });

    it('rejects the pre-sign-in CSRF token afterwards', async () => {
      const user = await createUser(t.db, 'agent');
      const agent = request.agent(t.app);
      const oldToken = await csrfTokenFor(agent);
      await agent.post('/api/auth/sign-in').set('x-csrf-token', oldToken).send({ email: user.email, password: PASSWORD }).expect(200);
      await agent.post('/api/auth/sign-out').set('x-csrf-token', oldToken).expect(403);
    });
  });

  describe('with a wrong password', () => {
    it('responds 401 without saying which part was wrong', async () => {
      const user = await createUser(t.db, 'agent');
      const agent = request.agent(t.app);
      const token = await csrfTokenFor(agent);
      const wrong = await agent.post('/api/auth/sign-in').set('x-csrf-token', token).send({ email: user.email, password: 'nope-nope-nope' });
      const unknown = await agent.post('/api/auth/sign-in').set('x-csrf-token', token).send({ email: 'nobody@people.test', password: 'nope-nope-nope' });
      expect(wrong.status).toBe(401);
      expect(unknown.status).toBe(401);
      expect(wrong.body.error).toEqual(unknown.body.error);
    });
  });

  describe('after too many failed attempts', () => {
    it('responds 429 even to the right password', async () => {
      const limited = createTestApp({ SIGN_IN_LIMIT: '3' });
      // Counters live in PostgreSQL and outlast an app instance: start from none, leave none.
      await limited.db('rate_limit_counters').delete();
      try {
        const user = await createUser(limited.db, 'agent');
        const agent = request.agent(limited.app);
        const token = await csrfTokenFor(agent);
        for (let i = 0; i < 3; i++) {
          await agent.post('/api/auth/sign-in').set('x-csrf-token', token).send({ email: user.email, password: 'wrong-password' }).expect(401);
        }
        const res = await agent.post('/api/auth/sign-in').set('x-csrf-token', token).send({ email: user.email, password: PASSWORD });
        expect(res.status).toBe(429);
        expect(res.body.error).toMatch(/too many/i);
        expect(res.body.details).toEqual([]);
      } finally {
        await limited.db('rate_limit_counters').delete();
        await limited.close();
      }
    });
  });
});

describe('POST /api/auth/sign-out', () => {
  it('destroys the session', async () => {
    const user = await createUser(t.db, 'inspector');
    const { agent, csrfToken } = await signIn(t.app, user);
    await agent.post('/api/auth/sign-out').set('x-csrf-token', csrfToken).expect(204);
    await agent.get('/api/auth/me').expect(401);
    const { count } = (await t.db('sessions').count<{ count: string }[]>({ count: '*' }).whereRaw("sess::text LIKE ?", [`%"user":${user.id}%`]))[0];
    expect(Number(count)).toBe(0);
  });

  it('responds 401 when not signed in', async () => {
    const agent = request.agent(t.app);
    const token = await csrfTokenFor(agent);
    await agent.post('/api/auth/sign-out').set('x-csrf-token', token).expect(401);
  });
});

describe('POST /api/auth/password', () => {
  it('changes the password when the current one is right', async () => {
    const user = await createUser(t.db, 'agent');
    const { agent, csrfToken } = await signIn(t.app, user);
    await agent.post('/api/auth/password').set('x-csrf-token', csrfToken).send({ currentPassword: PASSWORD, newPassword: 'a much longer new password' }).expect(204);
    await signIn(t.app, user, 'a much longer new password');
    await expect(signIn(t.app, user)).rejects.toThrow(/401/);
  });

  it('ends the account’s other sessions at once and keeps the one that changed it', async () => {
    const user = await createUser(t.db, 'agent');
    const changing = await signIn(t.app, user);
    const other = await signIn(t.app, user);
    await other.agent.get('/api/requests').expect(200);
    await changing.agent.post('/api/auth/password').set('x-csrf-token', changing.csrfToken).send({ currentPassword: PASSWORD, newPassword: 'a much longer new password' }).expect(204);
    await other.agent.get('/api/requests').expect(401);
    await other.agent.get('/api/auth/me').expect(401);
    await changing.agent.get('/api/requests').expect(200);
    const me = await changing.agent.get('/api/auth/me').expect(200);
    expect(me.body.user.id).toBe(user.id);
  });

  it('responds 400 on the field when the current password is wrong or the new one too short', async () => {
    const user = await createUser(t.db, 'agent');
    const { agent, csrfToken } = await signIn(t.app, user);
    const wrong = await agent.post('/api/auth/password').set('x-csrf-token', csrfToken).send({ currentPassword: 'not-it-at-all', newPassword: 'a much longer new password' });
    expect(wrong.status).toBe(400);
    expect(wrong.body.details).toEqual([{ path: 'currentPassword', message: expect.any(String) }]);
    const short = await agent.post('/api/auth/password').set('x-csrf-token', csrfToken).send({ currentPassword: PASSWORD, newPassword: 'short' });
    expect(short.status).toBe(400);
    expect(short.body.details[0].path).toBe('newPassword');
  });
});

describe('stored passwords', () => {
  it('are bcrypt hashes, never the password', async () => {
    const user = await createUser(t.db, 'agent');
    const row = await t.db('users').where({ id: user.id }).first();
    expect(row.password_hash).toMatch(/^\$2[aby]\$/);
    expect(row.password_hash).not.toContain(PASSWORD);
  });
});

describe('security headers', () => {
  it('are set by helmet', async () => {
    const res = await request(t.app).get('/api/health');
    expect(res.headers['content-security-policy']).toContain("default-src 'self'");
    expect(res.headers['x-content-type-options']).toBe('nosniff');
    expect(res.headers['x-powered-by']).toBeUndefined();
  });
});
