// Day economics: pick lists, the first-visit outcome, earnings per visit and day, a period with its
// single-visit completion rate and minutes against the rate book, the CSV, and intake photos.
//
// The seeded week below is priced with the demo rate book (Brightline Electric Co.) and every expected
// figure is worked by hand in the comments from docs/pricing.md (R1 half up, R5 largest remainder,
// R7 per hour). Trade figures are common practice (no published source), as the demo book says.
import sharp from 'sharp';
import request from 'supertest';
import { DEMO_RATE_BOOK, type DayEconomics, type PeriodEconomics, type PickList, type VisitPrep } from '@cc/shared';
import { extractPdfPages } from '../../server/src/integrations/pdf-text';
import type { DriveTimeSource, PlannedStop } from '../../server/src/economics/drive-time';
import { createTestApp, type TestApp } from '../helpers/test-app';
import { resetDatabase, type SignedIn } from '../helpers/fixtures';
import { createPricedRequest, createPricingCast, storeRateBook, type PricingCast, type StoredBook } from '../helpers/pricing-fixtures';
import { sign, signBody, write } from '../helpers/payment-fixtures';

jest.setTimeout(60_000);

let t: TestApp;
let cast: PricingCast;
let book: StoredBook;

const inDays = (days: number) => new Date(Date.now() + days * 86_400_000).toISOString().slice(0, 10);
const D1 = inDays(1);
const D2 = inDays(2);
const D3 = inDays(3);
const post = (who: SignedIn, path: string) => who.agent.post(path).set('x-csrf-token', who.csrfToken);
const bytesOf = (req: request.Test) =>
  req.buffer(true).parse((r, done) => {
    const chunks: Buffer[] = [];
    r.on('data', (c: Buffer) => chunks.push(c));
    r.on('end', () => done(null, Buffer.concat(chunks)));
  });

interface Line {
  code: string;
  quantity: number;
  entry: string;
  room?: string;
  adders?: string[];
}

/** A request priced with `lines` (entries and site conditions by key), quoted, and approved by the seller. */
async function approvedRequest(lines: Line[]): Promise<{ requestId: number; itemIds: number[] }> {
  const { requestId, itemIds } = await createPricedRequest(cast, t.db, { items: lines.map((l) => ({ code: l.code, quantity: l.quantity })) });
  for (let i = 0; i < itemIds.length; i++) {
    if (lines[i].room) await t.db('line_items').where({ id: itemIds[i] }).update({ room: lines[i].room });
    const pricing = (await cast.s.contractor.agent.get(`/api/requests/${requestId}/pricing`).expect(200)).body;
    const version = pricing.items.find((p: { id: number }) => p.id === itemIds[i]).version;
    const set = { entryId: book.entry[lines[i].entry], ...(lines[i].adders ? { adderIds: lines[i].adders!.map((a) => book.adder[a]) } : {}) };
    await write(cast.s.contractor, 'patch', `/api/requests/${requestId}/pricing`).send({ items: [{ id: itemIds[i], version }], set }).expect(200);
  }
  await write(cast.s.contractor, 'post', `/api/requests/${requestId}/quotes`).send({}).expect(201);
  await sign(cast.s.seller, requestId, signBody(itemIds, itemIds.map(() => 'approved')));
  return { requestId, itemIds };
}

async function bookVisit(requestId: number, date: string, electricianId: number, arrivalFrom = '08:00'): Promise<number> {
  const res = await post(cast.s.contractor, `/api/requests/${requestId}/visits`).send({ date, arrivalFrom, arrivalTo: '17:00', electricianId });
  expect(res.status).toBe(201);
  return res.body.id;
}

// With the tests that prove GFCI and receptacle work (its GFCI test, the plug-in tester's polarity and ground).
const proof = { gfci: { tripsOnTest: true, resets: true, downstreamProven: 0 }, receptacle: { polarityCorrect: true, groundPresent: true } };
const corrected = (overrides: object = {}) => ({ outcome: 'corrected', workPerformed: 'Work done as quoted', readings: proof, ...overrides });

async function record(requestId: number, itemId: number, body: object): Promise<void> {
  const res = await post(cast.s.colleague, `/api/requests/${requestId}/items/${itemId}/correction`).field('record', JSON.stringify(body));
  expect(res.status).toBe(201);
}

/**
 * Starts and finishes the visit, then sets its day and times: `minutes` on site from 09:00 UTC of
 * `date`. (Started before its day, a visit moves to today; the week is worked ahead of time here, so
 * the day it was booked for is put back, as if it had been worked then.)
 */
async function workVisit(requestId: number, visitId: number, date: string, minutes: number, records: [number, object][]): Promise<void> {
  await post(cast.s.colleague, `/api/requests/${requestId}/visits/${visitId}/start`).expect(200);
  for (const [itemId, body] of records) await record(requestId, itemId, body);
  await post(cast.s.colleague, `/api/requests/${requestId}/visits/${visitId}/finish`).expect(200);
  const start = new Date(`${date}T09:00:00Z`);
  await t.db('site_visits').where({ id: visitId }).update({ visit_date: date, started_at: start, finished_at: new Date(start.getTime() + minutes * 60_000) });
}

// The seeded week (ids filled in beforeAll).
const week = { r1: 0, r2: 0, r3: 0, r4: 0, r5: 0, a: 0, b: 0, c: 0, d: 0, e: 0, f: 0, v1: 0, v2: 0, v3: 0, v4: 0, v5: 0 };
/** Drive minutes of the day plan, by site visit (set below): stands in for the day plan's route. */
const drive = new Map<number, number>();

beforeAll(async () => {
  t = createTestApp();
  await resetDatabase(t.db);
  cast = await createPricingCast(t.app, t.db);
  book = await storeRateBook(t.db, cast.contractorOrg, DEMO_RATE_BOOK);
  t.services.economics.driveTime = async (_org, electricianId, date): Promise<PlannedStop[] | null> => {
    const visits: { id: number }[] = await t.db('site_visits').where({ electrician_id: electricianId, visit_date: date }).select('id');
    return visits.length ? visits.map((v) => ({ siteVisitId: v.id, driveMinutes: drive.get(v.id) ?? 0 })) : null;
  };
  const ana = cast.users.colleague.id;
  const office = cast.users.contractor.id;

  // R1: one inoperative GFCI outdoors, timed entry (20 min, GFCI $24.00).
  ({ requestId: week.r1, itemIds: [week.a] } = await approvedRequest([{ code: 'gfci-inoperative', quantity: 1, entry: 'gfci-replace', room: 'exterior' }]));
  await t.db('line_items').where({ id: week.a }).update({ evidence: 'GFCI at the patio would not trip; cover missing.', page: 7 });
  // R2: two double taps (20 min each, pigtail $1.00, +60 %) and an open ground behind tile (12 min × 1.2, screw $0.75, +60 %).
  ({ requestId: week.r2, itemIds: [week.b, week.c] } = await approvedRequest([
    { code: 'double-tap', quantity: 2, entry: 'double-tap-pigtail' },
    { code: 'open-ground', quantity: 1, entry: 'ground-reconnect', adders: ['tile-or-stone'] },
  ]));
  // R3: one GFCI at the flat rate ($175 first unit).
  ({ requestId: week.r3, itemIds: [week.d] } = await approvedRequest([{ code: 'gfci-inoperative', quantity: 1, entry: 'gfci-replace-flat' }]));
  await t.db('repair_requests').where({ id: week.r3 }).update({ street: '=HYPERLINK("http://x.test") Quarry Bend Rd' });
  // R4: a missing GFCI at the first device (30 min, GFCI $24.00), done by the office's own contractor.
  ({ requestId: week.r4, itemIds: [week.e] } = await approvedRequest([{ code: 'gfci-missing', quantity: 1, entry: 'gfci-receptacle-first-device' }]));
  // R5: a missing in-use cover, booked for D3 and not yet worked.
  ({ requestId: week.r5, itemIds: [week.f] } = await approvedRequest([{ code: 'weather-cover-missing', quantity: 1, entry: 'weather-cover', room: 'exterior' }]));

  week.v1 = await bookVisit(week.r1, D1, ana, '08:00');
  week.v2 = await bookVisit(week.r2, D1, ana, '10:00');
  week.v3 = await bookVisit(week.r3, D2, ana);
  week.v4 = await bookVisit(week.r4, D2, office);
  week.v5 = await bookVisit(week.r5, D3, ana);
  drive.set(week.v1, 15).set(week.v2, 10).set(week.v3, 20).set(week.v4, 5).set(week.v5, 12);
});
afterAll(() => t.close());

describe('GET /api/economics/pick-list', () => {
  const query = () => ({ date: D1, electricianId: cast.users.colleague.id });

  it('answers 401 signed out, 403 to the other roles, 404 for an electrician of another organisation, 400 for a bad date', async () => {
    await request(t.app).get('/api/economics/pick-list').query(query()).expect(401);
    for (const who of ['buyerAgent', 'listingAgent', 'seller', 'inspector', 'admin'] as const) await cast.s[who].agent.get('/api/economics/pick-list').query(query()).expect(403);
    await cast.s.contractor.agent.get('/api/economics/pick-list').query({ ...query(), electricianId: cast.users.otherContractor.id }).expect(404);
    await cast.s.otherContractor.agent.get('/api/economics/pick-list').query(query()).expect(404);
    const bad = await cast.s.contractor.agent.get('/api/economics/pick-list').query({ date: '2026-13-40', electricianId: 'x' });
    expect(bad.status).toBe(400);
    expect(bad.body.details.map((d: { path: string }) => d.path).sort()).toEqual(['date', 'electricianId']);
  });

  it('lists the day’s materials by kind with the site conditions and the spare allowance (hand-counted)', async () => {
    await write(cast.s.contractor, 'put', '/api/economics/spares').send({ spares: [{ entryKey: 'gfci-replace', spareUnits: 2 }] }).expect(200);
    const list: PickList = (await cast.s.contractor.agent.get('/api/economics/pick-list').query(query()).expect(200)).body;
    expect(list.visits.map((v) => v.id)).toEqual([week.v1, week.v2]);
    // R1: 1 GFCI (+2 spare) and, outdoors, an in-use cover (NFPA 70 (NEC) 2023, 406.9(B)(1)); R2: 2 pigtails,
    // 1 ground pigtail and screw, and for the tile 1 pair of long device screws (common practice).
    expect(list.lines.map((l) => [l.kind, l.name, l.quantity, l.spare, l.total, l.isSiteCondition])).toEqual([
      ['devices', 'GFCI receptacle 15 A, TR/WR', 1, 2, 3, false],
      ['covers', 'Extra-duty in-use cover', 1, 0, 1, true],
      ['wire-hardware', 'Ground pigtail and screw', 1, 0, 1, false],
      ['wire-hardware', 'Long device screws, 6-32 × 1½ in (pair)', 1, 0, 1, true],
      ['wire-hardware', 'Pigtail and listed connector', 2, 0, 2, false],
    ]);
    const one: PickList = (await cast.s.contractor.agent.get('/api/economics/pick-list').query({ ...query(), siteVisitId: week.v2 }).expect(200)).body;
    expect(one.lines.map((l) => l.name)).toEqual(['Ground pigtail and screw', 'Long device screws, 6-32 × 1½ in (pair)', 'Pigtail and listed connector']);
    await cast.s.contractor.agent.get('/api/economics/pick-list').query({ ...query(), siteVisitId: week.v3 }).expect(404);
  });

  it('refuses spare settings for entries not in the rate book, or out of bounds', async () => {
    const res = await write(cast.s.contractor, 'put', '/api/economics/spares').send({ spares: [{ entryKey: 'no-such-entry', spareUnits: 1 }] });
    expect(res.status).toBe(400);
    expect(res.body.details[0].path).toBe('spares.0.entryKey');
    await write(cast.s.contractor, 'put', '/api/economics/spares').send({ spares: [{ entryKey: 'gfci-replace', spareUnits: 21 }] }).expect(400);
    await write(cast.s.seller, 'put', '/api/economics/spares').send({ spares: [] }).expect(403);
  });

  it('ticks lines as loaded, from the electrician’s phone, and takes a tick off again', async () => {
    const list: PickList = (await cast.s.colleague.agent.get('/api/economics/pick-list').query(query()).expect(200)).body;
    const key = list.lines[0].key;
    const ticked: PickList = (await write(cast.s.colleague, 'put', '/api/economics/pick-list/ticks').send({ ...query(), lineKey: key, isTicked: true }).expect(200)).body;
    expect(ticked.tickedCount).toBe(1);
    expect(ticked.lines.find((l) => l.key === key)!.isTicked).toBe(true);
    await write(cast.s.colleague, 'put', '/api/economics/pick-list/ticks').send({ ...query(), lineKey: key, isTicked: true }).expect(200);
    await write(cast.s.colleague, 'put', '/api/economics/pick-list/ticks').send({ ...query(), lineKey: 'devices:nothing', isTicked: true }).expect(404);
    await write(cast.s.colleague, 'put', '/api/economics/pick-list/ticks').send({ ...query(), lineKey: 'a\u0000b', isTicked: true }).expect(400);
    await write(cast.s.otherContractor, 'put', '/api/economics/pick-list/ticks').send({ ...query(), lineKey: key, isTicked: true }).expect(404);
    const unticked: PickList = (await write(cast.s.colleague, 'put', '/api/economics/pick-list/ticks').send({ ...query(), lineKey: key, isTicked: false }).expect(200)).body;
    expect(unticked.tickedCount).toBe(0);
  });

  it('prints the pick list as a PDF with every line and the safety caution', async () => {
    const res = await bytesOf(cast.s.contractor.agent.get('/api/economics/pick-list.pdf').query(query()));
    expect(res.status).toBe(200);
    expect(res.headers['content-type']).toBe('application/pdf');
    const text = (await extractPdfPages(res.body as Buffer)).pages.join('\n').replace(/\s+/g, ' ');
    for (const name of ['GFCI receptacle 15 A, TR/WR', 'Extra-duty in-use cover', 'Pigtail and listed connector', 'Covers and plates', 'de-energise']) expect(text).toContain(name);
  });
});

describe('the pick list in the day plan’s driving order, the same on screen and on paper', () => {
  const query = () => ({ date: D1, electricianId: cast.users.colleague.id });
  let original: DriveTimeSource;

  let streets: { id: number; street: string }[];
  beforeAll(async () => {
    // Streets of their own, so that the two visits' labels differ.
    streets = await t.db('repair_requests').whereIn('id', [week.r1, week.r2]).select('id', 'street');
    await t.db('repair_requests').where({ id: week.r1 }).update({ street: '1 First Stop Lane' });
    await t.db('repair_requests').where({ id: week.r2 }).update({ street: '2 Second Stop Lane' });
    original = t.services.economics.driveTime;
    // The day plan drives to V2 first, then V1 (booked the other way round).
    t.services.economics.driveTime = async (_org, electricianId, date) =>
      date === D1 && electricianId === cast.users.colleague.id ? [{ siteVisitId: week.v2, driveMinutes: 10 }, { siteVisitId: week.v1, driveMinutes: 15 }] : original(_org, electricianId, date);
  });
  afterAll(async () => {
    for (const { id, street } of streets) await t.db('repair_requests').where({ id }).update({ street });
    t.services.economics.driveTime = original;
  });

  it('lists the visits in driving order and names each line’s visits; on paper too, with the spare only where there is one', async () => {
    await write(cast.s.contractor, 'put', '/api/economics/spares').send({ spares: [{ entryKey: 'gfci-replace', spareUnits: 2 }] }).expect(200);
    const list: PickList = (await cast.s.contractor.agent.get('/api/economics/pick-list').query(query()).expect(200)).body;
    expect(list.visits.map((v) => v.id)).toEqual([week.v2, week.v1]);
    const label = (id: number) => {
      const v = list.visits.find((x) => x.id === id)!;
      return `Site visit ${v.number} · ${v.street}`;
    };
    expect(list.lines.find((l) => l.name === 'GFCI receptacle 15 A, TR/WR')!.forVisits).toEqual([label(week.v1)]);
    expect(list.lines.find((l) => l.name === 'Pigtail and listed connector')!.forVisits).toEqual([label(week.v2)]);

    const res = await bytesOf(cast.s.contractor.agent.get('/api/economics/pick-list.pdf').query(query()));
    expect(res.status).toBe(200);
    const text = (await extractPdfPages(res.body as Buffer)).pages.join('\n').replace(/\s+/g, ' ');
    // Visits in driving order, each line with its visits, the spare in the screen's words only on the GFCI line.
    expect(label(week.v1)).not.toBe(label(week.v2));
    expect(text.indexOf(label(week.v2))).toBeLessThan(text.indexOf(label(week.v1)));
    expect(text).toContain(`GFCI receptacle 15 A, TR/WR — 1 for the items + 2 spare · ${label(week.v1)}`);
    expect(text).toContain(`Pigtail and listed connector — ${label(week.v2)}`);
    expect(text).not.toMatch(/\(\+0\)|\+ 0 spare|Load \(spare\)/);
  });
});

describe('the first-visit outcome on correction records', () => {
  it('asks for the cause when an item was not finished on the first visit', async () => {
    const res = await post(cast.s.colleague, `/api/requests/${week.r2}/items/${week.c}/correction`).field('record', JSON.stringify(corrected({ finishedOnFirstVisit: false })));
    expect(res.status).toBe(400);
    expect(res.body.details.map((d: { path: string }) => d.path)).toContain('returnCause');
    const bad = await post(cast.s.colleague, `/api/requests/${week.r2}/items/${week.c}/correction`).field('record', JSON.stringify(corrected({ finishedOnFirstVisit: false, returnCause: 'bad-luck' })));
    expect(bad.status).toBe(400);
  });
});

describe('the seeded week', () => {
  beforeAll(async () => {
    await workVisit(week.r1, week.v1, D1, 25, [[week.a, corrected()]]);
    await workVisit(week.r2, week.v2, D1, 50, [
      [week.b, corrected()],
      [week.c, corrected({ finishedOnFirstVisit: false, returnCause: 'part-not-on-truck' })],
    ]);
    await workVisit(week.r3, week.v3, D2, 18, [[week.d, corrected()]]);
    await workVisit(week.r4, week.v4, D2, 40, [[week.e, corrected()]]);
  });

  it('records the first-visit outcome on the correction', async () => {
    const work = (await cast.s.contractor.agent.get(`/api/requests/${week.r2}/work`).expect(200)).body;
    const byItem = Object.fromEntries(work.items.map((i: { id: number; correction: { isFirstVisit: boolean; returnCause: string | null } }) => [i.id, [i.correction.isFirstVisit, i.correction.returnCause]]));
    expect(byItem).toEqual({ [week.b]: [true, null], [week.c]: [false, 'part-not-on-truck'] });
  });

  it('computes D1 of Ana to the cent and the minute', async () => {
    const day: DayEconomics = (await cast.s.contractor.agent.get('/api/economics/day').query({ date: D1, electricianId: cast.users.colleague.id }).expect(200)).body;
    // V1: $95 service call + $185 first-hour minimum (20 min ≤ 60) + GFCI 2,400 + 35 % markup 840 = 31,240 before tax.
    //     Earnings 31,240 − 2,400 = 28,840; per on-site hour 28,840 × 60 / 25 = 69,216; per paid hour / (25 + 15) = 43,260.
    // V2: minutes 2 × 20 = 40 and 12 × 1.2 = 14.4 → 14 (R1); pooled 54 ≤ 60: 9,500 + 18,500 + materials (200 + 120) + (75 + 45) = 28,440.
    //     Materials cost 275; earnings 28,165; per on-site hour 28,165 × 60 / 50 = 33,798; per paid hour / 60 = 28,165.
    expect(day.visits.map((v) => [v.siteVisitId, v.correctedCount, v.billedCents, v.materialsCostCents, v.earningsCents, v.onSiteMinutes, v.driveMinutes, v.perOnSiteHourCents, v.perPaidHourCents])).toEqual([
      [week.v1, 1, 31_240, 2_400, 28_840, 25, 15, 69_216, 43_260],
      [week.v2, 2, 28_440, 275, 28_165, 50, 10, 33_798, 28_165],
    ]);
    // Day: 59,680 billed, 2,675 materials, 57,005 earned over 75 on site (45,604/h) and 100 paid minutes (34,203/h).
    expect(day.totals).toEqual({
      visitCount: 2,
      correctedCount: 3,
      billedCents: 59_680,
      materialsCostCents: 2_675,
      earningsCents: 57_005,
      onSiteMinutes: 75,
      driveMinutes: 25,
      perOnSiteHourCents: 45_604,
      perPaidHourCents: 34_203,
      visitsWithoutMinutes: 0,
    });
    expect(day.hasDayPlan).toBe(true);
    // Short jobs close together pay well above the first-hour minimum per paid hour (common practice).
    expect(day.totals.perPaidHourCents!).toBeGreaterThan(day.firstHourMinimumCents);
  });

  it('computes the period: days, single-visit rate, return causes and minutes against the rate book', async () => {
    const period: PeriodEconomics = (await cast.s.contractor.agent.get('/api/economics/period').query({ from: D1, to: D3 }).expect(200)).body;
    // D2: V3 flat only: 9,500 + 17,500 = 27,000, no materials cost, 18 + 20 min → 27,000 × 60 / 18 = 90,000; / 38 = 42,631.6 → 42,632.
    //     V4: 9,500 + 18,500 + 3,240 = 31,240, cost 2,400 → 28,840 over 40 (43,260/h) and 45 (38,453.3 → 38,453/h).
    //     Day: 55,840 earned over 58 on site (57,765.5 → 57,766/h) and 83 paid (40,366.3 → 40,366/h).
    // D3: V5 booked, not worked: nothing billed, no on-site minutes; its planned 12 minutes' drive still count as the day's driving.
    expect(period.days.map((d) => [d.date, d.totals.billedCents, d.totals.earningsCents, d.totals.onSiteMinutes, d.totals.driveMinutes, d.totals.perOnSiteHourCents, d.totals.perPaidHourCents])).toEqual([
      [D1, 59_680, 57_005, 75, 25, 45_604, 34_203],
      [D2, 58_240, 55_840, 58, 25, 57_766, 40_366],
      [D3, 0, 0, 0, 12, null, null],
    ]);
    expect(period.visits.find((v) => v.siteVisitId === week.v3)).toMatchObject({ billedCents: 27_000, materialsCostCents: 0, perOnSiteHourCents: 90_000, perPaidHourCents: 42_632 });
    expect(period.visits.find((v) => v.siteVisitId === week.v4)).toMatchObject({ billedCents: 31_240, perOnSiteHourCents: 43_260, perPaidHourCents: 38_453 });
    // Week: 112,845 earned over 133 on site (50,907.5 → 50,908/h) and 183 paid minutes (36,998.4 → 36,998/h); V5 has no
    // on-site minutes (left out of the rates) but its 12 minutes' drive are planned: 25 + 25 + 12 = 62 minutes' driving.
    expect(period.totals).toMatchObject({ visitCount: 5, correctedCount: 5, earningsCents: 112_845, onSiteMinutes: 133, driveMinutes: 62, perOnSiteHourCents: 50_908, perPaidHourCents: 36_998, visitsWithoutMinutes: 1 });

    // A, B, D, E first visit; C came back (part not on the truck): 4 of 5 = 8,000 bp.
    expect(period.singleVisit.overall).toEqual({ group: 'All items', items: 5, firstVisit: 4, rateBp: 8_000 });
    expect(period.singleVisit.byCode.map((r) => [r.group, r.items, r.firstVisit, r.rateBp])).toEqual([
      ['double-tap', 1, 1, 10_000],
      ['gfci-inoperative', 2, 2, 10_000],
      ['gfci-missing', 1, 1, 10_000],
      ['open-ground', 1, 0, 0],
    ]);
    const names = { [cast.users.colleague.name]: [4, 3, 7_500], [cast.users.contractor.name]: [1, 1, 10_000] };
    expect(Object.fromEntries(period.singleVisit.byElectrician.map((r) => [r.group, [r.items, r.firstVisit, r.rateBp]]))).toEqual(names);
    expect(period.singleVisit.byMonth.reduce((s, m) => s + m.items, 0)).toBe(5);
    expect(period.singleVisit.causes).toEqual([{ cause: 'part-not-on-truck', count: 1 }]);

    // V1: 25 min for one GFCI (book 20; within 25 % or 5 min). V2: 50 min split by priced minutes [40, 14] (R5):
    // 37.04 → 37 and 12.96 → 12, the leftover minute to the larger remainder (C): 37 and 13; B per unit 37 / 2 = 18.5 → 19.
    // V3: flat, 18 min, the book names no minutes. V4: 40 for a 30-minute entry: over 30 + 8 → priced low.
    expect(period.minutesVsBook.map((r) => [r.code, r.entryKey, r.bookMinutesPerUnit, r.samples, r.medianMinutesPerUnit, r.differenceMinutes, r.verdict])).toEqual([
      ['double-tap', 'double-tap-pigtail', 20, 1, 19, -1, 'about-right'],
      ['gfci-inoperative', 'gfci-replace', 20, 1, 25, 5, 'about-right'],
      ['gfci-inoperative', 'gfci-replace-flat', null, 1, 18, null, 'no-book-minutes'],
      ['gfci-missing', 'gfci-receptacle-first-device', 30, 1, 40, 10, 'priced-low'],
      ['open-ground', 'ground-reconnect', 12, 1, 13, 1, 'about-right'],
    ]);
  });

  it('narrows to one electrician and refuses a period that ends first or runs past 93 days', async () => {
    const period: PeriodEconomics = (await cast.s.contractor.agent.get('/api/economics/period').query({ from: D1, to: D3, electricianId: cast.users.contractor.id }).expect(200)).body;
    expect(period.visits.map((v) => v.siteVisitId)).toEqual([week.v4]);
    const res = await cast.s.contractor.agent.get('/api/economics/period').query({ from: D3, to: D1 });
    expect(res.status).toBe(400);
    expect(res.body.details[0].path).toBe('to');
    await cast.s.contractor.agent.get('/api/economics/period').query({ from: '2026-01-01', to: '2026-12-31' }).expect(400);
    await cast.s.contractor.agent.get('/api/economics/period').query({ from: D1, to: D3, electricianId: 2_147_483_648 }).expect(400);
    await cast.s.seller.agent.get('/api/economics/period').query({ from: D1, to: D3 }).expect(403);
  });

  it('exports the period as CSV, one row per visit, with formula-like text neutralised', async () => {
    const res = await cast.s.contractor.agent.get('/api/economics/period.csv').query({ from: D1, to: D3 }).expect(200);
    expect(res.headers['content-type']).toMatch(/^text\/csv/);
    const rows = res.text.trim().split('\n');
    expect(rows[0]).toBe('date,electrician,request,street,corrected_items,billed_cents,materials_cost_cents,earnings_cents,on_site_minutes,drive_minutes,per_on_site_hour_cents,per_paid_hour_cents');
    expect(rows).toHaveLength(6);
    const flat = rows.find((r) => r.includes('Quarry Bend Rd'))!;
    // OWASP CSV injection guidance: a cell starting with = is written with a leading apostrophe.
    expect(flat).toContain(`"'=HYPERLINK(""http://x.test"") Quarry Bend Rd"`);
    expect(flat).toContain(',1,27000,0,27000,18,20,90000,42632');
  });

  it('counts a change order against the first visit', async () => {
    await t.db('change_orders').insert({
      request_id: week.r4,
      number: 1,
      created_by: cast.users.contractor.id,
      reason: 'Second device found',
      status: 'approved',
      lines: JSON.stringify([{ kind: 'quantity', lineItemId: week.e, quantityBefore: 1, quantityAfter: 1 }]),
      price_cents: 0,
      scope_before_cents: 0,
      scope_after_cents: 0,
    });
    const period: PeriodEconomics = (await cast.s.contractor.agent.get('/api/economics/period').query({ from: D2, to: D2 }).expect(200)).body;
    expect(period.singleVisit.byCode.find((r) => r.group === 'gfci-missing')).toEqual({ group: 'gfci-missing', items: 1, firstVisit: 0, rateBp: 0 });
    expect(period.singleVisit.causes).toEqual([{ cause: 'change-order', count: 1 }]);
  });
});

describe('intake photos and evidence for the visit screen', () => {
  const photo = () => sharp({ create: { width: 320, height: 240, channels: 3, background: '#7f8c8d' } }).jpeg().toBuffer();
  // A request of its own, approved and not yet worked (photos are for a visit still to come).
  const open = { request: 0, item: 0, other: 0 };
  beforeAll(async () => {
    ({ requestId: open.request, itemIds: [open.item] } = await approvedRequest([{ code: 'gfci-inoperative', quantity: 1, entry: 'gfci-replace', room: 'exterior' }]));
    await t.db('line_items').where({ id: open.item }).update({ evidence: 'GFCI at the patio would not trip; cover missing.', page: 7 });
  });

  it('lets the agents and the seller attach photos, shows them with the report’s evidence to the contractor', async () => {
    const res = await post(cast.s.seller, `/api/requests/${open.request}/intake-photos`).field('itemId', String(open.item)).field('caption', 'Tile right up to the box').attach('photo', await photo(), 'patio.jpg');
    expect(res.status).toBe(201);
    const prep: VisitPrep = (await cast.s.colleague.agent.get(`/api/requests/${open.request}/visit-prep`).expect(200)).body;
    expect(prep.photos.map((p) => [p.itemId, p.caption, p.width])).toEqual([[open.item, 'Tile right up to the box', 320]]);
    expect(prep.evidence).toEqual([{ itemId: open.item, evidence: 'GFCI at the patio would not trip; cover missing.', page: 7 }]);
    expect(prep.canAddPhotos).toBe(false);
    const bytes = await bytesOf(cast.s.colleague.agent.get(prep.photos[0].url));
    expect(bytes.status).toBe(200);
    expect((await sharp(bytes.body as Buffer).metadata()).format).toBe('jpeg');
  });

  it('refuses the contractor (403), outsiders (404), non-images, NUL captions and items of other requests', async () => {
    const jpeg = await photo();
    await post(cast.s.contractor, `/api/requests/${open.request}/intake-photos`).attach('photo', jpeg, 'x.jpg').expect(403);
    await post(cast.s.otherContractor, `/api/requests/${open.request}/intake-photos`).attach('photo', jpeg, 'x.jpg').expect(404);
    await cast.s.otherContractor.agent.get(`/api/requests/${open.request}/visit-prep`).expect(404);
    await post(cast.s.seller, `/api/requests/${open.request}/intake-photos`).attach('photo', Buffer.from('not an image at all'), 'x.jpg').expect(415);
    await post(cast.s.seller, `/api/requests/${open.request}/intake-photos`).field('caption', 'a\u0000b').attach('photo', jpeg, 'x.jpg').expect(400);
    const other = await post(cast.s.seller, `/api/requests/${open.request}/intake-photos`).field('itemId', String(week.b)).attach('photo', jpeg, 'x.jpg');
    expect(other.status).toBe(400);
    expect(other.body.details[0].path).toBe('itemId');
    await post(cast.s.seller, `/api/requests/${open.request}/intake-photos`).expect(400);
    await cast.s.colleague.agent.get(`/api/requests/${open.request}/intake-photos/999999`).expect(404);
  });

  it('takes no more photos once the work is done (the flow table’s add-intake-photo), and says so', async () => {
    // week.r1's only item was corrected above: the request is past its visits.
    const { status } = (await cast.s.seller.agent.get(`/api/requests/${week.r1}`).expect(200)).body;
    expect(status).toBe('corrected');
    const res = await post(cast.s.seller, `/api/requests/${week.r1}/intake-photos`).attach('photo', await photo(), 'late.jpg');
    expect(res.status).toBe(409);
    expect(res.body.error).toMatch(/Adding photos for the electrician is not possible while the request is/);
    const prep: VisitPrep = (await cast.s.seller.agent.get(`/api/requests/${week.r1}/visit-prep`).expect(200)).body;
    expect(prep.canAddPhotos).toBe(false);
  });
});
