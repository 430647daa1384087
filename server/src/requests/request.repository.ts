import type { Knex } from 'knex';
import {
  itemStateAfter,
  requestReference,
  REQUEST_REFERENCE_DIGITS,
  REQUEST_REFERENCE_PREFIX,
  type HouseCode,
  type NecEdition,
  type PartyRole,
  type RepairRequestSummary,
  type RequestStatus,
  type Role,
  type StatusChange,
  REQUEST_SORTS,
} from '@cc/shared';
import type pg from 'pg';
import type { Db, Trx } from '../db/knex';
import { isoTimestamp, readPrepared, runStatement, StatementParams, type Statement } from '../db/read-pool';
import type { RepairRequestRow, RequestPartyRow, RequestStatusChangeRow } from '../db/tables';

/** Who is looking: decides which requests exist for them. */
export interface Viewer {
  id: number;
  role: Role;
  organisationId: number | null;
}

export interface RequestListFilter {
  page: number;
  pageSize: number;
  sort: (typeof REQUEST_SORTS)[number];
  direction: 'asc' | 'desc';
  statuses: RequestStatus[];
  text: string;
  /** An id typed as a reference (CC-00042) into the search box. */
  id: number | null;
  /** Only houses built before this year (null or left out: any year). */
  builtBefore?: number | null;
  /**
   * Keyset paging: the page starts after this row of the same list (its sort key as the database
   * writes it, and its id) instead of skipping `page * pageSize` rows.
   */
  after?: ListKey | null;
}

/** Where a list page ends: the last row's sort key (as text) and id. */
export interface ListKey {
  sortKey: string;
  id: number;
}

export interface NewRepairRequest {
  street: string;
  city: string;
  state: string;
  zip: string;
  yearBuilt: number;
  closingDate: string;
  necEdition: NecEdition;
  status: RequestStatus;
  contractorOrganisationId: number | null;
  createdBy: number;
  /** When it was opened (now, unless demo data backdates it). */
  createdAt?: Date;
}

export interface PartyRecord {
  id: number;
  role: PartyRole;
  email: string;
  userId: number | null;
  name: string | null;
  inviteToken: string | null;
  inviteExpiresAt: Date | null;
}

/** Each sort's column, on repair_requests (`r`) and on request_viewers (`v`). */
const SORT_COLUMNS: Record<RequestListFilter['sort'], string> = {
  closingDate: 'closing_date',
  createdAt: 'created_at',
  status: 'status',
  street: 'street',
};

/** Each sort column's type, for a sort key read back from a cursor. */
const SORT_TYPES: Record<RequestListFilter['sort'], string> = {
  closingDate: 'date',
  createdAt: 'timestamptz',
  status: 'text',
  street: 'text',
};

/**
 * How far lists count their rows; beyond it they say "1,000+" (or "100+"). A text search stops
 * sooner: its rows are not in any index, so each match counted is several rows read (the bench's
 * search matches one row in five), and 100 is the largest page a list serves (`PageQuerySchema`),
 * so any first page still tells its exact total up to there.
 */
export interface ListCountCaps {
  list: number;
  search: number;
}
export const LIST_COUNT_CAPS: ListCountCaps = { list: 1000, search: 100 };

/** Items a request does not count yet or any more: proposals nobody confirmed, and removed ones. */
const UNCOUNTED_ITEM_STATES = [itemStateAfter('propose'), itemStateAfter('remove')];

/** Item states that are approved work without an outcome yet (approved, and not accepted to rework). */
const OPEN_WORK_ITEM_STATES = [itemStateAfter('approve'), itemStateAfter('not-accept')];

/**
 * Joins to a query on `repair_requests as r` the `item_count` and `open_work_count` columns of a
 * request summary (closing-date tracking), read from the request's items counted by status.
 */
export function joinItemCounts(db: Db | Trx, query: Knex.QueryBuilder): Knex.QueryBuilder {
  return query.joinRaw(`LEFT JOIN LATERAL (${itemCountsOfR('?', '?')}) AS ic ON true`, [UNCOUNTED_ITEM_STATES, OPEN_WORK_ITEM_STATES]);
}

/**
 * The item counts of request `r`, with the parameters that stand for the two state lists: read from
 * its items counted by status (`item_status_counts`, kept by triggers on line_items), not by
 * reading its items.
 */
function itemCountsOfR(uncounted: string, openWork: string): string {
  return `SELECT coalesce(sum(c.value::int) FILTER (WHERE c.key <> ALL(${uncounted})), 0)::int AS item_count,
       coalesce(sum(c.value::int) FILTER (WHERE c.key = ANY(${openWork})), 0)::int AS open_work_count
       FROM jsonb_each_text(r.item_status_counts) AS c`;
}

/** The same, in a hand-written statement. */
const itemCountsIn = (p: StatementParams): string => itemCountsOfR(p.add(UNCOUNTED_ITEM_STATES), p.add(OPEN_WORK_ITEM_STATES));

/** The columns of repair_requests a summary shows (a list reads only these). */
const SUMMARY_COLUMNS = ['id', 'street', 'city', 'state', 'zip', 'year_built', 'closing_date', 'nec_edition', 'status', 'created_at', 'updated_at'] as const;

/** What a list page reads of each of its requests: the summary's columns and what its contractor's name and item counts come from. */
const PAGE_ROW_COLUMNS = [...SUMMARY_COLUMNS, 'contractor_organisation_id', 'item_status_counts'] as const;

/** A summary's row; its times are text when read on a read connection (see isoTimestamp). */
type SummaryRow = Omit<Pick<RepairRequestRow, (typeof SUMMARY_COLUMNS)[number]>, 'created_at' | 'updated_at'> & {
  created_at: Date | string;
  updated_at: Date | string;
  contractor_name: string | null;
  item_count: number;
  open_work_count: number;
  total_count?: string;
};

function toSummary(row: SummaryRow): RepairRequestSummary {
  return {
    id: row.id,
    reference: requestReference(row.id),
    street: row.street,
    city: row.city,
    state: row.state,
    zip: row.zip,
    yearBuilt: row.year_built,
    closingDate: row.closing_date,
    necEdition: row.nec_edition as NecEdition,
    status: row.status,
    contractorName: row.contractor_name,
    itemCount: Number(row.item_count),
    openWorkCount: Number(row.open_work_count),
    // Decided by the service, which knows today and the setting.
    isAtRisk: false,
    createdAt: isoTimestamp(row.created_at),
    updatedAt: isoTimestamp(row.updated_at),
  };
}

/**
 * Which requests `viewer` is party to, as a condition on `repair_requests as r` (null: every
 * request, for the administrator); `param` writes a value's placeholder. Lists read the same
 * parties through request_viewers (listStatement); a request's items check it in their own
 * statement (LineItemRepository.listVisibleAsJson).
 */
export function visibleTo(viewer: Viewer, param: (value: number) => string): string | null {
  if (viewer.role === 'admin') return null;
  if (viewer.role === 'contractor') return `r.contractor_organisation_id = ${param(viewer.organisationId ?? -1)}`;
  return `EXISTS (SELECT 1 FROM request_parties p WHERE p.request_id = r.id AND p.user_id = ${param(viewer.id)})`;
}

/**
 * Whether a list's exact total is kept (request_list_counts, by scope and status: migration
 * 20261205130000): lists filtered only by status. A search or a build-year filter counts its rows,
 * no further than its cap.
 */
function hasKeptTotal(filter: Pick<RequestListFilter, 'text' | 'builtBefore'>): boolean {
  return !filter.text && !filter.builtBefore;
}

/** The kept total of `viewer`'s list with `statuses` (none: every status), as the `n` of one row. */
function keptTotal(p: StatementParams, viewer: Viewer, statuses: readonly RequestStatus[]): string {
  const [scope, scopeId] = viewer.role === 'admin' ? ['all', 0] : viewer.role === 'contractor' ? ['contractor', viewer.organisationId ?? -1] : ['viewer', viewer.id];
  const byStatus = statuses.length ? ` AND status = ANY(${p.add(statuses)})` : '';
  return `SELECT coalesce(sum(n), 0) AS n FROM request_list_counts WHERE scope = ${p.add(scope)} AND scope_id = ${p.add(scopeId)}${byStatus}`;
}

export class RequestRepository {
  constructor(
    private readonly db: Db,
    /** Lists count no further than this (smaller caps only in tests). */
    private readonly countCaps: ListCountCaps = LIST_COUNT_CAPS,
    /** Where list pages run as prepared statements (db/read-pool.ts); without it, through Knex. */
    private readonly readPool: pg.Pool | null = null,
  ) {}

  /** Narrows a query on `repair_requests as r` to the requests `viewer` is party to. */
  private scope(query: Knex.QueryBuilder, viewer: Viewer): Knex.QueryBuilder {
    const bindings: Knex.RawBinding[] = [];
    const condition = visibleTo(viewer, (value) => {
      bindings.push(value);
      return '?';
    });
    return condition ? query.whereRaw(condition, bindings) : query;
  }

  private summaries(trx?: Trx): Knex.QueryBuilder {
    const db = trx ?? this.db;
    return joinItemCounts(db, db('repair_requests as r').leftJoin('organisations as o', 'o.id', 'r.contractor_organisation_id')).select(
      'r.*',
      'o.name as contractor_name',
      'ic.item_count',
      'ic.open_work_count',
    );
  }

  /**
   * One page of the requests `viewer` sees, in one statement: the page's ids are picked first by
   * the index of the sort within the viewer's scope (request_viewers for the people named on
   * requests, repair_requests for contractors and administrators), the summary columns are read
   * for those rows only, and the total is counted no further than the cap + 1 rows (then
   * `isTotalCapped`). `hasMore`: a row follows the page. Prepared once per connection with one
   * plan for every viewer and page.
   *
   * The page's summaries come back as JSON text written by PostgreSQL (`itemsJson`, an array of
   * RepairRequestSummary): the server sends it on as it is, instead of parsing every row and
   * writing it as JSON again. `lastAtRisk` is the last closing date at which open work is at risk
   * today (`lastAtRiskClosingDate`, shared), which sets each summary's `isAtRisk`.
   */
  async list(viewer: Viewer, filter: RequestListFilter, lastAtRisk: string): Promise<{ itemsJson: string; total: number; isTotalCapped: boolean; lastKey: ListKey | null; hasMore: boolean }> {
    const statement = this.listStatement(viewer, filter, lastAtRisk);
    type Row = { n: string; items: string | null; last_sort_key: string | null; last_id: number | null; has_more: boolean | null };
    const [row] = this.readPool ? await readPrepared<Row>(this.readPool, statement) : await runStatement<Row>(this.db, statement);
    const counted = Number(row.n);
    const cap = hasKeptTotal(filter) ? Infinity : filter.text ? this.countCaps.search : this.countCaps.list;
    const lastKey = row.last_id === null ? null : { sortKey: row.last_sort_key ?? '', id: row.last_id };
    return { itemsJson: row.items ?? '[]', total: Math.min(counted, cap), isTotalCapped: counted > cap, lastKey, hasMore: row.has_more === true };
  }

  /**
   * The one statement behind `list` (its plan is checked in the API tests), written by hand: it runs
   * on most requests, and building it through Knex cost more than running it. Its text depends only
   * on the list's shape (who looks, which filters, the sort), so each shape is one prepared statement.
   *
   * The rows `viewer` may list come from request_viewers (`v`, one row per person and request, with
   * the request's sort and filter columns) for the people named on requests, and from
   * repair_requests (`r`) for contractors and administrators.
   */
  listStatement(viewer: Viewer, filter: RequestListFilter, lastAtRisk: string): Statement {
    const p = new StatementParams();
    const isNamed = viewer.role !== 'admin' && viewer.role !== 'contractor';
    const key = isNamed ? 'v' : 'r';
    const table = isNamed ? 'request_viewers v' : 'repair_requests r';
    const id = isNamed ? 'v.request_id' : 'r.id';
    const sortColumn = SORT_COLUMNS[filter.sort];
    const dir = filter.direction === 'desc' ? 'DESC' : 'ASC';
    const where = (conditions: string[]) => (conditions.length ? ` WHERE ${conditions.join(' AND ')}` : '');

    const conditions: string[] = [];
    if (isNamed) conditions.push(`v.user_id = ${p.add(viewer.id)}`);
    if (viewer.role === 'contractor') conditions.push(`r.contractor_organisation_id = ${p.add(viewer.organisationId ?? -1)}`);
    if (filter.statuses.length) conditions.push(`${key}.status = ANY(${p.add(filter.statuses)})`);
    if (filter.builtBefore) conditions.push(`${key}.year_built < ${p.add(filter.builtBefore)}`);
    let matched: string | null = null;
    if (filter.text) {
      const like = p.add(`%${filter.text.replace(/[\\%_]/g, (c) => `\\${c}`)}%`);
      // request_viewers keeps its searched text in lower case (migration 20261204060000): LIKE
      // against the typed text in lower case finds what ILIKE would, without folding every row.
      const text = isNamed ? `v.search_text LIKE lower(${like})` : `(r.street || ' ' || r.city || ' ' || r.zip) ILIKE ${like}`;
      matched = filter.id !== null ? `(${text} OR ${id} = ${p.add(filter.id)})` : text;
    }
    const sort = `${key}.${sortColumn}`;
    const order = `${sort} ${dir}, ${id} ${dir}`;
    // Keyset paging: the rows after the last one of the previous page, found in the sort's index
    // (a row comparison on the index's columns), instead of reading and skipping the earlier pages.
    const after = filter.after ? `(${sort}, ${id}) ${dir === 'DESC' ? '<' : '>'} (CAST(${p.add(filter.after.sortKey)} AS ${SORT_TYPES[filter.sort]}), ${p.add(filter.after.id)})` : null;
    const pageConditions = after ? [...conditions, after] : conditions;
    // One row past the page tells whether another page follows (its summary is not read).
    const skipped = after ? 0 : filter.page * filter.pageSize;
    const offset = p.add(skipped);
    const pageLimit = `LIMIT ${p.add(filter.pageSize + 1)} OFFSET ${offset}`;
    const cap = matched ? this.countCaps.search : this.countCaps.list;
    if (!matched) {
      // A contractor's or the administrator's page that skips no row takes its summary columns
      // straight from the rows its index walk reaches; a page after skipped rows (OFFSET) reads
      // only the index for those and its own rows by key (withSummaries).
      const withRows = !isNamed && skipped === 0;
      const rowColumns = withRows ? `, ${PAGE_ROW_COLUMNS.filter((column) => column !== 'id').map((column) => `r.${column}`).join(', ')}` : '';
      return this.withSummaries(p, filter, lastAtRisk, `WITH page_ids AS (
          SELECT ${id} AS id, ${sort}::text AS sort_key, row_number() OVER (ORDER BY ${order}) - ${offset} AS ord${rowColumns} FROM ${table}${where(pageConditions)}
          ORDER BY ${order} ${pageLimit}),
        counted AS (${hasKeptTotal(filter) ? keptTotal(p, viewer, filter.statuses) : `SELECT count(*) AS n FROM (SELECT 1 FROM ${table}${where(conditions)} LIMIT ${p.add(cap + 1)}) AS c`})`, withRows);
    }
    // A text search reads no further than it must. Its matches are collected up to the cap + 1 in
    // any order ("matches", which reads every visible row only when there are few matches), and
    // then the page comes from one of two places:
    // - at most the cap matched: the matches themselves, sorted (no more than the cap of them);
    // - more matched: a walk of the viewer's rows in the sort's index, each tested as it passes,
    //   which stops after the page's rows. The walk's LIMIT (a parameter, sent as null: no limit)
    //   keeps the test outside it, so the generic plan (which cannot know how many rows a pattern
    //   matches) still takes the index that gives the order.
    // Only one of the two runs (each is gated on the count, which PostgreSQL reads first).
    const afterMatch = filter.after ? `(m.sort_key, m.id) ${dir === 'DESC' ? '<' : '>'} (CAST(${p.add(filter.after.sortKey)} AS ${SORT_TYPES[filter.sort]}), ${p.add(filter.after.id)})` : null;
    const isFew = `(SELECT n FROM counted) <= ${p.add(cap)}`;
    const orderIn = (alias: string) => `${alias}.sort_key ${dir}, ${alias}.id ${dir}`;
    return this.withSummaries(p, filter, lastAtRisk, `WITH matches AS MATERIALIZED (
          SELECT ${id} AS id, ${sort} AS sort_key FROM ${table}${where([...conditions, matched])} LIMIT ${p.add(cap + 1)}),
        counted AS (SELECT count(*) AS n FROM matches),
        found AS (
          (SELECT m.id, m.sort_key FROM matches m WHERE ${isFew}${afterMatch ? ` AND ${afterMatch}` : ''} ORDER BY ${orderIn('m')} ${pageLimit})
          UNION ALL
          (SELECT w.id, w.sort_key FROM (SELECT ${id} AS id, ${sort} AS sort_key, ${matched} AS hit FROM ${table}${where(pageConditions)} ORDER BY ${order} LIMIT ${p.add(null)}) AS w
            WHERE w.hit AND NOT ${isFew} ORDER BY ${orderIn('w')} ${pageLimit})),
        page_ids AS (SELECT f.id, f.sort_key::text AS sort_key, row_number() OVER (ORDER BY ${orderIn('f')}) AS ord FROM found f)`);
  }

  /**
   * The rest of `listStatement` after its CTEs: the page as one row. Each page row's summary is read
   * from `page_ids` when it carries the row's columns (`pageHasRows`), else by key (the request row
   * by row through the primary key whatever the page size: OFFSET 0 keeps it a nested loop, also in
   * a plan made once for any page); the contractor's name by its key likewise (a join here was
   * planned as a hash of every organisation per row, a subquery as a scan of them); written as JSON in the
   * shape of RepairRequestSummary, in the page's order; beside it the count, the last row's sort
   * key and id (for the cursor) and whether a row follows the page.
   */
  private withSummaries(p: StatementParams, filter: RequestListFilter, lastAtRisk: string, ctes: string, pageHasRows = false): Statement {
    const pageSize = p.add(filter.pageSize);
    const onPage = `page_ids.ord <= ${pageSize}`;
    // As toSummary and RequestsService.withRisk write a summary (an API test compares the two).
    const isoTime = (column: string) => `to_char(r.${column} AT TIME ZONE 'UTC', 'YYYY-MM-DD"T"HH24:MI:SS.MS"Z"')`;
    const summary = `SELECT r.id AS "id",
          '${REQUEST_REFERENCE_PREFIX}' || lpad(r.id::text, greatest(${REQUEST_REFERENCE_DIGITS}, length(r.id::text)), '0') AS "reference",
          r.street AS "street", r.city AS "city", r.state AS "state", r.zip AS "zip", r.year_built AS "yearBuilt",
          r.closing_date AS "closingDate", r.nec_edition AS "necEdition", r.status AS "status",
          org.name AS "contractorName",
          ic.item_count AS "itemCount", ic.open_work_count AS "openWorkCount",
          (ic.open_work_count > 0 AND r.closing_date <= CAST(${p.add(lastAtRisk)} AS date)) AS "isAtRisk",
          ${isoTime('created_at')} AS "createdAt", ${isoTime('updated_at')} AS "updatedAt"`;
    const pageRows = pageHasRows
      ? `SELECT ${PAGE_ROW_COLUMNS.map((column) => `page_ids.${column}`).join(', ')} WHERE ${onPage}`
      : `SELECT ${PAGE_ROW_COLUMNS.join(', ')} FROM repair_requests WHERE id = page_ids.id AND ${onPage} OFFSET 0`;
    return {
      text: `${ctes}
        SELECT counted.n,
          (json_agg(s ORDER BY page_ids.ord) FILTER (WHERE ${onPage}))::text AS items,
          (array_agg(page_ids.sort_key ORDER BY page_ids.ord DESC) FILTER (WHERE ${onPage}))[1] AS last_sort_key,
          (array_agg(page_ids.id ORDER BY page_ids.ord DESC) FILTER (WHERE ${onPage}))[1] AS last_id,
          bool_or(page_ids.ord > ${pageSize}) AS has_more
        FROM counted
        LEFT JOIN page_ids ON true
        LEFT JOIN LATERAL (${pageRows}) AS r ON true
        LEFT JOIN LATERAL (SELECT o.name FROM organisations o WHERE o.id = r.contractor_organisation_id OFFSET 0) AS org ON true
        LEFT JOIN LATERAL (${itemCountsIn(p)}) AS ic ON true
        LEFT JOIN LATERAL (${summary}) AS s ON true
        GROUP BY counted.n`,
      values: p.values,
    };
  }

  /**
   * What decides a request's code notes (build year, adopted edition) if `viewer` may see it, else
   * null: the access check of every item list, so a hand-written prepared statement.
   */
  async findVisibleHouse(viewer: Viewer, id: number): Promise<HouseCode | null> {
    type Row = Pick<RepairRequestRow, 'year_built' | 'nec_edition'>;
    const p = new StatementParams();
    const condition = visibleTo(viewer, (value) => p.add(value));
    const statement = { text: `SELECT r.year_built, r.nec_edition FROM repair_requests r WHERE r.id = ${p.add(id)}${condition ? ` AND ${condition}` : ''}`, values: p.values };
    const [row] = this.readPool ? await readPrepared<Row>(this.readPool, statement) : await runStatement<Row>(this.db, statement);
    return row ? { yearBuilt: row.year_built, necEdition: row.nec_edition as NecEdition } : null;
  }

  /** The request if `viewer` may see it, else null (callers answer 404 either way). */
  async findVisible(viewer: Viewer, id: number, trx?: Trx): Promise<(RepairRequestSummary & { contractorOrganisationId: number | null }) | null> {
    const row: (SummaryRow & Pick<RepairRequestRow, 'contractor_organisation_id'>) | undefined = await this.scope(this.summaries(trx), viewer).where('r.id', id).first();
    return row ? { ...toSummary(row), contractorOrganisationId: row.contractor_organisation_id } : null;
  }

  async create(request: NewRepairRequest, trx: Trx): Promise<number> {
    const [row] = await trx<RepairRequestRow>('repair_requests')
      .insert({
        street: request.street,
        city: request.city,
        state: request.state,
        zip: request.zip,
        year_built: request.yearBuilt,
        closing_date: request.closingDate,
        nec_edition: request.necEdition,
        status: request.status,
        contractor_organisation_id: request.contractorOrganisationId,
        created_by: request.createdBy,
        ...(request.createdAt ? { created_at: request.createdAt, updated_at: request.createdAt } : {}),
      })
      .returning('id');
    return row.id;
  }

  /**
   * Gives the request to another contractor and clears the site conditions flagged against the
   * previous one's rate book; returns whether the contractor changed (the caller clears the pricing).
   */
  async setContractor(id: number, contractorOrganisationId: number, trx: Trx): Promise<boolean> {
    const { contractor_organisation_id: previous } = await trx('repair_requests').where({ id }).forUpdate().first('contractor_organisation_id');
    if (previous === contractorOrganisationId) return false;
    await trx('repair_requests').where({ id }).update({ contractor_organisation_id: contractorOrganisationId, site_adder_ids: [], updated_at: new Date() });
    return true;
  }

  /** The request's status, its row locked until the transaction ends (moves take turns); null if there is none. */
  async lockStatus(id: number, trx: Trx): Promise<RequestStatus | null> {
    const row = await trx('repair_requests').where({ id }).forUpdate().first<{ status: RequestStatus } | undefined>('status');
    return row?.status ?? null;
  }

  /**
   * Moves the request to `to` and records the change with who made it, in which part, and why;
   * `from` guards against a concurrent move. Only the flow service calls this.
   */
  async changeStatus(
    id: number,
    change: { from: RequestStatus | null; to: RequestStatus; by: number | null; actor: string | null; note?: string | null; at?: Date },
    trx: Trx,
  ): Promise<boolean> {
    const at = change.at ?? new Date();
    if (change.from !== null) {
      const updated = await trx('repair_requests')
        .where({ id, status: change.from })
        .update({ status: change.to, updated_at: at });
      if (updated === 0) return false;
    }
    await trx<RequestStatusChangeRow>('request_status_changes').insert({
      request_id: id,
      from_status: change.from,
      to_status: change.to,
      changed_by: change.by,
      actor: change.actor,
      note: change.note ?? null,
      created_at: at,
    });
    return true;
  }

  async history(id: number): Promise<StatusChange[]> {
    const rows: (RequestStatusChangeRow & { by_name: string | null })[] = await this.db('request_status_changes as c')
      .leftJoin('users as u', 'u.id', 'c.changed_by')
      .where('c.request_id', id)
      .select('c.*', 'u.name as by_name')
      .orderBy([{ column: 'c.created_at' }, { column: 'c.id' }]);
    return rows.map((r) => ({
      from: r.from_status,
      to: r.to_status,
      at: r.created_at.toISOString(),
      byName: r.by_name,
      actor: r.actor,
      note: r.note,
    }));
  }

  async parties(requestId: number, trx?: Trx): Promise<PartyRecord[]> {
    const rows: (RequestPartyRow & { user_name: string | null })[] = await (trx ?? this.db)('request_parties as p')
      .leftJoin('users as u', 'u.id', 'p.user_id')
      .where('p.request_id', requestId)
      .select('p.*', 'u.name as user_name')
      .orderBy('p.id');
    return rows.map((r) => ({
      id: r.id,
      role: r.role,
      email: r.email,
      userId: r.user_id,
      name: r.user_name,
      inviteToken: r.invite_token,
      inviteExpiresAt: r.invite_expires_at,
    }));
  }

  async addParty(
    party: { requestId: number; role: PartyRole; email: string; userId: number | null; inviteToken: string | null; inviteExpiresAt: Date | null; invitedBy: number | null },
    trx: Trx,
  ): Promise<boolean> {
    const rows = await trx<RequestPartyRow>('request_parties')
      .insert({
        request_id: party.requestId,
        role: party.role,
        email: party.email,
        user_id: party.userId,
        invite_token: party.inviteToken,
        invite_expires_at: party.inviteExpiresAt,
        invited_by: party.invitedBy,
        joined_at: party.userId ? new Date() : null,
      })
      .onConflict(['request_id', 'role', 'email'])
      .ignore()
      .returning('id');
    return rows.length > 0;
  }

  async findInvitation(token: string, trx?: Trx): Promise<(RequestPartyRow & { inviter_name: string | null }) | null> {
    const row = await (trx ?? this.db)('request_parties as p')
      .leftJoin('users as u', 'u.id', 'p.invited_by')
      .where('p.invite_token', token)
      .select('p.*', 'u.name as inviter_name')
      .first();
    return row ?? null;
  }

  async acceptInvitation(partyId: number, userId: number, trx: Trx): Promise<void> {
    await trx('request_parties')
      .where({ id: partyId })
      // The token stays on the row: a second use of the link then hears "accepted already", not "no such link".
      .update({ user_id: userId, joined_at: new Date() });
  }
}
