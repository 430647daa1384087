import request from 'supertest';
import { DEMO_RATE_BOOK, QUOTE_NOTE_MAX, type QuoteVersion, type RequestPricing } from '@cc/shared';
import { extractPdfPages } from '../../server/src/integrations/pdf-text';
import { createTestApp, type TestApp } from '../helpers/test-app';
import { resetDatabase, type SignedIn } from '../helpers/fixtures';
import { addItems, createPricedRequest, createPricingCast, storeRateBook, type PricingCast, type StoredBook } from '../helpers/pricing-fixtures';

let t: TestApp;
let cast: PricingCast;
let book: StoredBook;
let licenceNumber: string;

const write = (who: SignedIn, method: 'post' | 'put' | 'patch', path: string) => who.agent[method](path).set('x-csrf-token', who.csrfToken);
const pricingOf = async (id: number): Promise<RequestPricing> => (await cast.s.contractor.agent.get(`/api/requests/${id}/pricing`).expect(200)).body;

/** Sets fields of items through the bulk-pricing route, one change per call. */
async function price(id: number, itemIds: number[], set: Record<string, unknown>): Promise<RequestPricing> {
  const pricing = await pricingOf(id);
  const res = await write(cast.s.contractor, 'patch', `/api/requests/${id}/pricing`).send({
    items: itemIds.map((i) => ({ id: i, version: pricing.items.find((p) => p.id === i)!.version })),
    set,
  });
  if (res.status !== 200) throw new Error(`pricing failed: ${res.status} ${JSON.stringify(res.body)}`);
  return res.body;
}

const send = (id: number, body: object = {}, who: SignedIn = cast.s.contractor) => write(who, 'post', `/api/requests/${id}/quotes`).send(body);

beforeAll(async () => {
  t = createTestApp();
  await resetDatabase(t.db);
  cast = await createPricingCast(t.app, t.db);
  book = await storeRateBook(t.db, cast.contractorOrg, DEMO_RATE_BOOK);
  licenceNumber = (await t.db('organisations').where({ id: cast.contractorOrg }).first('licence_number')).licence_number;
});
afterAll(() => t.close());

describe('POST /api/requests/:id/quotes', () => {
  let requestId: number;
  let gfci: number;
  let quote: QuoteVersion;

  beforeAll(async () => {
    ({ requestId, itemIds: [gfci] } = await createPricedRequest(cast, t.db, { items: [{ code: 'gfci-inoperative', quantity: 1, location: 'hall bath vanity' }] }));
  });

  it('responds 409 naming the items that have no price yet', async () => {
    const res = await send(requestId);
    expect(res.status).toBe(409);
    expect(res.body.error).toContain(`#${gfci} (gfci-inoperative, hall bath vanity)`);
    expect(res.body.details).toEqual([{ path: `items.${gfci}`, message: expect.stringContaining('has no entry') }]);
  });

  it('responds 403 to the agents and the seller, 404 to another contractor', async () => {
    await price(requestId, [gfci], { entryId: book.entry['gfci-replace'] });
    for (const who of ['buyerAgent', 'listingAgent', 'seller', 'inspector'] as const) await send(requestId, {}, cast.s[who]).expect(403);
    await send(requestId, {}, cast.s.otherContractor).expect(404);
    await send(requestId, {}, cast.s.outsiderAgent).expect(404);
  });

  it('responds 409 when the claimed total is not the server’s, and sends nothing', async () => {
    const res = await send(requestId, { claimedTotals: { totalCents: 30_000 } });
    expect(res.status).toBe(409);
    expect(res.body.details).toEqual([{ path: 'claimedTotals.totalCents', message: 'You see 30000 cents; the price is 31434' }]);
    await cast.s.seller.agent.get(`/api/requests/${requestId}/quotes`).expect(200).expect([]);
  });

  it('responds 400 for a note that is too long, saying the limit the form counts towards', async () => {
    const res = await send(requestId, { note: 'x'.repeat(QUOTE_NOTE_MAX + 1) });
    expect(res.status).toBe(400);
    expect(res.body.details).toEqual([{ path: 'note', message: `Use at most ${QUOTE_NOTE_MAX} characters` }]);
  });

  it('sends version 1 priced as docs/pricing.md Example 1: one GFCI on its own visit, $314.34', async () => {
    const res = await send(requestId, { claimedTotals: { totalCents: 31_434 }, note: 'We can start the week of the 12th.' });
    expect(res.status).toBe(201);
    quote = res.body;
    // docs/pricing.md, Example 1 (computed by hand): service call 9,500 + first-hour minimum 18,500 +
    // materials 2,400 + markup 840 = 31,240; tax 194; total 31,434; deposit 15,717.
    expect(quote.breakdown).toMatchObject({ serviceCallCents: 9_500, firstHourMinimumCents: 18_500, extraLabourCents: 0, subtotalCents: 31_240, materialsTaxCents: 194, totalCents: 31_434, depositCents: 15_717 });
    expect(quote).toMatchObject({
      version: 1,
      isCurrent: true,
      changes: null,
      note: 'We can start the week of the 12th.',
      sentByName: cast.users.contractor.name,
      requestReference: expect.stringMatching(/^CC-\d{5}$/),
      contractor: { organisationId: cast.contractorOrg, name: 'Assigned Electric', licenceNumber, licenceState: 'CO' },
      warrantyText: DEMO_RATE_BOOK.terms.warrantyText,
      cardDepositBp: 5_000,
      pdfPath: `/api/requests/${requestId}/quotes/1.pdf`,
    });
    expect(quote.safetyNotice).toMatch(/licensed/);
    expect(quote.safetyNotice).toMatch(/permit/);
    // The prices hold for the rate book's days after the day the quote was sent in the contractor's
    // time zone: a Colorado shop with no zone chosen keeps Denver's days (IANA tz database zone.tab),
    // read here through the runtime's own time-zone data (ECMA-402 Intl.DateTimeFormat).
    const sentDay = new Intl.DateTimeFormat('en-CA', { timeZone: 'America/Denver', year: 'numeric', month: '2-digit', day: '2-digit' }).format(new Date(quote.sentAt));
    const [y, m, d] = sentDay.split('-').map(Number);
    const valid = new Date(Date.UTC(y, m - 1, d + DEMO_RATE_BOOK.terms.quoteValidityDays));
    expect(quote.validUntil).toBe(valid.toISOString().slice(0, 10));
    expect(quote.lines).toEqual([
      expect.objectContaining({
        lineItemId: gfci,
        kind: 'priced',
        quantity: 1,
        entry: { id: book.entry['gfci-replace'], key: 'gfci-replace', version: 1, name: 'Replace inoperative GFCI receptacle', unit: 'device', mode: 'time-and-materials' },
        labourCents: 18_500,
        lineCents: 18_500 + 2_400 + 840,
      }),
    ]);
  });

  it('moves the request from pricing to quoted, recorded in its history, and the item to priced', async () => {
    const detail = (await cast.s.seller.agent.get(`/api/requests/${requestId}`).expect(200)).body;
    expect(detail.status).toBe('quoted');
    expect(detail.history.at(-1)).toMatchObject({ from: 'pricing', to: 'quoted', byName: cast.users.contractor.name, note: 'Quote version 1 sent' });
    expect((await pricingOf(requestId)).items[0]).toMatchObject({ status: 'priced' });
  });

  it('keeps the sent version as it was when the rate book entry changes, which makes a new entry version', async () => {
    const entry = (await cast.s.contractor.agent.get(`/api/rate-book/entries/${book.entry['gfci-replace']}`)).body;
    expect(entry.isOnSentQuote).toBe(true);
    const materials = [{ name: 'GFCI receptacle 20 A, TR/WR', quantityPerUnit: 1, unitCostCents: 2_800 }];
    await write(cast.s.contractor, 'patch', `/api/rate-book/entries/${entry.id}`).send({ version: 1, pricing: { ...entry.pricing, materials, materialsCentsPerUnit: 2_800 } }).expect(200);
    const again = (await cast.s.seller.agent.get(`/api/requests/${requestId}/quotes/1`).expect(200)).body;
    expect(again.breakdown.totalCents).toBe(31_434);
    expect(again.lines[0].entry.version).toBe(1);
  });

  describe('re-pricing after sending', () => {
    let second: QuoteVersion;

    it('sends version 2 with what changed against version 1', async () => {
      const [doubleTap] = await addItems(t.db, requestId, [{ code: 'double-tap', quantity: 1, location: 'main panel' }]);
      await price(requestId, [doubleTap], { entryId: book.entry['double-tap-pigtail'] });
      const res = await send(requestId);
      expect(res.status).toBe(201);
      second = res.body;
      expect(second.version).toBe(2);
      // The GFCI line now uses version 2 of its entry ($28.00 device): materials 2,800 + 35 % = 3,780.
      expect(second.lines.find((l) => l.lineItemId === gfci)?.entry?.version).toBe(2);
      expect(second.changes).toMatchObject({
        previousVersion: 1,
        previousTotalCents: 31_434,
        totalDeltaCents: second.breakdown.totalCents - 31_434,
        added: [{ lineItemId: doubleTap, code: 'double-tap', lineCents: second.lines.find((l) => l.lineItemId === doubleTap)!.lineCents }],
        removed: [],
        changed: [expect.objectContaining({ lineItemId: gfci, previousLineCents: 21_740, entryName: 'Replace inoperative GFCI receptacle' })],
      });
      expect((await cast.s.seller.agent.get(`/api/requests/${requestId}`)).body.status).toBe('quoted');
    });

    it('lists every version for the parties, the latest current, with the change of the total', async () => {
      for (const who of ['buyerAgent', 'listingAgent', 'seller', 'inspector', 'contractor', 'colleague', 'admin'] as const) {
        const res = await cast.s[who].agent.get(`/api/requests/${requestId}/quotes`);
        expect(res.status).toBe(200);
        expect(res.body.map((q: { version: number; isCurrent: boolean; totalDeltaCents: number | null }) => [q.version, q.isCurrent, q.totalDeltaCents])).toEqual([
          [1, false, null],
          [2, true, second.breakdown.totalCents - 31_434],
        ]);
      }
    });

    it('answers the current version and each version by number', async () => {
      expect((await cast.s.seller.agent.get(`/api/requests/${requestId}/quotes/current`).expect(200)).body.version).toBe(2);
      expect((await cast.s.seller.agent.get(`/api/requests/${requestId}/quotes/1`).expect(200)).body).toMatchObject({ version: 1, isCurrent: false });
      await cast.s.seller.agent.get(`/api/requests/${requestId}/quotes/3`).expect(404);
      await cast.s.seller.agent.get(`/api/requests/${requestId}/quotes/first`).expect(404);
    });

    it('lists an item declined as not in scope with its reason, and counts it as removed', async () => {
      const pricing = await pricingOf(requestId);
      const doubleTap = pricing.items.find((i) => i.code === 'double-tap')!;
      await write(cast.s.contractor, 'post', `/api/requests/${requestId}/pricing/out-of-scope`).send({ items: [{ id: doubleTap.id, version: doubleTap.version }], reason: 'Panel is a recalled model; replacement quoted separately' }).expect(200);
      const third: QuoteVersion = (await send(requestId).expect(201)).body;
      expect(third.lines.find((l) => l.lineItemId === doubleTap.id)).toMatchObject({ kind: 'out-of-scope', outOfScopeReason: 'Panel is a recalled model; replacement quoted separately', lineCents: 0 });
      expect(third.changes?.removed.map((l) => l.lineItemId)).toEqual([doubleTap.id]);
      // The GFCI alone again, at version 2 of its entry: 9,500 + 18,500 + 2,800 + 35 % markup 980
      // + tax 6 % of 3,780 = 226.8 → 227 (docs/pricing.md rules 1.3 and R1).
      expect(third.breakdown.totalCents).toBe(9_500 + 18_500 + 2_800 + 980 + 227);
    });
  });

  it('responds 404 to outsiders for the list, a version and its PDF', async () => {
    for (const who of ['outsiderAgent', 'otherContractor'] as const) {
      await cast.s[who].agent.get(`/api/requests/${requestId}/quotes`).expect(404);
      await cast.s[who].agent.get(`/api/requests/${requestId}/quotes/1`).expect(404);
      await cast.s[who].agent.get(`/api/requests/${requestId}/quotes/1.pdf`).expect(404);
    }
    await request(t.app).get(`/api/requests/${requestId}/quotes/1.pdf`).expect(401);
  });

  describe('GET /api/requests/:id/quotes/:version.pdf', () => {
    it('downloads a real PDF whose text holds the total, the licence number and the safety notice', async () => {
      const res = await cast.s.seller.agent.get(`/api/requests/${requestId}/quotes/1.pdf`).buffer(true).parse((r, done) => {
        const chunks: Buffer[] = [];
        r.on('data', (c: Buffer) => chunks.push(c));
        r.on('end', () => done(null, Buffer.concat(chunks)));
      });
      expect(res.status).toBe(200);
      expect(res.headers['content-type']).toBe('application/pdf');
      expect(res.headers['content-disposition']).toMatch(/^attachment; filename="?CC-\d{5}-quote-v1\.pdf"?$/);
      const pdf = res.body as Buffer;
      expect(pdf.subarray(0, 5).toString('latin1')).toBe('%PDF-');
      expect(pdf.toString('latin1')).toMatch(/\/FontName \/[A-Z]{6}\+SourceSans3-Regular/);
      const text = (await extractPdfPages(pdf)).pages.join('\n').replace(/\s+/g, ' ');
      expect(text).toContain('$314.34');
      expect(text).toContain(licenceNumber);
      expect(text).toContain('Replace inoperative GFCI receptacle');
      expect(text).toContain('licensed');
      expect(text).toContain('superseded');
    });
  });
});

describe('a quote priced as docs/pricing.md Example 3', () => {
  it('totals $878.43 with a $439.22 deposit for the mixed visit with multipliers, shutoff, flat lines and a permit', async () => {
    const { requestId, itemIds } = await createPricedRequest(cast, t.db, {
      items: [
        { code: 'receptacle-damaged', quantity: 3 },
        { code: 'double-tap', quantity: 1 },
        { code: 'gfci-inoperative', quantity: 2 },
      ],
    });
    const [l1, l2, l3] = itemIds;
    await price(requestId, [l1], { entryId: book.entry['receptacle-replace'], adderIds: [book.adder['plaster-walls'], book.adder['built-before-1960']] });
    await price(requestId, [l2], { entryId: book.entry['double-tap-pigtail'], adderIds: [book.adder['panel-shutoff']] });
    await price(requestId, [l3], { entryId: book.entry['gfci-replace-flat'] });
    await write(cast.s.contractor, 'put', `/api/requests/${requestId}/pricing/visits`).send({ visits: [{ key: 'visit-1', hasPermit: true }] }).expect(200);

    const quote: QuoteVersion = (await send(requestId, { claimedTotals: { totalCents: 87_843 } }).expect(201)).body;
    // docs/pricing.md, Example 3 (computed by hand): pool 82 + 20 + 20 = 122 min → 75 billed extra minutes.
    expect(quote.breakdown).toMatchObject({
      firstHourMinimumCents: 18_500,
      extraLabourCents: 16_875,
      flatCents: 26_000,
      materialsCostCents: 1_750,
      materialsMarkupCents: 1_050,
      materialsTaxCents: 168,
      permitCents: 14_000,
      subtotalCents: 87_675,
      totalCents: 87_843,
      depositCents: 43_922,
    });
    expect(quote.breakdown.visits[0]).toMatchObject({ pooledMinutes: 122, billedExtraMinutes: 75, visitAdderLabourCents: 5_799 });
    expect(quote.lines.map((l) => [l.lineItemId, l.labourMinutes, l.labourCents, l.flatCents])).toEqual([
      [l1, 82, 23_777, 0],
      [l2, 20, 5_799, 0],
      [l3, 0, 0, 26_000],
    ]);
    expect(quote.lines[0].adders.map((a) => a.key)).toEqual(['plaster-walls', 'built-before-1960']);
  });
});

describe('a quote for a 1978 house under the adopted 2023 edition', () => {
  // From memory: GFCI at kitchen counter-tops near the sink first required in 1987. NFPA 70 (NEC)
  // 2008, 406.11: tamper-resistant receptacles. Replacements: NEC 406.4(D)(3) and 406.4(D)(5).
  it('keeps each priced line’s note on the code in force when the house was built, and prints it in the PDF', async () => {
    const { requestId, itemIds } = await createPricedRequest(cast, t.db, {
      yearBuilt: 1978,
      items: [
        { code: 'receptacle-damaged', quantity: 1, location: 'kitchen island' },
        { code: 'double-tap', quantity: 1, location: 'main panel' },
      ],
    });
    await price(requestId, [itemIds[0]], { entryId: book.entry['receptacle-replace'] });
    await price(requestId, [itemIds[1]], { entryId: book.entry['double-tap-pigtail'] });
    const quote: QuoteVersion = (await send(requestId).expect(201)).body;
    const [receptacle, doubleTap] = quote.lines;
    expect(receptacle.editionNote).toMatchObject({ firstRequired: 2008, builtUnder: 'added-later', requiredByAdoptedEdition: true });
    expect(receptacle.editionNote?.summary).toBe('Tamper-resistant: came in 2008 (after this 1978 house was built): a recommended upgrade; required for any replacement today');
    expect(doubleTap.editionNote).toBeNull();
    // The note is kept as sent.
    const again: QuoteVersion = (await cast.s.seller.agent.get(`/api/requests/${requestId}/quotes/current`).expect(200)).body;
    expect(again.lines[0].editionNote).toEqual(receptacle.editionNote);

    const res = await cast.s.seller.agent.get(`/api/requests/${requestId}/quotes/1.pdf`).buffer(true).parse((r, done) => {
      const chunks: Buffer[] = [];
      r.on('data', (c: Buffer) => chunks.push(c));
      r.on('end', () => done(null, Buffer.concat(chunks)));
    });
    const text = (await extractPdfPages(res.body as Buffer)).pages.join('\n').replace(/\s+/g, ' ');
    expect(text).toContain('Code when built: Tamper-resistant: came in 2008');
    expect(text).toContain('The house and the code in force when it was built');
    expect(text).toContain('This house was built in 1978.');
    expect(text).toContain('(NEC 406.4(D)(5))');
    expect(text).toContain('authority having jurisdiction decides');
  });
});

describe('two contractors sending at the same moment', () => {
  it('gives them consecutive versions, never the same number', async () => {
    const { requestId, itemIds } = await createPricedRequest(cast, t.db, { items: [{ code: 'switch-issue', quantity: 1 }] });
    await price(requestId, itemIds, { entryId: book.entry['switch-replace'] });
    const results = await Promise.all([send(requestId), send(requestId, {}, cast.s.colleague)]);
    expect(results.map((r) => r.status)).toEqual([201, 201]);
    expect(results.map((r) => r.body.version).sort()).toEqual([1, 2]);
    const history = (await cast.s.buyerAgent.agent.get(`/api/requests/${requestId}`)).body.history;
    expect(history.filter((h: { to: string }) => h.to === 'quoted')).toHaveLength(1);
  });
});

describe('when the request is not in pricing or quoted', () => {
  it('responds 409 to the contractor', async () => {
    const { requestId, itemIds } = await createPricedRequest(cast, t.db, { items: [{ code: 'switch-issue', quantity: 1 }] });
    await price(requestId, itemIds, { entryId: book.entry['switch-replace'] });
    await t.db('repair_requests').where({ id: requestId }).update({ status: 'approved' });
    const res = await send(requestId);
    expect(res.status).toBe(409);
    expect(res.body.error).toMatch(/not awaiting prices/);
    await cast.s.seller.agent.get(`/api/requests/${requestId}/quotes/current`).expect(404);
  });
});
