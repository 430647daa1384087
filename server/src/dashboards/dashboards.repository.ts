// Figures for the dashboards, straight from the records: requests and their items, sent quotes, the
// flow's status changes, and the timeline entries that carry money (approvals, payments).
import type { ItemStatus, RequestStatus } from '@cc/shared';
import type { Db } from '../db/knex';

export interface AgentRequestRow {
  id: number;
  street: string;
  city: string;
  state: string;
  zip: string;
  status: RequestStatus;
  closing_date: string;
}

export interface MonthAmount {
  month: string;
  cents: number;
}

export interface AgentWorkRow {
  name: string;
  email: string;
  requests: number;
  converted: number;
  quoted_cents: number;
}

/** The latest sent version of each request's quote, for the requests of one contractor. */
const LATEST_QUOTES = `SELECT DISTINCT ON (q.request_id) q.request_id, q.total_cents, q.sent_at
  FROM quotes q JOIN repair_requests r ON r.id = q.request_id
 WHERE r.contractor_organisation_id = :org
 ORDER BY q.request_id, q.version DESC`;

export class DashboardsRepository {
  constructor(private readonly db: Db) {}

  /** Requests the agent is named on (every request for an administrator), with their statuses. */
  async agentRequests(userId: number | null, statuses: readonly RequestStatus[]): Promise<AgentRequestRow[]> {
    const query = this.db('repair_requests as r').whereIn('r.status', statuses).select('r.id', 'r.street', 'r.city', 'r.state', 'r.zip', 'r.status', 'r.closing_date');
    if (userId !== null) query.whereExists(this.db('request_parties as p').select(this.db.raw('1')).whereRaw('p.request_id = r.id').andWhere('p.user_id', userId));
    return query.orderBy([{ column: 'r.closing_date' }, { column: 'r.id' }]).limit(200);
  }

  async itemsByStatus(requestIds: number[]): Promise<{ status: ItemStatus; count: number }[]> {
    if (!requestIds.length) return [];
    const rows: { status: ItemStatus; count: string }[] = await this.db('line_items').whereIn('request_id', requestIds).whereNot('status', 'removed').select('status').count({ count: '*' }).groupBy('status');
    return rows.map((r) => ({ status: r.status, count: Number(r.count) }));
  }

  async statusCounts(organisationId: number): Promise<{ status: RequestStatus; count: number }[]> {
    const rows: { status: RequestStatus; count: string }[] = await this.db('repair_requests').where({ contractor_organisation_id: organisationId }).select('status').count({ count: '*' }).groupBy('status');
    return rows.map((r) => ({ status: r.status, count: Number(r.count) }));
  }

  /** Each request's latest quote total, in the month (UTC) that version was sent. */
  async quotedByMonth(organisationId: number, fromMonth: string): Promise<MonthAmount[]> {
    const { rows } = await this.db.raw<{ rows: { month: string; cents: string }[] }>(
      `SELECT to_char(l.sent_at AT TIME ZONE 'UTC', 'YYYY-MM') AS month, sum(l.total_cents) AS cents
         FROM (${LATEST_QUOTES}) l
        WHERE to_char(l.sent_at AT TIME ZONE 'UTC', 'YYYY-MM') >= :from
        GROUP BY 1`,
      { org: organisationId, from: fromMonth },
    );
    return rows.map((r) => ({ month: r.month, cents: Number(r.cents) }));
  }

  /** Money of one kind of timeline entry (items-decided, payment-received) by month (UTC). */
  async entryAmountsByMonth(organisationId: number, action: string, fromMonth: string): Promise<MonthAmount[]> {
    const { rows } = await this.db.raw<{ rows: { month: string; cents: string }[] }>(
      `SELECT to_char(a.created_at AT TIME ZONE 'UTC', 'YYYY-MM') AS month, sum(a.amount_cents) AS cents
         FROM activity_events a JOIN repair_requests r ON r.id = a.request_id
        WHERE r.contractor_organisation_id = :org AND a.action = :action AND a.amount_cents IS NOT NULL
          AND to_char(a.created_at AT TIME ZONE 'UTC', 'YYYY-MM') >= :from
        GROUP BY 1`,
      { org: organisationId, action, from: fromMonth },
    );
    return rows.map((r) => ({ month: r.month, cents: Number(r.cents) }));
  }

  /**
   * The buyer's agents who brought the contractor's requests: how many, how many reached the seller's
   * approval (a status change to `approvedStatus`), and what their latest quotes add up to.
   */
  async workByAgent(organisationId: number, approvedStatus: RequestStatus): Promise<AgentWorkRow[]> {
    const { rows } = await this.db.raw<{ rows: { name: string; email: string; requests: string; converted: string; quoted_cents: string }[] }>(
      `SELECT u.name, u.email, count(*) AS requests,
              count(*) FILTER (WHERE EXISTS (SELECT 1 FROM request_status_changes c WHERE c.request_id = r.id AND c.to_status = :approved)) AS converted,
              coalesce(sum(l.total_cents), 0) AS quoted_cents
         FROM repair_requests r
         JOIN request_parties p ON p.request_id = r.id AND p.role = 'buyer-agent' AND p.user_id IS NOT NULL
         JOIN users u ON u.id = p.user_id
         LEFT JOIN (${LATEST_QUOTES}) l ON l.request_id = r.id
        WHERE r.contractor_organisation_id = :org
        GROUP BY u.id, u.name, u.email
        ORDER BY count(*) DESC, u.name
        LIMIT 20`,
      { org: organisationId, approved: approvedStatus },
    );
    return rows.map((r) => ({ name: r.name, email: r.email, requests: Number(r.requests), converted: Number(r.converted), quoted_cents: Number(r.quoted_cents) }));
  }
}
