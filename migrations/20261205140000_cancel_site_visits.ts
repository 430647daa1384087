import type { Knex } from 'knex';

// A booked site visit can be called off (the seller cancelled a showing, the occupant is ill, a part is
// back-ordered). The visit is kept as history with status `cancelled`, who cancelled it, when and why;
// its items are freed for another visit. `version` counts every change of a visit (moved, started,
// finished, cancelled): a cancellation sends back the version it saw, and calendar feeds write it as
// the event's SEQUENCE (RFC 5545 §3.8.7.4) so that calendars take the latest state.
export async function up(knex: Knex): Promise<void> {
  await knex.schema.alterTable('site_visits', (t) => {
    t.integer('version').notNullable().defaultTo(1);
    t.timestamp('cancelled_at', { useTz: true });
    t.integer('cancelled_by').references('id').inTable('users').onDelete('SET NULL');
    t.text('cancel_reason');
  });
  await knex.raw('ALTER TABLE site_visits DROP CONSTRAINT site_visits_status_check');
  await knex.raw("ALTER TABLE site_visits ADD CONSTRAINT site_visits_status_check CHECK (status IN ('booked', 'started', 'finished', 'cancelled'))");
  // A cancelled visit always says when and why; no other visit does.
  await knex.raw(
    "ALTER TABLE site_visits ADD CONSTRAINT site_visits_cancellation_check CHECK ((status = 'cancelled') = (cancelled_at IS NOT NULL) AND (cancelled_at IS NULL) = (cancel_reason IS NULL))",
  );
}

export async function down(knex: Knex): Promise<void> {
  // Never delete history: a database that holds cancelled visits cannot go back to a schema without them.
  const { rows } = await knex.raw<{ rows: { n: number }[] }>("SELECT count(*)::int AS n FROM site_visits WHERE status = 'cancelled'");
  if (rows[0].n > 0) throw new Error(`${rows[0].n} cancelled site visits are kept as history; this migration cannot be undone while they exist`);
  await knex.raw('ALTER TABLE site_visits DROP CONSTRAINT site_visits_cancellation_check');
  await knex.raw('ALTER TABLE site_visits DROP CONSTRAINT site_visits_status_check');
  await knex.raw("ALTER TABLE site_visits ADD CONSTRAINT site_visits_status_check CHECK (status IN ('booked', 'started', 'finished'))");
  await knex.schema.alterTable('site_visits', (t) => {
    t.dropColumn('cancel_reason');
    t.dropColumn('cancelled_by');
    t.dropColumn('cancelled_at');
    t.dropColumn('version');
  });
}
