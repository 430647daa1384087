import { itemStatesFrom, PRICING_ITEM_STATES, type ItemStatus, type PricedItemState, type PricingVisit } from '@cc/shared';
import type { Db, Trx } from '../db/knex';
import type { ItemPricingRow, PricingVisitRow } from '../db/pricing-tables';

/** Item states a ballpark counts: those still to be confirmed or priced, and priced ones. */
const BALLPARK_ITEM_STATES = itemStatesFrom(['confirm', 'price']);

/** A line item with what the contractor set on it while pricing. */
export interface StoredPricingItem extends PricedItemState {
  id: number;
  version: number;
  code: string;
  room: string;
  location: string;
  quantity: number | null;
  status: ItemStatus;
  entryId: number | null;
  adderIds: number[];
  /** The contractor's quantity (null: the item's own). */
  pricingQuantity: number | null;
  isQuantityAssumed: boolean;
  visitKey: string;
  outOfScopeReason: string | null;
}

const COLUMNS = ['id', 'request_id', 'code', 'room', 'location', 'quantity', 'status', 'version', 'entry_id', 'adder_ids', 'pricing_quantity', 'is_quantity_assumed', 'visit_key', 'out_of_scope_reason'];

function toPricingItem(row: ItemPricingRow): StoredPricingItem {
  return {
    id: row.id,
    version: row.version,
    code: row.code,
    room: row.room,
    location: row.location ?? '',
    quantity: row.quantity,
    status: row.status as ItemStatus,
    entryId: row.entry_id,
    adderIds: row.adder_ids,
    pricingQuantity: row.pricing_quantity,
    isQuantityAssumed: row.is_quantity_assumed,
    visitKey: row.visit_key,
    outOfScopeReason: row.out_of_scope_reason,
  };
}

/**
 * The pricing side of line items (read only: `LineItemRepository` writes them), the visits of a
 * request and its flagged site conditions.
 */
export class ItemPricingRepository {
  constructor(private readonly db: Db) {}

  /** Items of a request in pricing states; with `forUpdate` they stay locked until the transaction ends. */
  async listForRequest(requestId: number, trx?: Trx, forUpdate = false): Promise<StoredPricingItem[]> {
    const query = (trx ?? this.db)('line_items')
      .where({ request_id: requestId })
      .whereIn('status', [...PRICING_ITEM_STATES])
      .select(COLUMNS)
      .orderBy('id');
    if (forUpdate && trx) query.forUpdate();
    const rows: ItemPricingRow[] = await query;
    return rows.map(toPricingItem);
  }

  /** Codes and quantities of the items a ballpark counts: proposed, open and priced ones (at their effective quantity). */
  async ballparkItems(requestId: number): Promise<{ code: string; quantity: number | null }[]> {
    const rows: { code: string; quantity: number | null }[] = await this.db('line_items')
      .where({ request_id: requestId })
      .whereIn('status', [...BALLPARK_ITEM_STATES])
      .select('code', this.db.raw('COALESCE(pricing_quantity, quantity) AS quantity'))
      .orderBy('id');
    return rows;
  }

  async listVisits(requestId: number, trx?: Trx): Promise<PricingVisit[]> {
    const rows = await (trx ?? this.db)<PricingVisitRow>('request_pricing_visits').where({ request_id: requestId }).orderBy('position');
    return rows.map((r) => ({ key: r.key, adderIds: r.adder_ids, hasPermit: r.has_permit }));
  }

  /** Drops the planned visits (a new contractor plans their own). */
  async clearVisits(requestId: number, trx: Trx): Promise<void> {
    await trx('request_pricing_visits').where({ request_id: requestId }).delete();
  }

  async replaceVisits(requestId: number, visits: readonly PricingVisit[], trx: Trx): Promise<void> {
    await trx('request_pricing_visits').where({ request_id: requestId }).delete();
    await trx('request_pricing_visits').insert(
      visits.map((v, position) => ({ request_id: requestId, key: v.key, position, adder_ids: v.adderIds, has_permit: v.hasPermit })),
    );
  }

  async siteAdderIds(requestId: number, trx?: Trx): Promise<number[]> {
    const row = await (trx ?? this.db)('repair_requests').where({ id: requestId }).first<{ site_adder_ids: number[] } | undefined>('site_adder_ids');
    return row?.site_adder_ids ?? [];
  }

  async setSiteAdderIds(requestId: number, adderIds: number[], trx?: Trx): Promise<void> {
    await (trx ?? this.db)('repair_requests').where({ id: requestId }).update({ site_adder_ids: adderIds, updated_at: new Date() });
  }
}
