import Papa from 'papaparse';
import request from 'supertest';
import { DEMO_RATE_BOOK, type RateBookEntryRecord } from '@cc/shared';
import { createTestApp, type TestApp } from '../helpers/test-app';
import { createOrganisation, createUser, resetDatabase, signIn, type SignedIn } from '../helpers/fixtures';

let t: TestApp;
let s: Record<'contractor' | 'colleague' | 'otherContractor' | 'agent' | 'seller' | 'inspector' | 'admin', SignedIn>;

const write = (who: SignedIn, method: 'post' | 'put' | 'patch' | 'delete', path: string) => who.agent[method](path).set('x-csrf-token', who.csrfToken);

const flatEntry = {
  code: 'gfci-inoperative',
  name: 'Replace GFCI receptacle, flat rate',
  unit: 'device',
  pricing: { mode: 'flat', firstUnitCents: 17_500, additionalUnitCents: 8_500, hardSiteMultiplierBp: 14_000 },
};
const timedEntry = {
  key: 'cover-plate',
  code: 'cover-plate-missing',
  name: 'Install cover plate',
  unit: 'plate',
  pricing: { mode: 'time-and-materials', labourMinutesPerUnit: 4, materialsCentsPerUnit: 200, markupBp: 6_000, materials: [{ name: 'Cover plate', quantityPerUnit: 1, unitCostCents: 200 }], minutesLow: 2, minutesHigh: 5 },
};

beforeAll(async () => {
  t = createTestApp();
  await resetDatabase(t.db);
  const org = await createOrganisation(t.db, 'contractor', 'Ledger Electric');
  const otherOrg = await createOrganisation(t.db, 'contractor', 'Other Ledger Electric');
  const users = {
    contractor: await createUser(t.db, 'contractor', org),
    colleague: await createUser(t.db, 'contractor', org),
    otherContractor: await createUser(t.db, 'contractor', otherOrg),
    agent: await createUser(t.db, 'agent'),
    seller: await createUser(t.db, 'seller'),
    inspector: await createUser(t.db, 'inspector'),
    admin: await createUser(t.db, 'admin'),
  };
  s = Object.fromEntries(await Promise.all(Object.entries(users).map(async ([k, u]) => [k, await signIn(t.app, u)]))) as typeof s;
});
afterAll(() => t.close());

describe('who reaches /api/rate-book', () => {
  it('responds 401 without a session', async () => {
    await request(t.app).get('/api/rate-book/entries').expect(401);
  });

  it.each(['agent', 'seller', 'inspector', 'admin'] as const)('responds 403 to the %s role', async (who) => {
    const res = await s[who].agent.get('/api/rate-book/terms');
    expect(res.status).toBe(403);
    expect(res.body).toEqual({ error: expect.any(String), details: [] });
    await write(s[who], 'post', '/api/rate-book/entries').send(timedEntry).expect(403);
  });

  it('refuses a write without the CSRF token', async () => {
    await s.contractor.agent.post('/api/rate-book/entries').send(timedEntry).expect(403);
  });
});

describe('PUT /api/rate-book/terms', () => {
  it('responds 404 before the terms are saved', async () => {
    await s.contractor.agent.get('/api/rate-book/terms').expect(404);
  });

  it('responds 400 with field paths for bad terms', async () => {
    const res = await write(s.contractor, 'put', '/api/rate-book/terms').send({ version: 0, terms: { ...DEMO_RATE_BOOK.terms, hourlyRateCents: 0, warrantyText: ' ' } });
    expect(res.status).toBe(400);
    expect(res.body.details.map((d: { path: string }) => d.path).sort()).toEqual(['terms.hourlyRateCents', 'terms.warrantyText']);
  });

  it('starts the rate book at version 0, then changes it at the version read; a stale version gets 409', async () => {
    const created = await write(s.contractor, 'put', '/api/rate-book/terms').send({ version: 0, terms: DEMO_RATE_BOOK.terms });
    expect(created.status).toBe(200);
    expect(created.body).toMatchObject({ version: 1, terms: { serviceCallCents: 9_500, quoteValidityDays: 30 } });

    const byColleague = await write(s.colleague, 'put', '/api/rate-book/terms').send({ version: 1, terms: { ...DEMO_RATE_BOOK.terms, serviceCallCents: 10_500 } });
    expect(byColleague.body).toMatchObject({ version: 2, terms: { serviceCallCents: 10_500 } });

    const stale = await write(s.contractor, 'put', '/api/rate-book/terms').send({ version: 1, terms: DEMO_RATE_BOOK.terms });
    expect(stale.status).toBe(409);
    expect(stale.body.error).toMatch(/changed by someone else/);
    await write(s.contractor, 'put', '/api/rate-book/terms').send({ version: 0, terms: DEMO_RATE_BOOK.terms }).expect(409);
  });

  it('keeps each organisation to its own rate book', async () => {
    await s.otherContractor.agent.get('/api/rate-book/terms').expect(404);
    const book = await s.otherContractor.agent.get('/api/rate-book').expect(200);
    expect(book.body).toMatchObject({ contractorName: 'Other Ledger Electric', terms: null, entries: [], adders: [] });
  });
});

describe('/api/rate-book/entries', () => {
  let flat: RateBookEntryRecord;
  let timed: RateBookEntryRecord;

  it('creates entries of both modes (201), making a key from the name when none is given', async () => {
    const a = await write(s.contractor, 'post', '/api/rate-book/entries').send(flatEntry);
    expect(a.status).toBe(201);
    flat = a.body;
    expect(flat).toMatchObject({ key: 'replace-gfci-receptacle-flat-rate', version: 1, code: 'gfci-inoperative', isOnSentQuote: false, pricing: flatEntry.pricing });
    const b = await write(s.colleague, 'post', '/api/rate-book/entries').send(timedEntry);
    expect(b.status).toBe(201);
    timed = b.body;
    const list = await s.contractor.agent.get('/api/rate-book/entries').expect(200);
    expect(list.body.map((e: RateBookEntryRecord) => e.key)).toEqual([flat.key, 'cover-plate']);
  });

  it('responds 400 with the pricing engine’s own rules at their paths', async () => {
    const res = await write(s.contractor, 'post', '/api/rate-book/entries').send({
      ...timedEntry,
      key: 'broken',
      pricing: { ...timedEntry.pricing, minutesLow: 9, materialsCentsPerUnit: 250 },
    });
    expect(res.status).toBe(400);
    expect(res.body.details).toEqual(
      expect.arrayContaining([
        { path: 'pricing.minutesLow', message: 'Easy-site minutes exceed hard-site minutes' },
        { path: 'pricing.materialsCentsPerUnit', message: 'Materials list adds up to 200 cents, not 250' },
      ]),
    );
    const flatBad = await write(s.contractor, 'post', '/api/rate-book/entries').send({ ...flatEntry, pricing: { ...flatEntry.pricing, additionalUnitCents: 20_000 } });
    expect(flatBad.body.details).toEqual([{ path: 'pricing.additionalUnitCents', message: 'Each additional unit costs more than the first' }]);
  });

  it('responds 400 when the key is taken', async () => {
    const res = await write(s.contractor, 'post', '/api/rate-book/entries').send(timedEntry);
    expect(res.status).toBe(400);
    expect(res.body.details).toEqual([{ path: 'key', message: expect.stringContaining('"cover-plate"') }]);
  });

  it('responds 404 to another organisation for an entry that is not theirs', async () => {
    await s.otherContractor.agent.get(`/api/rate-book/entries/${timed.id}`).expect(404);
    await write(s.otherContractor, 'patch', `/api/rate-book/entries/${timed.id}`).send({ version: 1, name: 'Mine now' }).expect(404);
    await write(s.otherContractor, 'delete', `/api/rate-book/entries/${timed.id}?version=1`).expect(404);
  });

  it('makes a new version on every change and keeps the earlier ones; the second writer gets 409', async () => {
    const changed = await write(s.contractor, 'patch', `/api/rate-book/entries/${timed.id}`).send({ version: 1, pricing: { ...timedEntry.pricing, labourMinutesPerUnit: 5 } });
    expect(changed.status).toBe(200);
    expect(changed.body).toMatchObject({ id: timed.id, version: 2, pricing: { labourMinutesPerUnit: 5 } });

    const second = await write(s.colleague, 'patch', `/api/rate-book/entries/${timed.id}`).send({ version: 1, name: 'Cover plate, colleague’s view' });
    expect(second.status).toBe(409);

    const detail = await s.colleague.agent.get(`/api/rate-book/entries/${timed.id}`).expect(200);
    expect(detail.body.versions.map((v: { version: number; pricing: { labourMinutesPerUnit: number } }) => [v.version, v.pricing.labourMinutesPerUnit])).toEqual([
      [2, 5],
      [1, 4],
    ]);
  });

  it('checks a change merged into the entry against the same rules (400)', async () => {
    const res = await write(s.contractor, 'patch', `/api/rate-book/entries/${flat.id}`).send({ version: 1, pricing: { ...flatEntry.pricing, firstUnitCents: 100 } });
    expect(res.status).toBe(400);
    expect(res.body.details).toEqual([{ path: 'pricing.additionalUnitCents', message: 'Each additional unit costs more than the first' }]);
    const empty = await write(s.contractor, 'patch', `/api/rate-book/entries/${flat.id}`).send({ version: 1 });
    expect(empty.status).toBe(400);
  });

  it('deletes at the version read (204), and 409 for a stale one', async () => {
    await write(s.contractor, 'delete', `/api/rate-book/entries/${flat.id}?version=7`).expect(409);
    await write(s.contractor, 'delete', `/api/rate-book/entries/${flat.id}?version=1`).expect(204);
    await s.contractor.agent.get(`/api/rate-book/entries/${flat.id}`).expect(404);
    await write(s.contractor, 'delete', `/api/rate-book/entries/${flat.id}`).expect(400);
  });
});

describe('/api/rate-book/adders', () => {
  it('creates, changes at the version read and deletes site conditions', async () => {
    const created = await write(s.contractor, 'post', '/api/rate-book/adders').send({ name: 'Plaster and lath walls', effect: { kind: 'labour-multiplier', multiplierBp: 13_000 } });
    expect(created.status).toBe(201);
    expect(created.body).toMatchObject({ key: 'plaster-and-lath-walls', version: 1, appliesWhenBuiltBefore: null, effect: { kind: 'labour-multiplier', multiplierBp: 13_000 } });
    const id = created.body.id;

    const changed = await write(s.colleague, 'patch', `/api/rate-book/adders/${id}`).send({ version: 1, appliesWhenBuiltBefore: 1950 });
    expect(changed.body).toMatchObject({ version: 2, appliesWhenBuiltBefore: 1950 });
    await write(s.contractor, 'patch', `/api/rate-book/adders/${id}`).send({ version: 1, name: 'Plaster' }).expect(409);
    await s.otherContractor.agent.get('/api/rate-book/adders').expect(200).expect([]);
    await write(s.otherContractor, 'patch', `/api/rate-book/adders/${id}`).send({ version: 2, name: 'Plaster' }).expect(404);

    await write(s.contractor, 'delete', `/api/rate-book/adders/${id}?version=2`).expect(204);
    await s.contractor.agent.get('/api/rate-book/adders').expect(200).expect([]);
  });

  it('responds 400 for an effect outside the engine’s range (multipliers ×1 to ×4)', async () => {
    const res = await write(s.contractor, 'post', '/api/rate-book/adders').send({ name: 'Too hard', effect: { kind: 'labour-multiplier', multiplierBp: 90_000 } });
    expect(res.status).toBe(400);
    expect(res.body.details[0].path).toBe('effect.multiplierBp');
  });
});

describe('GET /api/rate-book/changes', () => {
  it('records every change with who, when, what, before and after, newest first', async () => {
    const res = await s.contractor.agent.get('/api/rate-book/changes?pageSize=100').expect(200);
    const log = res.body.items as { subject: string; action: string; byName: string; before: unknown; after: unknown }[];
    expect(log[0]).toMatchObject({ subject: 'adder', action: 'delete', byName: s.contractor.user.name, after: null });
    const entryUpdate = log.find((c) => c.subject === 'entry' && c.action === 'update');
    expect(entryUpdate).toMatchObject({ byName: s.contractor.user.name, before: { version: 1, pricing: { labourMinutesPerUnit: 4 } }, after: { version: 2, pricing: { labourMinutesPerUnit: 5 } } });
    expect(log.filter((c) => c.subject === 'terms').map((c) => c.action)).toEqual(['update', 'create']);
    const other = await s.otherContractor.agent.get('/api/rate-book/changes').expect(200);
    expect(other.body.total).toBe(0);
  });
});

describe('CSV export and import', () => {
  const csvOf = async (who: SignedIn) => {
    const res = await who.agent.get('/api/rate-book/entries.csv').expect(200);
    expect(res.headers['content-type']).toMatch(/^text\/csv/);
    return res.text;
  };

  it('round-trips: export → import gives identical entries and no new versions', async () => {
    for (const entry of DEMO_RATE_BOOK.entries.slice(0, 8)) {
      const { id, ...content } = entry;
      await write(s.contractor, 'post', '/api/rate-book/entries').send({ key: id, ...content }).expect(201);
    }
    const before = (await s.contractor.agent.get('/api/rate-book/entries')).body;
    const csv = await csvOf(s.contractor);
    const res = await write(s.contractor, 'post', '/api/rate-book/entries/import').set('content-type', 'text/csv').send(csv);
    expect(res.status).toBe(200);
    expect(res.body).toEqual({ created: 0, updated: 0, unchanged: before.length });
    expect((await s.contractor.agent.get('/api/rate-book/entries')).body).toEqual(before);
  });

  it('imports a file into another organisation, whose export is then the same file', async () => {
    const csv = await csvOf(s.contractor);
    const res = await s.otherContractor.agent.post('/api/rate-book/entries/import').set('x-csrf-token', s.otherContractor.csrfToken).attach('file', Buffer.from(csv), { filename: 'entries.csv', contentType: 'text/csv' });
    expect(res.status).toBe(200);
    expect(res.body.created).toBe(csv.trim().split('\n').length - 1);
    expect(await csvOf(s.otherContractor)).toBe(csv);
  });

  it('updates changed rows as new versions and records them as imports', async () => {
    const csv = (await csvOf(s.contractor)).replace(',Install cover plate,', ',Install cover plate (any colour),');
    const res = await write(s.contractor, 'post', '/api/rate-book/entries/import').send({ csv });
    expect(res.body).toMatchObject({ created: 0, updated: 1 });
    const entries: RateBookEntryRecord[] = (await s.contractor.agent.get('/api/rate-book/entries')).body;
    expect(entries.find((e) => e.key === 'cover-plate')).toMatchObject({ name: 'Install cover plate (any colour)', version: 3 });
    const log = await s.contractor.agent.get('/api/rate-book/changes?pageSize=1');
    expect(log.body.items[0]).toMatchObject({ subject: 'entry', action: 'import' });
  });

  /** The exported CSV as a table of cells, and back. */
  const table = async () => Papa.parse<string[]>(await csvOf(s.contractor), { skipEmptyLines: true }).data;
  const toCsv = (rows: string[][]) => Papa.unparse(rows, { newline: '\n' });

  it('refuses a file with bad rows with row-level details and imports nothing of it', async () => {
    const rows = await table();
    const header = rows[0];
    const good = [...rows[1]];
    good[header.indexOf('key')] = 'brand-new-entry';
    const bad = [...rows[2]];
    bad[header.indexOf('labourMinutesPerUnit')] = 'ten';
    const empty = header.map((_, i) => (i === 0 ? 'x' : ''));
    const before = (await s.contractor.agent.get('/api/rate-book/entries')).body.length;
    const res = await write(s.contractor, 'post', '/api/rate-book/entries/import').set('content-type', 'text/csv').send(toCsv([header, good, bad, empty]));
    expect(res.status).toBe(400);
    expect(res.body.error).toMatch(/nothing was imported/);
    const paths = res.body.details.map((d: { path: string }) => d.path);
    expect(paths).toEqual(expect.arrayContaining(['rows.2.labourMinutesPerUnit', 'rows.3.name', 'rows.3.unit', 'rows.3.mode']));
    expect(paths.some((p: string) => p.startsWith('rows.1.'))).toBe(false);
    expect((await s.contractor.agent.get('/api/rate-book/entries')).body.length).toBe(before);
  });

  it('names the cell of a number that is not a whole number', async () => {
    const rows = await table();
    const row = rows.findIndex((r) => r[0] === 'cover-plate');
    rows[row][rows[0].indexOf('labourMinutesPerUnit')] = 'ten';
    const res = await write(s.contractor, 'post', '/api/rate-book/entries/import').set('content-type', 'text/csv').send(toCsv(rows));
    expect(res.status).toBe(400);
    expect(res.body.details).toEqual([{ path: `rows.${row}.labourMinutesPerUnit`, message: expect.stringContaining('whole number') }]);
  });

  it('responds 400 without a file', async () => {
    const res = await write(s.contractor, 'post', '/api/rate-book/entries/import').send({});
    expect(res.status).toBe(400);
    expect(res.body.details).toEqual([{ path: 'file', message: expect.any(String) }]);
  });
});
