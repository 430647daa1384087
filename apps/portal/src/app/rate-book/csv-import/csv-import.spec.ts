import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { ComponentFixture, TestBed } from '@angular/core/testing';
import { CsvImport } from './csv-import';

describe('CsvImport', () => {
  let fixture: ComponentFixture<CsvImport>;
  let httpTesting: HttpTestingController;
  let host: HTMLElement;

  beforeEach(async () => {
    TestBed.configureTestingModule({ providers: [provideHttpClient(), provideHttpClientTesting()] });
    httpTesting = TestBed.inject(HttpTestingController);
    fixture = TestBed.createComponent(CsvImport);
    host = fixture.nativeElement;
    await fixture.whenStable();
  });

  afterEach(() => httpTesting.verify());

  async function choose(text: string): Promise<void> {
    const input = host.querySelector<HTMLInputElement>('[data-testid="csv-file"]')!;
    const file = new File([text], 'rate-book.csv', { type: 'text/csv' });
    Object.defineProperty(input, 'files', { value: [file], configurable: true });
    input.dispatchEvent(new Event('change'));
    await fixture.whenStable();
  }

  it('uploads the chosen file and lists each problem at its row and column', async () => {
    await choose('key,code\n');
    const req = httpTesting.expectOne({ method: 'POST', url: '/api/rate-book/entries/import' });
    expect((req.request.body as FormData).get('file')).toBeInstanceOf(File);
    req.flush(
      {
        error: 'Some rows of the file need attention; nothing was imported',
        details: [
          { path: 'rows.2.markupBp', message: 'Enter a whole number (cents, minutes or basis points)' },
          { path: 'rows.4.key', message: 'The key "gfci-replace" is used in row 1 already' },
        ],
      },
      { status: 400, statusText: 'Bad Request' },
    );
    await fixture.whenStable();
    expect(host.querySelector('[data-testid="csv-import-errors"] p')?.textContent).toContain('nothing was imported');
    expect(Array.from(host.querySelectorAll('[data-testid="csv-import-problem"]')).map((li) => li.textContent?.replace(/\s+/g, ' ').trim())).toEqual([
      'Row 2, markupBp: Enter a whole number (cents, minutes or basis points)',
      'Row 4, key: The key "gfci-replace" is used in row 1 already',
    ]);
  });

  it('reports what an import did and tells the rate book to reload', async () => {
    const imported = jest.fn();
    fixture.componentInstance.imported.subscribe(imported);
    await choose('key,code\n');
    httpTesting.expectOne('/api/rate-book/entries/import').flush({ created: 1, updated: 2, unchanged: 30 });
    await fixture.whenStable();
    expect(host.querySelector('[data-testid="csv-import-result"]')?.textContent).toContain('1 new, 2 changed, 30 unchanged');
    expect(imported).toHaveBeenCalledWith({ created: 1, updated: 2, unchanged: 30 });
    expect(host.querySelector('[data-testid="csv-export"]')?.getAttribute('href')).toBe('/api/rate-book/entries.csv');
  });
});
