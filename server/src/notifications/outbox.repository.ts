// The outbox: one row per message and person, written in the transaction of the change that causes
// it; the worker claims rows with FOR UPDATE SKIP LOCKED, so several server processes share the work.
import type { Knex } from 'knex';
import type { Db, Trx } from '../db/knex';
import type { ItemOutcome } from './message-templates';

export type OutboxStatus = 'pending' | 'sending' | 'sent' | 'held' | 'digested' | 'failed' | 'skipped';

export interface OutboxRow {
  id: string;
  dedupe_key: string;
  kind: string;
  request_id: number | null;
  recipient_user_id: number | null;
  recipient_email: string;
  subject: string;
  text_body: string;
  html_body: string;
  link: string;
  status: OutboxStatus;
  attempts: number;
  next_attempt_at: Date;
  lease_until: Date | null;
  lease_token: string | null;
  message_id: string;
  last_error: string | null;
  sent_at: Date | null;
  digest_id: string | null;
  /** The outcomes an `item-corrected` message tells (several when gathered); null for other kinds. */
  gathered: ItemOutcome[] | null;
  /** The invoice whose PDF the worker attaches when it sends the message (the escrow company's). */
  attachment_invoice_id: number | null;
  created_at: Date;
}

export type NewOutboxMessage = Pick<
  OutboxRow,
  'dedupe_key' | 'kind' | 'request_id' | 'recipient_user_id' | 'recipient_email' | 'subject' | 'text_body' | 'html_body' | 'link' | 'message_id' | 'attachment_invoice_id'
> & { status: 'pending' | 'held'; gathered?: string; next_attempt_at?: Knex.Raw };

/** A claimed message: the row and the token that proves this worker holds it. */
export interface ClaimedMessage {
  row: OutboxRow;
  leaseToken: string;
  attempt: number;
}

export class OutboxRepository {
  constructor(private readonly db: Db) {}

  /** Writes messages; one already written under the same key is left as it is. Returns how many are new. */
  async enqueue(messages: NewOutboxMessage[], trx: Trx): Promise<number> {
    if (!messages.length) return 0;
    const rows = await trx('outbox_messages').insert(messages).onConflict('dedupe_key').ignore().returning('id');
    return rows.length;
  }

  /**
   * The `item-corrected` message to `userId` about `requestId` that still waits for more outcomes
   * (not yet claimed by a worker), locked until the end of `trx` so that a worker cannot send it
   * while an outcome is added; null when there is none.
   */
  async gathering(requestId: number, userId: number, trx: Trx): Promise<Pick<OutboxRow, 'id' | 'gathered'> | null> {
    const row = await trx('outbox_messages')
      .where({ kind: 'item-corrected', request_id: requestId, recipient_user_id: userId, status: 'pending', attempts: 0 })
      .where('next_attempt_at', '>', trx.fn.now())
      .orderBy('id', 'desc')
      .forUpdate()
      .first('id', 'gathered');
    return row ?? null;
  }

  /** The `item-corrected` messages about `requestId` still waiting for more outcomes, locked until the end of `trx`. */
  async allGathering(requestId: number, trx: Trx): Promise<(Pick<OutboxRow, 'id' | 'gathered' | 'recipient_user_id' | 'recipient_email'> & { name: string | null })[]> {
    return trx('outbox_messages as o')
      .leftJoin('users as u', 'u.id', 'o.recipient_user_id')
      .where({ 'o.kind': 'item-corrected', 'o.request_id': requestId, 'o.status': 'pending', 'o.attempts': 0 })
      .where('o.next_attempt_at', '>', trx.fn.now())
      .forUpdate('o')
      .select('o.id', 'o.gathered', 'o.recipient_user_id', 'o.recipient_email', 'u.name');
  }

  /** A gathering message written again and due at once, ahead of messages written after it in the same transaction. */
  async release(id: string, message: Pick<OutboxRow, 'subject' | 'text_body' | 'html_body' | 'link'>, trx: Trx): Promise<void> {
    await trx('outbox_messages').where({ id }).update({ ...message, next_attempt_at: trx.raw("now() - interval '1 second'") });
  }

  /** Writes a waiting message again with one more outcome (its words and the outcomes it tells). */
  async regather(id: string, message: Pick<OutboxRow, 'subject' | 'text_body' | 'html_body' | 'link'>, gathered: readonly ItemOutcome[], trx: Trx): Promise<void> {
    await trx('outbox_messages').where({ id }).update({ ...message, gathered: JSON.stringify(gathered) });
  }

  /**
   * Claims the next message due (or one whose claim ran out because its worker stopped), marks it
   * `sending` under a new lease and opens its attempt record, all in one statement.
   */
  async claimNext(worker: string, leaseMs: number): Promise<ClaimedMessage | null> {
    const { rows } = await this.db.raw<{ rows: (OutboxRow & { attempt_no: number })[] }>(
      `WITH next AS (
         SELECT id FROM outbox_messages
          WHERE (status = 'pending' AND next_attempt_at <= now())
             OR (status = 'sending' AND lease_until < now())
          ORDER BY next_attempt_at, id
          LIMIT 1
          FOR UPDATE SKIP LOCKED
       ), stopped AS (
         UPDATE outbox_attempts a SET outcome = 'interrupted', finished_at = now(), error = 'The worker stopped before the send was recorded'
           FROM next WHERE a.message_id = next.id AND a.outcome IS NULL
       ), claimed AS (
         UPDATE outbox_messages m
            SET status = 'sending', attempts = m.attempts + 1, lease_token = gen_random_uuid(),
                lease_until = now() + make_interval(secs => ?::double precision / 1000)
           FROM next WHERE m.id = next.id
         RETURNING m.*
       ), attempt AS (
         INSERT INTO outbox_attempts (message_id, attempt, lease_token, worker)
         SELECT id, attempts, lease_token, ? FROM claimed
         RETURNING attempt
       )
       SELECT claimed.*, attempt.attempt AS attempt_no FROM claimed, attempt`,
      [leaseMs, worker],
    );
    const row = rows[0];
    if (!row) return null;
    return { row, leaseToken: row.lease_token!, attempt: row.attempt_no };
  }

  /** Keeps the claim while the send is under way. */
  async renewLease(claim: ClaimedMessage, leaseMs: number): Promise<void> {
    await this.db('outbox_messages')
      .where({ id: claim.row.id, lease_token: claim.leaseToken, status: 'sending' })
      .update({ lease_until: this.db.raw('now() + make_interval(secs => ?::double precision / 1000)', [leaseMs]) });
  }

  /** Records a send; false when the claim was lost meanwhile (nothing is changed then). */
  async markSent(claim: ClaimedMessage): Promise<boolean> {
    return this.db.transaction(async (trx) => {
      const updated = await trx('outbox_messages')
        .where({ id: claim.row.id, lease_token: claim.leaseToken, status: 'sending' })
        .update({ status: 'sent', sent_at: trx.fn.now(), lease_until: null, last_error: null });
      await this.finishAttempt(trx, claim, 'sent', null);
      return updated === 1;
    });
  }

  /** Records a failed attempt: due again at `retryAt`, or failed for good when `retryAt` is null. */
  async markFailed(claim: ClaimedMessage, error: string, retryAt: Date | null): Promise<void> {
    await this.db.transaction(async (trx) => {
      await trx('outbox_messages')
        .where({ id: claim.row.id, lease_token: claim.leaseToken, status: 'sending' })
        .update(retryAt ? { status: 'pending', next_attempt_at: retryAt, lease_until: null, last_error: error } : { status: 'failed', lease_until: null, last_error: error });
      await this.finishAttempt(trx, claim, 'failed', error);
    });
  }

  private async finishAttempt(trx: Trx, claim: ClaimedMessage, outcome: string, error: string | null): Promise<void> {
    await trx('outbox_attempts').where({ message_id: claim.row.id, lease_token: claim.leaseToken }).update({ outcome, error, finished_at: trx.fn.now() });
  }

  /** Messages waiting for the digest, per person, oldest first. */
  async held(trx: Trx): Promise<OutboxRow[]> {
    return trx<OutboxRow>('outbox_messages').where({ status: 'held' }).whereNotNull('recipient_user_id').orderBy('id').forUpdate().skipLocked();
  }

  async markDigested(ids: string[], digestId: string | null, trx: Trx): Promise<void> {
    if (ids.length) await trx('outbox_messages').whereIn('id', ids).update({ status: digestId ? 'digested' : 'skipped', digest_id: digestId });
  }

  async skipHeldFor(userId: number, trx: Trx): Promise<void> {
    await trx('outbox_messages').where({ recipient_user_id: userId, status: 'held' }).update({ status: 'skipped' });
  }

  async counts(): Promise<Record<string, number>> {
    const rows: { status: string; count: string }[] = await this.db('outbox_messages').select('status').count({ count: '*' }).groupBy('status');
    return Object.fromEntries(rows.map((r) => [r.status, Number(r.count)]));
  }
}
