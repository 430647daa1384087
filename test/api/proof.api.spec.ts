// Site visits, correction records, the completion letter and its public verification.
import { readdirSync, statSync } from 'node:fs';
import { join } from 'node:path';
import sharp from 'sharp';
import request from 'supertest';
import { findingCodeInfo, MAX_PHOTO_BYTES, NOT_A_PDF_MESSAGE, type CompletionLetter, type Correction, type WorkOverview } from '@cc/shared';
import { extractPdfPages } from '../../server/src/integrations/pdf-text';
import { createTestApp, type TestApp } from '../helpers/test-app';
import { resetDatabase, type SignedIn } from '../helpers/fixtures';
import { createPricedRequest, createPricingCast, type CastKey, type PricingCast } from '../helpers/pricing-fixtures';
import { gfciRecord } from '../helpers/proof-fixtures';

// Letters render PDFs with photos and read them back: slower than the other API calls on a busy machine.
jest.setTimeout(30_000);

let t: TestApp;
let cast: PricingCast;

const post = (who: SignedIn, path: string) => who.agent.post(path).set('x-csrf-token', who.csrfToken);
const inDays = (days: number) => new Date(Date.now() + days * 86_400_000).toISOString().slice(0, 10);
const visitBody = (overrides: object = {}) => ({ date: inDays(2), arrivalFrom: '08:00', arrivalTo: '10:00', electricianId: cast.users.colleague.id, accessNotes: 'Lockbox 4417 on the side gate', ...overrides });
const work = async (id: number, who: SignedIn = cast.s.contractor): Promise<WorkOverview> => (await who.agent.get(`/api/requests/${id}/work`).expect(200)).body;
const bytesOf = (req: request.Test) =>
  req.buffer(true).parse((r, done) => {
    const chunks: Buffer[] = [];
    r.on('data', (c: Buffer) => chunks.push(c));
    r.on('end', () => done(null, Buffer.concat(chunks)));
  });

/** Every file under the storage folder (uploads, photos, letters). */
function storedFiles(): string[] {
  const walk = (dir: string): string[] => {
    try {
      return readdirSync(dir).flatMap((name) => (statSync(join(dir, name)).isDirectory() ? walk(join(dir, name)) : [join(dir, name)]));
    } catch {
      return [];
    }
  };
  return walk(t.config.storageDir);
}

/** A small JPEG photo carrying camera metadata and a GPS position, as phones write them. */
async function phonePhoto(colour = '#c0392b'): Promise<Buffer> {
  return sharp({ create: { width: 640, height: 480, channels: 3, background: colour } })
    .jpeg()
    .withExif({ IFD0: { Make: 'PhoneMaker', Model: 'Model 9', Copyright: 'Site camera' }, IFD3: { GPSLatitudeRef: 'N', GPSLatitude: '38/1 50/1 0/1', GPSLongitudeRef: 'W', GPSLongitude: '104/1 49/1 0/1' } })
    .toBuffer();
}

function recordCorrection(id: number, itemId: number, record: object, photos: { kind: 'before' | 'after'; data: Buffer; name?: string; type?: string }[] = [], who: SignedIn = cast.s.contractor) {
  const req = post(who, `/api/requests/${id}/items/${itemId}/correction`).field('record', JSON.stringify(record));
  for (const p of photos) req.attach(p.kind, p.data, { filename: p.name ?? `${p.kind}.jpg`, contentType: p.type ?? 'image/jpeg' });
  return req;
}

beforeAll(async () => {
  t = createTestApp();
  await resetDatabase(t.db);
  cast = await createPricingCast(t.app, t.db);
});
afterAll(() => t.close());

describe('POST /api/requests/:id/visits', () => {
  let requestId: number;
  let itemIds: number[];

  beforeAll(async () => {
    ({ requestId, itemIds } = await createPricedRequest(cast, t.db, {
      status: 'approved',
      items: [
        { code: 'gfci-missing', quantity: 2, location: 'kitchen counter', status: 'approved' },
        { code: 'double-tap', quantity: 1, location: 'main panel', status: 'approved' },
      ],
    }));
  });

  it('responds 403 to the agents, the seller and the inspector, 404 to another contractor and an outsider', async () => {
    for (const who of ['buyerAgent', 'listingAgent', 'seller', 'inspector'] as const) await post(cast.s[who], `/api/requests/${requestId}/visits`).send(visitBody()).expect(403);
    await post(cast.s.otherContractor, `/api/requests/${requestId}/visits`).send(visitBody()).expect(404);
    await post(cast.s.outsiderAgent, `/api/requests/${requestId}/visits`).send(visitBody()).expect(404);
  });

  it('responds 400 with field details for a window that ends before it starts, NUL bytes, a past date or someone else’s electrician', async () => {
    const cases: [object, string][] = [
      [{ arrivalTo: '07:00' }, 'arrivalTo'],
      [{ accessNotes: 'gate\u0000code' }, 'accessNotes'],
      [{ date: inDays(-3) }, 'date'],
      [{ electricianId: cast.users.otherContractor.id }, 'electricianId'],
      [{ arrivalFrom: '25:00' }, 'arrivalFrom'],
    ];
    for (const [overrides, path] of cases) {
      const res = await post(cast.s.contractor, `/api/requests/${requestId}/visits`).send(visitBody(overrides));
      expect(res.status).toBe(400);
      expect(res.body.details.map((d: { path: string }) => d.path)).toContain(path);
    }
  });

  it('books the visit for every approved item and moves the request to scheduled', async () => {
    const res = await post(cast.s.contractor, `/api/requests/${requestId}/visits`).send(visitBody());
    expect(res.status).toBe(201);
    expect(res.body).toMatchObject({ number: 1, status: 'booked', electrician: { id: cast.users.colleague.id }, itemIds, accessNotes: 'Lockbox 4417 on the side gate' });
    expect((await work(requestId)).status).toBe('scheduled');
  });

  it('shows the access notes only to the assigned contractor and the listing agent', async () => {
    const seen: Partial<Record<CastKey, string | null>> = {};
    for (const who of ['contractor', 'colleague', 'listingAgent', 'buyerAgent', 'seller', 'inspector', 'admin'] as const) {
      seen[who] = (await work(requestId, cast.s[who])).visits[0].accessNotes;
    }
    expect(seen).toEqual({
      contractor: 'Lockbox 4417 on the side gate',
      colleague: 'Lockbox 4417 on the side gate',
      listingAgent: 'Lockbox 4417 on the side gate',
      buyerAgent: null,
      seller: null,
      inspector: null,
      admin: null,
    });
    await cast.s.otherContractor.agent.get(`/api/requests/${requestId}/work`).expect(404);
  });

  it('starts and finishes the visit, moving the request under way', async () => {
    const visitId = (await work(requestId)).visits[0].id;
    await post(cast.s.seller, `/api/requests/${requestId}/visits/${visitId}/start`).expect(403);
    await post(cast.s.contractor, `/api/requests/${requestId}/visits/${visitId}/finish`).expect(409);
    const told = await t.db('outbox_messages').where({ request_id: requestId, kind: 'visit-scheduled' }).count({ n: '*' }).first();
    const started = await post(cast.s.colleague, `/api/requests/${requestId}/visits/${visitId}/start`).expect(200);
    expect(started.body.status).toBe('started');
    // Booked for two days ahead and started now ("Start it today anyway", review 7, P3-2): the visit
    // takes place today (the contractor's today, within a day of UTC's), and the seller's side hears the new day.
    expect(started.body.date < inDays(2) && started.body.date >= inDays(-1)).toBe(true);
    const toldAfter = await t.db('outbox_messages').where({ request_id: requestId, kind: 'visit-scheduled' }).count({ n: '*' }).first();
    expect(Number(toldAfter?.n)).toBeGreaterThan(Number(told?.n));
    expect((await work(requestId)).status).toBe('in-progress');
    await post(cast.s.contractor, `/api/requests/${requestId}/visits/${visitId}/start`).expect(409);
    expect((await post(cast.s.contractor, `/api/requests/${requestId}/visits/${visitId}/finish`).expect(200)).body.status).toBe('finished');
    await post(cast.s.contractor, `/api/requests/${requestId}/visits/999999/start`).expect(404);
  });
});

describe('POST /api/requests/:id/items/:itemId/correction', () => {
  let requestId: number;
  let gfci: number;
  let panel: number;

  beforeAll(async () => {
    ({ requestId, itemIds: [gfci, panel] } = await createPricedRequest(cast, t.db, {
      status: 'approved',
      items: [
        { code: 'gfci-inoperative', quantity: 1, location: 'hall bath vanity', status: 'approved' },
        { code: 'double-tap', quantity: 1, location: 'main panel, breaker 14', status: 'approved' },
      ],
    }));
    await post(cast.s.contractor, `/api/requests/${requestId}/visits`).send(visitBody()).expect(201);
  });

  it('rejects a file that is not an image, whatever its name and declared type, and stores nothing', async () => {
    const before = storedFiles();
    const fake = Buffer.from('%PDF-1.7 not a photo at all, just text pretending to be one');
    const res = await recordCorrection(requestId, gfci, gfciRecord(), [{ kind: 'after', data: fake, name: 'after.jpg', type: 'image/jpeg' }]);
    expect(res.status).toBe(415);
    expect(res.body.details).toEqual([{ path: 'after.0', message: 'Choose a JPEG, PNG, WebP or HEIC photo' }]);
    expect(storedFiles()).toEqual(before);
    expect(await t.db('item_corrections').where({ line_item_id: gfci }).count()).toEqual([{ count: '0' }]);
    expect((await work(requestId)).items.find((i) => i.id === gfci)?.status).toBe('approved');
  });

  it('rejects a photo larger than the limit with 413 and stores nothing', async () => {
    const before = storedFiles();
    const big = Buffer.concat([await phonePhoto(), Buffer.alloc(MAX_PHOTO_BYTES)]);
    const res = await recordCorrection(requestId, gfci, gfciRecord(), [{ kind: 'before', data: big }]);
    expect(res.status).toBe(413);
    expect(res.body.error).toBe('The file is larger than allowed');
    expect(storedFiles()).toEqual(before);
    expect(await t.db('correction_photos').where({ request_id: requestId }).count()).toEqual([{ count: '0' }]);
  });

  it('responds 400 for readings out of bounds and a correction without its work', async () => {
    const bad = gfciRecord({ readings: { groundPath: { impedanceOhms: 1e6, conductorSize: '12', runLengthFt: 50 } } });
    const res = await recordCorrection(requestId, gfci, bad);
    expect(res.status).toBe(400);
    expect(res.body.details[0].path).toBe('readings.groundPath.impedanceOhms');
    const noWork = await recordCorrection(requestId, gfci, gfciRecord({ workPerformed: '' }));
    expect(noWork.body.details).toEqual([{ path: 'workPerformed', message: 'Describe the work performed' }]);
    await recordCorrection(requestId, gfci, { outcome: 'corrected' }).field('extra', 'x').expect(400);
  });

  it('refuses "corrected" on a GFCI item without its GFCI test, on the readings field, and records nothing', async () => {
    // A GFCI is tested once installed, as its listing's instructions say (UL 943 devices; NFPA 70 (NEC) 2023, 110.3(B)).
    const res = await recordCorrection(requestId, gfci, gfciRecord({ readings: { receptacle: { polarityCorrect: true, groundPresent: true } } }));
    expect(res.status).toBe(400);
    expect(res.body.details).toEqual([{ path: 'readings', message: 'Take the “GFCI test” reading: a corrected item of this kind is proven by its test' }]);
    expect(await t.db('item_corrections').where({ line_item_id: gfci }).count()).toEqual([{ count: '0' }]);
    expect((await work(requestId)).items.find((i) => i.id === gfci)?.status).toBe('approved');
  });

  it('responds 403 to the parties and 404 to another contractor', async () => {
    await recordCorrection(requestId, gfci, gfciRecord(), [], cast.s.listingAgent).expect(403);
    await recordCorrection(requestId, gfci, gfciRecord(), [], cast.s.otherContractor).expect(404);
  });

  it('records the correction with photos cleaned of their metadata, and judges the readings', async () => {
    const photo = await phonePhoto();
    expect((await sharp(photo).metadata()).exif).toBeDefined();
    const res = await recordCorrection(requestId, gfci, gfciRecord(), [
      { kind: 'before', data: await phonePhoto('#7f8c8d') },
      { kind: 'after', data: photo, name: 'IMG_2041.JPG' },
    ]);
    expect(res.status).toBe(201);
    const correction: Correction = res.body;
    expect(correction).toMatchObject({ outcome: 'corrected', deviceModel: 'GF20-TR', deviceLot: '2026-41', siteVisitNumber: 1 });
    // UL 943: at 7.4 mA a Class A GFCI trips within (20/7.4)^1.43 ≈ 4.14 s; 27 ms is well within.
    expect(correction.evaluations.find((e) => e.key === 'gfci.tripTimeMs')).toMatchObject({ status: 'within', expected: 'At most 4144 ms' });
    // NEC Chapter 9 Table 8: 50 ft of 12 AWG at 20 °C ≈ 0.079 Ω; 0.12 Ω is within with terminations.
    expect(correction.evaluations.find((e) => e.key === 'groundPath.impedanceOhms')).toMatchObject({ status: 'within' });
    expect(correction.photos.map((p) => p.kind)).toEqual(['before', 'after']);

    const stored = await bytesOf(cast.s.inspector.agent.get(correction.photos[1].url)).expect(200);
    const meta = await sharp(stored.body as Buffer).metadata();
    expect(meta.format).toBe('jpeg');
    expect(meta.exif).toBeUndefined();
    expect((stored.body as Buffer).includes(Buffer.from('PhoneMaker'))).toBe(false);
    await cast.s.otherContractor.agent.get(correction.photos[1].url).expect(404);
    expect(storedFiles().some((f) => f.includes('tmp-'))).toBe(false);
  });

  it('refuses a second outcome for the same item with 409', async () => {
    await recordCorrection(requestId, gfci, gfciRecord()).expect(409);
  });

  it('refuses GFCI labels on an item they do not mark (a double tap at the panel), on the labels field', async () => {
    // "No Equipment Ground" / "GFCI Protected" mark receptacles on GFCI protection (NFPA 70 (NEC) 406.4(D)(2)).
    const res = await recordCorrection(requestId, panel, { outcome: 'corrected', workPerformed: 'Moved one conductor to its own breaker', labels: ['GFCI Protected'] });
    expect(res.status).toBe(400);
    expect(res.body.details).toEqual([expect.objectContaining({ path: 'labels' })]);
    expect((await work(requestId)).items.find((i) => i.id === panel)?.status).toBe('approved');
  });

  it('moves the request to corrected when the last approved item has an outcome', async () => {
    const res = await recordCorrection(requestId, panel, { outcome: 'not-corrected', reason: 'Panel is a brand with no listed tandem breaker; a replacement panel needs a permit and the seller’s approval' });
    expect(res.status).toBe(201);
    const overview = await work(requestId);
    expect(overview.status).toBe('corrected');
    expect(overview.items.map((i) => i.status)).toEqual(['done', 'not-done']);
    expect(overview.can.issueLetter).toBe(true);
  });
});

describe('completion letters', () => {
  let requestId: number;
  let gfci: number;
  let openGround: number;
  let letter: CompletionLetter;
  let firstPdf: Buffer;

  const pdfOf = async (revision: number, who: SignedIn) => {
    const res = await bytesOf(who.agent.get(`/api/requests/${requestId}/letters/${revision}.pdf`)).expect(200);
    return res.body as Buffer;
  };

  /** Uploads a PDF to the public check as a visitor who never signed in. */
  async function publicCheck(pdf: Buffer, code?: string) {
    const visitor = request.agent(t.app);
    const token = (await visitor.get('/api/auth/csrf').expect(200)).body.csrfToken;
    const req = visitor.post('/api/verify').set('x-csrf-token', token).attach('file', pdf, { filename: 'letter.pdf', contentType: 'application/pdf' });
    if (code) req.field('code', code);
    return req;
  }

  beforeAll(async () => {
    ({ requestId, itemIds: [gfci, openGround] } = await createPricedRequest(cast, t.db, {
      status: 'approved',
      items: [
        { code: 'gfci-missing', quantity: 2, location: 'kitchen counter right of range', status: 'approved' },
        { code: 'open-ground', quantity: 3, location: 'living room, three-slot receptacles', status: 'approved' },
      ],
    }));
    const visit = await post(cast.s.contractor, `/api/requests/${requestId}/visits`).send(visitBody()).expect(201);
    // The electrician arrives and is still marked on site when the letter is issued.
    await post(cast.s.contractor, `/api/requests/${requestId}/visits/${visit.body.id}/start`).expect(200);
    await recordCorrection(requestId, gfci, gfciRecord(), [{ kind: 'after', data: await phonePhoto() }]).expect(201);
  });

  it('is refused while an approved item has no outcome (409) and to anyone but the contractor (403)', async () => {
    const body = { isPermitNotRequired: true, signatureName: 'Sam Okafor' };
    await post(cast.s.contractor, `/api/requests/${requestId}/letters`).send(body).expect(409);
    await recordCorrection(requestId, openGround, {
      outcome: 'corrected',
      workPerformed: 'GFCI protection added upstream; receptacles labelled per NEC 406.4(D)(2)',
      labels: ['No Equipment Ground', 'GFCI Protected'],
      readings: { gfci: { tripsOnTest: true, resets: true, downstreamProven: 3 }, receptacle: { polarityCorrect: true, groundPresent: false }, voltageDrop: { percent: 2.4, loadAmps: 15 } },
    }).expect(201);
    for (const who of ['buyerAgent', 'listingAgent', 'seller', 'inspector'] as const) await post(cast.s[who], `/api/requests/${requestId}/letters`).send(body).expect(403);
    await post(cast.s.otherContractor, `/api/requests/${requestId}/letters`).send(body).expect(404);
  });

  it('needs a permit number or the statement that none was required', async () => {
    const res = await post(cast.s.contractor, `/api/requests/${requestId}/letters`).send({ signatureName: 'Sam Okafor' });
    expect(res.status).toBe(400);
    expect(res.body.details).toEqual([{ path: 'permitNumber', message: 'Enter the permit number, or confirm that none was required' }]);
  });

  it('issues revision 1 whose PDF text holds every item, reading and evaluation, and whose hash is its bytes’', async () => {
    // The visit started in beforeAll was never finished: the letter ends it (review 7, P3-2).
    expect((await work(requestId)).visits.map((v) => v.status)).toEqual(['started']);
    const res = await post(cast.s.contractor, `/api/requests/${requestId}/letters`).send({ isPermitNotRequired: true, signatureName: 'Sam Okafor' });
    expect(res.status).toBe(201);
    expect((await work(requestId)).visits.map((v) => v.status)).toEqual(['finished']);
    letter = res.body;
    expect(letter).toMatchObject({ revision: 1, itemCount: 2, isCurrent: true });
    expect(letter.verificationUrl).toBe(`http://portal.test/verify/${letter.verificationCode}`);
    expect((await work(requestId)).status).toBe('letter-issued');

    firstPdf = await pdfOf(1, cast.s.inspector);
    expect(await pdfOf(1, cast.s.buyerAgent)).toEqual(firstPdf);
    expect(await pdfOf(1, cast.s.listingAgent)).toEqual(firstPdf);
    await cast.s.outsiderAgent.agent.get(`/api/requests/${requestId}/letters/1.pdf`).expect(404);
    const { createHash } = await import('node:crypto');
    expect(createHash('sha256').update(firstPdf).digest('hex')).toBe(letter.sha256);

    const text = (await extractPdfPages(firstPdf)).pages.join('\n').replace(/\s+/g, ' ');
    for (const phrase of [
      letter.number,
      'revision 1',
      'Assigned Electric',
      findingCodeInfo('gfci-missing').label,
      'Kitchen counter right of range',
      findingCodeInfo('open-ground').label,
      'living room, three-slot receptacles',
      'Replaced the worn GFCI receptacle',
      'Acme Devices GF20-TR lot/date code 2026-41',
      'Labels applied: "No Equipment Ground", "GFCI Protected"',
      'Trips on its TEST button: Yes',
      'Downstream receptacles proven: 2',
      'Downstream receptacles proven: 3',
      'Trip time at 7.4 mA: 27 ms — within the expected range',
      'Source: UL 943',
      'Ground-path impedance (50 ft of 12 AWG at 20 °C): 0.12 Ω',
      'NEC) Chapter 9 Table 8',
      'Voltage drop under load (15 A): 2.4 %',
      '210.19(A)',
      'Polarity correct: Yes',
      'No permit was required',
      'Only the items listed in this letter were addressed',
      'Workmanship is warranted',
      '/s/ Sam Okafor',
      'de-energise the circuit',
      letter.verificationCode,
    ]) {
      expect(text).toContain(phrase);
    }
  });

  it('shows the public verification without a sign-in and without personal data', async () => {
    const res = await request(t.app).get(`/api/verify/${letter.verificationCode}`).expect(200);
    expect(res.body).toEqual({ number: letter.number, revision: 1, issuedOn: letter.issuedAt.slice(0, 10), itemCount: 2, sha256: letter.sha256, isCurrent: true, supersededBy: null, isAccepted: false });
    const body = JSON.stringify(res.body);
    for (const personal of [cast.users.seller.email, cast.users.seller.name, cast.users.inspector.name, '14 Test Hollow Road', 'Marlow Springs']) expect(body).not.toContain(personal);
    await request(t.app).get('/api/verify/NOSUCHCODE').expect(404);
    await request(t.app).get('/api/verify/x').expect(404);
  });

  it('tells the genuine current PDF from a modified one', async () => {
    const genuine = await publicCheck(firstPdf, letter.verificationCode);
    expect(genuine.status).toBe(200);
    expect(genuine.body).toMatchObject({ isGenuine: true, isCurrent: true, matchesCode: true });

    const modified = Buffer.from(firstPdf);
    const at = modified.indexOf(Buffer.from('/Title'));
    modified[at + 10] = modified[at + 10] === 0x41 ? 0x42 : 0x41;
    const forged = await publicCheck(modified, letter.verificationCode);
    expect(forged.status).toBe(200);
    expect(forged.body).toMatchObject({ isGenuine: false, isCurrent: false, matchesCode: false });
    expect(forged.body.message).toBe('This PDF is not a completion letter issued through Closing Circuit (or it was changed after issue).');

    const appended = await publicCheck(Buffer.concat([firstPdf, Buffer.from('\n% edited\n')]));
    expect(appended.body).toMatchObject({ isGenuine: false, matchesCode: null, letter: null });
  });

  it('answers 200 with isGenuine false for an unknown PDF (even beside a code that names no letter), and 400 on the file field for a non-PDF', async () => {
    const unknown = await publicCheck(Buffer.concat([firstPdf, Buffer.from('\n% edited\n')]), 'NOSUCHCODE');
    expect(unknown.status).toBe(200);
    expect(unknown.body).toMatchObject({ isGenuine: false, matchesCode: false, letter: null, message: expect.stringContaining('is not a completion letter issued through Closing Circuit') });

    const genuineWrongCode = await publicCheck(firstPdf, 'NOSUCHCODE');
    expect(genuineWrongCode.status).toBe(200);
    expect(genuineWrongCode.body).toMatchObject({ isGenuine: true, matchesCode: false });

    const visitor = request.agent(t.app);
    const token = (await visitor.get('/api/auth/csrf').expect(200)).body.csrfToken;
    const text = await visitor.post('/api/verify').set('x-csrf-token', token).attach('file', Buffer.from('Letter number CL-1, revision 1\n'), { filename: 'letter.txt', contentType: 'text/plain' });
    expect(text.status).toBe(400);
    expect(text.body.details).toEqual([{ path: 'file', message: NOT_A_PDF_MESSAGE }]);
  });

  it('lets the inspector list an item not accepted, which reopens it; the next revision supersedes the first', async () => {
    await post(cast.s.seller, `/api/requests/${requestId}/proof-review`).send({ decision: 'accept' }).expect(403);
    const bad = await post(cast.s.inspector, `/api/requests/${requestId}/proof-review`).send({ decision: 'not-accept', items: [] });
    expect(bad.status).toBe(400);
    await post(cast.s.inspector, `/api/requests/${requestId}/proof-review`)
      .send({ decision: 'not-accept', items: [{ itemId: openGround, reason: 'Labels missing on two of the three receptacles' }] })
      .expect(204);
    let overview = await work(requestId);
    expect(overview.status).toBe('reopened');
    expect(overview.items.find((i) => i.id === openGround)).toMatchObject({ status: 'not-accepted', notAcceptedReason: 'Labels missing on two of the three receptacles' });

    await post(cast.s.inspector, `/api/requests/${requestId}/work/resume`).expect(403);
    overview = (await post(cast.s.contractor, `/api/requests/${requestId}/work/resume`).expect(200)).body;
    expect(overview.status).toBe('in-progress');
    expect(overview.items.find((i) => i.id === openGround)?.status).toBe('approved');
    await recordCorrection(requestId, openGround, {
      outcome: 'corrected',
      workPerformed: 'Applied the missing "No Equipment Ground" labels',
      labels: ['No Equipment Ground', 'GFCI Protected'],
      readings: { receptacle: { polarityCorrect: true, groundPresent: false } },
    }).expect(201);
    const second: CompletionLetter = (await post(cast.s.contractor, `/api/requests/${requestId}/letters`).send({ permitNumber: 'MS-2026-0412', signatureName: 'Sam Okafor' }).expect(201)).body;
    expect(second).toMatchObject({ number: letter.number, revision: 2, isCurrent: true });

    const old = await publicCheck(firstPdf, letter.verificationCode);
    expect(old.body).toMatchObject({ isGenuine: true, isCurrent: false, matchesCode: true, letter: { revision: 1, supersededBy: { revision: 2 } } });
    expect(old.body.message).toContain('Genuine but superseded');
    const secondPdf = await pdfOf(2, cast.s.buyerAgent);
    expect((await publicCheck(secondPdf, letter.verificationCode)).body).toMatchObject({ isGenuine: true, isCurrent: true, matchesCode: false });
    expect((await extractPdfPages(secondPdf)).pages.join(' ')).toContain('MS-2026-0412');
  });

  it('records "re-inspection accepted": every corrected item is accepted and so is the request', async () => {
    await post(cast.s.inspector, `/api/requests/${requestId}/proof-review`).send({ decision: 'accept', note: 'Re-inspected on site' }).expect(204);
    const overview = await work(requestId, cast.s.buyerAgent);
    expect(overview.status).toBe('accepted');
    expect(overview.items.map((i) => i.status)).toEqual(['accepted', 'accepted']);
    const current = overview.letters.at(-1)!;
    expect((await request(t.app).get(`/api/verify/${current.verificationCode}`).expect(200)).body.isAccepted).toBe(true);
    await post(cast.s.inspector, `/api/requests/${requestId}/proof-review`).send({ decision: 'accept' }).expect(409);
  });
});

describe('GET /api/requests/:id/work closing progress', () => {
  it('flags approved work still open within the set business days of closing', async () => {
    const { requestId } = await createPricedRequest(cast, t.db, { status: 'approved', items: [{ code: 'gfci-missing', quantity: 1, status: 'approved' }] });
    await t.db('repair_requests').where({ id: requestId }).update({ closing_date: inDays(1) });
    const soon = await work(requestId, cast.s.buyerAgent);
    expect(soon.closing).toMatchObject({ approvedCount: 1, resolvedCount: 0, isAtRisk: true, atRiskBusinessDays: 3 });
    await t.db('repair_requests').where({ id: requestId }).update({ closing_date: inDays(40) });
    expect((await work(requestId, cast.s.buyerAgent)).closing.isAtRisk).toBe(false);
  });
});

describe('a reading outside its range, a declined item, the payments and the visit after the last outcome', () => {
  let requestId: number;
  let gfci: number;
  // UL 943: at 100 mA a Class A GFCI trips within (20/100)^1.43 s ≈ 100 ms; 300 ms is outside.
  const slowTrip = gfciRecord({ readings: { gfci: { tripsOnTest: true, resets: true, downstreamProven: 2, tripTimeMs: 300, testCurrentMa: 100 } } });
  const note = 'Re-tested after tightening the line terminals: 22 ms at 100 mA';

  beforeAll(async () => {
    ({ requestId, itemIds: [gfci] } = await createPricedRequest(cast, t.db, {
      status: 'approved',
      items: [
        { code: 'gfci-inoperative', quantity: 1, location: 'hall bath vanity', status: 'approved' },
        { code: 'weather-cover-missing', quantity: 1, location: 'back patio receptacle', status: 'declined' },
      ],
    }));
    await post(cast.s.contractor, `/api/requests/${requestId}/visits`).send(visitBody()).expect(201);
    await post(cast.s.contractor, `/api/requests/${requestId}/visits`).send(visitBody({ date: inDays(3) })).expect(201);
  });

  it('refuses "corrected" with a failing check unless a note says why', async () => {
    const res = await recordCorrection(requestId, gfci, slowTrip);
    expect(res.status).toBe(400);
    expect(res.body.details).toEqual([{ path: 'reason', message: expect.stringContaining('A reading is outside its expected range') }]);
    const visits = (await work(requestId)).visits;
    await post(cast.s.contractor, `/api/requests/${requestId}/visits/${visits[0].id}/start`).expect(200);
    const saved = await recordCorrection(requestId, gfci, { ...slowTrip, reason: note });
    expect(saved.status).toBe(201);
    expect(saved.body.reason).toBe(note);
  });

  it('lets both visits be finished once the request moved to corrected (started or never started)', async () => {
    const overview = await work(requestId);
    expect(overview.status).toBe('corrected');
    expect(overview.can.finishVisit).toBe(true);
    expect(overview.visits.map((v) => v.status)).toEqual(['started', 'booked']);
    for (const visit of overview.visits) {
      expect((await post(cast.s.contractor, `/api/requests/${requestId}/visits/${visit.id}/finish`).expect(200)).body.status).toBe('finished');
    }
  });

  it('prints the failing reading with the note, the declined item under "not done", no payment amounts and the report', async () => {
    const [payment] = await t
      .db('payments')
      .insert({ request_id: requestId, organisation_id: cast.contractorOrg, method: 'card', purpose: 'full', amount_cents: 31_434, status: 'succeeded', idempotency_key: `letter-${requestId}`, created_by: cast.users.seller.id, paid_at: new Date('2026-11-28T15:00:00Z') })
      .returning('id');
    await t.db('invoices').insert({ organisation_id: cast.contractorOrg, series: 'receipt', number: 7341, request_id: requestId, kind: 'receipt', payment_id: payment.id, addressed_to: '{}', content: '{}', total_cents: 31_434, balance_cents: 0 });
    await post(cast.s.contractor, `/api/requests/${requestId}/letters`).send({ isPermitNotRequired: true, signatureName: 'Sam Okafor' }).expect(201);
    const pdf = (await bytesOf(cast.s.contractor.agent.get(`/api/requests/${requestId}/letters/1.pdf`)).expect(200)).body as Buffer;
    const text = (await extractPdfPages(pdf)).pages.join('\n').replace(/\s+/g, ' ');
    expect(text).toContain('Recorded as corrected with a reading OUTSIDE the expected range (Trip time at 100 mA).');
    expect(text).toContain(`Contractor's note: ${note}`);
    const notDone = text.slice(text.indexOf('Items not done'), text.indexOf('Permit'));
    expect(notDone).toContain('back patio receptacle');
    expect(notDone).toContain('declined by the seller');
    // The letter goes to the inspector and the buyer's side: a payment short of the total is left out,
    // with its amount and receipt (P3-5; paid in full or at closing is said: test/unit letter-pdf, payment-status).
    expect(text).not.toMatch(/\bPayment\b/);
    expect(text).not.toContain('$314.34');
    expect(text).not.toContain('RCT-007341');
    expect(text).not.toContain('not recorded in Closing Circuit');
    expect(text).toContain('Inspection report: No report file was uploaded to Closing Circuit');
  });
});
