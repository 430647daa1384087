import type { Db } from '../db/knex';

/** The stored sessions (connect-pg-simple's `sessions` table), for ending a user's sessions. */
export class SessionRepository {
  constructor(private readonly db: Db) {}

  /** Ends every session of `userId` except `keepSid` (the one that asked); returns how many ended. */
  async endOthers(userId: number, keepSid: string): Promise<number> {
    return this.db('sessions')
      .whereRaw("(sess::jsonb -> 'passport' ->> 'user') = ?", [String(userId)])
      .whereNot({ sid: keepSid })
      .delete();
  }
}
