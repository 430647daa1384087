// Sessions and their users kept for a moment in each server process (server/src/auth/session-cache.ts):
// every change ends the kept copy at once in the process that made it, in every other process when
// PostgreSQL's notice arrives, and a process that stops listening keeps nothing. The apps here keep a
// session for a minute, so what ends a session in these tests is the change, never the time.
import { createTestApp, type TestApp } from '../helpers/test-app';
import { createOrganisation, createUser, PASSWORD, resetDatabase, signIn, type SignedIn } from '../helpers/fixtures';

const KEPT_FOR_A_MINUTE = { sessionCacheMs: 60_000 };
const NEW_PASSWORD = 'a much longer new password';

let first: TestApp;
let second: TestApp;

/** Polls `check` every 20 ms until it holds or `withinMs` has passed; answers whether it held (and when). */
async function eventually(check: () => Promise<boolean> | boolean, withinMs: number): Promise<{ held: boolean; afterMs: number }> {
  const started = Date.now();
  for (;;) {
    if (await check()) return { held: true, afterMs: Date.now() - started };
    if (Date.now() - started > withinMs) return { held: false, afterMs: Date.now() - started };
    await new Promise((resolve) => setTimeout(resolve, 20));
  }
}

const listening = async (t: TestApp) => expect((await eventually(() => t.sessionCache.listening, 30_000)).held).toBe(true);

/**
 * Asks for the signed-in user until the process keeps the session. The notice of the session's own
 * last write (sign-in saves it) reaches the process at some moment after commit and rightly drops the
 * copy once; the request after it keeps the session again.
 */
async function keptAfterRequest(t: TestApp, s: SignedIn): Promise<boolean> {
  const kept = await eventually(async () => {
    await s.agent.get('/api/auth/me').expect(200);
    return t.sessionCache.size >= 1;
  }, 2_000);
  return kept.held;
}

/** Ends the session row of `sid` without telling anyone (triggers off for this one statement). */
async function deleteUnannounced(t: TestApp, userId: number): Promise<void> {
  await t.db.transaction(async (trx) => {
    await trx.raw('SET LOCAL session_replication_role = replica');
    await trx.raw(`DELETE FROM sessions WHERE (sess::jsonb -> 'passport' ->> 'user') = ?`, [String(userId)]);
  });
}

const changePassword = (s: SignedIn) =>
  s.agent.post('/api/auth/password').set('x-csrf-token', s.csrfToken).send({ currentPassword: PASSWORD, newPassword: NEW_PASSWORD }).expect(204);

beforeAll(async () => {
  first = createTestApp({}, KEPT_FOR_A_MINUTE);
  second = createTestApp({}, KEPT_FOR_A_MINUTE);
  await resetDatabase(first.db);
  await Promise.all([listening(first), listening(second)]);
});
afterAll(async () => {
  await first.close();
  await second.close();
});

describe('one server process', () => {
  it('keeps a signed-in session: a deletion nobody announces is not seen while it is kept', async () => {
    const user = await createUser(first.db, 'agent');
    const s = await signIn(first.app, user);
    await s.agent.get('/api/auth/me').expect(200);
    await deleteUnannounced(first, user.id);
    const kept = await s.agent.get('/api/auth/me').expect(200);
    expect(kept.body.user.id).toBe(user.id);
  });

  it('a password change ends the user’s other session on the very next request', async () => {
    const user = await createUser(first.db, 'agent');
    const [changing, other] = [await signIn(first.app, user), await signIn(first.app, user)];
    await other.agent.get('/api/requests').expect(200);
    await other.agent.get('/api/auth/me').expect(200);
    const sizeBefore = first.sessionCache.size;
    expect(sizeBefore).toBeGreaterThanOrEqual(2);
    await changePassword(changing);
    await other.agent.get('/api/requests').expect(401);
    await other.agent.get('/api/auth/me').expect(401);
    await changing.agent.get('/api/auth/me').expect(200);
  });

  it('a deactivated account, a renamed organisation and a changed name are seen on the next request', async () => {
    const admin = await signIn(first.app, await createUser(first.db, 'admin'));
    const org = await createOrganisation(first.db, 'brokerage', 'Larch Realty');
    const person = await createUser(first.db, 'agent', org);
    const s = await signIn(first.app, person);
    expect((await s.agent.get('/api/auth/me').expect(200)).body.user).toMatchObject({ name: person.name, organisationName: 'Larch Realty' });

    await admin.agent.put(`/api/admin/organisations/${org}`).set('x-csrf-token', admin.csrfToken).send({ name: 'Larch & Pine Realty', kind: 'brokerage' }).expect(200);
    expect((await s.agent.get('/api/auth/me').expect(200)).body.user.organisationName).toBe('Larch & Pine Realty');

    await admin.agent.patch(`/api/admin/users/${person.id}`).set('x-csrf-token', admin.csrfToken).send({ email: person.email, name: 'Robin Larch', organisationId: org }).expect(200);
    expect((await s.agent.get('/api/auth/me').expect(200)).body.user.name).toBe('Robin Larch');

    await admin.agent.put(`/api/admin/users/${person.id}/active`).set('x-csrf-token', admin.csrfToken).send({ isActive: false }).expect(200);
    await s.agent.get('/api/auth/me').expect(401);
  });

  it('signing out ends the session at once', async () => {
    const s = await signIn(first.app, await createUser(first.db, 'seller'));
    await s.agent.get('/api/auth/me').expect(200);
    await s.agent.post('/api/auth/sign-out').set('x-csrf-token', s.csrfToken).expect(204);
    await s.agent.get('/api/auth/me').expect(401);
  });
});

describe('two server processes on one database', () => {
  it('a password change in one ends the user’s session in the other within a second', async () => {
    const user = await createUser(first.db, 'agent');
    const changing = await signIn(first.app, user);
    const elsewhere = await signIn(second.app, user);
    expect(await keptAfterRequest(second, elsewhere)).toBe(true);

    await changePassword(changing);
    const ended = await eventually(async () => (await elsewhere.agent.get('/api/auth/me')).status === 401, 1_000);
    expect(ended.held).toBe(true);
    await changing.agent.get('/api/auth/me').expect(200);
  });

  it('an administrator’s deactivation in one ends the session in the other within a second', async () => {
    const admin = await signIn(first.app, await createUser(first.db, 'admin'));
    const person = await createUser(first.db, 'inspector');
    const elsewhere = await signIn(second.app, person);
    await elsewhere.agent.get('/api/auth/me').expect(200);
    await admin.agent.put(`/api/admin/users/${person.id}/active`).set('x-csrf-token', admin.csrfToken).send({ isActive: false }).expect(200);
    expect((await eventually(async () => (await elsewhere.agent.get('/api/auth/me')).status === 401, 1_000)).held).toBe(true);
  });
});

describe('a process that stops listening', () => {
  it('empties its cache, keeps nothing until it listens again, then keeps sessions again', async () => {
    const user = await createUser(second.db, 'agent');
    const s = await signIn(second.app, user);
    expect(await keptAfterRequest(second, s)).toBe(true);

    const pid = second.sessionChanges.backendPid;
    expect(pid).not.toBeNull();
    await second.db.raw('SELECT pg_terminate_backend(?)', [pid]);
    expect((await eventually(() => !second.sessionCache.listening, 10_000)).held).toBe(true);
    expect(second.sessionCache.size).toBe(0);

    // No notice can reach it now: a session ended without one is still seen at once.
    await deleteUnannounced(second, user.id);
    await s.agent.get('/api/auth/me').expect(401);

    await listening(second);
    expect(second.sessionChanges.backendPid).not.toBe(pid);
    const again = await signIn(second.app, user);
    expect(await keptAfterRequest(second, again)).toBe(true);
  });
});
