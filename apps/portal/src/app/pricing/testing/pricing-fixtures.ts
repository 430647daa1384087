import { DEMO_RATE_BOOK, PricingItem, RateBook, RepairRequestDetail, RequestPricing } from '@cc/shared';

/*
 * A small rate book taken from the demo rate book of docs/pricing.md (its worked examples use these
 * entries and conditions), with the API's numeric ids as the engine's string ids.
 */
const demoEntry = (key: string) => DEMO_RATE_BOOK.entries.find((e) => e.id === key)!;
const demoAdder = (key: string) => DEMO_RATE_BOOK.adders.find((a) => a.id === key)!;

export const SMALL_BOOK: RateBook = {
  contractorName: 'Brightline Electric',
  terms: DEMO_RATE_BOOK.terms,
  entries: [
    { ...demoEntry('gfci-replace'), id: '11' },
    { ...demoEntry('gfci-replace-flat'), id: '12' },
    { ...demoEntry('double-tap-pigtail'), id: '13' },
  ],
  adders: [
    { ...demoAdder('tight-box'), id: '21' },
    { ...demoAdder('panel-shutoff'), id: '22' },
  ],
};

export function pricingItem(id: number, overrides: Partial<PricingItem> = {}): PricingItem {
  return {
    id,
    version: 1,
    code: 'gfci-inoperative',
    room: 'kitchen',
    location: `counter ${id}`,
    quantity: 1,
    status: 'open',
    entryId: null,
    adderIds: [],
    pricingQuantity: null,
    isQuantityAssumed: false,
    visitKey: 'visit-1',
    outOfScopeReason: null,
    suggestedEntryId: 11,
    isPriced: false,
    lineCents: null,
    editionNote: null,
    ...overrides,
  };
}

/** A request in pricing with the given items, priced (by the server) as `breakdown` says. */
export function requestPricing(items: PricingItem[], overrides: Partial<RequestPricing> = {}): RequestPricing {
  return {
    requestId: 5,
    status: 'pricing',
    canEdit: true,
    items,
    visits: [{ key: 'visit-1', adderIds: [], hasPermit: false }],
    rateBook: SMALL_BOOK,
    pricingInput: null,
    breakdown: null,
    problem: null,
    unpricedItemIds: items.filter((i) => i.entryId === null && i.status !== 'out-of-scope').map((i) => i.id),
    currentQuoteVersion: null,
    ...overrides,
  };
}

/** The request the pricing page names in its heading. */
export function requestDetail(overrides: Partial<RepairRequestDetail> = {}): RepairRequestDetail {
  return {
    id: 5,
    reference: 'CC-00005',
    street: '48 Tamarack Loop',
    city: 'Marlow Springs',
    state: 'CO',
    zip: '81290',
    yearBuilt: 1978,
    closingDate: '2026-05-01',
    necEdition: 2023,
    status: 'pricing',
    contractorName: 'Brightline Electric',
    itemCount: 2,
    openWorkCount: 0,
    isAtRisk: false,
    createdAt: '2026-04-01T10:00:00Z',
    updatedAt: '2026-04-02T10:00:00Z',
    contractor: { id: 7, name: 'Brightline Electric', licenceNumber: 'EC-0048215', licenceState: 'CO', licenceClass: 'Electrical contractor' },
    parties: [],
    history: [{ from: null, to: 'draft', at: '2026-04-01T10:00:00Z', byName: 'Ada Agent', note: null }],
    myParts: [],
    ...overrides,
  };
}
