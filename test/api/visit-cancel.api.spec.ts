// Calling off a booked site visit: who may, with what reason, what happens to the visit, its items and
// the request (back from scheduled to approved through the flow table when it was the last visit), who
// is e-mailed, and how the day plan, the week and the calendars show it afterwards.
import request from 'supertest';
import type { DayPlan, RepairRequestDetail, SiteVisit, WeekPlan, WorkOverview } from '@cc/shared';
import { NO_NUL_MESSAGE } from '@cc/shared';
import { createTestApp, type TestApp } from '../helpers/test-app';
import { resetDatabase, type SignedIn } from '../helpers/fixtures';
import { createPricedRequest, createPricingCast, type CastKey, type PricingCast } from '../helpers/pricing-fixtures';

let t: TestApp;
let cast: PricingCast;

const write = (who: SignedIn, path: string) => who.agent.post(path).set('x-csrf-token', who.csrfToken);
const inDays = (days: number) => new Date(Date.now() + days * 86_400_000).toISOString().slice(0, 10);
const REASON = 'The seller cancelled the showing day; the occupant asked for another week';

/** An approved request with `count` approved items. */
async function approvedJob(count = 1): Promise<{ requestId: number; itemIds: number[] }> {
  return createPricedRequest(cast, t.db, { status: 'approved', items: Array.from({ length: count }, (_, i) => ({ code: 'gfci-missing', quantity: 1, location: `spot ${i}`, status: 'approved' })) });
}

async function book(requestId: number, date: string, electricianId = cast.users.colleague.id, who: SignedIn = cast.s.contractor): Promise<SiteVisit> {
  const res = await write(who, `/api/requests/${requestId}/visits`).send({ date, arrivalFrom: '08:00', arrivalTo: '10:00', electricianId, accessNotes: 'Lockbox 2211' });
  expect(res.status).toBe(201);
  return res.body;
}

const cancel = (who: SignedIn, requestId: number, visitId: number, body: object) => write(who, `/api/requests/${requestId}/visits/${visitId}/cancel`).send(body);
const detail = async (requestId: number): Promise<RepairRequestDetail> => (await cast.s.contractor.agent.get(`/api/requests/${requestId}`).expect(200)).body;
const work = async (requestId: number, who: SignedIn = cast.s.contractor): Promise<WorkOverview> => (await who.agent.get(`/api/requests/${requestId}/work`).expect(200)).body;
const outbox = (requestId: number, kind: string) => t.db('outbox_messages').where({ request_id: requestId, kind }).orderBy('id').select('recipient_user_id', 'subject', 'text_body');

beforeAll(async () => {
  t = createTestApp();
  await resetDatabase(t.db);
  cast = await createPricingCast(t.app, t.db);
});
afterAll(() => t.close());

describe('cancelling the last booked visit', () => {
  let requestId: number;
  let itemIds: number[];
  let visit: SiteVisit;
  let answer: SiteVisit;
  const date = inDays(12);

  beforeAll(async () => {
    ({ requestId, itemIds } = await approvedJob(2));
    visit = await book(requestId, date);
    expect((await detail(requestId)).status).toBe('scheduled');
    const res = await cancel(cast.s.contractor, requestId, visit.id, { reason: `  ${REASON}  `, version: visit.version });
    expect(res.status).toBe(200);
    answer = res.body;
  });

  it('keeps the visit as cancelled with who, when and why (trimmed), and a new version', async () => {
    expect(answer).toMatchObject({ id: visit.id, number: 1, status: 'cancelled', date, version: visit.version + 1, itemIds: [] });
    expect(answer.cancellation).toEqual({ at: expect.any(String), byName: cast.users.contractor.name, reason: REASON });
    const row = await t.db('site_visits').where({ id: visit.id }).first();
    expect(row).toMatchObject({ status: 'cancelled', cancelled_by: cast.users.contractor.id, cancel_reason: REASON, visit_date: date, electrician_id: cast.users.colleague.id });
    expect(row.cancelled_at).toBeInstanceOf(Date);
    // Every party still reads it on the visits page, with the reason.
    const seen = (await work(requestId, cast.s.seller)).visits;
    expect(seen).toEqual([expect.objectContaining({ id: visit.id, status: 'cancelled', cancellation: expect.objectContaining({ reason: REASON }) })]);
  });

  it('frees its items for another visit', async () => {
    const items = await t.db('line_items').whereIn('id', itemIds).orderBy('id').select('site_visit_id', 'status');
    expect(items).toEqual([
      { site_visit_id: null, status: 'approved' },
      { site_visit_id: null, status: 'approved' },
    ]);
  });

  it('moves the request back from scheduled to approved through the flow, with the actor and the reason in its history', async () => {
    const request = await detail(requestId);
    expect(request.status).toBe('approved');
    const last = request.history.at(-1)!;
    expect(last).toMatchObject({ from: 'scheduled', to: 'approved', byName: cast.users.contractor.name, actor: 'contractor' });
    expect(last.note).toBe(`Site visit 1 on ${date} cancelled: ${REASON}`);
    const overview = await work(requestId);
    expect(overview.status).toBe('approved');
    expect(overview.can.bookVisit).toBe(true);
  });

  it('lets the freed items be booked again: the new visit takes them and the request is scheduled again', async () => {
    const again = await book(requestId, inDays(14));
    expect(again.number).toBe(2);
    expect([...again.itemIds].sort()).toEqual([...itemIds].sort());
    expect((await detail(requestId)).status).toBe('scheduled');
  });
});

describe('a visit that is not the last one, and a request whose work started', () => {
  it('leaves the request scheduled while another visit stays booked, and moves it back when that one is cancelled too', async () => {
    const { requestId } = await approvedJob(1);
    const first = await book(requestId, inDays(10));
    const second = await book(requestId, inDays(11));
    expect((await cancel(cast.s.contractor, requestId, first.id, { reason: 'Part back-ordered', version: first.version })).status).toBe(200);
    expect((await detail(requestId)).status).toBe('scheduled');
    expect((await cancel(cast.s.contractor, requestId, second.id, { reason: 'Occupant ill', version: second.version })).status).toBe(200);
    expect((await detail(requestId)).status).toBe('approved');
  });

  it('leaves a request under way where it is (another visit was started)', async () => {
    const { requestId } = await approvedJob(2);
    const first = await book(requestId, inDays(1));
    const second = await book(requestId, inDays(2));
    await write(cast.s.contractor, `/api/requests/${requestId}/visits/${first.id}/start`).expect(200);
    expect((await detail(requestId)).status).toBe('in-progress');
    const res = await cancel(cast.s.contractor, requestId, second.id, { reason: 'Not needed after all', version: second.version });
    expect(res.status).toBe(200);
    expect((await detail(requestId)).status).toBe('in-progress');
    expect((await t.db('request_status_changes').where({ request_id: requestId, to_status: 'approved', from_status: 'scheduled' })).length).toBe(0);
  });

  it('lets a colleague of the contractor cancel (the booking right is the organisation’s)', async () => {
    const { requestId } = await approvedJob(1);
    const visit = await book(requestId, inDays(9));
    const res = await cancel(cast.s.colleague, requestId, visit.id, { reason: 'Occupant ill', version: visit.version });
    expect(res.status).toBe(200);
    expect(res.body.cancellation.byName).toBe(cast.users.colleague.name);
  });
});

describe('who may cancel', () => {
  let requestId: number;
  let visit: SiteVisit;

  beforeAll(async () => {
    ({ requestId } = await approvedJob(1));
    visit = await book(requestId, inDays(8));
  });

  it('answers 401 without a session', async () => {
    await request(t.app).post(`/api/requests/${requestId}/visits/${visit.id}/cancel`).send({ reason: REASON, version: 1 }).expect((res) => expect([401, 403]).toContain(res.status));
  });

  it.each<[CastKey, number]>([
    ['seller', 403],
    ['listingAgent', 403],
    ['buyerAgent', 403],
    ['inspector', 403],
    ['admin', 403],
    ['otherContractor', 404],
    ['outsiderAgent', 404],
  ])('%s gets %i and the visit stays booked', async (who, status) => {
    const res = await cancel(cast.s[who], requestId, visit.id, { reason: REASON, version: visit.version });
    expect(res.status).toBe(status);
    expect(res.body).toEqual({ error: expect.any(String), details: expect.any(Array) });
    expect((await t.db('site_visits').where({ id: visit.id }).first('status')).status).toBe('booked');
  });

  it('answers 404 for a visit of another request or none', async () => {
    const other = await approvedJob(1);
    await cancel(cast.s.contractor, other.requestId, visit.id, { reason: REASON, version: visit.version }).expect(404);
    await cancel(cast.s.contractor, requestId, 2_000_000_000, { reason: REASON, version: 1 }).expect(404);
  });
});

describe('bad input answers 400 with the field named', () => {
  let requestId: number;
  let visit: SiteVisit;

  beforeAll(async () => {
    ({ requestId } = await approvedJob(1));
    visit = await book(requestId, inDays(7));
  });

  it.each<[string, object, string]>([
    ['an empty body', {}, 'reason'],
    ['no reason', { version: 1 }, 'reason'],
    ['an empty reason', { reason: '', version: 1 }, 'reason'],
    ['a reason of spaces only', { reason: '     ', version: 1 }, 'reason'],
    ['a reason too long', { reason: 'x'.repeat(501), version: 1 }, 'reason'],
    ['no version', { reason: REASON }, 'version'],
    ['a version that is not a number', { reason: REASON, version: 'one' }, 'version'],
    ['a version past 2^31-1', { reason: REASON, version: 2 ** 31 }, 'version'],
  ])('%s', async (_, body, path) => {
    const res = await cancel(cast.s.contractor, requestId, visit.id, body);
    expect(res.status).toBe(400);
    expect(res.body.error).toEqual(expect.any(String));
    expect(res.body.details).toEqual(expect.arrayContaining([expect.objectContaining({ path })]));
    await expectStillBooked();
  });

  it('a NUL byte in the reason', async () => {
    const res = await cancel(cast.s.contractor, requestId, visit.id, { reason: 'Occupant\u0000ill', version: visit.version });
    expect(res.status).toBe(400);
    expect(res.body.details).toEqual([expect.objectContaining({ path: 'reason', message: NO_NUL_MESSAGE })]);
    await expectStillBooked();
  });

  it('a visit id past 2^31-1 in the path', async () => {
    const res = await cancel(cast.s.contractor, requestId, 2 ** 31, { reason: REASON, version: 1 });
    expect([400, 404]).toContain(res.status);
    expect(res.body).toEqual({ error: expect.any(String), details: expect.any(Array) });
    await expectStillBooked();
  });

  /** Each refusal leaves the visit as it was: booked, at the same version. */
  async function expectStillBooked(): Promise<void> {
    expect(await t.db('site_visits').where({ id: visit.id }).first('status', 'version')).toEqual({ status: 'booked', version: visit.version });
  }
});

describe('a stale version answers 409', () => {
  it('the visit was moved meanwhile on the day plan', async () => {
    const { requestId } = await approvedJob(1);
    const visit = await book(requestId, inDays(20));
    await write(cast.s.contractor, `/api/day-plan/visits/${visit.id}/move`).send({ date: inDays(21), electricianId: cast.users.colleague.id }).expect(200);
    const res = await cancel(cast.s.contractor, requestId, visit.id, { reason: REASON, version: visit.version });
    expect(res.status).toBe(409);
    expect(res.body).toEqual({ error: expect.stringContaining('changed meanwhile'), details: [] });
    // With the version the day plan now shows, it goes through.
    const moved = (await t.db('site_visits').where({ id: visit.id }).first('version')).version;
    expect(moved).toBe(visit.version + 1);
    await cancel(cast.s.contractor, requestId, visit.id, { reason: REASON, version: moved }).expect(200);
  });

  it('the visit was started meanwhile, or was cancelled already', async () => {
    const { requestId } = await approvedJob(2);
    const started = await book(requestId, inDays(1));
    const other = await book(requestId, inDays(3));
    await write(cast.s.contractor, `/api/requests/${requestId}/visits/${started.id}/start`).expect(200);
    const res = await cancel(cast.s.contractor, requestId, started.id, { reason: REASON, version: started.version });
    expect(res.status).toBe(409);
    expect(res.body.error).toMatch(/started/);
    await cancel(cast.s.contractor, requestId, other.id, { reason: REASON, version: other.version }).expect(200);
    const again = await cancel(cast.s.contractor, requestId, other.id, { reason: REASON, version: other.version + 1 });
    expect(again.status).toBe(409);
    expect(again.body.error).toMatch(/cancelled already/);
  });

  it('a request whose state does not allow it (the work is done) answers 409', async () => {
    const { requestId } = await approvedJob(1);
    const visit = await book(requestId, inDays(4));
    await t.db('repair_requests').where({ id: requestId }).update({ status: 'corrected' });
    const res = await cancel(cast.s.contractor, requestId, visit.id, { reason: REASON, version: visit.version });
    expect(res.status).toBe(409);
  });
});

describe('who is e-mailed, in the same transaction', () => {
  it('the parties told of the booking and the electrician, never the person who cancelled', async () => {
    const { requestId } = await approvedJob(1);
    const date = inDays(13);
    const visit = await book(requestId, date, cast.users.colleague.id);
    const scheduled = (await outbox(requestId, 'visit-scheduled')).map((m) => m.recipient_user_id).sort();
    await cancel(cast.s.contractor, requestId, visit.id, { reason: REASON, version: visit.version }).expect(200);

    const told = await outbox(requestId, 'visit-cancelled');
    expect(told.map((m) => m.recipient_user_id).sort()).toEqual(scheduled);
    expect(scheduled.sort()).toEqual([cast.users.buyerAgent.id, cast.users.listingAgent.id, cast.users.seller.id].sort());
    const reference = `CC-${String(requestId).padStart(5, '0')}`;
    for (const m of told) {
      expect(m.subject).toMatch(new RegExp(`^${reference}: electrician's visit on .+ cancelled$`));
      expect(m.text_body).toContain(`The contractor cancelled visit 1 to 14 Test Hollow Road`);
      expect(m.text_body).toContain(`“${REASON}”`);
      expect(m.text_body).not.toContain('Lockbox');
    }
    const electrician = (await outbox(requestId, 'electrician-visit')).filter((m) => m.subject.includes('cancelled'));
    expect(electrician.map((m) => m.recipient_user_id)).toEqual([cast.users.colleague.id]);
    expect(electrician[0].subject).toMatch(new RegExp(`^${reference}: visit 1 on .+ cancelled$`));
    expect(electrician[0].text_body).toContain(REASON);
    expect(electrician[0].text_body).toContain('calendar feed marks it cancelled');
    // No message to the contractor who cancelled.
    expect((await t.db('outbox_messages').where({ request_id: requestId, recipient_user_id: cast.users.contractor.id })).filter((m: { subject: string }) => m.subject.includes('cancelled'))).toEqual([]);
    // The timeline tells the cancellation once.
    const entries = await t.db('activity_events').where({ request_id: requestId, kind: 'visits' }).select('summary');
    expect(entries.filter((e: { summary: string }) => /cancelled/.test(e.summary))).toHaveLength(1);
  });

  it('an electrician who cancels their own visit is not e-mailed about it', async () => {
    const { requestId } = await approvedJob(1);
    const visit = await book(requestId, inDays(13), cast.users.colleague.id);
    await cancel(cast.s.colleague, requestId, visit.id, { reason: REASON, version: visit.version }).expect(200);
    expect((await outbox(requestId, 'electrician-visit')).filter((m) => m.subject.includes('cancelled'))).toEqual([]);
    expect(await outbox(requestId, 'visit-cancelled')).toHaveLength(3);
  });

  it('a refused cancellation writes no message', async () => {
    const { requestId } = await approvedJob(1);
    const visit = await book(requestId, inDays(13));
    await cancel(cast.s.contractor, requestId, visit.id, { reason: REASON, version: visit.version + 5 }).expect(409);
    expect(await outbox(requestId, 'visit-cancelled')).toEqual([]);
  });
});

describe('the day plan, the week and the calendars', () => {
  it('leave a cancelled visit off the day and the week; the calendar file and feed keep it as STATUS:CANCELLED', async () => {
    const { requestId } = await approvedJob(1);
    const date = inDays(25);
    const electricianId = cast.users.colleague.id;
    const keep = await book((await approvedJob(1)).requestId, date, electricianId);
    const visit = await book(requestId, date, electricianId);
    const before: DayPlan = (await cast.s.contractor.agent.get('/api/day-plan').query({ date, electricianId }).expect(200)).body;
    expect(before.stops.map((s) => s.visitId).sort()).toEqual([keep.id, visit.id].sort());
    expect(before.stops.find((s) => s.visitId === visit.id)!.visitVersion).toBe(visit.version);

    await cancel(cast.s.contractor, requestId, visit.id, { reason: REASON, version: visit.version }).expect(200);

    const after: DayPlan = (await cast.s.contractor.agent.get('/api/day-plan').query({ date, electricianId }).expect(200)).body;
    expect(after.stops.map((s) => s.visitId)).toEqual([keep.id]);
    const week: WeekPlan = (await cast.s.contractor.agent.get('/api/day-plan/week').query({ start: date }).expect(200)).body;
    const weekIds = week.days.flatMap((d) => d.visits.map((v) => v.visitId));
    expect(weekIds).toContain(keep.id);
    expect(weekIds).not.toContain(visit.id);

    const file = await cast.s.contractor.agent.get(`/api/day-plan/visits/${visit.id}.ics`).expect(200);
    expect(file.text).toMatch(/STATUS:CANCELLED\r?\n/);
    expect(file.text).toMatch(new RegExp(`SEQUENCE:${visit.version + 1}\\r?\\n`));
    expect(file.text).not.toContain(REASON);

    const feedUrl = (await write(cast.s.contractor, `/api/day-plan/feeds/${electricianId}`).expect(200)).body.url as string;
    const feed = (await request(t.app).get(new URL(feedUrl).pathname).expect(200)).text;
    const events = feed.split('BEGIN:VEVENT').slice(1);
    const cancelled = events.find((e) => e.includes(`UID:site-visit-${visit.id}@closing-circuit`))!;
    const kept = events.find((e) => e.includes(`UID:site-visit-${keep.id}@closing-circuit`))!;
    expect(cancelled).toMatch(/STATUS:CANCELLED\r?\n/);
    expect(cancelled).toMatch(/TRANSP:TRANSPARENT\r?\n/);
    expect(cancelled.replace(/\r?\n[ \t]/g, '')).toContain('SUMMARY:Cancelled: site visit 1');
    expect(cancelled).not.toContain('Lockbox');
    expect(kept).toMatch(/STATUS:CONFIRMED\r?\n/);
  });

  it('no day plan suggestion or economics day counts it, and no outcome can be recorded on it', async () => {
    const { requestId, itemIds } = await approvedJob(1);
    const date = inDays(26);
    const visit = await book(requestId, date);
    await cancel(cast.s.contractor, requestId, visit.id, { reason: REASON, version: visit.version }).expect(200);
    const economics = await cast.s.contractor.agent.get('/api/economics/day').query({ date, electricianId: cast.users.colleague.id });
    if (economics.status === 200) expect(JSON.stringify(economics.body)).not.toContain(`"siteVisitId":${visit.id}`);
    // The request is approved again, so its items wait for a visit; recording an outcome on the cancelled visit is refused.
    await write(cast.s.contractor, `/api/requests/${requestId}/visits`).send({ date, arrivalFrom: '08:00', arrivalTo: '10:00', electricianId: cast.users.colleague.id }).expect(201);
    const res = await cast.s.contractor.agent
      .post(`/api/requests/${requestId}/items/${itemIds[0]}/correction`)
      .set('x-csrf-token', cast.s.contractor.csrfToken)
      .field('record', JSON.stringify({ outcome: 'not-corrected', reason: 'Could not reach the panel', siteVisitId: visit.id }));
    expect(res.status).toBe(400);
    expect(res.body.details).toEqual([expect.objectContaining({ path: 'siteVisitId' })]);
  });
});
