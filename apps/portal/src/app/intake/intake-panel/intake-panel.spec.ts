import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { HarnessLoader } from '@angular/cdk/testing';
import { TestbedHarnessEnvironment } from '@angular/cdk/testing/testbed';
import { ComponentFixture, TestBed } from '@angular/core/testing';
import { MatExpansionPanelHarness } from '@angular/material/expansion/testing';
import { MatTableHarness } from '@angular/material/table/testing';
import { PartyRole, RepairRequestDetail, RequestStatus, Role, toLineItemList } from '@cc/shared';
import { Auth } from '../../core/auth/auth';
import { proposedItems, report, reportText } from '../testing/intake-fixtures';
import { IntakePanel } from './intake-panel';

function request(status: RequestStatus, myParts: PartyRole[]): RepairRequestDetail {
  return {
    id: 12,
    reference: 'CC-0012',
    street: '77 Juniper Row',
    city: 'Golden',
    state: 'CO',
    zip: '80401',
    yearBuilt: 1955,
    closingDate: '2026-05-01',
    necEdition: 2023,
    status,
    contractorName: null,
    itemCount: 3,
    openWorkCount: 0,
    isAtRisk: false,
    createdAt: '2026-04-01T10:00:00Z',
    updatedAt: '2026-04-01T10:00:00Z',
    contractor: null,
    parties: [],
    history: [],
    myParts,
  };
}

describe('IntakePanel', () => {
  let fixture: ComponentFixture<IntakePanel>;
  let loader: HarnessLoader;
  let httpTesting: HttpTestingController;

  async function render(role: Role, status: RequestStatus, myParts: PartyRole[], items = proposedItems()): Promise<HTMLElement> {
    TestBed.configureTestingModule({ providers: [provideHttpClient(), provideHttpClientTesting()] });
    TestBed.inject(Auth).useSession({
      user: { id: 3, email: 'ada@ridge.example', name: 'Ada Agent', role, organisationId: null, organisationName: null },
      csrfToken: 't',
    });
    httpTesting = TestBed.inject(HttpTestingController);
    fixture = TestBed.createComponent(IntakePanel);
    fixture.componentRef.setInput('request', request(status, myParts));
    loader = TestbedHarnessEnvironment.loader(fixture);
    await fixture.whenStable();
    httpTesting.expectOne('/api/requests/12/reports').flush([report()]);
    // The item list as the server sends it: each edition note once, by key.
    httpTesting.expectOne('/api/requests/12/items').flush(toLineItemList(items));
    // The review (where shown) loads the text of the report beside it.
    fixture.detectChanges();
    for (const text of httpTesting.match('/api/requests/12/reports/5/text')) text.flush(reportText());
    await fixture.whenStable();
    return fixture.nativeElement;
  }

  afterEach(() => httpTesting.verify());

  it('gives the buyer’s agent the upload, the review beside the report text and the skipped text while in intake', async () => {
    const host = await render('agent', 'intake', ['buyer-agent']);
    expect(host.querySelector('cc-report-upload')).not.toBeNull();
    expect(host.querySelector('cc-item-review')).not.toBeNull();
    const skipped = await loader.getHarness(MatExpansionPanelHarness);
    expect(await skipped.getDescription()).toBe('1 passage with no electrical item');
    await skipped.expand();
    expect(await skipped.getTextContent()).toContain('Shingles are worn at the ridge.');
  });

  it('lets the inspector add the report but not review the items', async () => {
    const host = await render('inspector', 'intake', ['inspector']);
    expect(host.querySelector('cc-report-upload')).not.toBeNull();
    expect(host.querySelector('cc-item-review')).toBeNull();
    expect(host.querySelector('cc-line-item-list')).not.toBeNull();
  });

  it('shows every party the confirmed items read-only once pricing has begun', async () => {
    const open = proposedItems().map((i) => ({ ...i, status: 'open' as const }));
    const host = await render('seller', 'pricing', ['seller'], open);
    expect(host.querySelector('cc-report-upload')).toBeNull();
    expect(host.querySelector('cc-item-review')).toBeNull();
    const cells = await (await loader.getHarness(MatTableHarness)).getCellTextByColumnName();
    expect(cells['room'].text).toEqual(['Kitchen', 'Bedroom', 'Garage']);
    expect(cells['quantity'].text).toEqual(['2', 'Not stated', 'Not stated']);
    expect(cells['status'].text).toEqual(['Confirmed', 'Confirmed', 'Confirmed']);
    expect(cells['code'].text[2]).toContain('Junction box without a cover');
  });

  it('keeps the agent’s view read-only after the review too', async () => {
    const open = proposedItems().map((i) => ({ ...i, status: 'open' as const }));
    const host = await render('agent', 'pricing', ['buyer-agent'], open);
    expect(host.querySelector('cc-report-upload')).toBeNull();
    expect(host.querySelector('cc-line-item-list')).not.toBeNull();
  });

  it('says there are no items yet when nothing was added', async () => {
    const host = await render('seller', 'draft', ['seller'], []);
    expect(host.querySelector('[data-testid="line-items-empty"]')?.textContent).toContain('No items yet');
  });

  it('loads the lists once after the first report (no request started and then cancelled)', async () => {
    await render('agent', 'draft', ['buyer-agent'], []);
    let changes = 0;
    fixture.componentInstance.requestChanged.subscribe(() => changes++);
    const upload = fixture.debugElement.query((el) => el.name === 'cc-report-upload');
    upload.triggerEventHandler('parsed', { report: report(), isDuplicate: false, proposedCount: 3, skippedCount: 1 });
    await fixture.whenStable();
    // The request moves to intake; only the reloaded request brings new lists.
    expect(changes).toBe(1);
    httpTesting.expectNone('/api/requests/12/reports');
    fixture.componentRef.setInput('request', request('intake', ['buyer-agent']));
    await fixture.whenStable();
    const reports = httpTesting.match('/api/requests/12/reports');
    const items = httpTesting.match('/api/requests/12/items');
    expect([reports.length, items.length]).toEqual([1, 1]);
    expect(reports[0].cancelled || items[0].cancelled).toBe(false);
    reports[0].flush([report()]);
    items[0].flush(toLineItemList(proposedItems()));
  });
});
