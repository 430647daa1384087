import { evaluateReadings, findingCodeInfo, ReadingsSchema, type Correction } from '@cc/shared';
import sharp from 'sharp';
import { extractPdfPages } from '../integrations/pdf-text';
import { DECLINED_BY_SELLER, renderLetterPdf, type LetterContent } from './letter-pdf';
import { reportReferenceOf } from './letters.service';

function correction(overrides: Partial<Correction>): Correction {
  const readings = ReadingsSchema.parse({ gfci: { tripsOnTest: true, resets: true, downstreamProven: 1, tripTimeMs: 27, testCurrentMa: 7.4 } });
  return {
    itemId: 1,
    outcome: 'corrected',
    reason: '',
    workPerformed: 'Replaced the GFCI receptacle',
    materials: '',
    deviceMake: '',
    deviceModel: '',
    deviceLot: '',
    labels: [],
    readings,
    evaluations: evaluateReadings(readings),
    siteVisitId: null,
    siteVisitNumber: null,
    isFirstVisit: true,
    returnCause: null,
    recordedByName: 'Sam Okafor',
    recordedAt: '2026-12-01T10:00:00.000Z',
    photos: [],
    ...overrides,
  };
}

function content(overrides: Partial<LetterContent>): LetterContent {
  return {
    number: 'CL-00005',
    revision: 1,
    issuedOn: '2026-12-02',
    requestReference: 'CC-00005',
    contractor: { name: 'Brightline Electric', licence: 'Licence EC-1', contact: '' },
    property: '87 Tinsmith Way, Marlow Springs, CO 81290',
    parties: [],
    reportReference: 'report.pdf (added 2026-11-20)',
    items: [],
    declinedItems: [],
    permit: 'No permit was required.',
    warranty: 'One year.',
    paymentStatus: 'The work in this letter is paid in full.',
    signatureName: 'Sam Okafor',
    verificationUrl: 'http://portal.test/verify/ABCDEFGHJK',
    verificationCode: 'ABCDEFGHJK',
    photos: new Map(),
    ...overrides,
  };
}

const textOf = async (letter: LetterContent) => (await extractPdfPages(await renderLetterPdf(letter))).pages.join('\n').replace(/\s+/g, ' ');

describe('renderLetterPdf', () => {
  it('says so when an item listed as corrected has a reading outside its range (UL 943: at most 100 ms at 100 mA)', async () => {
    const readings = ReadingsSchema.parse({ gfci: { tripsOnTest: true, resets: true, downstreamProven: 1, tripTimeMs: 300, testCurrentMa: 100 } });
    const slow = correction({ readings, evaluations: evaluateReadings(readings), reason: 'Re-tested after tightening the line terminals: 22 ms' });
    const text = await textOf(content({ items: [{ code: 'gfci-inoperative', room: 'kitchen', location: 'kitchen counter', quantity: 1, necRefs: [], correction: slow }] }));
    expect(text).toContain('Recorded as corrected with a reading OUTSIDE the expected range (Trip time at 100 mA).');
    expect(text).toContain("Contractor's note: Re-tested after tightening the line terminals: 22 ms");
    expect(text).toContain('Trip time at 100 mA: 300 ms — OUTSIDE the expected range');
  });

  it('says that no note was given for an older record without one', async () => {
    const readings = ReadingsSchema.parse({ receptacle: { polarityCorrect: false, groundPresent: true } });
    const text = await textOf(content({ items: [{ code: 'reversed-polarity', room: 'kitchen', location: 'hall', quantity: null, necRefs: [], correction: correction({ readings, evaluations: evaluateReadings(readings) }) }] }));
    expect(text).toContain('OUTSIDE the expected range (Polarity correct). No note was given.');
  });

  it('lists an item the seller declined under "Items not done", with the reason', async () => {
    const text = await textOf(
      content({
        items: [{ code: 'gfci-inoperative', room: 'kitchen', location: 'kitchen counter', quantity: 1, necRefs: [], correction: correction({}) }],
        declinedItems: [{ code: 'weather-cover-missing', room: 'exterior', location: 'back patio receptacle', quantity: null }],
      }),
    );
    const notDone = text.slice(text.indexOf('Items not done'));
    expect(notDone).toContain('back patio receptacle');
    expect(notDone).toContain(DECLINED_BY_SELLER);
    expect(notDone).not.toContain('None: every listed item was corrected');
  });

  it('names each place in words once: the room as a reader says it, never its key', async () => {
    const text = await textOf(
      content({
        items: [
          { code: 'gfci-inoperative', room: 'kitchen', location: 'kitchen counter', quantity: 1, necRefs: [], correction: correction({}) },
          { code: 'afci-missing', room: 'living-area', location: 'FAMILY ROOM', quantity: null, necRefs: [], correction: correction({}) },
        ],
      }),
    );
    expect(text).toContain('Kitchen counter, quantity 1');
    expect(text).toContain('Living area, Family room');
    expect(text).not.toMatch(/FAMILY ROOM|room, living-area/);
    expect(text).not.toMatch(/kitchen counter, kitchen/i);
  });
});

describe('the letter’s code references and payment (review 7, P3-5)', () => {
  it('writes the smoke-alarm item’s reference cleanly, as the finding-code table keeps it and as older items kept it', async () => {
    for (const necRefs of [findingCodeInfo('smoke-co-alarm').necRefs, ['local code', 'NFPA 72']]) {
      const text = await textOf(content({ items: [{ code: 'smoke-co-alarm', room: 'hallway', location: 'upstairs hallway', quantity: 1, necRefs, correction: correction({}) }] }));
      expect(text).toContain('Code reference: NFPA 72 and local code');
      expect(text).not.toContain('NEC local code');
    }
    const gfci = await textOf(content({ items: [{ code: 'gfci-inoperative', room: 'kitchen', location: 'kitchen counter', quantity: 1, necRefs: ['406.4(D)(3)', '110.3(B)'], correction: correction({}) }] }));
    expect(gfci).toContain('Code reference: NEC 406.4(D)(3), 110.3(B)');
  });

  it('says only that the work is paid in full or paid at closing, and leaves the section out otherwise; never an amount', async () => {
    const paid = await textOf(content({ paymentStatus: 'The work in this letter is paid in full.' }));
    expect(paid).toContain('Payment The work in this letter is paid in full.');
    const none = await textOf(content({ paymentStatus: null }));
    expect(none).not.toContain('Payment');
    expect(none).not.toMatch(/\$\d/);
  });
});

describe('reportReferenceOf', () => {
  it('names the report files and the inspector, never the request reference', () => {
    expect(reportReferenceOf([{ name: 'Wren-Hollow-inspection.pdf', kind: 'pdf', uploadedOn: '2026-11-20' }], 'Nora Lindqvist')).toBe(
      'Wren-Hollow-inspection.pdf (added 2026-11-20); inspection by Nora Lindqvist',
    );
    expect(reportReferenceOf([], null)).toBe('No report file was uploaded to Closing Circuit; the items are those listed below.');
  });

  it('puts the letter number, the page and the verification code at the foot of every page, and never leaves the signature alone', async () => {
    const photo = await sharp({ create: { width: 800, height: 450, channels: 3, background: '#2e6b3f' } }).jpeg().toBuffer();
    const photos = new Map<number, Buffer>();
    const items = Array.from({ length: 9 }, (_, i) => {
      photos.set(i + 1, photo);
      photos.set(i + 101, photo);
      return {
        code: 'gfci-inoperative' as const,
        room: 'kitchen',
        location: `counter receptacle ${i + 1}`,
        quantity: 1,
        necRefs: ['406.4(D)(3)', '110.3(B)'],
        correction: correction({
          itemId: i + 1,
          materials: 'GFCI receptacle, 20 A, tamper-resistant, weather-resistant where outdoors',
          photos: [
            { id: i + 1, kind: 'before', width: 800, height: 450, url: `/api/photos/${i + 1}` },
            { id: i + 101, kind: 'after', width: 800, height: 450, url: `/api/photos/${i + 101}` },
          ],
        }),
      };
    });
    const pages = (await extractPdfPages(await renderLetterPdf(content({ items, photos })))).pages.map((p) => p.replace(/\s+/g, ' '));
    expect(pages.length).toBeGreaterThan(1);
    pages.forEach((page, i) => expect(page).toContain(`CL-00005, revision 1 · page ${i + 1} of ${pages.length} · verify with code ABCDEFGHJK at http://portal.test/verify`));
    // The signature shares its page with the safety notice before it.
    const last = pages[pages.length - 1];
    expect(last).toContain('/s/ Sam Okafor');
    expect(last).toContain('Safety and code notice');
    // Each item starts and ends on one page: its title, its test results and its photos' captions together.
    for (const page of pages) {
      const titles = (page.match(/\d\. GFCI/g) ?? []).length;
      const captions = (page.match(/Before After/g) ?? []).length;
      expect(captions).toBe(titles);
    }
  });
});

