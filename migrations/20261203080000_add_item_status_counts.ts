import type { Knex } from 'knex';

// A request's items counted by status, kept on the request row, so that request lists and
// dashboards read a request's item counts with the row instead of counting its items each time.
// The counts know nothing of the flow: which statuses count as items or as open work is decided by
// the reader (the flow's item states in shared/src/requests/request-flow.ts).
//
// Statement triggers with transition tables add each statement's changes as deltas (+1 for every
// new or updated row's status, -1 for every deleted or old one). Deltas, not a recount: a
// concurrent transaction's changes to the same request then add up (the UPDATE applies them to the
// newest row version), where a recount could read a snapshot without them. PostgreSQL allows one
// event per trigger with transition tables, hence three triggers on one function.
export async function up(knex: Knex): Promise<void> {
  await knex.raw(`
    ALTER TABLE repair_requests ADD COLUMN item_status_counts jsonb NOT NULL DEFAULT '{}'::jsonb;

    UPDATE repair_requests r SET item_status_counts = s.counts
    FROM (SELECT request_id, jsonb_object_agg(status, n) AS counts
          FROM (SELECT request_id, status, count(*) AS n FROM line_items GROUP BY request_id, status) c
          GROUP BY request_id) s
    WHERE s.request_id = r.id;

    -- Adds the changes (request, status, +1 or -1) to the requests' counts.
    CREATE FUNCTION item_status_counts_add(p_request_ids integer[], p_statuses text[], p_changes integer[]) RETURNS void AS $$
      WITH deltas AS (
        SELECT request_id, status, sum(n)::int AS n
        FROM unnest(p_request_ids, p_statuses, p_changes) AS c(request_id, status, n)
        GROUP BY request_id, status HAVING sum(n) <> 0
      )
      UPDATE repair_requests r
      SET item_status_counts = (
        SELECT coalesce(jsonb_object_agg(status, total), '{}'::jsonb)
        FROM (SELECT status, sum(n) AS total
              FROM (SELECT key AS status, value::int AS n FROM jsonb_each_text(r.item_status_counts)
                    UNION ALL
                    SELECT d.status, d.n FROM deltas d WHERE d.request_id = r.id) AS both_sides
              GROUP BY status HAVING sum(n) <> 0) AS totals)
      WHERE r.id IN (SELECT request_id FROM deltas)
    $$ LANGUAGE sql;

    CREATE FUNCTION line_items_status_counts() RETURNS trigger AS $$
    BEGIN
      IF TG_OP = 'INSERT' THEN
        PERFORM item_status_counts_add(array_agg(request_id), array_agg(status::text), array_agg(1)) FROM new_rows;
      ELSIF TG_OP = 'DELETE' THEN
        PERFORM item_status_counts_add(array_agg(request_id), array_agg(status::text), array_agg(-1)) FROM old_rows;
      ELSE
        PERFORM item_status_counts_add(array_agg(request_id), array_agg(status), array_agg(n))
        FROM (SELECT request_id, status::text AS status, 1 AS n FROM new_rows
              UNION ALL SELECT request_id, status::text, -1 FROM old_rows) AS c;
      END IF;
      RETURN NULL;
    END
    $$ LANGUAGE plpgsql;

    CREATE TRIGGER line_items_status_counts_insert AFTER INSERT ON line_items
      REFERENCING NEW TABLE AS new_rows FOR EACH STATEMENT EXECUTE FUNCTION line_items_status_counts();
    CREATE TRIGGER line_items_status_counts_update AFTER UPDATE ON line_items
      REFERENCING OLD TABLE AS old_rows NEW TABLE AS new_rows FOR EACH STATEMENT EXECUTE FUNCTION line_items_status_counts();
    CREATE TRIGGER line_items_status_counts_delete AFTER DELETE ON line_items
      REFERENCING OLD TABLE AS old_rows FOR EACH STATEMENT EXECUTE FUNCTION line_items_status_counts();
  `);
}

export async function down(knex: Knex): Promise<void> {
  await knex.raw(`
    DROP FUNCTION IF EXISTS line_items_status_counts() CASCADE;
    DROP FUNCTION IF EXISTS item_status_counts_add(integer[], text[], integer[]);
    ALTER TABLE repair_requests DROP COLUMN IF EXISTS item_status_counts;
  `);
}
