import type { Knex } from 'knex';

// The organisation's time zone (IANA name) for booking, planning and calendars; null: the zone of the
// shop's state (shared/src/geo/time-zones.ts).
export async function up(knex: Knex): Promise<void> {
  await knex.schema.alterTable('day_plan_settings', (t) => {
    t.string('time_zone', 64).nullable();
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.alterTable('day_plan_settings', (t) => {
    t.dropColumn('time_zone');
  });
}
