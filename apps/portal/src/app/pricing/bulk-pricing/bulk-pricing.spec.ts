import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { HarnessLoader } from '@angular/cdk/testing';
import { TestbedHarnessEnvironment } from '@angular/cdk/testing/testbed';
import { ComponentFixture, TestBed } from '@angular/core/testing';
import { MATERIAL_ANIMATIONS } from '@angular/material/core';
import { MatButtonHarness } from '@angular/material/button/testing';
import { MatDialogHarness } from '@angular/material/dialog/testing';
import { MatInputHarness } from '@angular/material/input/testing';
import { MatCheckboxHarness } from '@angular/material/checkbox/testing';
import { MatSelectHarness } from '@angular/material/select/testing';
import { provideRouter, Router } from '@angular/router';
import { BulkPriceItems, editionNote, priceQuote, QUOTE_NOTE_MAX, RepairRequestDetail, RequestPricing, SendQuote } from '@cc/shared';
import { Clock } from '../../core/time/clock';
import { pricingItem, requestDetail, requestPricing, SMALL_BOOK } from '../testing/pricing-fixtures';
import { BulkPricing } from './bulk-pricing';

describe('BulkPricing', () => {
  let fixture: ComponentFixture<BulkPricing>;
  let loader: HarnessLoader;
  let httpTesting: HttpTestingController;
  let host: HTMLElement;

  const twoOpenGfcis = () => requestPricing([pricingItem(40, { version: 3 }), pricingItem(41, { version: 7, location: 'hall bath' })]);

  async function render(pricing: RequestPricing, request = requestDetail()): Promise<void> {
    TestBed.configureTestingModule({
      providers: [
        provideRouter([]),
        provideHttpClient(),
        provideHttpClientTesting(),
        { provide: Clock, useValue: { today: () => '2026-04-20' } },
        { provide: MATERIAL_ANIMATIONS, useValue: { animationsDisabled: true } },
      ],
    });
    httpTesting = TestBed.inject(HttpTestingController);
    fixture = TestBed.createComponent(BulkPricing);
    fixture.componentRef.setInput('id', '5');
    loader = TestbedHarnessEnvironment.loader(fixture);
    host = fixture.nativeElement;
    await fixture.whenStable();
    httpTesting.expectOne('/api/requests/5/pricing').flush(pricing);
    httpTesting.expectOne('/api/requests/5').flush(request);
    await fixture.whenStable();
    // The ballpark card beside the items asks for its range and the conditions it may flag.
    httpTesting.match('/api/requests/5/ballpark').forEach((req) => req.flush({ error: 'Not now', details: [] }, { status: 409, statusText: 'Conflict' }));
    httpTesting.match('/api/requests/5/site-conditions').forEach((req) => req.flush({ adderIds: [], available: [] }));
    await fixture.whenStable();
  }

  async function selectBothAndChange(): Promise<void> {
    for (const box of await loader.getAllHarnesses(MatCheckboxHarness.with({ selector: '[data-testid="pricing-select"]' }))) await box.check();
    await (await loader.getHarness(MatSelectHarness.with({ selector: '[data-testid="bulk-entry"]' }))).clickOptions({ text: /Replace inoperative GFCI receptacle$/ });
    await (await loader.getHarness(MatCheckboxHarness.with({ label: 'Set site conditions' }))).check();
    await (await loader.getHarness(MatSelectHarness.with({ selector: '[data-testid="bulk-adders"]' }))).clickOptions({ text: /Shallow or crowded box/ });
  }

  const text = (testId: string) => host.querySelector(`[data-testid="${testId}"]`)?.textContent?.trim() ?? '';

  afterEach(() => httpTesting.verify());

  // Who is on the request: the quote goes by e-mail to the seller and the agents with an account.
  const SELLER_SIDE: RepairRequestDetail['parties'] = [
    { role: 'buyer-agent', email: 'maya@juniper.test', name: 'Maya Chen', userId: 2, isPending: false, inviteUrl: null },
    { role: 'seller', email: 'tomas@mail.test', name: 'Tomás Garza', userId: 3, isPending: false, inviteUrl: null },
    { role: 'listing-agent', email: 'rob@tallgrass.test', name: null, userId: 4, isPending: false, inviteUrl: null },
    { role: 'inspector', email: 'nora@inspect.test', name: 'Nora Reyes', userId: 5, isPending: false, inviteUrl: null },
    { role: 'seller', email: 'co-owner@mail.test', name: null, userId: null, isPending: true, inviteUrl: null },
  ];

  /** The confirmation before sending: answers it and returns what it said. */
  async function confirmSending(goAhead = true): Promise<string> {
    const dialog = await TestbedHarnessEnvironment.documentRootLoader(fixture).getHarness(MatDialogHarness);
    const said = `${await dialog.getTitleText()} ${await dialog.getContentText()}`;
    await (await dialog.getHarness(MatButtonHarness.with({ selector: goAhead ? '[data-testid="confirm-go"]' : '[data-testid="confirm-cancel"]' }))).click();
    await fixture.whenStable();
    return said;
  }

  it('shows live totals from the shared engine and previews a change before it is applied', async () => {
    await render(requestPricing([pricingItem(40, { entryId: 11 }), pricingItem(41)]));
    // docs/pricing.md, Example 1: one GFCI on its own visit, $314.34.
    expect(text('totals-quote-total')).toBe('$314.34');
    await selectBothAndChange();
    // docs/pricing.md, Example 2: two GFCIs in shallow boxes on one visit, $449.94.
    expect(text('bulk-preview-total')).toBe('$449.94');
    expect(text('totals-quote-total')).toBe('$314.34');
  });

  it('shows beside an item the code in force when the house was built, in plain words', async () => {
    // From memory: bathroom GFCI first required in 1975; replacement rule NEC 406.4(D)(3).
    const note = editionNote('gfci-missing', 'bathroom', { yearBuilt: 1978, necEdition: 2023 });
    await render(requestPricing([pricingItem(40, { code: 'gfci-missing', room: 'bathroom', editionNote: note }), pricingItem(41)]));
    const notes = host.querySelectorAll('[data-testid="pricing-row"] [data-testid="edition-note"]');
    expect(notes).toHaveLength(1);
    expect(notes[0].querySelector('summary')?.textContent).toContain('GFCI: required when this 1978 house was built; required for any replacement today');
    expect(notes[0].textContent).toContain('authority having jurisdiction');
  });

  it('applies one change to every selected item with the versions it saw and the totals it shows', async () => {
    await render(twoOpenGfcis());
    await selectBothAndChange();
    await (await loader.getHarness(MatButtonHarness.with({ text: /Apply to 2 selected/ }))).click();

    const req = httpTesting.expectOne({ method: 'PATCH', url: '/api/requests/5/pricing' });
    const body = req.request.body as BulkPriceItems;
    expect(body.items).toEqual([{ id: 40, version: 3 }, { id: 41, version: 7 }]);
    expect(body.set).toEqual({ entryId: 11, adderIds: [21] });
    const expected = priceQuote(SMALL_BOOK, {
      visits: [{ key: 'visit-1' }],
      lines: [40, 41].map((id) => ({ key: String(id), entryId: '11', quantity: 1, adderIds: ['21'], visitKey: 'visit-1' })),
    });
    expect(body.claimedTotals?.totalCents).toBe(expected.totalCents);
    expect(body.claimedTotals?.visits).toEqual([{ key: 'visit-1', totalCents: expected.totalCents }]);

    const saved = requestPricing([40, 41].map((id) => pricingItem(id, { version: 8, entryId: 11, adderIds: [21] })));
    req.flush(saved);
    await fixture.whenStable();
    expect(text('totals-quote-total')).toBe('$449.94');
    expect(Array.from(host.querySelectorAll('[data-testid="pricing-adders"]')).map((cell) => cell.textContent?.trim())).toEqual([
      'Shallow or crowded box',
      'Shallow or crowded box',
    ]);
  });

  it('says clearly when someone else changed the items meanwhile, and reloads on request', async () => {
    await render(twoOpenGfcis());
    await selectBothAndChange();
    await (await loader.getHarness(MatButtonHarness.with({ text: /Apply to 2 selected/ }))).click();
    const message = 'Someone else changed item #41 (gfci-inoperative, hall bath) meanwhile. Reload to see the current prices.';
    httpTesting
      .expectOne({ method: 'PATCH', url: '/api/requests/5/pricing' })
      .flush({ error: message, details: [{ path: 'items.1.version', message: 'Item #41 is at version 8, not 7' }] }, { status: 409, statusText: 'Conflict' });
    await fixture.whenStable();
    expect(text('pricing-conflict')).toContain(message);

    await (await loader.getHarness(MatButtonHarness.with({ selector: '[data-testid="pricing-reload"]' }))).click();
    httpTesting.expectOne('/api/requests/5/pricing').flush(twoOpenGfcis());
    await fixture.whenStable();
    httpTesting.match('/api/requests/5/ballpark').forEach((req) => req.flush({ error: 'Not now', details: [] }, { status: 409, statusText: 'Conflict' }));
    expect(host.querySelector('[data-testid="pricing-conflict"]')).toBeNull();
  });

  it('sends the quote only when every item is priced, claiming the totals it shows', async () => {
    await render(requestPricing([pricingItem(40, { entryId: 11 }), pricingItem(41)]));
    expect(await (await loader.getHarness(MatButtonHarness.with({ selector: '[data-testid="pricing-send"]' }))).isDisabled()).toBe(true);

    TestBed.resetTestingModule();
    await render(requestPricing([pricingItem(40, { entryId: 11 })], { unpricedItemIds: [] }), requestDetail({ parties: SELLER_SIDE }));
    const navigate = jest.spyOn(TestBed.inject(Router), 'navigate').mockResolvedValue(true);
    const send = await loader.getHarness(MatButtonHarness.with({ selector: '[data-testid="pricing-send"]' }));
    expect(await send.getText()).toContain('$314.34');
    await send.click();
    await confirmSending();
    const req = httpTesting.expectOne({ method: 'POST', url: '/api/requests/5/quotes' });
    // docs/pricing.md, Example 1: 31,434 cents.
    expect((req.request.body as SendQuote).claimedTotals?.totalCents).toBe(31_434);
    req.flush({ error: 'Not priced', details: [] }, { status: 409, statusText: 'Conflict' });
    await fixture.whenStable();
    expect(text('pricing-conflict')).toContain('Not priced');
    expect(navigate).not.toHaveBeenCalled();
  });

  it('asks before sending, naming who is e-mailed the quote and its total, and sends nothing when cancelled', async () => {
    await render(requestPricing([pricingItem(40, { entryId: 11 })], { unpricedItemIds: [] }), requestDetail({ parties: SELLER_SIDE }));
    await (await loader.getHarness(MatButtonHarness.with({ selector: '[data-testid="pricing-send"]' }))).click();
    const said = await confirmSending(false);
    expect(said).toContain('Send quote version 1?');
    // The seller and both agents with an account (the listing agent by e-mail, having no name); not the
    // inspector, nor the co-owner who has not made an account. docs/pricing.md, Example 1: $314.34.
    expect(said).toContain("Maya Chen (buyer's agent), Tomás Garza (seller) and rob@tallgrass.test (listing agent) will be e-mailed the quote");
    expect(said).toContain('$314.34');
    expect(said).not.toContain('Nora');
    httpTesting.expectNone({ method: 'POST', url: '/api/requests/5/quotes' });
  });

  it('counts the note towards its limit and sends it trimmed', async () => {
    await render(requestPricing([pricingItem(40, { entryId: 11 })], { unpricedItemIds: [] }), requestDetail({ parties: SELLER_SIDE }));
    jest.spyOn(TestBed.inject(Router), 'navigate').mockResolvedValue(true);
    const note = await loader.getHarness(MatInputHarness.with({ selector: '[data-testid="pricing-note"]' }));
    expect(text('pricing-note-count')).toBe(`0 / ${QUOTE_NOTE_MAX}`);
    expect(host.querySelector('[data-testid="pricing-note"]')?.getAttribute('maxlength')).toBe(String(QUOTE_NOTE_MAX));
    await note.setValue('  Both boxes are shallow.  ');
    expect(text('pricing-note-count')).toBe(`27 / ${QUOTE_NOTE_MAX}`);
    await (await loader.getHarness(MatButtonHarness.with({ selector: '[data-testid="pricing-send"]' }))).click();
    await confirmSending();
    const req = httpTesting.expectOne({ method: 'POST', url: '/api/requests/5/quotes' });
    expect((req.request.body as SendQuote).note).toBe('Both boxes are shallow.');
    req.flush({ error: 'Not now', details: [] }, { status: 409, statusText: 'Conflict' });
    await fixture.whenStable();
  });
});
