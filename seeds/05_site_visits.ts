import type { Knex } from 'knex';
import { DEMO_PLANNED_DAY } from './data/demo-scenario';
import { nextWeekday } from './data/next-weekday';

// Books Lee Park's planned day (the next weekday, as Sam Okafor's in seeds/05_day_plan.ts): Lee of
// Brightline visits the scheduled and the under-way requests in the order given, with their approved
// items planned on the visit. Day economics (pick list, earnings) and the visit screen read these.
// Only these requests' visits are replaced; the day plan's own visits stay.
export async function seed(knex: Knex): Promise<void> {
  const date = nextWeekday();
  const electrician = await knex('users').where({ email: DEMO_PLANNED_DAY.electricianEmail }).first('id');
  if (!electrician) return;
  for (const stop of DEMO_PLANNED_DAY.stops) {
    const request = await knex('repair_requests').where({ street: stop.street }).first('id');
    if (!request) continue;
    await knex('site_visits').where({ request_id: request.id }).delete();
    const [visit] = await knex('site_visits')
      .insert({ request_id: request.id, number: 1, visit_date: date, arrival_from: stop.arrivalFrom, arrival_to: stop.arrivalTo, electrician_id: electrician.id, booked_by: electrician.id, access_notes: stop.accessNotes })
      .returning('id');
    await knex('line_items').where({ request_id: request.id, status: 'approved' }).update({ site_visit_id: visit.id });
  }
}
