import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting, TestRequest } from '@angular/common/http/testing';
import { HarnessLoader } from '@angular/cdk/testing';
import { TestbedHarnessEnvironment } from '@angular/cdk/testing/testbed';
import { ComponentFixture, TestBed } from '@angular/core/testing';
import { MatInputHarness } from '@angular/material/input/testing';
import { MatPaginatorHarness } from '@angular/material/paginator/testing';
import { MatSelectHarness } from '@angular/material/select/testing';
import { MatSortHarness } from '@angular/material/sort/testing';
import { MatTableHarness } from '@angular/material/table/testing';
import { provideRouter, Router } from '@angular/router';
import { Page, RepairRequestSummary, Role } from '@cc/shared';
import { Auth } from '../../core/auth/auth';
import { Clock } from '../../core/time/clock';
import { RequestList } from './request-list';
import { summary } from '../request-summary.testing';

function page(items: RepairRequestSummary[], total: number, pageIndex = 0): Page<RepairRequestSummary> {
  return { items, total, page: pageIndex, pageSize: 20 };
}

describe('RequestList', () => {
  let fixture: ComponentFixture<RequestList>;
  let loader: HarnessLoader;
  let httpTesting: HttpTestingController;

  async function render(role: Role): Promise<void> {
    TestBed.configureTestingModule({
      providers: [
        provideRouter([]),
        provideHttpClient(),
        provideHttpClientTesting(),
        { provide: Clock, useValue: { today: () => '2026-04-10' } },
      ],
    });
    TestBed.inject(Auth).useSession({
      user: { id: 3, email: 'u@example.test', name: 'Uma User', role, organisationId: null, organisationName: null },
      csrfToken: 't',
    });
    httpTesting = TestBed.inject(HttpTestingController);
    fixture = TestBed.createComponent(RequestList);
    loader = TestbedHarnessEnvironment.loader(fixture);
    await fixture.whenStable();
  }

  function expectList(): TestRequest {
    return httpTesting.expectOne((req) => req.url === '/api/requests');
  }

  async function settle(): Promise<void> {
    await fixture.whenStable();
  }

  afterEach(() => httpTesting.verify());

  it('asks for the first page sorted by closing date, then shows one row per request', async () => {
    await render('agent');
    const req = expectList();
    expect(req.request.params.get('page')).toBe('0');
    expect(req.request.params.get('pageSize')).toBe('20');
    expect(req.request.params.get('sort')).toBe('closingDate');
    expect(req.request.params.get('direction')).toBe('asc');
    expect(req.request.params.has('status')).toBe(false);
    expect(req.request.params.has('q')).toBe(false);
    req.flush(page([summary(1), summary(2, { closingDate: '2026-04-07', status: 'quoted', contractorName: null })], 2));
    await settle();

    const table = await loader.getHarness(MatTableHarness);
    const rows = await table.getCellTextByColumnName();
    expect(rows['reference'].text).toEqual(['CC-0001', 'CC-0002']);
    // 2026-04-10 → 2026-04-22 is 12 calendar days; 2026-04-07 was 3 days before.
    expect(rows['closingDate'].text[0]).toContain('in 12 days');
    expect(rows['closingDate'].text[1]).toContain('passed 3 days ago');
    expect(rows['status'].text).toEqual(['Awaiting prices', 'Quote with seller']);
    expect(rows['contractor'].text).toEqual(['Foothill Wiring Co.', 'Not chosen yet']);
    expect(rows['itemCount'].text).toEqual(['4', '4']);
  });

  it('asks for the next page when the paginator moves on', async () => {
    await render('agent');
    expectList().flush(page(Array.from({ length: 20 }, (_, i) => summary(i + 1)), 45));
    await settle();

    await (await loader.getHarness(MatPaginatorHarness)).goToNextPage();
    const req = expectList();
    expect(req.request.params.get('page')).toBe('1');
    expect(req.request.params.get('sort')).toBe('closingDate');
    req.flush(page([summary(21)], 45, 1));
  });

  it('pages by key: the next page starts after the cursor the page before gave, and going back reuses the earlier one', async () => {
    await render('agent');
    expectList().flush({ ...page(Array.from({ length: 20 }, (_, i) => summary(i + 1)), 60), nextCursor: 'after-page-0' });
    await settle();
    const paginator = await loader.getHarness(MatPaginatorHarness);

    await paginator.goToNextPage();
    const second = expectList();
    expect(second.request.params.get('after')).toBe('after-page-0');
    expect(second.request.params.get('page')).toBe('1');
    second.flush({ ...page(Array.from({ length: 20 }, (_, i) => summary(i + 21)), 60, 1), nextCursor: 'after-page-1' });
    await settle();

    await paginator.goToNextPage();
    const third = expectList();
    expect(third.request.params.get('after')).toBe('after-page-1');
    third.flush({ ...page([summary(41)], 60, 2), nextCursor: null });
    await settle();

    await paginator.goToPreviousPage();
    const back = expectList();
    expect(back.request.params.get('after')).toBe('after-page-0');
    back.flush({ ...page(Array.from({ length: 20 }, (_, i) => summary(i + 21)), 60, 1), nextCursor: 'after-page-1' });
    await settle();

    await paginator.goToPreviousPage();
    const first = expectList();
    expect(first.request.params.has('after')).toBe(false);
    first.flush({ ...page(Array.from({ length: 20 }, (_, i) => summary(i + 1)), 60), nextCursor: 'after-page-0' });
  });

  it('goes on past a capped total while the server says more pages follow, never showing an exact figure it did not count', async () => {
    await render('agent');
    const rows = (from: number, count = 20) => Array.from({ length: count }, (_, i) => summary(from + i));
    // A search the server counted to its cap of 100: 127 rows in all, which the portal learns page by page.
    expectList().flush({ ...page(rows(1), 100), isTotalCapped: true, nextCursor: 'after-0' });
    await settle();
    const paginator = await loader.getHarness(MatPaginatorHarness);
    expect(await paginator.getRangeLabel()).toBe('1 – 20 of 100+');

    for (let p = 1; p <= 5; p++) {
      expect(await paginator.isNextPageDisabled()).toBe(false);
      await paginator.goToNextPage();
      const req = expectList();
      expect(req.request.params.get('after')).toBe(`after-${p - 1}`);
      req.flush({ ...page(rows(20 * p + 1), 100, p), isTotalCapped: true, nextCursor: `after-${p}` });
      await settle();
    }
    // Past the cap: more rows than this page's last, since a next page follows.
    expect(await paginator.getRangeLabel()).toBe('101 – 120 of 120+');
    expect(await paginator.isNextPageDisabled()).toBe(false);

    await paginator.goToNextPage();
    const last = expectList();
    expect(last.request.params.get('after')).toBe('after-5');
    last.flush({ ...page(rows(121, 7), 100, 6), isTotalCapped: true, nextCursor: null });
    await settle();
    // The last page ends the list: its exact total is known now.
    expect(await paginator.getRangeLabel()).toBe('121 – 127 of 127');
    expect(await paginator.isNextPageDisabled()).toBe(true);
    expect(await (await loader.getHarness(MatTableHarness)).getRows()).toHaveLength(7);
  });

  it('sorts on the server and starts again from the first page', async () => {
    await render('agent');
    expectList().flush(page(Array.from({ length: 20 }, (_, i) => summary(i + 1)), 45));
    await settle();
    await (await loader.getHarness(MatPaginatorHarness)).goToNextPage();
    expectList().flush(page([summary(21)], 45, 1));
    await settle();

    const header = await (await loader.getHarness(MatSortHarness)).getSortHeaders({ label: 'Status' });
    await header[0].click();
    const req = expectList();
    expect(req.request.params.get('sort')).toBe('status');
    expect(req.request.params.get('direction')).toBe('asc');
    expect(req.request.params.get('page')).toBe('0');
    req.flush(page([summary(3)], 45));
  });

  it('filters by several statuses, comma-separated', async () => {
    await render('agent');
    expectList().flush(page([summary(1)], 1));
    await settle();

    const status = await loader.getHarness(MatSelectHarness.with({ selector: '[data-testid="request-list-status"]' }));
    await status.open();
    await status.clickOptions({ text: 'Quote with seller' });
    expect(expectList().request.params.get('status')).toBe('quoted');
    await status.clickOptions({ text: 'Approved' });
    const req = expectList();
    expect(req.request.params.get('status')).toBe('quoted,approved');
    req.flush(page([], 0));
    await settle();

    const empty = (fixture.nativeElement as HTMLElement).querySelector('[data-testid="request-list-empty"]');
    expect(empty?.textContent).toContain('No requests match these filters');
  });

  it('filters by the year the house was built, on the server, and shows the year on each row', async () => {
    await render('contractor');
    expectList().flush(page([summary(1)], 1));
    await settle();
    expect((fixture.nativeElement as HTMLElement).querySelector('.place')?.textContent).toContain('built 1978');

    const built = await loader.getHarness(MatSelectHarness.with({ selector: '[data-testid="request-list-built"]' }));
    await built.clickOptions({ text: 'Built before 1975' });
    const req = expectList();
    expect(req.request.params.get('builtBefore')).toBe('1975');
    expect(req.request.params.get('page')).toBe('0');
    req.flush(page([], 0));
    await settle();
    expect((fixture.nativeElement as HTMLElement).querySelector('[data-testid="request-list-empty"]')?.textContent).toContain('No requests match these filters');

    await built.clickOptions({ text: 'Any year' });
    const all = expectList();
    expect(all.request.params.has('builtBefore')).toBe(false);
    all.flush(page([summary(1)], 1));
  });

  it('searches after typing pauses, with the text trimmed', async () => {
    await render('agent');
    expectList().flush(page([summary(1)], 1));
    await settle();

    await (await loader.getHarness(MatInputHarness.with({ selector: '[data-testid="request-list-search"]' }))).setValue(' aspen ');
    httpTesting.expectNone((req) => req.url === '/api/requests');
    await new Promise((resolve) => setTimeout(resolve, 350));
    await settle();
    const req = expectList();
    expect(req.request.params.get('q')).toBe('aspen');
    req.flush(page([summary(1)], 1));
  });

  it('opens the detail page when a row is clicked', async () => {
    await render('contractor');
    const navigate = jest.spyOn(TestBed.inject(Router), 'navigate').mockResolvedValue(true);
    expectList().flush(page([summary(8)], 1));
    await settle();

    (fixture.nativeElement as HTMLElement).querySelector<HTMLElement>('[data-testid="request-row"]')?.click();
    expect(navigate).toHaveBeenCalledWith(['/requests', 8]);
  });

  it('names the list after the role and offers a new request only to agents', async () => {
    await render('contractor');
    expectList().flush(page([], 0));
    await settle();
    const host: HTMLElement = fixture.nativeElement;
    expect(host.querySelector('h1')?.textContent).toContain('Assigned requests');
    expect(host.querySelector('[data-testid="request-list-new"]')).toBeNull();
    expect(host.querySelector('[data-testid="request-list-empty"]')?.textContent).toContain('Nothing here yet');
  });
});
