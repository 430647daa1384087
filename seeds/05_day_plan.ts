import type { Knex } from 'knex';
import { DEFAULT_DAY_PLAN_SETTINGS } from '@cc/shared';
import { BRIGHTLINE_SHOP, ORGANISATIONS, PEOPLE, PLANNED_DAY_VISITS } from './data/demo-scenario';
import { nextWeekday } from './data/next-weekday';

// Brightline's planning settings (defaults, with its shop) and a planned day for Sam Okafor on the
// next weekday: a site visit for each scheduled request of PLANNED_DAY_VISITS, taking its approved
// items. The approved requests nearby stay without a visit: the day plan suggests them.
export async function seed(knex: Knex): Promise<void> {
  await knex('calendar_feeds').delete();
  await knex('day_plan_settings').delete();
  const brightline = ORGANISATIONS.find((o) => o.key === 'brightline')!;
  const org = await knex('organisations').where({ name: brightline.name }).first('id');
  const sam = await knex('users').where({ email: PEOPLE.find((p) => p.key === 'sam')!.email }).first('id');
  await knex('day_plan_settings').insert({
    organisation_id: org.id,
    road_factor_percent: DEFAULT_DAY_PLAN_SETTINGS.roadFactorPercent,
    average_speed_mph: DEFAULT_DAY_PLAN_SETTINGS.averageSpeedMph,
    setup_minutes: DEFAULT_DAY_PLAN_SETTINGS.setupMinutes,
    flat_item_minutes: DEFAULT_DAY_PLAN_SETTINGS.flatItemMinutes,
    day_start: DEFAULT_DAY_PLAN_SETTINGS.dayStart,
    day_end: DEFAULT_DAY_PLAN_SETTINGS.dayEnd,
    lunch_start: DEFAULT_DAY_PLAN_SETTINGS.lunchStart,
    lunch_minutes: DEFAULT_DAY_PLAN_SETTINGS.lunchMinutes,
    shop_street: BRIGHTLINE_SHOP.street,
    shop_city: BRIGHTLINE_SHOP.city,
    shop_state: BRIGHTLINE_SHOP.state,
    shop_zip: BRIGHTLINE_SHOP.zip,
    version: 1,
    updated_by: sam.id,
  });

  const date = nextWeekday();
  for (const planned of PLANNED_DAY_VISITS) {
    const request = await knex('repair_requests').where({ street: planned.street, contractor_organisation_id: org.id }).first('id');
    await knex.transaction(async (trx) => {
      const [visit] = await trx('site_visits')
        .insert({ request_id: request.id, number: 1, visit_date: date, arrival_from: planned.arrivalFrom, arrival_to: planned.arrivalTo, electrician_id: sam.id, access_notes: 'Lockbox on the front door; code from the listing agent', booked_by: sam.id })
        .returning('id');
      await trx('line_items').where({ request_id: request.id, status: 'approved' }).whereNull('site_visit_id').update({ site_visit_id: visit.id });
    });
  }
}
