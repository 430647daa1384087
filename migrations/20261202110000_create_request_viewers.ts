import type { Knex } from 'knex';

// Request lists of the people named on requests (agents, sellers, inspectors) read one row per
// (person, request) in the order of the list's sort, from an index that starts with the person:
// `request_viewers` holds, for each user named on a request (request_parties.user_id), the request's
// sort and filter columns (status, build year, the searched text). Triggers keep it in step in the same transaction as the write that changes it (a
// party joins, leaves or changes; a request's sort column changes), so no code path can forget it;
// nothing else writes it. The administrator's and a contractor's lists keep reading repair_requests
// through its own indexes (20261202002000_index_request_lists plus the two added here).
export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('request_viewers', (t) => {
    t.integer('user_id').notNullable().references('id').inTable('users').onDelete('CASCADE');
    t.integer('request_id').notNullable().references('id').inTable('repair_requests').onDelete('CASCADE');
    t.date('closing_date').notNullable();
    t.timestamp('created_at', { useTz: true }).notNullable();
    t.string('street', 200).notNullable();
    t.string('status', 20).notNullable();
    t.integer('year_built').notNullable();
    // What the list's search box matches: street, city and ZIP code as repair_requests_search_trgm reads them.
    t.text('search_text').notNullable();
    t.primary(['user_id', 'request_id']);
    t.index(['request_id'], 'request_viewers_request_index');
    t.index(['user_id', 'closing_date', 'request_id'], 'request_viewers_closing_index');
    t.index(['user_id', 'created_at', 'request_id'], 'request_viewers_created_index');
    t.index(['user_id', 'street', 'request_id'], 'request_viewers_street_index');
    t.index(['user_id', 'status', 'closing_date', 'request_id'], 'request_viewers_status_index');
  });

  await knex.raw(`
    CREATE FUNCTION request_viewers_add(p_user_id integer, p_request_id integer) RETURNS void AS $$
      INSERT INTO request_viewers (user_id, request_id, closing_date, created_at, street, status, year_built, search_text)
      SELECT p_user_id, r.id, r.closing_date, r.created_at, r.street, r.status, r.year_built, r.street || ' ' || r.city || ' ' || r.zip
      FROM repair_requests r WHERE r.id = p_request_id
      ON CONFLICT (user_id, request_id) DO NOTHING
    $$ LANGUAGE sql;

    CREATE FUNCTION request_viewers_drop(p_user_id integer, p_request_id integer) RETURNS void AS $$
      DELETE FROM request_viewers v
      WHERE v.user_id = p_user_id AND v.request_id = p_request_id
        AND NOT EXISTS (SELECT 1 FROM request_parties p WHERE p.user_id = p_user_id AND p.request_id = p_request_id)
    $$ LANGUAGE sql;

    CREATE FUNCTION request_parties_viewers() RETURNS trigger AS $$
    BEGIN
      IF TG_OP IN ('UPDATE', 'DELETE') AND OLD.user_id IS NOT NULL THEN
        PERFORM request_viewers_drop(OLD.user_id, OLD.request_id);
      END IF;
      IF TG_OP IN ('INSERT', 'UPDATE') AND NEW.user_id IS NOT NULL THEN
        PERFORM request_viewers_add(NEW.user_id, NEW.request_id);
      END IF;
      RETURN NULL;
    END
    $$ LANGUAGE plpgsql;

    CREATE TRIGGER request_parties_viewers AFTER INSERT OR DELETE OR UPDATE OF user_id, request_id ON request_parties
      FOR EACH ROW EXECUTE FUNCTION request_parties_viewers();

    CREATE FUNCTION repair_requests_viewers() RETURNS trigger AS $$
    BEGIN
      UPDATE request_viewers
        SET closing_date = NEW.closing_date, created_at = NEW.created_at, street = NEW.street, status = NEW.status,
            year_built = NEW.year_built, search_text = NEW.street || ' ' || NEW.city || ' ' || NEW.zip
        WHERE request_id = NEW.id;
      RETURN NULL;
    END
    $$ LANGUAGE plpgsql;

    CREATE TRIGGER repair_requests_viewers AFTER UPDATE OF closing_date, created_at, street, status, year_built, city, zip ON repair_requests
      FOR EACH ROW
      WHEN (OLD.closing_date IS DISTINCT FROM NEW.closing_date OR OLD.created_at IS DISTINCT FROM NEW.created_at
            OR OLD.street IS DISTINCT FROM NEW.street OR OLD.status IS DISTINCT FROM NEW.status
            OR OLD.year_built IS DISTINCT FROM NEW.year_built OR OLD.city IS DISTINCT FROM NEW.city OR OLD.zip IS DISTINCT FROM NEW.zip)
      EXECUTE FUNCTION repair_requests_viewers();

    INSERT INTO request_viewers (user_id, request_id, closing_date, created_at, street, status, year_built, search_text)
    SELECT DISTINCT p.user_id, r.id, r.closing_date, r.created_at, r.street, r.status, r.year_built, r.street || ' ' || r.city || ' ' || r.zip
    FROM request_parties p JOIN repair_requests r ON r.id = p.request_id
    WHERE p.user_id IS NOT NULL;
  `);

  // A contractor's list by street or of one status (by closing date), the administrator's by status
  // or closing date, each read in index order.
  await knex.schema.alterTable('repair_requests', (t) => {
    t.index(['contractor_organisation_id', 'street', 'id'], 'repair_requests_contractor_street_index');
    t.index(['contractor_organisation_id', 'status', 'closing_date', 'id'], 'repair_requests_contractor_status_index');
    t.index(['status', 'id'], 'repair_requests_status_id_index');
    t.index(['closing_date', 'id'], 'repair_requests_closing_id_index');
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.alterTable('repair_requests', (t) => {
    t.dropIndex([], 'repair_requests_contractor_street_index');
    t.dropIndex([], 'repair_requests_contractor_status_index');
    t.dropIndex([], 'repair_requests_status_id_index');
    t.dropIndex([], 'repair_requests_closing_id_index');
  });
  await knex.raw(`
    DROP TRIGGER repair_requests_viewers ON repair_requests;
    DROP FUNCTION repair_requests_viewers();
    DROP TRIGGER request_parties_viewers ON request_parties;
    DROP FUNCTION request_parties_viewers();
    DROP FUNCTION request_viewers_drop(integer, integer);
    DROP FUNCTION request_viewers_add(integer, integer);
  `);
  await knex.schema.dropTable('request_viewers');
}
