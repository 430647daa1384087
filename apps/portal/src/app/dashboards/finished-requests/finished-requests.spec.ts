import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting, TestRequest } from '@angular/common/http/testing';
import { TestbedHarnessEnvironment } from '@angular/cdk/testing/testbed';
import { ComponentFixture, TestBed } from '@angular/core/testing';
import { MatPaginatorHarness } from '@angular/material/paginator/testing';
import { provideRouter } from '@angular/router';
import { FINAL_STATUSES } from '@cc/shared';
import { Clock } from '../../core/time/clock';
import { summary } from '../../requests/request-summary.testing';
import { FINISHED_PAGE_SIZE, FinishedRequests } from './finished-requests';

// Review 7, P4-2: requests whose corrections were accepted left the agent's dashboard altogether.
describe('FinishedRequests', () => {
  let fixture: ComponentFixture<FinishedRequests>;
  let httpTesting: HttpTestingController;

  beforeEach(async () => {
    TestBed.configureTestingModule({
      providers: [provideRouter([]), provideHttpClient(), provideHttpClientTesting(), { provide: Clock, useValue: { today: () => '2026-12-09' } }],
    });
    httpTesting = TestBed.inject(HttpTestingController);
    fixture = TestBed.createComponent(FinishedRequests);
    await fixture.whenStable();
  });
  afterEach(() => httpTesting.verify());

  const expectList = (): TestRequest => httpTesting.expectOne((req) => req.url === '/api/requests');
  const cards = () => [...(fixture.nativeElement as HTMLElement).querySelectorAll('[data-testid="finished-request"]')].map((c) => c.textContent?.replace(/\s+/g, ' ').trim());

  it('asks the request list for the final states, latest closing first, one page at a time', async () => {
    const req = expectList();
    expect(req.request.params.get('status')).toBe(FINAL_STATUSES.join(','));
    expect(req.request.params.get('sort')).toBe('closingDate');
    expect(req.request.params.get('direction')).toBe('desc');
    expect(req.request.params.get('pageSize')).toBe(String(FINISHED_PAGE_SIZE));
    expect(req.request.params.get('page')).toBe('0');
    req.flush({ items: [summary(11, { status: 'accepted', closingDate: '2026-12-09', itemCount: 3 }), summary(8, { status: 'withdrawn', closingDate: '2026-12-01', itemCount: 1 })], total: 2, page: 0, pageSize: FINISHED_PAGE_SIZE, nextCursor: null });
    await fixture.whenStable();
    expect(cards()).toEqual([
      'CC-0011Finished11 Aspen Court, Fort Collins, CO 80521Proof accepted Closing Dec 9, 2026 · closing today · 3 items',
      'CC-0008Finished8 Aspen Court, Fort Collins, CO 80521Withdrawn Closing Dec 1, 2026 · passed 8 days ago · 1 item',
    ]);
    // Two finished requests fit on one page: no paginator.
    expect(await TestbedHarnessEnvironment.loader(fixture).getAllHarnesses(MatPaginatorHarness)).toEqual([]);
  });

  it('pages by key: the next page starts after the cursor the first page gave', async () => {
    expectList().flush({ items: Array.from({ length: FINISHED_PAGE_SIZE }, (_, i) => summary(i + 1, { status: 'accepted' })), total: 9, page: 0, pageSize: FINISHED_PAGE_SIZE, nextCursor: 'after-page-0' });
    await fixture.whenStable();
    await (await TestbedHarnessEnvironment.loader(fixture).getHarness(MatPaginatorHarness)).goToNextPage();
    const next = expectList();
    expect(next.request.params.get('after')).toBe('after-page-0');
    expect(next.request.params.get('page')).toBe('1');
    next.flush({ items: [summary(7, { status: 'declined' })], total: 9, page: 1, pageSize: FINISHED_PAGE_SIZE, nextCursor: null });
    await fixture.whenStable();
    expect(cards()).toHaveLength(1);
  });

  it('says what finished means when there is none', async () => {
    expectList().flush({ items: [], total: 0, page: 0, pageSize: FINISHED_PAGE_SIZE, nextCursor: null });
    await fixture.whenStable();
    expect((fixture.nativeElement as HTMLElement).textContent).toContain('No finished requests yet');
  });
});
