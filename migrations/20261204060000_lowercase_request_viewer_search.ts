import type { Knex } from 'knex';

// The people's lists search `request_viewers.search_text` for what was typed, case-insensitively.
// ILIKE folds the case of every row it reads on every search (about 2 µs a row here); the text is
// now kept in lower case once, when it is written, and a search matches it with LIKE against the
// typed text in lower case: the same matches, in about a fifth of the time (docs/performance.md).
// `request_search_text` is the one definition of the searched text for both trigger functions.
const functions = (text: (street: string, city: string, zip: string) => string) => `
  CREATE OR REPLACE FUNCTION request_viewers_add(p_user_id integer, p_request_id integer) RETURNS void AS $$
    INSERT INTO request_viewers (user_id, request_id, closing_date, created_at, street, status, year_built, search_text)
    SELECT p_user_id, r.id, r.closing_date, r.created_at, r.street, r.status, r.year_built, ${text('r.street', 'r.city', 'r.zip')}
    FROM repair_requests r WHERE r.id = p_request_id
    ON CONFLICT (user_id, request_id) DO NOTHING
  $$ LANGUAGE sql;

  CREATE OR REPLACE FUNCTION repair_requests_viewers() RETURNS trigger AS $$
  BEGIN
    UPDATE request_viewers
      SET closing_date = NEW.closing_date, created_at = NEW.created_at, street = NEW.street, status = NEW.status,
          year_built = NEW.year_built, search_text = ${text('NEW.street', 'NEW.city', 'NEW.zip')}
      WHERE request_id = NEW.id;
    RETURN NULL;
  END
  $$ LANGUAGE plpgsql;
`;

export async function up(knex: Knex): Promise<void> {
  await knex.raw(`
    CREATE FUNCTION request_search_text(street text, city text, zip text) RETURNS text AS $$
      SELECT lower(street || ' ' || city || ' ' || zip)
    $$ LANGUAGE sql IMMUTABLE;
    ${functions((s, c, z) => `request_search_text(${s}, ${c}, ${z})`)}
    UPDATE request_viewers v SET search_text = request_search_text(r.street, r.city, r.zip)
    FROM repair_requests r WHERE r.id = v.request_id;
  `);
}

export async function down(knex: Knex): Promise<void> {
  await knex.raw(`
    ${functions((s, c, z) => `${s} || ' ' || ${c} || ' ' || ${z}`)}
    UPDATE request_viewers v SET search_text = r.street || ' ' || r.city || ' ' || r.zip
    FROM repair_requests r WHERE r.id = v.request_id;
    DROP FUNCTION request_search_text(text, text, text);
  `);
}
