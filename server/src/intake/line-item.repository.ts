import { DEFAULT_VISIT_KEY, itemStateAfter, type HouseCode, type NecEdition, PRICING_ITEM_STATES, type Confidence, type FindingCode, type ItemStatus, type LineItem, type PricingFields, type Room, type Severity } from '@cc/shared';
import type pg from 'pg';
import type { Db, Trx } from '../db/knex';
import { readPrepared, runStatement, StatementParams, type Statement } from '../db/read-pool';
import type { LineItemRow } from '../db/tables';
import { visibleTo, type Viewer } from '../requests/request.repository';

const TABLE = 'line_items';

/** A line item as stored; the service adds what is computed (edition notes). */
export type StoredLineItem = Omit<LineItem, 'editionNote'>;

export function toLineItem(row: LineItemRow): StoredLineItem {
  return {
    id: row.id,
    requestId: row.request_id,
    code: row.code as FindingCode,
    room: row.room as Room,
    location: row.location ?? '',
    quantity: row.quantity,
    evidence: row.evidence,
    page: row.page,
    reportFileId: row.report_file_id,
    evidenceStart: row.evidence_start,
    evidenceEnd: row.evidence_end,
    severity: row.severity as Severity,
    necRefs: row.nec_refs,
    status: row.status as ItemStatus,
    isEdited: row.is_edited,
    version: row.version,
    confidence: (row.confidence as Confidence | null) ?? null,
    recommendation: row.recommendation ?? null,
    computation: row.computation ?? null,
  };
}

export interface NewLineItem {
  requestId: number;
  code: FindingCode;
  room: Room;
  location: string;
  quantity: number | null;
  evidence: string | null;
  page: number | null;
  severity: Severity;
  necRefs: string[];
  status: ItemStatus;
  isEdited: boolean;
  reportFileId: number | null;
  evidenceStart: number | null;
  evidenceEnd: number | null;
  /** How the reader found a proposed item; null for items a person adds. */
  confidence?: Confidence | null;
  recommendation?: string | null;
  computation?: string | null;
}

/** What a change writes on an item: the review's fields and the pricing's. */
export type LineItemChanges = Partial<Pick<NewLineItem, 'code' | 'room' | 'location' | 'quantity' | 'severity' | 'necRefs' | 'status' | 'isEdited' | 'evidence'>> & PricingFields;

const REMOVED: ItemStatus = itemStateAfter('remove');
const PROPOSED: ItemStatus = itemStateAfter('propose');

function toRow(item: LineItemChanges & Partial<NewLineItem>): Partial<LineItemRow> {
  const row: Partial<LineItemRow> = {};
  if (item.requestId !== undefined) row.request_id = item.requestId;
  if (item.code !== undefined) row.code = item.code;
  if (item.room !== undefined) row.room = item.room;
  if (item.location !== undefined) row.location = item.location;
  if (item.quantity !== undefined) row.quantity = item.quantity;
  if (item.evidence !== undefined) row.evidence = item.evidence;
  if (item.page !== undefined) row.page = item.page;
  if (item.severity !== undefined) row.severity = item.severity;
  if (item.necRefs !== undefined) row.nec_refs = item.necRefs;
  if (item.status !== undefined) row.status = item.status;
  if (item.isEdited !== undefined) row.is_edited = item.isEdited;
  if (item.reportFileId !== undefined) row.report_file_id = item.reportFileId;
  if (item.evidenceStart !== undefined) row.evidence_start = item.evidenceStart;
  if (item.evidenceEnd !== undefined) row.evidence_end = item.evidenceEnd;
  if (item.confidence !== undefined) row.confidence = item.confidence;
  if (item.recommendation !== undefined) row.recommendation = item.recommendation;
  if (item.computation !== undefined) row.computation = item.computation;
  if (item.entryId !== undefined) row.entry_id = item.entryId;
  if (item.adderIds !== undefined) row.adder_ids = [...item.adderIds];
  if (item.pricingQuantity !== undefined) row.pricing_quantity = item.pricingQuantity;
  if (item.isQuantityAssumed !== undefined) row.is_quantity_assumed = item.isQuantityAssumed;
  if (item.visitKey !== undefined) row.visit_key = item.visitKey;
  if (item.outOfScopeReason !== undefined) row.out_of_scope_reason = item.outOfScopeReason;
  return row;
}

/** The one writer of `line_items` (the pricing repository only reads them). */
export class LineItemRepository {
  constructor(
    private readonly db: Db,
    /** Where the item list runs as a prepared statement outside transactions (db/read-pool.ts). */
    private readonly readPool: pg.Pool | null = null,
  ) {}

  /** Items of a request in reading order (report position, then creation), removed ones left out. */
  async listForRequest(requestId: number, trx?: Trx): Promise<StoredLineItem[]> {
    const statement = this.listStatement(requestId);
    const rows = !trx && this.readPool ? await readPrepared<LineItemRow>(this.readPool, statement) : await runStatement<LineItemRow>(trx ?? this.db, statement);
    return rows.map(toLineItem);
  }

  /** The statement behind `listForRequest` (its plan is checked in the API tests), written by hand as it runs on most pages. */
  listStatement(requestId: number): Statement {
    return {
      text: `SELECT * FROM ${TABLE} WHERE request_id = $1 AND status <> $2 ORDER BY report_file_id NULLS LAST, evidence_start NULLS LAST, id`,
      values: [requestId, REMOVED],
    };
  }

  /**
   * A request's items as the item list sends them, in one statement that also checks that `viewer`
   * may see the request (null when not: the caller answers 404) and reads what its edition notes
   * depend on (the house). Each item comes as the JSON of a LineItem without its note, written by
   * PostgreSQL in toLineItem's shape (an API test compares the two), with its code and room beside
   * it for the note's key.
   */
  async listVisibleAsJson(viewer: Viewer, requestId: number): Promise<{ house: HouseCode; items: { json: string; code: string; room: string }[] } | null> {
    type Row = { year_built: number; nec_edition: number; json: string | null; code: string | null; room: string | null };
    const statement = this.listVisibleAsJsonStatement(viewer, requestId);
    const rows = this.readPool ? await readPrepared<Row>(this.readPool, statement) : await runStatement<Row>(this.db, statement);
    if (!rows.length) return null;
    const house: HouseCode = { yearBuilt: rows[0].year_built, necEdition: rows[0].nec_edition as NecEdition };
    const items = rows[0].json === null ? [] : rows.map((r) => ({ json: r.json!, code: r.code!, room: r.room! }));
    return { house, items };
  }

  /** The statement behind `listVisibleAsJson` (its plan is checked in the API tests). */
  listVisibleAsJsonStatement(viewer: Viewer, requestId: number): Statement {
    const p = new StatementParams();
    const id = p.add(requestId);
    const visible = visibleTo(viewer, (value) => p.add(value));
    return {
      text: `SELECT r.year_built, r.nec_edition, x.code, x.room, row_to_json(x)::text AS json
        FROM repair_requests r
        LEFT JOIN LATERAL (
          SELECT i.id AS "id", i.request_id AS "requestId", i.code AS "code", i.room AS "room", coalesce(i.location, '') AS "location",
                 i.quantity AS "quantity", i.evidence AS "evidence", i.page AS "page", i.report_file_id AS "reportFileId",
                 i.evidence_start AS "evidenceStart", i.evidence_end AS "evidenceEnd", i.severity AS "severity", i.nec_refs AS "necRefs",
                 i.status AS "status", i.is_edited AS "isEdited", i.version AS "version", i.confidence AS "confidence",
                 i.recommendation AS "recommendation", i.computation AS "computation"
          FROM ${TABLE} i WHERE i.request_id = r.id AND i.status <> ${p.add(REMOVED)}) AS x ON true
        WHERE r.id = ${id}${visible ? ` AND ${visible}` : ''}
        ORDER BY x."reportFileId" NULLS LAST, x."evidenceStart" NULLS LAST, x.id`,
      values: p.values,
    };
  }

  async findInRequest(requestId: number, id: number, trx?: Trx): Promise<StoredLineItem | null> {
    const row = await (trx ?? this.db)<LineItemRow>(TABLE).where({ request_id: requestId, id }).whereNot({ status: REMOVED }).first();
    return row ? toLineItem(row) : null;
  }

  async insert(items: NewLineItem[], trx: Trx): Promise<number[]> {
    // In chunks, so that no statement nears the driver's limit of 65,535 parameters.
    const ids: number[] = [];
    for (let at = 0; at < items.length; at += 200) {
      const rows = await trx<LineItemRow>(TABLE).insert(items.slice(at, at + 200).map((i) => toRow(i))).returning('id');
      ids.push(...rows.map((r) => r.id));
    }
    return ids;
  }

  /** Applies `changes` only if the item is still at `version`; returns whether it was. */
  async update(id: number, version: number, changes: LineItemChanges, trx: Trx): Promise<boolean> {
    const updated = await trx<LineItemRow>(TABLE)
      .where({ id, version })
      .update({ ...toRow(changes), version: version + 1, updated_at: new Date() });
    return updated === 1;
  }

  /** Unedited proposals read from `reportFileId`: the ones a re-read may replace. */
  async uneditedProposals(reportFileId: number, trx: Trx): Promise<StoredLineItem[]> {
    const rows = await trx<LineItemRow>(TABLE).where({ report_file_id: reportFileId, status: PROPOSED, is_edited: false });
    return rows.map(toLineItem);
  }

  /** Where the items read from a report sit in its text: code, start of the evidence, whether a person edited the item. */
  async placesInReport(reportFileId: number, trx: Trx): Promise<{ code: string; evidenceStart: number | null; isEdited: boolean }[]> {
    const rows: { code: string; evidence_start: number | null; is_edited: boolean }[] = await trx(TABLE)
      .where({ report_file_id: reportFileId })
      .select('code', 'evidence_start', 'is_edited');
    return rows.map((r) => ({ code: r.code, evidenceStart: r.evidence_start, isEdited: r.is_edited }));
  }

  /**
   * Clears what a contractor set while pricing (entries, conditions, quantities, visits, "not our
   * scope"): it refers to the rate book of a contractor who no longer has the request.
   */
  async clearPricing(requestId: number, trx: Trx): Promise<void> {
    await trx(TABLE)
      .where({ request_id: requestId })
      .whereIn('status', [...PRICING_ITEM_STATES])
      .update({
        status: itemStateAfter('confirm'),
        entry_id: null,
        adder_ids: [],
        pricing_quantity: null,
        is_quantity_assumed: false,
        visit_key: DEFAULT_VISIT_KEY,
        out_of_scope_reason: null,
        version: trx.raw('version + 1'),
        updated_at: new Date(),
      });
  }

  async deleteByIds(ids: number[], trx: Trx): Promise<void> {
    if (ids.length) await trx<LineItemRow>(TABLE).whereIn('id', ids).delete();
  }
}
