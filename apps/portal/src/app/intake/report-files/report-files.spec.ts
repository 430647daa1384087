import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { TestbedHarnessEnvironment } from '@angular/cdk/testing/testbed';
import { TestBed } from '@angular/core/testing';
import { MatButtonHarness } from '@angular/material/button/testing';
import { ReportFile, UploadResult } from '@cc/shared';
import { ReportFiles } from './report-files';

const REPORT: ReportFile = {
  id: 5,
  kind: 'pdf',
  originalName: 'hollow-road-inspection.pdf',
  sizeBytes: 2048,
  pageCount: 2,
  sha256: 'a'.repeat(64),
  textLength: 14,
  skipped: [],
  uploadedByName: 'Ada Agent',
  createdAt: '2026-04-18T10:00:00.000Z',
};

describe('ReportFiles', () => {
  async function setUp() {
    TestBed.configureTestingModule({ providers: [provideHttpClient(), provideHttpClientTesting()] });
    const fixture = TestBed.createComponent(ReportFiles);
    fixture.componentRef.setInput('requestId', 7);
    fixture.componentRef.setInput('reports', [REPORT]);
    await fixture.whenStable();
    return { fixture, http: TestBed.inject(HttpTestingController), loader: TestbedHarnessEnvironment.loader(fixture) };
  }

  afterEach(() => TestBed.inject(HttpTestingController).verify());

  it('lists the report and reads it again on request', async () => {
    const { fixture, http, loader } = await setUp();
    expect(fixture.nativeElement.textContent).toContain('hollow-road-inspection.pdf');
    expect(fixture.nativeElement.textContent).toContain('2 pages');
    const results: UploadResult[] = [];
    fixture.componentInstance.reread.subscribe((r) => results.push(r));
    await (await loader.getHarness(MatButtonHarness.with({ text: /Read again/ }))).click();
    const req = http.expectOne('/api/requests/7/reports/5/reparse');
    expect(req.request.method).toBe('POST');
    const answer: UploadResult = { report: REPORT, isDuplicate: false, proposedCount: 3, skippedCount: 1 };
    req.flush(answer);
    expect(results).toEqual([answer]);
  });
});
