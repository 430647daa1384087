// Reliability: hostile uploads are refused without stalling anyone, report lists stay small, and
// simultaneous writes to one request all succeed. Loopback only; each case is bounded in size.
import { mkdirSync, mkdtempSync, readdirSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import request from 'supertest';
import { sweepStorageAtStart } from '../../../server/src/integrations/storage/sweep-at-start';
import { createOrganisation, createUser, resetDatabase, signIn, validRequestBody, type SignedIn } from '../../helpers/fixtures';
import { inflatingPdf, manyPagesPdf, slowPdf } from '../../helpers/hostile-pdfs';
import { createTestApp, type TestApp } from '../../helpers/test-app';

let t: TestApp;
let storageDir: string;
let agent: SignedIn;
let other: SignedIn;

const EXCERPT = 'ELECTRICAL\n1. Open junction box in the garage ceiling.\n2. Reversed polarity at the primary bedroom receptacle.';

beforeAll(async () => {
  storageDir = mkdtempSync(join(tmpdir(), 'cc-reliability-'));
  t = createTestApp({ STORAGE_DIR: storageDir });
  await resetDatabase(t.db);
  await createOrganisation(t.db, 'contractor');
  agent = await signIn(t.app, await createUser(t.db, 'agent'));
  other = await signIn(t.app, await createUser(t.db, 'agent'));
});
afterAll(async () => {
  await t.close();
  rmSync(storageDir, { recursive: true, force: true });
});

async function newRequest(by: SignedIn = agent): Promise<number> {
  const res = await by.agent.post('/api/requests').set('x-csrf-token', by.csrfToken).send(validRequestBody()).expect(201);
  return res.body.id;
}

const upload = (id: number, file: Buffer, filename: string, contentType: string) =>
  agent.agent.post(`/api/requests/${id}/reports`).set('x-csrf-token', agent.csrfToken).attach('file', file, { filename, contentType });

const reportCount = async (id: number) => Number((await t.db('report_files').where({ request_id: id }).count<{ c: string }[]>({ c: '*' }))[0].c);

describe('a hostile upload', () => {
  it('of 15,000 pages is refused from its page count, before any page is read', async () => {
    const id = await newRequest();
    const res = await upload(id, manyPagesPdf(15_000), 'long.pdf', 'application/pdf');
    expect(res.status).toBe(422);
    expect(res.body).toEqual({ error: expect.stringMatching(/15,000 pages; at most 150/), details: [{ path: 'file', message: expect.any(String) }] });
    expect(await reportCount(id)).toBe(0);
  });

  it('whose streams expand to 100 MB is refused before pdf.js reads it', async () => {
    const id = await newRequest();
    const res = await upload(id, inflatingPdf(100 * 1024 * 1024), 'expands.pdf', 'application/pdf');
    expect(res.status).toBe(422);
    expect(res.body.error).toMatch(/expands to far more content/);
    expect(await reportCount(id)).toBe(0);
  });

  it('that reads slowly is stopped at the time limit while health checks and other people keep being answered', async () => {
    // An instance with a short read time limit, so that the slow report is stopped within the test.
    const short = createTestApp({ STORAGE_DIR: storageDir, REPORT_READ_TIMEOUT_SECONDS: '1' }); // the report takes several seconds to read even on a quiet machine
    try {
      const [uploader, bystander] = await Promise.all([signIn(short.app, agent.user), signIn(short.app, other.user)]);
      const id = await newRequest(uploader);
      let uploadAnswered = false;
      const hostile = uploader.agent
        .post(`/api/requests/${id}/reports`)
        .set('x-csrf-token', uploader.csrfToken)
        .attach('file', slowPdf(2_500_000), { filename: 'slow.pdf', contentType: 'application/pdf' })
        .then((res) => {
          uploadAnswered = true;
          return res;
        });
      // Side by side: while the upload is being read, the health check and another user's list are
      // asked again and again; count the answers that came back before the upload's own answer.
      const answeredMeanwhile: number[] = [];
      while (!uploadAnswered && answeredMeanwhile.length < 200) {
        const [health, list] = await Promise.all([request(short.app).get('/api/health'), bystander.agent.get('/api/requests')]);
        if (!uploadAnswered) answeredMeanwhile.push(health.status, list.status);
      }
      const res = await hostile;
      expect(res.status).toBe(422);
      expect(res.body.error).toMatch(/took too long/);
      expect(answeredMeanwhile.length).toBeGreaterThanOrEqual(4);
      expect(new Set(answeredMeanwhile)).toEqual(new Set([200]));
      // The pool replaced the stopped worker: the next report is read.
      const next = await uploader.agent.post(`/api/requests/${id}/reports/paste`).set('x-csrf-token', uploader.csrfToken).send({ text: EXCERPT });
      expect(next.status).toBe(201);
    } finally {
      await short.close();
    }
  });

  it('of a text file longer than the text limit is refused (413) and nothing is stored', async () => {
    const id = await newRequest();
    const res = await upload(id, Buffer.alloc(1_700_000, 'a'), 'huge.txt', 'text/plain');
    expect(res.status).toBe(413);
    expect(res.body.error).toMatch(/longer than 400,000 characters/);
    expect(await reportCount(id)).toBe(0);
  });

  it('of a paste that yields more findings than a report may have is refused before anything is inserted', async () => {
    const id = await newRequest();
    const lines = Array.from({ length: 700 }, (_, i) => `${i + 1}. Open junction box at the garage ceiling, location ${i + 1}.`);
    const res = await agent.agent.post(`/api/requests/${id}/reports/paste`).set('x-csrf-token', agent.csrfToken).send({ text: ['ELECTRICAL', ...lines].join('\n') });
    expect(res.status).toBe(422);
    expect(res.body.error).toMatch(/700 findings; at most 500/);
    expect(await reportCount(id)).toBe(0);
  });
});

describe('report lists and answers', () => {
  it('carry summaries; the pages come from the text route only', async () => {
    const id = await newRequest();
    const up = await upload(id, Buffer.from(`${EXCERPT}\fPage two: the kitchen is fine.`), 'excerpt.txt', 'text/plain').expect(201);
    expect(up.body.report).not.toHaveProperty('pages');
    expect(up.body.report).toMatchObject({ pageCount: 2, textLength: EXCERPT.length + 30 });
    const list = await agent.agent.get(`/api/requests/${id}/reports`).expect(200);
    expect(list.body[0]).not.toHaveProperty('pages');
    const text = await agent.agent.get(`/api/requests/${id}/reports/${up.body.report.id}/text`).expect(200);
    expect(text.body.pages).toEqual([EXCERPT, 'Page two: the kitchen is fine.']);
    await other.agent.get(`/api/requests/${id}/reports/${up.body.report.id}/text`).expect(404);
  });

  it('take a .txt that mentions "%PDF-" inside its first kilobyte as text', async () => {
    const id = await newRequest();
    const res = await upload(id, Buffer.from(`Inspection notes (exported from report.pdf, header %PDF-1.7)\n${EXCERPT}`), 'notes.txt', 'text/plain');
    expect(res.status).toBe(201);
    expect(res.body.report.kind).toBe('text');
  });
});

describe('broken multipart bodies', () => {
  it.each([
    ['a body cut short', 'multipart/form-data; boundary=XYZ', '--XYZ\r\nContent-Disposition: form-data; name="file"; filename="a.txt"\r\nContent-Type: text/plain\r\n\r\nhalf a fi'],
    ['a missing boundary', 'multipart/form-data', '--XYZ\r\nContent-Disposition: form-data; name="file"; filename="a.txt"\r\n\r\nx\r\n--XYZ--\r\n'],
    ['a NUL in the file name', 'multipart/form-data; boundary=XYZ', '--XYZ\r\nContent-Disposition: form-data; name="file"; filename="a\u0000b.txt"\r\nContent-Type: text/plain\r\n\r\nELECTRICAL open junction box in the garage ceiling.\r\n--XYZ--\r\n'],
  ])('%s answers 400 with {error, details}', async (_name, contentType, body) => {
    const id = await newRequest();
    const res = await agent.agent.post(`/api/requests/${id}/reports`).set('x-csrf-token', agent.csrfToken).set('content-type', contentType).send(Buffer.from(body, 'latin1'));
    expect(res.status).toBe(400);
    expect(res.body).toEqual({ error: expect.any(String), details: expect.any(Array) });
    expect(await reportCount(id)).toBe(0);
  });
});

describe('simultaneous writes', () => {
  it('20 pastes on one request at once are all stored (201), none deadlocks', async () => {
    const id = await newRequest();
    const results = await Promise.all(
      Array.from({ length: 20 }, (_, i) =>
        agent.agent.post(`/api/requests/${id}/reports/paste`).set('x-csrf-token', agent.csrfToken).send({ text: `${EXCERPT}\n3. Paste number ${i + 1}: missing cover plate in the den.` }),
      ),
    );
    expect(results.map((r) => r.status)).toEqual(Array(20).fill(201));
    expect(await reportCount(id)).toBe(20);
  });

  it('the same new file sent to 10 requests at once is stored once and every upload succeeds', async () => {
    const ids = await Promise.all(Array.from({ length: 10 }, () => newRequest()));
    const file = Buffer.from(`${EXCERPT}\n4. Shared file ${Date.now()}.`);
    const results = await Promise.all(ids.map((id) => upload(id, file, 'shared.txt', 'text/plain')));
    expect(results.map((r) => r.status)).toEqual(Array(10).fill(201));
    const sha = results[0].body.report.sha256;
    const stored = readdirSync(storageDir, { recursive: true }).map(String);
    expect(stored.filter((f) => f.endsWith(sha))).toHaveLength(1);
    expect(stored.filter((f) => f.endsWith('.tmp'))).toHaveLength(0);
  });
});

describe('start-up sweep of the file storage', () => {
  it('removes temporary files of uploads that never committed and keeps those whose report did', async () => {
    const id = await newRequest();
    const up = await upload(id, Buffer.from(`${EXCERPT}\n5. Sweep ${Date.now()}.`), 'sweep.txt', 'text/plain').expect(201);
    const committedKey: string = up.body.report.sha256;
    // As a kill between commit and rename leaves it: the row exists, only the temporary file does.
    const committedDir = join(storageDir, committedKey.slice(0, 2));
    rmSync(join(committedDir, committedKey));
    writeFileSync(join(committedDir, `${committedKey}.11111111-2222-3333-4444-555555555555.tmp`), 'bytes');
    const orphanKey = 'f'.repeat(64);
    mkdirSync(join(storageDir, 'ff'), { recursive: true });
    writeFileSync(join(storageDir, 'ff', `${orphanKey}.66666666-7777-8888-9999-000000000000.tmp`), 'partial');

    expect(await sweepStorageAtStart(storageDir, t.db)).toEqual({ committed: 1, removed: 1 });
    const files = readdirSync(storageDir, { recursive: true }).map(String);
    expect(files).toContain(join(committedKey.slice(0, 2), committedKey));
    expect(files.some((f) => f.includes(orphanKey))).toBe(false);
  });
});
