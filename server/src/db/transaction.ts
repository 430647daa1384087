import type { Db, Trx } from './knex';

/** PostgreSQL's codes for a transaction that lost a race and may simply run again. */
const RETRYABLE = new Set(['40001', '40P01']); // serialization_failure, deadlock_detected

export const isRetryable = (err: unknown): boolean => RETRYABLE.has((err as { code?: string })?.code ?? '');

/**
 * Runs `work` in a transaction, and runs it again (up to `attempts` times, after a short random
 * pause) when PostgreSQL ended it as a serialisation failure or a deadlock victim. `work` must not
 * have effects outside the transaction that a second run would repeat.
 */
export async function inTransaction<T>(db: Db, work: (trx: Trx) => Promise<T>, attempts = 5): Promise<T> {
  for (let attempt = 1; ; attempt++) {
    try {
      return await db.transaction(work);
    } catch (err) {
      if (!isRetryable(err) || attempt >= attempts) throw err;
      await new Promise((resolve) => setTimeout(resolve, 5 + Math.random() * 20 * attempt));
    }
  }
}
