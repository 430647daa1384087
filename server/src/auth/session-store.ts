import connectPgSimple from 'connect-pg-simple';
import session from 'express-session';
import type pg from 'pg';

/** How often a session's expiry is written again while it is in use (sessions roll). */
const TOUCH_EVERY_MS = 5 * 60_000;
/** Sessions remembered for the throttle; beyond this the memory starts again (a touch more, never less). */
const REMEMBERED = 20_000;

/**
 * Sessions kept in PostgreSQL (connect-pg-simple). Sessions roll (every answer moves the expiry
 * on), but the expiry is written at most once per TOUCH_EVERY_MS per session and process instead of
 * on every request: a session then lives up to that much less than its full idle time.
 */
export function createSessionStore(pool: pg.Pool, options: { prune: boolean }): InstanceType<ReturnType<typeof connectPgSimple>> {
  const PgStore = connectPgSimple(session);
  const lastTouched = new Map<string, number>();
  class ThrottledPgStore extends PgStore {
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
      super.destroy(sid, done);
    }
  }
  return new ThrottledPgStore({ pool, tableName: 'sessions', pruneSessionInterval: options.prune ? 15 * 60 : false });
}
