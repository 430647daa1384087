import type { Knex } from 'knex';
import sharp from 'sharp';
import { IssueLetterSchema, ProofReviewSchema, RecordCorrectionSchema, RecordFundsSchema, StartPaymentSchema, type CurrentUser, type FindingCode, type RecordCorrection } from '@cc/shared';
import { loadConfig } from '../server/src/config/config';
import type { UploadedPhoto } from '../server/src/corrections/corrections.service';
import { createServices } from '../server/src/services';
import { UserRepository } from '../server/src/auth/user.repository';
import { PEOPLE, REQUESTS } from './data/demo-scenario';
import { markHistoryDelivered } from './data/history';

const DAY = 86_400_000;

/** What the electrician records for each kind of demo item (readings within the limits of shared/src/readings). */
const RECORDS: Partial<Record<FindingCode, RecordCorrection>> = {
  'gfci-missing': {
    outcome: 'corrected',
    workPerformed: 'Installed a GFCI receptacle at the first device of the counter run; downstream receptacles labelled',
    materials: '20 A tamper- and weather-resistant GFCI receptacle, "GFCI Protected" labels',
    deviceMake: 'Marlow Electric Supply',
    deviceModel: 'GF20-TR',
    labels: ['GFCI Protected'],
    readings: { gfci: { tripsOnTest: true, resets: true, downstreamProven: 1, tripTimeMs: 25, testCurrentMa: 6.5 }, receptacle: { polarityCorrect: true, groundPresent: true } },
  },
  'double-tap': {
    outcome: 'corrected',
    workPerformed: 'Joined the two conductors with a pigtail under a listed connector; one conductor now on the breaker terminal',
    materials: '12 AWG copper pigtail, listed twist-on connector',
  },
  'reversed-polarity': {
    outcome: 'corrected',
    workPerformed: 'Re-terminated the ungrounded conductor on the brass screw and the grounded conductor on the silver screw',
    materials: 'None (re-terminated the existing receptacle)',
    readings: { receptacle: { polarityCorrect: true, groundPresent: true } },
  },
  'weather-cover-missing': {
    outcome: 'corrected',
    workPerformed: 'Installed an in-use (extra-duty) cover and a weather-resistant receptacle',
    materials: 'Extra-duty in-use cover, 15 A weather-resistant receptacle',
  },
};

/** A drawn "after" photo: the device on its wall plate (demo pictures, not real ones). */
async function demoPhoto(caption: string): Promise<Buffer> {
  const svg = `<svg xmlns="http://www.w3.org/2000/svg" width="800" height="600">
    <rect width="800" height="600" fill="#e8e2d6"/>
    <rect x="300" y="130" width="200" height="320" rx="14" fill="#fbfaf7" stroke="#9a958c" stroke-width="4"/>
    <rect x="345" y="185" width="110" height="80" rx="10" fill="#f1efe9" stroke="#7d786f" stroke-width="3"/>
    <rect x="345" y="315" width="110" height="80" rx="10" fill="#f1efe9" stroke="#7d786f" stroke-width="3"/>
    <text x="400" y="540" font-family="sans-serif" font-size="30" text-anchor="middle" fill="#3c3a36">${caption}</text>
  </svg>`;
  return sharp(Buffer.from(svg)).jpeg({ quality: 80 }).toBuffer();
}

// The proof of the work for the demo requests that carry `proof`: their paths left them scheduled;
// here the electrician's visit (two days before the seeding day) is started, each approved item's
// correction is recorded with its readings and a photo, the visit is finished, and, as far as
// `proof` goes, the seller elects payment at closing, the completion letter is issued (a real PDF in
// the file storage, verifiable on /verify), the inspector accepts it and the contractor records the
// funds from escrow. All through the server's own services.
export async function seed(knex: Knex): Promise<void> {
  const config = loadConfig(process.env);
  const services = createServices(knex, config);
  const users = new UserRepository(knex);
  const userByKey = async (key: string): Promise<CurrentUser> => (await users.findById((await knex('users').where({ email: PEOPLE.find((p) => p.key === key)!.email }).first('id')).id))!;
  const inspector = await userByKey('nora');
  const visitDate = new Date(Date.now() - 2 * DAY).toISOString().slice(0, 10);

  for (const demo of REQUESTS.filter((r) => r.proof)) {
    const request = await knex('repair_requests').where({ street: demo.street }).first('id', 'contractor_organisation_id');
    const electricianRow = await knex('users').where({ role: 'contractor', organisation_id: request.contractor_organisation_id }).orderBy('id').first('id');
    const electrician = (await users.findById(electricianRow.id))!;
    await knex('site_visits').where({ request_id: request.id }).delete();
    // Booked before today (booking in the past is refused on the page), so written as the other seeds write visits.
    const [visit] = await knex('site_visits')
      .insert({ request_id: request.id, number: 1, visit_date: visitDate, arrival_from: '13:00', arrival_to: '14:00', electrician_id: electrician.id, booked_by: electrician.id, access_notes: 'Lockbox on the front door; code from the listing agent' })
      .returning('id');
    await knex('line_items').where({ request_id: request.id, status: 'approved' }).update({ site_visit_id: visit.id });

    await services.visits.start(electrician, request.id, visit.id);
    for (const item of await knex('line_items').where({ request_id: request.id, status: 'approved' }).orderBy('id').select('id', 'code')) {
      const record = RECORDS[item.code as FindingCode];
      if (!record) throw new Error(`${demo.street}: no demo correction for ${item.code}`);
      const photo: UploadedPhoto = { kind: 'after', buffer: await demoPhoto(`After: ${item.code}`) };
      await services.corrections.record(electrician, request.id, item.id, RecordCorrectionSchema.parse({ ...record, siteVisitId: visit.id }), [photo]);
    }
    await services.visits.finish(electrician, request.id, visit.id);
    if (demo.proof === 'corrected') continue;
    // The seller chose payment from the proceeds at closing (an invoice to the escrow company).
    const sellerRow = await knex('request_parties').where({ request_id: request.id, role: 'seller' }).whereNotNull('user_id').first('user_id');
    const seller = (await users.findById(sellerRow.user_id))!;
    const started = await services.sellerSide.payments.start(
      seller,
      request.id,
      StartPaymentSchema.parse({ plan: 'at-closing', idempotencyKey: `demo-closing-payment-${request.id}-0000`, escrow: { company: 'Marlow Title & Escrow', officer: 'Renata Ruiz', email: 'renata.ruiz@marlow-title.test', fileNumber: `MT-26-${1000 + request.id}` } }),
    );
    await services.letters.issue(electrician, request.id, IssueLetterSchema.parse({ isPermitNotRequired: true, signatureName: electrician.name }));
    if (demo.proof !== 'accepted') continue;
    await services.letters.review(inspector, request.id, ProofReviewSchema.parse({ decision: 'accept', note: 'Checked against the letter and the photos' }));
    // The sale closed today (Bellweather's closing date): the escrow company wired the invoice's
    // amount, and the contractor records it.
    await services.sellerSide.payments.recordFunds(
      electrician,
      request.id,
      RecordFundsSchema.parse({ paymentId: started.payment.id, amountCents: started.payment.amountCents, receivedOn: new Date().toISOString().slice(0, 10), reference: `Wire MT-26-${1000 + request.id}` }),
    );
  }
  await markHistoryDelivered(knex);
}
