import { mkdtempSync, readdirSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { createTestApp, type TestApp } from '../helpers/test-app';
import { createOrganisation, createUser, resetDatabase, signIn, validRequestBody, type SignedIn } from '../helpers/fixtures';
import { encryptedPdf, imageOnlyPdf, textPdf } from '../helpers/pdf-fixtures';

// A short excerpt in an inspector's words (written for this test): two electrical defects, one roof note.
const PAGE_1 = [
  'ROOFING',
  'Several shingles are lifted at the north eave. Recommend a roofer evaluate.',
  '',
  'ELECTRICAL',
  '1. The receptacle at the hall bathroom vanity is not GFCI protected.',
].join('\n');
const PAGE_2 = ['2. Reversed polarity was found at the receptacle on the east wall of the primary bedroom.'].join('\n');

let t: TestApp;
let storageDir: string;
let agent: SignedIn;
let inspector: SignedIn;
let seller: SignedIn;
let contractor: SignedIn;
let outsider: SignedIn;

beforeAll(async () => {
  storageDir = mkdtempSync(join(tmpdir(), 'cc-files-'));
  t = createTestApp({ STORAGE_DIR: storageDir });
  await resetDatabase(t.db);
  const org = await createOrganisation(t.db, 'contractor');
  const people = {
    agent: await createUser(t.db, 'agent'),
    inspector: await createUser(t.db, 'inspector'),
    seller: await createUser(t.db, 'seller'),
    contractor: await createUser(t.db, 'contractor', org),
    outsider: await createUser(t.db, 'agent'),
  };
  [agent, inspector, seller, contractor, outsider] = await Promise.all(
    [people.agent, people.inspector, people.seller, people.contractor, people.outsider].map((u) => signIn(t.app, u)),
  );
});
afterAll(async () => {
  await t.close();
  rmSync(storageDir, { recursive: true, force: true });
});

async function newRequest(): Promise<number> {
  const res = await agent.agent
    .post('/api/requests')
    .set('x-csrf-token', agent.csrfToken)
    .send(validRequestBody({ inspectorEmail: inspector.user.email, sellerEmail: seller.user.email, contractorOrganisationId: (await t.db('organisations').first('id')).id }));
  return res.body.id;
}

const storedFiles = () => readdirSync(storageDir, { recursive: true }).filter((f) => String(f).length > 10);
const counts = async (requestId: number) => ({
  reports: Number((await t.db('report_files').where({ request_id: requestId }).count<{ c: string }[]>({ c: '*' }))[0].c),
  items: Number((await t.db('line_items').where({ request_id: requestId }).count<{ c: string }[]>({ c: '*' }))[0].c),
  status: (await t.db('repair_requests').where({ id: requestId }).first('status')).status,
});

describe('POST /api/requests/:id/reports', () => {
  it('reads a PDF page by page into proposed items, skips the roof note, and moves the request to intake', async () => {
    const id = await newRequest();
    const pdf = await textPdf([PAGE_1, PAGE_2]);
    const res = await agent.agent.post(`/api/requests/${id}/reports`).set('x-csrf-token', agent.csrfToken).attach('file', pdf, { filename: 'inspection.pdf', contentType: 'application/pdf' });
    expect(res.status).toBe(201);
    expect(res.body).toMatchObject({ isDuplicate: false, report: { kind: 'pdf', pageCount: 2, originalName: 'inspection.pdf' } });
    expect(res.body.skippedCount).toBeGreaterThanOrEqual(1);
    expect(res.body.report.skipped.some((s: { text: string }) => /shingles/.test(s.text))).toBe(true);

    const items = await agent.agent.get(`/api/requests/${id}/items`).expect(200);
    const byCode = Object.fromEntries(items.body.items.map((i: { code: string }) => [i.code, i]));
    expect(byCode['gfci-missing']).toMatchObject({ room: 'bathroom', page: 1, status: 'proposed' });
    expect(byCode['reversed-polarity']).toMatchObject({ room: 'bedroom', page: 2, status: 'proposed' });
    expect(res.body.report.pages).toBeUndefined();
    const text = await agent.agent.get(`/api/requests/${id}/reports/${res.body.report.id}/text`).expect(200);
    expect(text.body).toEqual({ id: res.body.report.id, pages: [expect.stringContaining('ROOFING'), expect.stringContaining('Reversed polarity')] });
    const joined = text.body.pages.join('\f');
    for (const item of items.body.items) expect(joined.slice(item.evidenceStart, item.evidenceEnd)).toBe(item.evidence);
    expect((await counts(id)).status).toBe('intake');
  });

  it('recognises the same file uploaded again and stores it once', async () => {
    const id = await newRequest();
    const pdf = await textPdf([PAGE_1]);
    const first = await agent.agent.post(`/api/requests/${id}/reports`).set('x-csrf-token', agent.csrfToken).attach('file', pdf, 'a.pdf');
    const before = await counts(id);
    const filesBefore = storedFiles().length;
    const again = await inspector.agent.post(`/api/requests/${id}/reports`).set('x-csrf-token', inspector.csrfToken).attach('file', pdf, 'same-again.pdf');
    expect(again.status).toBe(200);
    expect(again.body).toMatchObject({ isDuplicate: true, proposedCount: 0, report: { id: first.body.report.id } });
    expect(await counts(id)).toEqual(before);
    expect(storedFiles().length).toBe(filesBefore);
  });

  it('takes a plain-text file with form feeds as page breaks', async () => {
    const id = await newRequest();
    const res = await agent.agent.post(`/api/requests/${id}/reports`).set('x-csrf-token', agent.csrfToken).attach('file', Buffer.from(`${PAGE_1}\f${PAGE_2}`), { filename: 'report.txt', contentType: 'text/plain' });
    expect(res.status).toBe(201);
    expect(res.body.report).toMatchObject({ kind: 'text', pageCount: 2 });
    expect(res.body.proposedCount).toBeGreaterThanOrEqual(2);
  });

  describe('refuses, with a clear error and nothing written', () => {
    const cases: [string, () => Promise<{ buffer: Buffer; name: string; type: string }>, number, RegExp][] = [
      ['a corrupt PDF', async () => ({ buffer: Buffer.from('%PDF-1.7\n1 0 obj << /Type /Catalog >>\nthis is not a real pdf body at all'), name: 'broken.pdf', type: 'application/pdf' }), 422, /damaged|could not be read|not a valid/i],
      ['an encrypted PDF', async () => ({ buffer: await encryptedPdf(PAGE_1), name: 'locked.pdf', type: 'application/pdf' }), 422, /password/i],
      ['an image-only PDF', async () => ({ buffer: await imageOnlyPdf(), name: 'scan.pdf', type: 'application/pdf' }), 422, /no text layer/i],
      ['a PNG', async () => ({ buffer: Buffer.from('89504e470d0a1a0a0000000d49484452', 'hex'), name: 'photo.png', type: 'image/png' }), 415, /only pdf and plain-text/i],
      ['a file named .pdf that is not a PDF', async () => ({ buffer: Buffer.from('just some words pretending'), name: 'fake.pdf', type: 'application/pdf' }), 415, /not one/i],
      ['a binary file named .txt', async () => ({ buffer: Buffer.from([0x41, 0x00, 0x42, 0x00, 0x43]), name: 'data.txt', type: 'text/plain' }), 415, /not a text file/i],
      ['an oversized file', async () => ({ buffer: Buffer.concat([Buffer.from('%PDF-1.7\n'), Buffer.alloc(25 * 1024 * 1024 + 10, 0x20)]), name: 'huge.pdf', type: 'application/pdf' }), 413, /larger than allowed/i],
    ];

    it.each(cases)('%s', async (_name, make, status, message) => {
      const id = await newRequest();
      const filesBefore = storedFiles().length;
      const { buffer, name, type } = await make();
      const res = await agent.agent.post(`/api/requests/${id}/reports`).set('x-csrf-token', agent.csrfToken).attach('file', buffer, { filename: name, contentType: type });
      expect(res.status).toBe(status);
      expect(res.body.error).toMatch(message);
      expect(Array.isArray(res.body.details)).toBe(true);
      expect(await counts(id)).toEqual({ reports: 0, items: 0, status: 'draft' });
      expect(storedFiles().length).toBe(filesBefore);
    });

    it('a request without a file', async () => {
      const id = await newRequest();
      const res = await agent.agent.post(`/api/requests/${id}/reports`).set('x-csrf-token', agent.csrfToken).field('note', 'no file');
      expect(res.status).toBe(400);
      expect(res.body.details).toEqual([{ path: 'file', message: expect.any(String) }]);
    });
  });

  it('lets the inspector upload; 403 to the seller and the contractor; 404 to an outsider', async () => {
    const id = await newRequest();
    const file = () => Buffer.from(`${PAGE_1}\n${Math.random()}`);
    await inspector.agent.post(`/api/requests/${id}/reports`).set('x-csrf-token', inspector.csrfToken).attach('file', file(), 'r.txt').expect(201);
    await seller.agent.post(`/api/requests/${id}/reports`).set('x-csrf-token', seller.csrfToken).attach('file', file(), 'r.txt').expect(403);
    await contractor.agent.post(`/api/requests/${id}/reports`).set('x-csrf-token', contractor.csrfToken).attach('file', file(), 'r.txt').expect(403);
    await outsider.agent.post(`/api/requests/${id}/reports`).set('x-csrf-token', outsider.csrfToken).attach('file', file(), 'r.txt').expect(404);
    await outsider.agent.get(`/api/requests/${id}/reports`).expect(404);
    await seller.agent.get(`/api/requests/${id}/reports`).expect(200);
  });
});

describe('POST /api/requests/:id/reports/paste', () => {
  it('reads pasted text', async () => {
    const id = await newRequest();
    const res = await agent.agent.post(`/api/requests/${id}/reports/paste`).set('x-csrf-token', agent.csrfToken).send({ text: PAGE_2 });
    expect(res.status).toBe(201);
    expect(res.body.report.kind).toBe('pasted');
    const items = await agent.agent.get(`/api/requests/${id}/items`);
    expect(items.body.items.map((i: { code: string }) => i.code)).toEqual(['reversed-polarity']);
  });

  it('responds 400 on the field for empty text', async () => {
    const id = await newRequest();
    const res = await agent.agent.post(`/api/requests/${id}/reports/paste`).set('x-csrf-token', agent.csrfToken).send({ text: '   ' });
    expect(res.status).toBe(400);
    expect(res.body.details[0].path).toBe('text');
  });
});

describe('POST /api/requests/:id/reports/:reportId/reparse', () => {
  it('replaces untouched proposals and keeps edited and removed ones', async () => {
    const id = await newRequest();
    const up = await agent.agent.post(`/api/requests/${id}/reports/paste`).set('x-csrf-token', agent.csrfToken).send({ text: `${PAGE_1}\n${PAGE_2}` });
    const items = (await agent.agent.get(`/api/requests/${id}/items`)).body.items;
    const gfci = items.find((i: { code: string }) => i.code === 'gfci-missing');
    const polarity = items.find((i: { code: string }) => i.code === 'reversed-polarity');
    await agent.agent.patch(`/api/requests/${id}/items/${gfci.id}`).set('x-csrf-token', agent.csrfToken).send({ version: gfci.version, location: 'hall bath, left of sink', quantity: 2 }).expect(200);
    await agent.agent.delete(`/api/requests/${id}/items/${polarity.id}?version=${polarity.version}`).set('x-csrf-token', agent.csrfToken).expect(204);

    const re = await agent.agent.post(`/api/requests/${id}/reports/${up.body.report.id}/reparse`).set('x-csrf-token', agent.csrfToken);
    expect(re.status).toBe(200);
    const after = (await agent.agent.get(`/api/requests/${id}/items`)).body.items;
    expect(after.filter((i: { code: string }) => i.code === 'gfci-missing')).toEqual([expect.objectContaining({ id: gfci.id, location: 'hall bath, left of sink', quantity: 2, isEdited: true })]);
    expect(after.some((i: { code: string }) => i.code === 'reversed-polarity')).toBe(false);
  });
});
