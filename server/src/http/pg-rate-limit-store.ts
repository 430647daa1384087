import type { ClientRateLimitInfo, IncrementResponse, Options, Store } from 'express-rate-limit';
import type { Db } from '../db/knex';

const TABLE = 'rate_limit_counters';

/**
 * An express-rate-limit store that keeps its counters in PostgreSQL (table `rate_limit_counters`),
 * so that restarting the server or running a second instance does not reset them. Each limiter
 * uses its own `prefix`; a counter starts a new window once its `resets_at` has passed.
 */
export class PgRateLimitStore implements Store {
  readonly localKeys = false;
  private windowMs = 60_000;
  private increments = 0;

  constructor(
    private readonly db: Db,
    readonly prefix: string,
  ) {}

  init(options: Options): void {
    this.windowMs = options.windowMs;
  }

  private key(key: string): string {
    return `${this.prefix}:${key}`.slice(0, 300);
  }

  async get(key: string): Promise<ClientRateLimitInfo | undefined> {
    const row = await this.db(TABLE).where({ key: this.key(key) }).where('resets_at', '>', this.db.fn.now()).first('hits', 'resets_at');
    return row ? { totalHits: row.hits, resetTime: row.resets_at } : undefined;
  }

  async increment(key: string): Promise<IncrementResponse> {
    // One statement: concurrent attempts each count, none is lost.
    const { rows } = await this.db.raw<{ rows: { hits: number; resets_at: Date }[] }>(
      `INSERT INTO ${TABLE} AS c (key, hits, resets_at) VALUES (?, 1, now() + ? * interval '1 millisecond')
       ON CONFLICT (key) DO UPDATE SET
         hits = CASE WHEN c.resets_at <= now() THEN 1 ELSE c.hits + 1 END,
         resets_at = CASE WHEN c.resets_at <= now() THEN excluded.resets_at ELSE c.resets_at END
       RETURNING hits, resets_at`,
      [this.key(key), this.windowMs],
    );
    if (++this.increments % 500 === 0) await this.db(TABLE).where('resets_at', '<', this.db.fn.now()).delete();
    return { totalHits: rows[0].hits, resetTime: rows[0].resets_at };
  }

  async decrement(key: string): Promise<void> {
    await this.db(TABLE)
      .where({ key: this.key(key) })
      .where('resets_at', '>', this.db.fn.now())
      .update({ hits: this.db.raw('greatest(hits - 1, 0)') });
  }

  async resetKey(key: string): Promise<void> {
    await this.db(TABLE).where({ key: this.key(key) }).delete();
  }
}
