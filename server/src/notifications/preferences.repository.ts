import { NOTIFICATION_RULES, type Delivery, type NotificationKind } from '@cc/shared';
import type { Db, Trx } from '../db/knex';

/** What each person chose for each kind of message; no row means the kind's default. */
export class PreferencesRepository {
  constructor(private readonly db: Db) {}

  /** Delivery of `kind` for each of `userIds` (defaults filled in). */
  async deliveries(userIds: number[], kind: NotificationKind, trx?: Trx): Promise<Map<number, Delivery>> {
    const rows: { user_id: number; delivery: Delivery }[] = userIds.length
      ? await (trx ?? this.db)('notification_preferences').whereIn('user_id', userIds).andWhere({ kind }).select('user_id', 'delivery')
      : [];
    const chosen = new Map(rows.map((r) => [r.user_id, r.delivery]));
    return new Map(userIds.map((id) => [id, chosen.get(id) ?? NOTIFICATION_RULES[kind].defaultDelivery]));
  }

  async forUser(userId: number, trx?: Trx): Promise<Map<NotificationKind, Delivery>> {
    const rows: { kind: NotificationKind; delivery: Delivery }[] = await (trx ?? this.db)('notification_preferences').where({ user_id: userId }).select('kind', 'delivery');
    return new Map(rows.map((r) => [r.kind, r.delivery]));
  }

  async set(userId: number, choices: { kind: NotificationKind; delivery: Delivery }[], trx: Trx): Promise<void> {
    if (!choices.length) return;
    await trx('notification_preferences')
      .insert(choices.map((c) => ({ user_id: userId, kind: c.kind, delivery: c.delivery, updated_at: trx.fn.now() })))
      .onConflict(['user_id', 'kind'])
      .merge(['delivery', 'updated_at']);
  }
}
