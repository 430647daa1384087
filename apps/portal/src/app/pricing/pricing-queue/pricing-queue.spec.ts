import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { HarnessLoader } from '@angular/cdk/testing';
import { TestbedHarnessEnvironment } from '@angular/cdk/testing/testbed';
import { ComponentFixture, TestBed } from '@angular/core/testing';
import { MatTableHarness } from '@angular/material/table/testing';
import { provideRouter } from '@angular/router';
import { Clock } from '../../core/time/clock';
import { requestDetail } from '../testing/pricing-fixtures';
import { PricingQueue } from './pricing-queue';

describe('PricingQueue', () => {
  let fixture: ComponentFixture<PricingQueue>;
  let loader: HarnessLoader;
  let httpTesting: HttpTestingController;

  beforeEach(async () => {
    TestBed.configureTestingModule({
      providers: [provideRouter([]), provideHttpClient(), provideHttpClientTesting(), { provide: Clock, useValue: { today: () => '2026-04-20' } }],
    });
    httpTesting = TestBed.inject(HttpTestingController);
    fixture = TestBed.createComponent(PricingQueue);
    loader = TestbedHarnessEnvironment.loader(fixture);
    await fixture.whenStable();
  });

  afterEach(() => httpTesting.verify());

  it('asks for the requests awaiting a price, soonest closing first, and shows their item counts and closings', async () => {
    const req = httpTesting.expectOne((r) => r.url === '/api/requests');
    expect(req.request.params.get('status')).toBe('pricing');
    expect(req.request.params.get('sort')).toBe('closingDate');
    expect(req.request.params.get('direction')).toBe('asc');
    const rows = [requestDetail({ itemCount: 4, closingDate: '2026-04-24' }), requestDetail({ id: 6, reference: 'CC-00006', itemCount: 1, closingDate: '2026-05-10' })];
    req.flush({ items: rows, total: 2, page: 0, pageSize: 20 });
    await fixture.whenStable();

    const cells = await (await loader.getHarness(MatTableHarness)).getCellTextByColumnName();
    expect(cells['itemCount'].text).toEqual(['4', '1']);
    // 2026-04-20 → 2026-04-24 is 4 calendar days.
    expect(cells['closingDate'].text[0]).toContain('in 4 days');
    expect(cells['reference'].text).toEqual(['CC-00005', 'CC-00006']);
  });
});
