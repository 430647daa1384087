import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { HarnessLoader } from '@angular/cdk/testing';
import { TestbedHarnessEnvironment } from '@angular/cdk/testing/testbed';
import { ComponentFixture, TestBed } from '@angular/core/testing';
import { MatSelectHarness } from '@angular/material/select/testing';
import { MatTableHarness } from '@angular/material/table/testing';
import { provideRouter, Router } from '@angular/router';
import { priceQuote, QuoteVersion, QuoteVersionSummary } from '@cc/shared';
import { Auth } from '../../core/auth/auth';
import { SMALL_BOOK } from '../../pricing/testing/pricing-fixtures';
import { QuoteView } from './quote-view';

const line = (lineItemId: number, location: string, lineCents: number): QuoteVersion['lines'][number] => ({
  lineItemId,
  kind: 'priced',
  code: 'gfci-inoperative',
  room: 'kitchen',
  location,
  entry: { id: 11, key: 'gfci-replace', version: 1, name: 'Replace inoperative GFCI receptacle', unit: 'device', mode: 'time-and-materials' },
  quantity: 1,
  isQuantityAssumed: false,
  adders: [],
  visitKey: 'visit-1',
  labourMinutes: 20,
  labourCents: lineCents - 3_240,
  materialsCents: 3_240,
  flatCents: 0,
  lineCents,
  outOfScopeReason: null,
  editionNote: null,
});

function version(n: number, isCurrent: boolean): QuoteVersion {
  // docs/pricing.md, Example 1 (one GFCI, 31,434) for version 1; version 2 adds a second GFCI.
  const lines = n === 1 ? [{ key: '40', entryId: '11', quantity: 1, visitKey: 'visit-1' }] : ['40', '41'].map((key) => ({ key, entryId: '11', quantity: 1, visitKey: 'visit-1' }));
  return {
    id: 100 + n,
    requestId: 5,
    requestReference: 'CC-00005',
    version: n,
    isCurrent,
    sentAt: '2026-04-20T15:00:00Z',
    sentByName: 'Sam Okafor',
    validUntil: '2026-05-20',
    contractor: { organisationId: 7, name: 'Brightline Electric', licenceNumber: 'EC-0048215', licenceState: 'CO', licenceClass: 'Electrical contractor', phone: null, address: null },
    property: { street: '48 Tamarack Loop', city: 'Marlow Springs', state: 'CO', zip: '81290' },
    lines: n === 1 ? [line(40, 'kitchen counter', 21_740)] : [line(40, 'kitchen counter', 13_417), line(41, 'hall bath', 13_416)],
    breakdown: priceQuote(SMALL_BOOK, { visits: [{ key: 'visit-1' }], lines }),
    cardDepositBp: 5_000,
    warrantyText: 'Workmanship is warranted for one year.',
    safetyNotice: 'The work is done by licensed electricians under the local code and permits.',
    note: null,
    changes:
      n === 1
        ? null
        : {
            previousVersion: 1,
            added: [{ lineItemId: 41, code: 'gfci-inoperative', location: 'hall bath', lineCents: 13_416 }],
            removed: [],
            changed: [
              { lineItemId: 40, code: 'gfci-inoperative', location: 'kitchen counter', lineCents: 13_417, previousLineCents: 21_740, quantity: 1, previousQuantity: 1, entryName: 'Replace inoperative GFCI receptacle', previousEntryName: 'Replace inoperative GFCI receptacle' },
            ],
            previousTotalCents: 31_434,
            totalDeltaCents: priceQuote(SMALL_BOOK, { visits: [{ key: 'visit-1' }], lines }).totalCents - 31_434,
          },
    pdfPath: `/api/requests/5/quotes/${n}.pdf`,
  };
}

const V2_TOTAL = version(2, true).breakdown.totalCents;
const summaries: QuoteVersionSummary[] = [
  { version: 2, isCurrent: true, sentAt: '2026-04-21T15:00:00Z', sentByName: 'Sam Okafor', validUntil: '2026-05-21', totalCents: V2_TOTAL, depositCents: 0, lineCount: 2, totalDeltaCents: V2_TOTAL - 31_434 },
  { version: 1, isCurrent: false, sentAt: '2026-04-20T15:00:00Z', sentByName: 'Sam Okafor', validUntil: '2026-05-20', totalCents: 31_434, depositCents: 15_717, lineCount: 1, totalDeltaCents: null },
];

describe('QuoteView', () => {
  let fixture: ComponentFixture<QuoteView>;
  let loader: HarnessLoader;
  let httpTesting: HttpTestingController;

  async function render(versionParam: string | undefined): Promise<HTMLElement> {
    TestBed.configureTestingModule({ providers: [provideRouter([]), provideHttpClient(), provideHttpClientTesting()] });
    TestBed.inject(Auth).useSession({
      user: { id: 9, email: 'tomas@mail.test', name: 'Tomás Garza', role: 'seller', organisationId: null, organisationName: null },
      csrfToken: 't',
    });
    httpTesting = TestBed.inject(HttpTestingController);
    fixture = TestBed.createComponent(QuoteView);
    fixture.componentRef.setInput('id', '5');
    fixture.componentRef.setInput('version', versionParam);
    loader = TestbedHarnessEnvironment.loader(fixture);
    await fixture.whenStable();
    return fixture.nativeElement;
  }

  function flushVersion2(): void {
    httpTesting.expectOne('/api/requests/5/quotes/current').flush(version(2, true));
    httpTesting.expectOne('/api/requests/5/quotes').flush(summaries);
  }

  afterEach(() => httpTesting.verify());

  it('shows the current version with its lines, totals, licence, warranty, safety notice and PDF link', async () => {
    const host = await render(undefined);
    flushVersion2();
    await fixture.whenStable();
    const text = (id: string) => host.querySelector(`[data-testid="${id}"]`)?.textContent?.trim() ?? '';

    expect(text('quote-heading')).toBe('Quote, version 2');
    expect(text('quote-current-flag')).toBe('Current version');
    expect(await (await loader.getHarness(MatTableHarness)).getRows()).toHaveLength(2);
    // Two GFCIs on one visit, 40 min (docs/pricing.md Example 2 without the shallow boxes), by hand:
    // 9,500 + 18,500 + 0 extra + 4,800 materials + 1,680 markup + tax 6,480 × 6 % = 388.8 → 389: 34,869.
    expect(text('totals-quote-total')).toBe('$348.69');
    expect(text('quote-licence')).toBe('Licence EC-0048215, CO (Electrical contractor)');
    expect(text('quote-warranty')).toContain('one year');
    expect(text('quote-safety-notice')).toContain('licensed electricians');
    expect(host.querySelector('[data-testid="quote-pdf"]')?.getAttribute('href')).toBe('/api/requests/5/quotes/2.pdf');
  });

  it('lists what changed against the previous version', async () => {
    const host = await render(undefined);
    flushVersion2();
    await fixture.whenStable();
    expect(host.querySelector('#changes-heading')?.textContent).toBe('What changed since version 1');
    expect(host.querySelector('[data-testid="quote-changes-total"]')?.textContent).toContain('$314.34 → $348.69');
    expect(host.querySelector('[data-testid="quote-changes-total"]')?.textContent).toContain('+$34.35');
    expect(host.querySelector('[data-testid="quote-change-added"]')?.textContent).toContain('hall bath');
    expect(host.querySelector('[data-testid="quote-change-changed"]')?.textContent).toContain('$217.40 → $134.17');
  });

  it('names the current version in the picker and marks an older one as replaced', async () => {
    const host = await render('1');
    httpTesting.expectOne('/api/requests/5/quotes/1').flush(version(1, false));
    httpTesting.expectOne('/api/requests/5/quotes').flush(summaries);
    await fixture.whenStable();
    expect(host.querySelector('[data-testid="quote-current-flag"]')?.textContent?.trim()).toBe('Replaced by version 2');
    expect(host.querySelector('[data-testid="quote-changes"]')).toBeNull();

    const navigate = jest.spyOn(TestBed.inject(Router), 'navigate').mockResolvedValue(true);
    const picker = await loader.getHarness(MatSelectHarness.with({ selector: '[data-testid="quote-version-picker"]' }));
    await picker.open();
    const options = await picker.getOptions();
    expect(await options[0].getText()).toMatch(/^Version 2 · \$348\.69 \(\+\$34\.35\) · current$/);
    await options[0].click();
    expect(navigate).toHaveBeenCalledWith(['/requests', 5, 'quotes', 2]);
  });
});
