import request from 'supertest';
import { DEMO_RATE_BOOK, effectiveQuantity, priceQuote, type RequestPricing } from '@cc/shared';
import { createTestApp, type TestApp } from '../helpers/test-app';
import { resetDatabase, type SignedIn } from '../helpers/fixtures';
import { createPricedRequest, createPricingCast, storeRateBook, type PricingCast, type StoredBook } from '../helpers/pricing-fixtures';

let t: TestApp;
let cast: PricingCast;
let book: StoredBook;
let requestId: number;
/** gfci ×1, receptacles ×3, double tap ×1, cover plates "several", a code the rate book lacks. */
let items: { gfci: number; receptacles: number; doubleTap: number; plates: number; unknown: number };

const write = (who: SignedIn, method: 'post' | 'put' | 'patch', path: string) => who.agent[method](path).set('x-csrf-token', who.csrfToken);
const pricingOf = async (who: SignedIn = cast.s.contractor, id = requestId): Promise<RequestPricing> => (await who.agent.get(`/api/requests/${id}/pricing`).expect(200)).body;
const refs = (pricing: RequestPricing, ...ids: number[]) => ids.map((id) => ({ id, version: pricing.items.find((i) => i.id === id)!.version }));

beforeAll(async () => {
  t = createTestApp();
  await resetDatabase(t.db);
  cast = await createPricingCast(t.app, t.db);
  book = await storeRateBook(t.db, cast.contractorOrg, DEMO_RATE_BOOK);
  const created = await createPricedRequest(cast, t.db, {
    items: [
      { code: 'gfci-inoperative', quantity: 1 },
      { code: 'receptacle-damaged', quantity: 3 },
      { code: 'double-tap', quantity: 1 },
      { code: 'cover-plate-missing', quantity: null },
      { code: 'mystery-code', quantity: 1 },
    ],
  });
  requestId = created.requestId;
  const [gfci, receptacles, doubleTap, plates, unknown] = created.itemIds;
  items = { gfci, receptacles, doubleTap, plates, unknown };
});
afterAll(() => t.close());

describe('GET /api/requests/:id/pricing', () => {
  it('responds 401 without a session', async () => {
    await request(t.app).get(`/api/requests/${requestId}/pricing`).expect(401);
  });

  it.each(['outsiderAgent', 'otherContractor'] as const)('responds 404 to %s, who is not a party', async (who) => {
    await cast.s[who].agent.get(`/api/requests/${requestId}/pricing`).expect(404);
  });

  it.each(['buyerAgent', 'listingAgent', 'seller', 'inspector'] as const)('responds 403 to the %s, who sees the request but does not price', async (who) => {
    const res = await cast.s[who].agent.get(`/api/requests/${requestId}/pricing`);
    expect(res.status).toBe(403);
    expect(res.body.error).toMatch(/assigned contractor/);
  });

  it('shows every user of the assigned organisation the items, the suggested entries and the rate book', async () => {
    const pricing = await pricingOf(cast.s.colleague);
    expect(pricing).toMatchObject({ requestId, status: 'pricing', canEdit: true, breakdown: null, currentQuoteVersion: null, visits: [{ key: 'visit-1', adderIds: [], hasPermit: false }] });
    expect(pricing.items.map((i) => i.id)).toEqual(Object.values(items));
    // The first entry of the rate book for the code (gfci-replace before gfci-replace-flat).
    expect(pricing.items.find((i) => i.id === items.gfci)).toMatchObject({ suggestedEntryId: book.entry['gfci-replace'], entryId: null, isPriced: false, version: 1 });
    expect(pricing.items.find((i) => i.id === items.unknown)?.suggestedEntryId).toBeNull();
    // NFPA 70 (NEC) 2008, 406.11: tamper-resistant receptacles, after this 1978 house was built;
    // a replacement today is tamper-resistant under the adopted 2023 edition (NEC 406.4(D)(5)).
    expect(pricing.items.find((i) => i.id === items.receptacles)?.editionNote).toMatchObject({ firstRequired: 2008, builtUnder: 'added-later', requiredByAdoptedEdition: true });
    expect(pricing.items.find((i) => i.id === items.doubleTap)?.editionNote).toBeNull();
    expect(pricing.unpricedItemIds).toEqual(Object.values(items));
    expect(pricing.rateBook?.entries.find((e) => e.id === String(book.entry['gfci-replace']))).toMatchObject({ code: 'gfci-inoperative', name: 'Replace inoperative GFCI receptacle' });
  });

  it('lets an administrator look without editing', async () => {
    expect((await pricingOf(cast.s.admin)).canEdit).toBe(false);
  });
});

describe('PATCH /api/requests/:id/pricing', () => {
  it('responds 403 to an agent and 404 to another contractor', async () => {
    const pricing = await pricingOf();
    const body = { items: refs(pricing, items.gfci), set: { entryId: book.entry['gfci-replace'] } };
    await write(cast.s.buyerAgent, 'patch', `/api/requests/${requestId}/pricing`).send(body).expect(403);
    await write(cast.s.otherContractor, 'patch', `/api/requests/${requestId}/pricing`).send(body).expect(404);
  });

  it('responds 400 with field paths for a malformed change', async () => {
    const res = await write(cast.s.contractor, 'patch', `/api/requests/${requestId}/pricing`).send({ items: [], set: { quantity: 0 } });
    expect(res.status).toBe(400);
    expect(res.body.details.map((d: { path: string }) => d.path).sort()).toEqual(['items', 'set.quantity']);
    const nothing = await write(cast.s.contractor, 'patch', `/api/requests/${requestId}/pricing`).send({ items: [{ id: items.gfci, version: 1 }], set: {} });
    expect(nothing.body.details).toEqual([{ path: 'set', message: 'Choose something to change' }]);
  });

  it('says what is wrong with a quantity in plain words, as the form shows it', async () => {
    const item = [{ id: items.gfci, version: 1 }];
    const huge = await write(cast.s.contractor, 'patch', `/api/requests/${requestId}/pricing`).send({ items: item, set: { quantity: 999_999_999 } });
    expect(huge.status).toBe(400);
    expect(huge.body.details).toEqual([{ path: 'set.quantity', message: 'Use at most 999' }]);
    const fraction = await write(cast.s.contractor, 'patch', `/api/requests/${requestId}/pricing`).send({ items: item, set: { quantity: 1.5 } });
    expect(fraction.body.details).toEqual([{ path: 'set.quantity', message: 'Use a whole number, without decimals' }]);
  });

  it('responds 400 for an entry or site condition that is not in the rate book', async () => {
    const body = { items: [{ id: items.gfci, version: 1 }] };
    const entry = await write(cast.s.contractor, 'patch', `/api/requests/${requestId}/pricing`).send({ ...body, set: { entryId: 999_999 } });
    expect(entry.status).toBe(400);
    expect(entry.body.details).toEqual([{ path: 'set.entryId', message: expect.any(String) }]);
    const adder = await write(cast.s.contractor, 'patch', `/api/requests/${requestId}/pricing`).send({ ...body, set: { adderIds: [book.adder['tight-box'], 999_999] } });
    expect(adder.body.details).toEqual([{ path: 'set.adderIds.1', message: expect.any(String) }]);
    const visit = await write(cast.s.contractor, 'patch', `/api/requests/${requestId}/pricing`).send({ ...body, set: { visitKey: 'visit-9' } });
    expect(visit.body.details).toEqual([{ path: 'set.visitKey', message: expect.any(String) }]);
  });

  it('responds 404 naming an item that is not one of the request’s items awaiting prices', async () => {
    const res = await write(cast.s.contractor, 'patch', `/api/requests/${requestId}/pricing`).send({ items: [{ id: 987_654, version: 1 }], set: { quantity: 2 } });
    expect(res.status).toBe(404);
    expect(res.body.details).toEqual([{ path: 'items.0.id', message: expect.stringContaining('#987654') }]);
  });

  it('applies one entry to several items at once and prices them with the shared engine', async () => {
    const before = await pricingOf();
    const res = await write(cast.s.contractor, 'patch', `/api/requests/${requestId}/pricing`).send({
      items: refs(before, items.receptacles, items.plates),
      set: { entryId: book.entry['receptacle-replace'] },
    });
    expect(res.status).toBe(200);
    const pricing: RequestPricing = res.body;
    const receptacles = pricing.items.find((i) => i.id === items.receptacles)!;
    const plates = pricing.items.find((i) => i.id === items.plates)!;
    // The report's quantity (3) is priced; the contractor set none of their own.
    expect(receptacles).toMatchObject({ entryId: book.entry['receptacle-replace'], quantity: 3, pricingQuantity: null, isQuantityAssumed: false, isPriced: true, version: 2 });
    expect(effectiveQuantity(receptacles)).toBe(3);
    // The report said "several": 1 is assumed and flagged for the contractor to check.
    expect(plates).toMatchObject({ quantity: null, pricingQuantity: 1, isQuantityAssumed: true, isPriced: true });
    // The server's figures are the shared engine's for the input it reports.
    expect(pricing.breakdown).toEqual(priceQuote(pricing.rateBook!, pricing.pricingInput!));
    expect(pricing.pricingInput?.lines.map((l) => [l.key, l.quantity])).toEqual([
      [String(items.receptacles), 3],
      [String(items.plates), 1],
    ]);
    expect(receptacles.lineCents! + plates.lineCents!).toBe(pricing.breakdown!.firstHourMinimumCents + pricing.breakdown!.extraLabourCents + pricing.breakdown!.materialsCostCents + pricing.breakdown!.materialsMarkupCents);
  });

  it('sets a quantity, which clears the "assumed" flag', async () => {
    const before = await pricingOf();
    const res = await write(cast.s.contractor, 'patch', `/api/requests/${requestId}/pricing`).send({ items: refs(before, items.plates), set: { quantity: 4 } });
    expect(res.body.items.find((i: { id: number }) => i.id === items.plates)).toMatchObject({ pricingQuantity: 4, isQuantityAssumed: false, quantity: null });
  });

  describe('when two people change the same items', () => {
    it('gives the second writer 409 with a message naming the items, and keeps the first change', async () => {
      const seen = await pricingOf(cast.s.contractor);
      const alsoSeen = await pricingOf(cast.s.colleague);
      await write(cast.s.contractor, 'patch', `/api/requests/${requestId}/pricing`).send({ items: refs(seen, items.receptacles, items.plates), set: { adderIds: [book.adder['plaster-walls']] } }).expect(200);
      const res = await write(cast.s.colleague, 'patch', `/api/requests/${requestId}/pricing`).send({ items: refs(alsoSeen, items.gfci, items.receptacles, items.plates), set: { adderIds: [] } });
      expect(res.status).toBe(409);
      expect(res.body.error).toMatch(new RegExp(`items #${items.receptacles} \\(receptacle-damaged.*#${items.plates} \\(cover-plate-missing`));
      expect(res.body.details.map((d: { path: string }) => d.path)).toEqual(['items.1.version', 'items.2.version']);
      const after = await pricingOf();
      expect(after.items.find((i) => i.id === items.receptacles)?.adderIds).toEqual([book.adder['plaster-walls']]);
      expect(after.items.find((i) => i.id === items.gfci)?.version).toBe(seen.items.find((i) => i.id === items.gfci)?.version);
    });
  });

  describe('with claimedTotals', () => {
    it('accepts a change whose claimed totals are the engine’s, computed by the client from the same rate book', async () => {
      const before = await pricingOf();
      const input = structuredClone(before.pricingInput!);
      input.lines.find((l) => l.key === String(items.plates))!.quantity = 5;
      const claimed = priceQuote(before.rateBook!, input);
      const res = await write(cast.s.contractor, 'patch', `/api/requests/${requestId}/pricing`).send({
        items: refs(before, items.plates),
        set: { quantity: 5 },
        claimedTotals: { totalCents: claimed.totalCents, materialsTaxCents: claimed.materialsTaxCents },
      });
      expect(res.status).toBe(200);
      expect(res.body.breakdown.totalCents).toBe(claimed.totalCents);
    });

    it('responds 409 with every figure that differs and leaves the items as they were', async () => {
      const before = await pricingOf();
      const res = await write(cast.s.contractor, 'patch', `/api/requests/${requestId}/pricing`).send({
        items: refs(before, items.plates),
        set: { quantity: 6 },
        claimedTotals: { totalCents: 1, serviceCallCents: DEMO_RATE_BOOK.terms.serviceCallCents },
      });
      expect(res.status).toBe(409);
      expect(res.body.details).toEqual([{ path: 'claimedTotals.totalCents', message: expect.stringMatching(/^You see 1 cents; the price is \d+$/) }]);
      expect((await pricingOf()).items.find((i) => i.id === items.plates)).toMatchObject({ pricingQuantity: 5, version: before.items.find((i) => i.id === items.plates)!.version });
    });
  });

  it('refuses a labour site condition on a flat-rate entry (the engine’s adder-not-for-flat rule), naming the item', async () => {
    const before = await pricingOf();
    const res = await write(cast.s.contractor, 'patch', `/api/requests/${requestId}/pricing`).send({
      items: refs(before, items.gfci),
      set: { entryId: book.entry['gfci-replace-flat'], adderIds: [book.adder['tight-box']] },
    });
    expect(res.status).toBe(400);
    expect(res.body.error).toContain(`#${items.gfci} (gfci-inoperative`);
    expect((await pricingOf()).items.find((i) => i.id === items.gfci)?.entryId).toBeNull();
  });
});

describe('POST /api/requests/:id/pricing/auto-price', () => {
  it('responds 403 to the seller', async () => {
    await write(cast.s.seller, 'post', `/api/requests/${requestId}/pricing/auto-price`).send({}).expect(403);
  });

  it('gives every open item without an entry the suggested one, and keeps the contractor’s own choices', async () => {
    const before = await pricingOf();
    await write(cast.s.contractor, 'patch', `/api/requests/${requestId}/pricing`).send({ items: refs(before, items.gfci), set: { entryId: book.entry['gfci-replace-flat'] } }).expect(200);
    const res = await write(cast.s.colleague, 'post', `/api/requests/${requestId}/pricing/auto-price`).send({});
    expect(res.status).toBe(200);
    expect(res.body).toMatchObject({ pricedItemIds: [items.doubleTap], assumedQuantityItemIds: [], noEntryItemIds: [items.unknown] });
    const pricing: RequestPricing = res.body.pricing;
    expect(pricing.items.find((i) => i.id === items.doubleTap)?.entryId).toBe(book.entry['double-tap-pigtail']);
    expect(pricing.items.find((i) => i.id === items.gfci)?.entryId).toBe(book.entry['gfci-replace-flat']);
    expect(pricing.unpricedItemIds).toEqual([items.unknown]);
  });
});

describe('POST /api/requests/:id/pricing/out-of-scope', () => {
  it('responds 400 without a reason', async () => {
    const res = await write(cast.s.contractor, 'post', `/api/requests/${requestId}/pricing/out-of-scope`).send({ items: [{ id: items.unknown, version: 1 }], reason: '' });
    expect(res.status).toBe(400);
    expect(res.body.details).toEqual([{ path: 'reason', message: expect.any(String) }]);
  });

  it('declines items as not in the contractor’s scope, with the reason, and leaves them out of the total', async () => {
    const before = await pricingOf();
    const res = await write(cast.s.contractor, 'post', `/api/requests/${requestId}/pricing/out-of-scope`).send({ items: refs(before, items.unknown), reason: 'Low-voltage work; a specialist handles it' });
    expect(res.status).toBe(200);
    expect(res.body.items.find((i: { id: number }) => i.id === items.unknown)).toMatchObject({ status: 'out-of-scope', outOfScopeReason: 'Low-voltage work; a specialist handles it', isPriced: false });
    expect(res.body.unpricedItemIds).toEqual([]);
    expect(res.body.breakdown.totalCents).toBe(before.breakdown!.totalCents);
  });

  it('takes an item back into scope when it is given an entry', async () => {
    const before = await pricingOf();
    const res = await write(cast.s.contractor, 'patch', `/api/requests/${requestId}/pricing`).send({ items: refs(before, items.unknown), set: { entryId: book.entry['general-evaluation'] } });
    expect(res.body.items.find((i: { id: number }) => i.id === items.unknown)).toMatchObject({ status: 'open', outOfScopeReason: null, isPriced: true });
    const back = await pricingOf();
    await write(cast.s.contractor, 'post', `/api/requests/${requestId}/pricing/out-of-scope`).send({ items: refs(back, items.unknown), reason: 'Not electrical work' }).expect(200);
  });
});

describe('PUT /api/requests/:id/pricing/visits', () => {
  it('adds the permit of the rate book (fee + handling, untaxed) to a visit that pulls one', async () => {
    const before = await pricingOf();
    const res = await write(cast.s.contractor, 'put', `/api/requests/${requestId}/pricing/visits`).send({ visits: [{ key: 'visit-1', hasPermit: true }] });
    expect(res.status).toBe(200);
    const permit = DEMO_RATE_BOOK.terms.permit.feeCents + DEMO_RATE_BOOK.terms.permit.handlingCents;
    expect(res.body.breakdown.permitCents).toBe(permit);
    expect(res.body.breakdown.totalCents - before.breakdown!.totalCents).toBe(permit);
  });

  it('moves items to a second visit, which pays its own service call', async () => {
    await write(cast.s.contractor, 'put', `/api/requests/${requestId}/pricing/visits`).send({ visits: [{ key: 'visit-1', hasPermit: true }, { key: 'visit-2' }] }).expect(200);
    const before = await pricingOf();
    const res = await write(cast.s.contractor, 'patch', `/api/requests/${requestId}/pricing`).send({ items: refs(before, items.doubleTap), set: { visitKey: 'visit-2' } });
    expect(res.body.breakdown.serviceCallCents).toBe(2 * DEMO_RATE_BOOK.terms.serviceCallCents);
  });

  it('responds 400 when a visit still holding items is left out, or a condition is not in the rate book', async () => {
    const dropped = await write(cast.s.contractor, 'put', `/api/requests/${requestId}/pricing/visits`).send({ visits: [{ key: 'visit-1' }] });
    expect(dropped.status).toBe(400);
    expect(dropped.body.details[0].message).toContain(`#${items.doubleTap}`);
    const unknown = await write(cast.s.contractor, 'put', `/api/requests/${requestId}/pricing/visits`).send({ visits: [{ key: 'visit-1', adderIds: [999_999] }, { key: 'visit-2' }] });
    expect(unknown.body.details).toEqual([{ path: 'visits.0.adderIds.0', message: expect.any(String) }]);
    const twice = await write(cast.s.contractor, 'put', `/api/requests/${requestId}/pricing/visits`).send({ visits: [{ key: 'visit-1' }, { key: 'visit-1' }] });
    expect(twice.body.details).toEqual([{ path: 'visits', message: 'A visit is listed twice' }]);
  });
});

describe('when the request is not awaiting prices', () => {
  it('responds 409 to the contractor', async () => {
    const { requestId: inIntake, itemIds } = await createPricedRequest(cast, t.db, { status: 'intake', items: [{ code: 'double-tap', quantity: 1, status: 'proposed' }] });
    const res = await write(cast.s.contractor, 'post', `/api/requests/${inIntake}/pricing/auto-price`).send({});
    expect(res.status).toBe(409);
    expect(res.body.error).toMatch(/not awaiting prices/);
    await write(cast.s.contractor, 'patch', `/api/requests/${inIntake}/pricing`).send({ items: [{ id: itemIds[0], version: 1 }], set: { quantity: 2 } }).expect(409);
  });

  it('responds 409 when the organisation has no rate book', async () => {
    const { requestId: other } = await createPricedRequest(cast, t.db, { contractorOrg: cast.otherContractorOrg, items: [{ code: 'double-tap', quantity: 1 }] });
    const res = await write(cast.s.otherContractor, 'post', `/api/requests/${other}/pricing/auto-price`).send({});
    expect(res.status).toBe(409);
    expect(res.body.error).toMatch(/no rate book/);
  });
});

describe('site conditions and the ballpark range', () => {
  let ballparkRequest: number;
  beforeAll(async () => {
    // docs/pricing.md, Example 5: gfci-inoperative × 1, cover-plate-missing × "several", built 1985.
    ballparkRequest = (await createPricedRequest(cast, t.db, { yearBuilt: 1985, items: [{ code: 'gfci-inoperative', quantity: 1 }, { code: 'cover-plate-missing', quantity: null }] })).requestId;
  });

  it('gives the range of docs/pricing.md Example 5 ($310 – $540), labelled as an estimate', async () => {
    const res = await cast.s.buyerAgent.agent.get(`/api/requests/${ballparkRequest}/ballpark`);
    expect(res.status).toBe(200);
    expect(res.body).toMatchObject({ label: 'Estimate, not a quote', kind: 'estimate', lowCents: 31_000, highCents: 54_000, yearBuilt: 1985, itemCount: 2, siteConditions: [], contractorName: 'Assigned Electric' });
  });

  it.each(['listingAgent', 'seller', 'contractor', 'admin'] as const)('shows the range to the %s', async (who) => {
    expect((await cast.s[who].agent.get(`/api/requests/${ballparkRequest}/ballpark`).expect(200)).body.lowCents).toBe(31_000);
  });

  it('responds 403 to the inspector and 404 to outsiders', async () => {
    await cast.s.inspector.agent.get(`/api/requests/${ballparkRequest}/ballpark`).expect(403);
    await cast.s.outsiderAgent.agent.get(`/api/requests/${ballparkRequest}/ballpark`).expect(404);
    await cast.s.otherContractor.agent.get(`/api/requests/${ballparkRequest}/ballpark`).expect(404);
  });

  it('lets the agents and the contractor flag site conditions, which the range then assumes', async () => {
    const offered = await cast.s.seller.agent.get(`/api/requests/${ballparkRequest}/site-conditions`).expect(200);
    expect(offered.body.available.map((a: { name: string }) => a.name)).toContain('Plaster and lath walls');
    await write(cast.s.seller, 'put', `/api/requests/${ballparkRequest}/site-conditions`).send({ adderIds: [book.adder['plaster-walls']] }).expect(403);
    await write(cast.s.inspector, 'put', `/api/requests/${ballparkRequest}/site-conditions`).send({ adderIds: [] }).expect(403);
    const bad = await write(cast.s.buyerAgent, 'put', `/api/requests/${ballparkRequest}/site-conditions`).send({ adderIds: [999_999] });
    expect(bad.status).toBe(400);
    expect(bad.body.details).toEqual([{ path: 'adderIds.0', message: expect.any(String) }]);

    const set = await write(cast.s.buyerAgent, 'put', `/api/requests/${ballparkRequest}/site-conditions`).send({ adderIds: [book.adder['plaster-walls']] });
    expect(set.body.adderIds).toEqual([book.adder['plaster-walls']]);
    await write(cast.s.contractor, 'put', `/api/requests/${ballparkRequest}/site-conditions`).send({ adderIds: [book.adder['plaster-walls'], book.adder['panel-shutoff']] }).expect(200);
    const range = (await cast.s.buyerAgent.agent.get(`/api/requests/${ballparkRequest}/ballpark`)).body;
    expect(range.siteConditions.map((c: { name: string }) => c.name)).toEqual(['Plaster and lath walls', 'Panel shutoff for the visit']);
    expect(range.highAdderIds).toEqual([String(book.adder['plaster-walls']), String(book.adder['panel-shutoff'])]);
    // By hand from docs/pricing.md 1.3 and 1.5 (R1 for minutes × multiplier):
    // High: the flat GFCI (24,500) still wins; plates 4 × 5 min × 1.3 = 26 + 20 min shutoff = 46 min, inside the
    // first hour: 9,500 + 18,500 + 24,500 + 800 + 480 + tax 77 = 53,857 → $540, as without the conditions.
    // Low: the easy site assumes no conditions (a quote need not charge them), so it stays at Example 5's
    // 31,774 → $310.
    expect([range.low.exactCents, range.high.exactCents]).toEqual([31_774, 53_857]);
    expect([range.lowCents, range.highCents]).toEqual([31_000, 54_000]);
  });

  it('prices a flagged condition that takes the labour past the first hour (figures by hand from docs/pricing.md 1.3)', async () => {
    const { requestId: id } = await createPricedRequest(cast, t.db, { yearBuilt: 1985, items: [{ code: 'receptacle-damaged', quantity: 3 }] });
    // receptacle-replace, 3 units: materials 3 × (350 + 200) = 1,650, markup 60 % = 990, tax 6 % of 2,640 = 158.4 → 158;
    // with the service call 9,500 and the first-hour minimum 18,500: 30,798 when the labour fits the first hour.
    const plain = (await cast.s.contractor.agent.get(`/api/requests/${id}/ballpark`)).body;
    expect([plain.low.exactCents, plain.high.exactCents]).toEqual([30_798, 30_798]); // low 3 × 10 min, high 3 × 20 min = 60
    await write(cast.s.contractor, 'put', `/api/requests/${id}/site-conditions`).send({ adderIds: [book.adder['plaster-walls']] }).expect(200);
    const flagged = (await cast.s.contractor.agent.get(`/api/requests/${id}/ballpark`)).body;
    // High: 60 min × 1.3 = 78 → 18 min extra → 2 steps of 15 = 30 min × $135/h = 6,750 more. Low: 30 × 1.3 = 39 min, no extra.
    expect([flagged.low.exactCents, flagged.high.exactCents]).toEqual([30_798, 37_548]);
    expect([flagged.lowCents, flagged.highCents]).toEqual([30_000, 38_000]);
  });

  it('responds 409 when no contractor is assigned, or the contractor has no rate book', async () => {
    const { requestId: unassigned } = await createPricedRequest(cast, t.db, { contractorOrg: null, items: [{ code: 'double-tap', quantity: 1 }] });
    const res = await cast.s.buyerAgent.agent.get(`/api/requests/${unassigned}/ballpark`);
    expect(res.status).toBe(409);
    expect(res.body.error).toMatch(/No contractor/);
    const { requestId: noBook } = await createPricedRequest(cast, t.db, { contractorOrg: cast.otherContractorOrg, items: [{ code: 'double-tap', quantity: 1 }] });
    expect((await cast.s.buyerAgent.agent.get(`/api/requests/${noBook}/ballpark`)).status).toBe(409);
  });
});

describe('a bulk change priced as docs/pricing.md Example 2 (figures fixed by hand, not the server against itself)', () => {
  /** A new request with two inoperative GFCIs, both given `gfci-replace` in a shallow box, claiming `claimed`. */
  async function priceTwoGfcisInShallowBoxes(claimed: Record<string, number>) {
    const { requestId: id, itemIds } = await createPricedRequest(cast, t.db, {
      items: [
        { code: 'gfci-inoperative', quantity: 1 },
        { code: 'gfci-inoperative', quantity: 1 },
      ],
    });
    const before = await pricingOf(cast.s.contractor, id);
    const res = await write(cast.s.contractor, 'patch', `/api/requests/${id}/pricing`).send({
      items: refs(before, ...itemIds),
      set: { entryId: book.entry['gfci-replace'], adderIds: [book.adder['tight-box']] },
      claimedTotals: claimed,
    });
    return { id, res };
  }

  it('prices two GFCIs in shallow boxes on one visit at $449.94, the figures the contractor claimed', async () => {
    const { res } = await priceTwoGfcisInShallowBoxes({ totalCents: 44_994, extraLabourCents: 10_125, materialsTaxCents: 389 });
    expect(res.status).toBe(200);
    // Example 2, step by step: service call 9,500; first-hour minimum 18,500; 100 min pooled → 40 extra,
    // billed 45 min at $135/h = 10,125; materials 4,800 + markup 1,680; tax 6 % = 389 (rounded half up).
    expect(res.body.breakdown).toMatchObject({
      serviceCallCents: 9_500,
      firstHourMinimumCents: 18_500,
      extraLabourCents: 10_125,
      subtotalCents: 44_605,
      materialsTaxCents: 389,
      totalCents: 44_994,
      depositCents: 22_497,
    });
    // Line labour shares 14,313 and 14,312 (the spare cent to the earlier line), each with 3,240 of materials.
    expect(res.body.items.map((i: { lineCents: number }) => i.lineCents)).toEqual([17_553, 17_552]);
  });

  it('refuses a change whose claimed total is not Example 2’s, and keeps the items unpriced', async () => {
    const { id, res } = await priceTwoGfcisInShallowBoxes({ totalCents: 31_434 });
    expect(res.status).toBe(409);
    expect(res.body.details).toEqual([{ path: 'claimedTotals.totalCents', message: 'You see 31434 cents; the price is 44994' }]);
    expect((await pricingOf(cast.s.contractor, id)).items.every((i) => i.entryId === null)).toBe(true);
  });
});
