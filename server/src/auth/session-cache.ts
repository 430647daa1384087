import pg from 'pg';
import type { CurrentUser } from '@cc/shared';

/** How long a session and its user are kept in this process at most. */
export const SESSION_CACHE_MS = 2_000;

/** The channel on which the triggers of migration 20261204090000 say what changed. */
export const SESSION_CHANGES_CHANNEL = 'cc_session_changes';

/** What writes to sessions, users and organisations tell the cache (this process's own writes, at once). */
export interface SessionInvalidation {
  /** A session was written or ended. */
  forgetSession(sid: string): void;
  /** A user's account changed (password, role, organisation, name, e-mail, deactivated, removed). */
  forgetUser(userId: number): void;
  /** An organisation changed (its name is part of its people's signed-in user). */
  forgetOrganisation(organisationId: number): void;
}

/** For processes that serve no sessions (the notification worker, seeds): their writes reach servers as notices. */
export const NO_SESSION_CACHE: SessionInvalidation = { forgetSession() {}, forgetUser() {}, forgetOrganisation() {} };

interface Entry {
  /** The session as stored (JSON text): each request parses its own copy, as express-session changes it. */
  sessJson: string;
  user: CurrentUser | null;
  /** Kept until then: the sooner of the cache's time and the session's own expiry. */
  until: number;
}

/**
 * Sessions with their active user, kept in this process for at most `ttlMs` so that an authenticated
 * request reads neither from PostgreSQL. Kept only while the process listens for changes
 * (SessionChangeListener): every write to a session, a user or an organisation, in this process
 * or another, removes what it changed, and losing the listening connection empties the cache
 * until it listens again.
 *
 * A read that began before a change must not keep what it read: `ticket()` before the read, and
 * `keep` stores the result only if nothing was forgotten since (any change, for simplicity: they
 * are rare next to reads).
 */
export class SessionCache implements SessionInvalidation {
  private readonly entries = new Map<string, Entry>();
  private generation = 0;
  private isListening = false;

  constructor(
    private readonly ttlMs = SESSION_CACHE_MS,
    private readonly maxEntries = 50_000,
  ) {}

  /** Whether the process hears about changes (and so keeps sessions). */
  get listening(): boolean {
    return this.isListening;
  }

  /** How many sessions are kept. */
  get size(): number {
    return this.entries.size;
  }

  /** The kept session, if it is still fresh. */
  find(sid: string, now = Date.now()): { sessJson: string; user: CurrentUser | null } | undefined {
    const entry = this.entries.get(sid);
    if (!entry) return undefined;
    if (entry.until <= now) {
      this.entries.delete(sid);
      return undefined;
    }
    return entry;
  }

  /** Taken before reading a session from PostgreSQL; `keep` needs it. */
  ticket(): number {
    return this.generation;
  }

  /** Keeps what a read found, unless something changed since `ticket` or the process is not listening. */
  keep(ticket: number, sid: string, sessJson: string, user: CurrentUser | null, expiresAt: number, now = Date.now()): void {
    if (!this.isListening || ticket !== this.generation || this.ttlMs <= 0) return;
    if (this.entries.size >= this.maxEntries) this.entries.clear();
    this.entries.set(sid, { sessJson, user, until: Math.min(now + this.ttlMs, expiresAt) });
  }

  forgetSession(sid: string): void {
    this.generation++;
    this.entries.delete(sid);
  }

  forgetUser(userId: number): void {
    this.generation++;
    for (const [sid, entry] of this.entries) if (entry.user?.id === userId) this.entries.delete(sid);
  }

  forgetOrganisation(organisationId: number): void {
    this.generation++;
    for (const [sid, entry] of this.entries) if (entry.user?.organisationId === organisationId) this.entries.delete(sid);
  }

  /** Forgets every session (a table emptied, the listening connection lost or found again). */
  clear(): void {
    this.generation++;
    this.entries.clear();
  }

  /** Called by the listener: keeping starts only once the process listens, and ends (emptied) when it stops. */
  setListening(isListening: boolean): void {
    this.isListening = isListening;
    this.clear();
  }

  /** Applies one notice of the channel: "s:<sid>", "u:<user id>", "o:<organisation id>" or "*". */
  applyNotice(payload: string): void {
    const kind = payload.slice(0, 2);
    const value = payload.slice(2);
    if (kind === 's:') this.forgetSession(value);
    else if (kind === 'u:' && /^\d+$/.test(value)) this.forgetUser(Number(value));
    else if (kind === 'o:' && /^\d+$/.test(value)) this.forgetOrganisation(Number(value));
    else this.clear();
  }
}

/**
 * Listens on SESSION_CHANGES_CHANNEL with a connection of its own and applies each notice to the
 * cache. While it is not listening (starting, the connection lost) the cache keeps nothing; it
 * connects again after `retryMs`.
 */
export class SessionChangeListener {
  private client: pg.Client | null = null;
  private retry: NodeJS.Timeout | null = null;
  private isClosed = false;

  constructor(
    private readonly databaseUrl: string,
    private readonly cache: SessionCache,
    private readonly retryMs = 1_000,
  ) {}

  /** The server process id of the listening connection (null while not listening). */
  get backendPid(): number | null {
    return this.cache.listening ? ((this.client as unknown as { processID?: number } | null)?.processID ?? null) : null;
  }

  start(): void {
    if (this.isClosed || this.client) return;
    const client = new pg.Client({ connectionString: this.databaseUrl, keepAlive: true, application_name: 'cc-session-changes' } as pg.ClientConfig);
    this.client = client;
    let isLost = false;
    const lost = (err?: Error) => {
      if (isLost) return;
      isLost = true;
      this.cache.setListening(false);
      if (this.client === client) this.client = null;
      client.removeAllListeners('notification');
      client.end().catch(() => undefined);
      if (!this.isClosed) {
        if (err) console.error(`Listening for session changes stopped (${err.message}); sessions are read from PostgreSQL until it listens again`);
        this.retry = setTimeout(() => {
          this.retry = null;
          this.start();
        }, this.retryMs);
        this.retry.unref();
      }
    };
    client.on('error', lost);
    client.on('end', () => lost());
    client.on('notification', (message) => {
      if (message.channel === SESSION_CHANGES_CHANNEL) this.cache.applyNotice(message.payload ?? '*');
    });
    client
      .connect()
      .then(() => client.query(`LISTEN ${SESSION_CHANGES_CHANNEL}`))
      .then(
        () => {
          if (!isLost && !this.isClosed) this.cache.setListening(true);
        },
        (err: Error) => lost(err),
      );
  }

  async close(): Promise<void> {
    this.isClosed = true;
    if (this.retry) clearTimeout(this.retry);
    this.cache.setListening(false);
    const client = this.client;
    this.client = null;
    if (client) await client.end().catch(() => undefined);
  }
}
