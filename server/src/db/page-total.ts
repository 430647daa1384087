import type { Knex } from 'knex';

/**
 * The total of a paged list read with `count(*) over() AS total_count`. A page past the end has no
 * rows to carry the count, so the same query is counted again without its order and page.
 */
export async function pageTotal(rows: readonly unknown[], query: Knex.QueryBuilder): Promise<number> {
  if (rows.length) return Number((rows[0] as { total_count: string | number }).total_count);
  const counted = await query.clone().clearSelect().clearOrder().clear('limit').clear('offset').count({ c: '*' }).first();
  return Number((counted as { c?: string | number } | undefined)?.c ?? 0);
}
