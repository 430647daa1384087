import type { Knex } from 'knex';

// Each request list's total, kept by status for each scope a list reads, so that a list page tells
// its exact total by reading a few rows instead of counting the visible rows (up to a cap) on every
// page: `viewer` (a person named on requests: request_viewers by user), `contractor` (repair_requests
// by contractor organisation) and `all` (the administrator's list; scope_id 0). A list filtered by
// build year or searched text still counts its rows (request.repository.ts).
//
// Statement triggers with transition tables add each statement's changes as deltas, as the item
// status counts do (20261203080000): +1 for every new or updated row's (scope, status), -1 for every
// deleted or old one, so concurrent transactions' changes add up. The deltas are written in key
// order, so two transactions take the rows' locks in the same order. TRUNCATE fires no row changes:
// its own trigger clears the scopes of the emptied table.
/** The four statement triggers of `table` (one event each, as transition tables require) calling `<table>_list_counts()`. */
function countingTriggers(table: string): string {
  const fn = `${table}_list_counts`;
  return `
    CREATE TRIGGER ${fn}_insert AFTER INSERT ON ${table} REFERENCING NEW TABLE AS new_rows FOR EACH STATEMENT EXECUTE FUNCTION ${fn}();
    CREATE TRIGGER ${fn}_update AFTER UPDATE ON ${table} REFERENCING OLD TABLE AS old_rows NEW TABLE AS new_rows FOR EACH STATEMENT EXECUTE FUNCTION ${fn}();
    CREATE TRIGGER ${fn}_delete AFTER DELETE ON ${table} REFERENCING OLD TABLE AS old_rows FOR EACH STATEMENT EXECUTE FUNCTION ${fn}();
    CREATE TRIGGER ${fn}_truncate AFTER TRUNCATE ON ${table} FOR EACH STATEMENT EXECUTE FUNCTION ${fn}();`;
}

export async function up(knex: Knex): Promise<void> {
  await knex.raw(`
    CREATE TABLE request_list_counts (
      scope text NOT NULL CHECK (scope IN ('viewer', 'contractor', 'all')),
      scope_id integer NOT NULL,
      status text NOT NULL,
      n integer NOT NULL,
      PRIMARY KEY (scope, scope_id, status)
    );

    CREATE FUNCTION request_list_counts_add(p_scopes text[], p_scope_ids integer[], p_statuses text[], p_changes integer[]) RETURNS void AS $$
      INSERT INTO request_list_counts AS c (scope, scope_id, status, n)
      SELECT scope, scope_id, status, sum(n)::int
      FROM unnest(p_scopes, p_scope_ids, p_statuses, p_changes) AS d(scope, scope_id, status, n)
      GROUP BY scope, scope_id, status HAVING sum(n) <> 0
      ORDER BY scope, scope_id, status
      ON CONFLICT (scope, scope_id, status) DO UPDATE SET n = c.n + EXCLUDED.n
    $$ LANGUAGE sql;

    CREATE FUNCTION request_viewers_list_counts() RETURNS trigger AS $$
    BEGIN
      IF TG_OP = 'TRUNCATE' THEN
        DELETE FROM request_list_counts WHERE scope = 'viewer';
      ELSIF TG_OP = 'INSERT' THEN
        PERFORM request_list_counts_add(array_agg('viewer'::text), array_agg(user_id), array_agg(status::text), array_agg(1)) FROM new_rows;
      ELSIF TG_OP = 'DELETE' THEN
        PERFORM request_list_counts_add(array_agg('viewer'::text), array_agg(user_id), array_agg(status::text), array_agg(-1)) FROM old_rows;
      ELSE
        PERFORM request_list_counts_add(array_agg('viewer'::text), array_agg(user_id), array_agg(status), array_agg(n))
        FROM (SELECT user_id, status::text AS status, 1 AS n FROM new_rows
              UNION ALL SELECT user_id, status::text, -1 FROM old_rows) AS c;
      END IF;
      RETURN NULL;
    END
    $$ LANGUAGE plpgsql;

    CREATE FUNCTION repair_requests_list_counts() RETURNS trigger AS $$
    BEGIN
      IF TG_OP = 'TRUNCATE' THEN
        DELETE FROM request_list_counts WHERE scope IN ('contractor', 'all');
      ELSIF TG_OP = 'INSERT' THEN
        PERFORM request_list_counts_add(array_agg(scope), array_agg(scope_id), array_agg(status), array_agg(n))
        FROM (SELECT 'all'::text AS scope, 0 AS scope_id, status::text AS status, 1 AS n FROM new_rows
              UNION ALL SELECT 'contractor', contractor_organisation_id, status::text, 1 FROM new_rows WHERE contractor_organisation_id IS NOT NULL) AS c;
      ELSIF TG_OP = 'DELETE' THEN
        PERFORM request_list_counts_add(array_agg(scope), array_agg(scope_id), array_agg(status), array_agg(n))
        FROM (SELECT 'all'::text AS scope, 0 AS scope_id, status::text AS status, -1 AS n FROM old_rows
              UNION ALL SELECT 'contractor', contractor_organisation_id, status::text, -1 FROM old_rows WHERE contractor_organisation_id IS NOT NULL) AS c;
      ELSE
        -- Every update fires this (a column list cannot go with transition tables); an update that
        -- changes neither status nor contractor adds deltas that sum to nothing, and writes nothing.
        PERFORM request_list_counts_add(array_agg(scope), array_agg(scope_id), array_agg(status), array_agg(n))
        FROM (SELECT 'all'::text AS scope, 0 AS scope_id, status::text AS status, 1 AS n FROM new_rows
              UNION ALL SELECT 'contractor', contractor_organisation_id, status::text, 1 FROM new_rows WHERE contractor_organisation_id IS NOT NULL
              UNION ALL SELECT 'all', 0, status::text, -1 FROM old_rows
              UNION ALL SELECT 'contractor', contractor_organisation_id, status::text, -1 FROM old_rows WHERE contractor_organisation_id IS NOT NULL) AS c;
      END IF;
      RETURN NULL;
    END
    $$ LANGUAGE plpgsql;

    ${countingTriggers('request_viewers')}
    ${countingTriggers('repair_requests')}

    INSERT INTO request_list_counts (scope, scope_id, status, n)
    SELECT 'viewer', user_id, status, count(*) FROM request_viewers GROUP BY user_id, status
    UNION ALL SELECT 'contractor', contractor_organisation_id, status, count(*) FROM repair_requests WHERE contractor_organisation_id IS NOT NULL GROUP BY contractor_organisation_id, status
    UNION ALL SELECT 'all', 0, status, count(*) FROM repair_requests GROUP BY status;
  `);
}

export async function down(knex: Knex): Promise<void> {
  await knex.raw(`
    DROP FUNCTION IF EXISTS request_viewers_list_counts() CASCADE;
    DROP FUNCTION IF EXISTS repair_requests_list_counts() CASCADE;
    DROP FUNCTION IF EXISTS request_list_counts_add(text[], integer[], text[], integer[]);
    DROP TABLE IF EXISTS request_list_counts;
  `);
}
