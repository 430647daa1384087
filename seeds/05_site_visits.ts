import type { Knex } from 'knex';
import { DEMO_PLANNED_DAY } from './data/demo-scenario';

// Books the demo's planned day: tomorrow (from the seeding day) Sam Okafor of Brightline visits the
// scheduled and the under-way requests in the order given, with their approved items planned on the
// visit. Day economics (pick list, earnings) and the visit screen read these.
export async function seed(knex: Knex): Promise<void> {
  await knex('site_visits').delete();
  const date = new Date(Date.now() + DEMO_PLANNED_DAY.inDays * 86_400_000).toISOString().slice(0, 10);
  const electrician = await knex('users').where({ email: DEMO_PLANNED_DAY.electricianEmail }).first('id');
  if (!electrician) return;
  for (const stop of DEMO_PLANNED_DAY.stops) {
    const request = await knex('repair_requests').where({ street: stop.street }).first('id');
    if (!request) continue;
    const [visit] = await knex('site_visits')
      .insert({ request_id: request.id, number: 1, visit_date: date, arrival_from: stop.arrivalFrom, arrival_to: stop.arrivalTo, electrician_id: electrician.id, booked_by: electrician.id, access_notes: stop.accessNotes })
      .returning('id');
    await knex('line_items').where({ request_id: request.id, status: 'approved' }).update({ site_visit_id: visit.id });
  }
}
