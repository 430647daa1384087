import connectPgSimple from 'connect-pg-simple';
import session from 'express-session';
import type pg from 'pg';
import type { CurrentUser } from '@cc/shared';
import { toCurrentUser, type UserWithOrgRow } from './user.repository';
import type { SessionCache } from './session-cache';

/** How often a session's expiry is written again while it is in use (sessions roll). */
const TOUCH_EVERY_MS = 5 * 60_000;
/** Sessions remembered for the throttle; beyond this the memory starts again (a touch more, never less). */
const REMEMBERED = 20_000;

/**
 * The session and its signed-in user in one statement: the user only while the account is active
 * (a deactivated account's sessions find no user, so the person is signed out at once). Kept for a
 * moment in the SessionCache, which every change of a session, a user or an organisation empties
 * of what it changed. Prepared once per connection (named statement).
 */
const SESSION_WITH_USER = {
  name: 'cc-session-with-user-2',
  text: `SELECT s.sess::text AS sess, (extract(epoch FROM s.expire) * 1000)::float8 AS expire_ms, u.id, u.email, u.name, u.role, u.organisation_id, o.name AS organisation_name
         FROM sessions s
         LEFT JOIN users u
           ON u.is_active
          AND u.id = CASE WHEN (s.sess -> 'passport' ->> 'user') ~ '^[0-9]{1,9}$' THEN (s.sess -> 'passport' ->> 'user')::int END
         LEFT JOIN organisations o ON o.id = u.organisation_id
         WHERE s.sid = $1 AND s.expire >= to_timestamp($2)`,
};

type SessionWithUserRow = { sess: string; expire_ms: number } & (
  | Pick<UserWithOrgRow, 'id' | 'email' | 'name' | 'role' | 'organisation_id' | 'organisation_name'>
  | { id: null }
);

/**
 * The user read with a session, keyed by the session's `passport` object (which express-session
 * hands on to req.session by reference): null when the session's account is gone or deactivated.
 * Held only as long as that session object lives, i.e. for the one request that read it.
 */
const usersReadWithSession = new WeakMap<object, { forId: unknown; user: CurrentUser | null }>();

/**
 * The active user read together with the session behind `passportData` (req.session.passport),
 * if that read was for user `id`; `undefined` when there is none (then the caller reads the user).
 */
export function userReadWithSession(passportData: unknown, id: number): CurrentUser | null | undefined {
  if (typeof passportData !== 'object' || passportData === null) return undefined;
  const read = usersReadWithSession.get(passportData);
  return read && read.forId === id ? read.user : undefined;
}

/** Hands the user read with `sess` on to passport's deserialiser (see userReadWithSession). */
function rememberUser(sess: session.SessionData, user: CurrentUser | null): void {
  const passportData = (sess as { passport?: { user?: unknown } }).passport;
  if (typeof passportData === 'object' && passportData !== null) {
    // A copy per request: nothing a route does to req.user reaches the kept one.
    usersReadWithSession.set(passportData, { forId: passportData.user, user: user && { ...user } });
  }
}

/**
 * Sessions kept in PostgreSQL (connect-pg-simple). Reading a session also reads its active user in
 * the same statement (see SESSION_WITH_USER), so an authenticated request makes one round trip before
 * its route, and none while the session is in `cache` (a moment, see SessionCache). Writing or
 * ending a session here forgets it in the cache at once (before and after the write, so that a read
 * running meanwhile does not keep the old one). Sessions roll (every answer moves the expiry on),
 * but the expiry is written at most once per TOUCH_EVERY_MS per session and process instead of on
 * every request: a session then lives up to that much less than its full idle time.
 */
export function createSessionStore(pool: pg.Pool, cache: SessionCache, options: { prune: boolean }): InstanceType<ReturnType<typeof connectPgSimple>> {
  const PgStore = connectPgSimple(session);
  const lastTouched = new Map<string, number>();
  class SessionStore extends PgStore {
    override get(sid: string, done: (err: unknown, sess?: session.SessionData | null) => void): void {
      const kept = cache.find(sid);
      if (kept) {
        const sess = JSON.parse(kept.sessJson) as session.SessionData;
        rememberUser(sess, kept.user);
        return done(null, sess);
      }
      const ticket = cache.ticket();
      pool.query<SessionWithUserRow>({ ...SESSION_WITH_USER, values: [sid, Math.ceil(Date.now() / 1000)] }).then(
        ({ rows: [row] }) => {
          if (!row) return done(null);
          let sess: session.SessionData;
          try {
            sess = JSON.parse(row.sess);
          } catch {
            return this.destroy(sid, (err) => done(err));
          }
          const user = row.id === null ? null : toCurrentUser(row);
          cache.keep(ticket, sid, row.sess, user, row.expire_ms);
          rememberUser(sess, user);
          done(null, sess);
        },
        (err: unknown) => done(err),
      );
    }

    override set(sid: string, sess: session.SessionData, done?: (err?: unknown) => void): void {
      cache.forgetSession(sid);
      super.set(sid, sess, (err?: unknown) => {
        cache.forgetSession(sid);
        done?.(err);
      });
    }

    override touch(sid: string, sess: session.SessionData, done?: (err?: unknown) => void): void {
      const now = Date.now();
      if (now - (lastTouched.get(sid) ?? 0) < TOUCH_EVERY_MS) {
        done?.();
        return;
      }
      if (lastTouched.size >= REMEMBERED) lastTouched.clear();
      lastTouched.set(sid, now);
      super.touch(sid, sess, done);
    }

    override destroy(sid: string, done?: (err?: unknown) => void): void {
      lastTouched.delete(sid);
      cache.forgetSession(sid);
      super.destroy(sid, (err?: unknown) => {
        cache.forgetSession(sid);
        done?.(err);
      });
    }
  }
  return new SessionStore({ pool, tableName: 'sessions', pruneSessionInterval: options.prune ? 15 * 60 : false });
}
