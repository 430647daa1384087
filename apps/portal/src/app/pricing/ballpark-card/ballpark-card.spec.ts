import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { HarnessLoader } from '@angular/cdk/testing';
import { TestbedHarnessEnvironment } from '@angular/cdk/testing/testbed';
import { ComponentFixture, TestBed } from '@angular/core/testing';
import { MatCardHarness } from '@angular/material/card/testing';
import { MatChipListboxHarness } from '@angular/material/chips/testing';
import { ballpark, DEMO_RATE_BOOK, RequestBallpark } from '@cc/shared';
import { BallparkCard } from './ballpark-card';

/** docs/pricing.md, Example 5: a GFCI and "several" cover plates, built 1985, computed by hand as $310 – $540. */
function example5(): RequestBallpark {
  const range = ballpark(DEMO_RATE_BOOK, {
    items: [
      { code: 'gfci-inoperative', quantity: 1 },
      { code: 'cover-plate-missing', quantity: null },
    ],
    yearBuilt: 1985,
    siteAdderIds: [],
  });
  return { ...range, requestId: 9, contractorName: 'Copperleaf Electric Co.', yearBuilt: 1985, itemCount: 2, siteConditions: [] };
}

describe('BallparkCard', () => {
  let fixture: ComponentFixture<BallparkCard>;
  let loader: HarnessLoader;
  let httpTesting: HttpTestingController;

  async function render(canFlag: boolean): Promise<HTMLElement> {
    TestBed.configureTestingModule({ providers: [provideHttpClient(), provideHttpClientTesting()] });
    httpTesting = TestBed.inject(HttpTestingController);
    fixture = TestBed.createComponent(BallparkCard);
    fixture.componentRef.setInput('requestId', 9);
    fixture.componentRef.setInput('canFlag', canFlag);
    loader = TestbedHarnessEnvironment.loader(fixture);
    await fixture.whenStable();
    return fixture.nativeElement;
  }

  afterEach(() => httpTesting.verify());

  it('labels the range as an estimate, not a quote, and shows the rounded low and high', async () => {
    const host = await render(false);
    httpTesting.expectOne('/api/requests/9/ballpark').flush(example5());
    await fixture.whenStable();
    const card = await loader.getHarness(MatCardHarness);
    expect(await card.getTitleText()).toBe('Ballpark range');
    expect(await card.getSubtitleText()).toContain('Estimate, not a quote');
    expect(host.querySelector('[data-testid="ballpark-range"]')?.textContent).toBe('$310.00 – $540.00');
  });

  it('lets an agent or the contractor flag a site condition, then shows the new range', async () => {
    await render(true);
    httpTesting.expectOne('/api/requests/9/ballpark').flush(example5());
    httpTesting.expectOne('/api/requests/9/site-conditions').flush({
      adderIds: [],
      available: [{ id: 21, name: 'Plaster and lath walls', effect: { kind: 'labour-multiplier', multiplierBp: 13_000 }, appliesWhenBuiltBefore: null }],
    });
    await fixture.whenStable();

    const chips = await (await loader.getHarness(MatChipListboxHarness)).getChips();
    await chips[0].select();
    const req = httpTesting.expectOne({ method: 'PUT', url: '/api/requests/9/site-conditions' });
    expect(req.request.body).toEqual({ adderIds: [21] });
    req.flush({ adderIds: [21], available: [] });
    await fixture.whenStable();
    httpTesting.expectOne('/api/requests/9/ballpark').flush(example5());
    httpTesting.expectOne('/api/requests/9/site-conditions').flush({ adderIds: [21], available: [] });
  });

  it('says why there is no range instead of showing one', async () => {
    const host = await render(false);
    httpTesting.expectOne('/api/requests/9/ballpark').flush({ error: 'This request has no items yet to estimate', details: [] }, { status: 409, statusText: 'Conflict' });
    await fixture.whenStable();
    expect(host.querySelector('[data-testid="ballpark-unavailable"]')?.textContent).toContain('no items yet');
    expect(host.querySelector('[data-testid="ballpark-range"]')).toBeNull();
  });
});
