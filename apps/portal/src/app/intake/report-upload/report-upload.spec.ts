import { HttpEventType, provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { HarnessLoader } from '@angular/cdk/testing';
import { TestbedHarnessEnvironment } from '@angular/cdk/testing/testbed';
import { ComponentFixture, TestBed } from '@angular/core/testing';
import { MatButtonHarness } from '@angular/material/button/testing';
import { MatInputHarness } from '@angular/material/input/testing';
import { MatProgressBarHarness } from '@angular/material/progress-bar/testing';
import { UploadResult } from '@cc/shared';
import { uploadResult } from '../testing/intake-fixtures';
import { ReportUpload } from './report-upload';

describe('ReportUpload', () => {
  let fixture: ComponentFixture<ReportUpload>;
  let loader: HarnessLoader;
  let httpTesting: HttpTestingController;
  let results: UploadResult[];

  beforeEach(async () => {
    TestBed.configureTestingModule({ providers: [provideHttpClient(), provideHttpClientTesting()] });
    httpTesting = TestBed.inject(HttpTestingController);
    fixture = TestBed.createComponent(ReportUpload);
    fixture.componentRef.setInput('requestId', 12);
    results = [];
    fixture.componentInstance.parsed.subscribe((r) => results.push(r));
    loader = TestbedHarnessEnvironment.loader(fixture);
    await fixture.whenStable();
  });

  afterEach(() => httpTesting.verify());

  const host = (): HTMLElement => fixture.nativeElement;

  async function choose(file: File): Promise<void> {
    const input = host().querySelector<HTMLInputElement>('[data-testid="report-file-input"]')!;
    Object.defineProperty(input, 'files', { value: [file], configurable: true });
    input.dispatchEvent(new Event('change'));
    await fixture.whenStable();
  }

  const pdf = () => new File(['%PDF-1.7 report'], 'inspection.pdf', { type: 'application/pdf' });

  it('sends the file as the multipart field "file", shows the upload progress, then hands on the parse result', async () => {
    await choose(pdf());
    const req = httpTesting.expectOne('/api/requests/12/reports');
    expect(req.request.method).toBe('POST');
    expect(req.request.reportProgress).toBe(true);
    expect((req.request.body as FormData).get('file')).toBeInstanceOf(File);

    req.event({ type: HttpEventType.UploadProgress, loaded: 40, total: 100 });
    await fixture.whenStable();
    const bar = await loader.getHarness(MatProgressBarHarness);
    expect(await bar.getValue()).toBe(40);
    expect(host().querySelector('[data-testid="report-upload-progress"]')?.textContent).toContain('40 %');

    req.event({ type: HttpEventType.UploadProgress, loaded: 100, total: 100 });
    await fixture.whenStable();
    expect(host().textContent).toContain('Reading “inspection.pdf”');

    req.flush(uploadResult(), { status: 201, statusText: 'Created' });
    await fixture.whenStable();
    expect(results).toEqual([uploadResult()]);
    expect(await loader.getAllHarnesses(MatProgressBarHarness)).toHaveLength(0);
  });

  it('shows the server’s words for a refused file type (415) and does not offer pasting for it', async () => {
    await choose(new File(['x'], 'photo.png', { type: 'image/png' }));
    httpTesting.expectOne('/api/requests/12/reports').flush(
      { error: 'Only PDF and plain-text reports can be read', details: [{ path: 'file', message: 'Upload a PDF or a .txt file, or paste the text' }] },
      { status: 415, statusText: 'Unsupported Media Type' },
    );
    await fixture.whenStable();
    const alert = host().querySelector('[data-testid="report-upload-error"]')!;
    expect(alert.getAttribute('role')).toBe('alert');
    expect(alert.textContent).toContain('Only PDF and plain-text reports can be read');
    expect(alert.textContent).toContain('Upload a PDF or a .txt file');
    expect(host().querySelector('cc-paste-report')).toBeNull();
    expect(results).toEqual([]);
  });

  it('opens the paste box when a PDF has no text layer (422), and reads the pasted text instead', async () => {
    await choose(pdf());
    httpTesting.expectOne('/api/requests/12/reports').flush(
      { error: 'This PDF has no text layer (it looks like scanned images)', details: [{ path: 'file', message: 'Paste the electrical findings into the text box instead' }] },
      { status: 422, statusText: 'Unprocessable Entity' },
    );
    await fixture.whenStable();
    expect(host().querySelector('[data-testid="report-upload-error"]')?.textContent).toContain('no text layer');
    expect(host().querySelector('cc-paste-report')).not.toBeNull();

    // Too short for the paste schema: the field says so and nothing is sent.
    const text = await loader.getHarness(MatInputHarness.with({ selector: '[data-testid="paste-text"]' }));
    await text.setValue('GFCI');
    await (await loader.getHarness(MatButtonHarness.with({ text: 'Read the pasted text' }))).click();
    expect(host().textContent).toContain('Paste the electrical part of the report');
    httpTesting.expectNone('/api/requests/12/reports/paste');

    const pasted = 'Electrical: the garage receptacles are not GFCI protected.';
    await text.setValue(pasted);
    await (await loader.getHarness(MatButtonHarness.with({ text: 'Read the pasted text' }))).click();
    const req = httpTesting.expectOne('/api/requests/12/reports/paste');
    expect(req.request.body).toEqual({ text: pasted });
    req.flush(uploadResult({ proposedCount: 1 }), { status: 201, statusText: 'Created' });
    await fixture.whenStable();
    expect(results.map((r) => r.proposedCount)).toEqual([1]);
    expect(host().querySelector('[data-testid="report-upload-error"]')).toBeNull();
  });

  it('refuses a file over 25 MB before sending it, and words a 413 from the server the same way', async () => {
    const big = pdf();
    Object.defineProperty(big, 'size', { value: 26 * 1024 * 1024 });
    await choose(big);
    httpTesting.expectNone('/api/requests/12/reports');
    expect(host().querySelector('[data-testid="report-upload-error"]')?.textContent).toContain('larger than 25 MB');

    await choose(pdf());
    httpTesting.expectOne('/api/requests/12/reports').flush(
      { error: 'The file is larger than allowed', details: [{ path: 'file', message: 'The file is larger than allowed' }] },
      { status: 413, statusText: 'Payload Too Large' },
    );
    await fixture.whenStable();
    expect(host().querySelector('[data-testid="report-upload-error"]')?.textContent).toContain('The file is larger than allowed (at most 25 MB)');
  });
});
