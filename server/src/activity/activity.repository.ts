// The activity timeline of a request: every change (who, what, when, values before and after),
// written in the transaction of the change itself.
import type { ActivityEntry, ActivityKind, ActivityValues } from '@cc/shared';
import type { Db, Trx } from '../db/knex';

export interface NewActivity {
  requestId: number;
  itemId?: number | null;
  actorUserId: number | null;
  kind: ActivityKind;
  action: string;
  summary: string;
  before?: ActivityValues | null;
  after?: ActivityValues | null;
  amountCents?: number | null;
  /** When it happened: now, unless demo data backdates its history. */
  at?: Date;
}

interface ActivityRow {
  id: string;
  request_id: number;
  line_item_id: number | null;
  actor_user_id: number | null;
  kind: ActivityKind;
  action: string;
  summary: string;
  before: ActivityValues | null;
  after: ActivityValues | null;
  amount_cents: number | null;
  created_at: Date;
  actor_name: string | null;
}

const toEntry = (r: ActivityRow): ActivityEntry => ({
  id: Number(r.id),
  kind: r.kind,
  action: r.action,
  summary: r.summary,
  actorName: r.actor_name,
  itemId: r.line_item_id,
  before: r.before,
  after: r.after,
  at: r.created_at.toISOString(),
});

export class ActivityRepository {
  constructor(private readonly db: Db) {}

  async record(trx: Trx, entries: NewActivity | NewActivity[]): Promise<void> {
    const list = Array.isArray(entries) ? entries : [entries];
    if (!list.length) return;
    await trx('activity_events').insert(
      list.map((e) => ({
        request_id: e.requestId,
        line_item_id: e.itemId ?? null,
        actor_user_id: e.actorUserId,
        kind: e.kind,
        action: e.action,
        summary: e.summary.slice(0, 500),
        before: e.before ? JSON.stringify(e.before) : null,
        after: e.after ? JSON.stringify(e.after) : null,
        amount_cents: e.amountCents ?? null,
        ...(e.at ? { created_at: e.at } : {}),
      })),
    );
  }

  /** Newest first. */
  async list(requestId: number, kinds: ActivityKind[], page: number, pageSize: number): Promise<{ items: ActivityEntry[]; total: number }> {
    const query = this.db('activity_events as a')
      .leftJoin('users as u', 'u.id', 'a.actor_user_id')
      .where('a.request_id', requestId)
      .select('a.*', 'u.name as actor_name', this.db.raw('count(*) over() AS total_count'));
    if (kinds.length) query.whereIn('a.kind', kinds);
    const rows: (ActivityRow & { total_count: string })[] = await query
      .orderBy([{ column: 'a.created_at', order: 'desc' }, { column: 'a.id', order: 'desc' }])
      .limit(pageSize)
      .offset(page * pageSize);
    return { items: rows.map(toEntry), total: rows.length ? Number(rows[0].total_count) : 0 };
  }
}

/** The fields of `before` and `after` that differ (both sides), for an edit's timeline entry. */
export function changedFields(before: ActivityValues, after: ActivityValues): { before: ActivityValues; after: ActivityValues } | null {
  const b: ActivityValues = {};
  const a: ActivityValues = {};
  for (const key of Object.keys(after)) {
    if (JSON.stringify(before[key] ?? null) !== JSON.stringify(after[key] ?? null)) {
      b[key] = before[key] ?? null;
      a[key] = after[key] ?? null;
    }
  }
  return Object.keys(a).length ? { before: b, after: a } : null;
}
