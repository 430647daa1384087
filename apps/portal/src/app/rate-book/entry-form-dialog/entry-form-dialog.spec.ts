import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { HarnessLoader } from '@angular/cdk/testing';
import { TestbedHarnessEnvironment } from '@angular/cdk/testing/testbed';
import { ComponentFixture, TestBed } from '@angular/core/testing';
import { MatButtonHarness } from '@angular/material/button/testing';
import { MatButtonToggleHarness } from '@angular/material/button-toggle/testing';
import { MAT_DIALOG_DATA, MatDialogRef } from '@angular/material/dialog';
import { MatFormFieldHarness } from '@angular/material/form-field/testing';
import { MatInputHarness } from '@angular/material/input/testing';
import { RateBookEntryRecord } from '@cc/shared';
import { EntryFormData, EntryFormDialog } from './entry-form-dialog';

const GFCI_ENTRY: RateBookEntryRecord = {
  id: 11,
  key: 'gfci-replace',
  version: 2,
  code: 'gfci-inoperative',
  name: 'Replace inoperative GFCI receptacle',
  unit: 'device',
  pricing: { mode: 'time-and-materials', labourMinutesPerUnit: 20, materialsCentsPerUnit: 2_400, markupBp: null, materials: [], minutesLow: 15, minutesHigh: 25 },
  position: 0,
  isOnSentQuote: true,
  updatedAt: '2026-04-01T10:00:00Z',
};

describe('EntryFormDialog', () => {
  let fixture: ComponentFixture<EntryFormDialog>;
  let loader: HarnessLoader;
  let httpTesting: HttpTestingController;
  const close = jest.fn();

  async function render(data: EntryFormData): Promise<void> {
    close.mockReset();
    TestBed.configureTestingModule({
      providers: [provideHttpClient(), provideHttpClientTesting(), { provide: MAT_DIALOG_DATA, useValue: data }, { provide: MatDialogRef, useValue: { close } }],
    });
    httpTesting = TestBed.inject(HttpTestingController);
    fixture = TestBed.createComponent(EntryFormDialog);
    loader = TestbedHarnessEnvironment.loader(fixture);
    await fixture.whenStable();
  }

  const input = (testId: string) => loader.getHarness(MatInputHarness.with({ selector: `[data-testid="${testId}"]` }));
  const errorsOf = async (label: string) => (await loader.getHarness(MatFormFieldHarness.with({ floatingLabelText: label }))).getTextErrors();
  const save = async () => (await loader.getHarness(MatButtonHarness.with({ text: 'Save entry' }))).click();

  afterEach(() => httpTesting.verify());

  it('shows the shared schema messages and what to type, and sends nothing', async () => {
    await render({ entry: null });
    await (await input('entry-form-minutes')).setValue('twenty');
    await (await input('entry-form-materials-cost')).setValue('24.999');
    await (await input('entry-form-markup')).setValue('600');
    await save();

    expect(await errorsOf('Name')).toEqual(['Name the entry']);
    expect(await errorsOf('Labour minutes per unit')).toEqual(['Enter a whole number']);
    expect(await errorsOf('Materials cost per unit ($)')).toEqual(['Enter dollars and cents, such as 95.00']);
    // ShareBpSchema (shared/src/pricing/rate-book.schema.ts) allows at most 50,000 bp, said as 500 %.
    expect(await errorsOf('Markup (%)')).toEqual(['At most 500 %']);
    httpTesting.expectNone('/api/rate-book/entries');
  });

  it('places the engine rules of an entry on their fields: easy-site above hard-site minutes, a dearer additional unit', async () => {
    await render({ entry: null });
    await (await input('entry-form-name')).setValue('Replace GFCI');
    await (await input('entry-form-minutes')).setValue('20');
    await (await input('entry-form-materials-cost')).setValue('24.00');
    await (await input('entry-form-minutes-low')).setValue('30');
    await (await input('entry-form-minutes-high')).setValue('25');
    await save();
    expect(await errorsOf('Easy-site minutes (ballpark)')).toEqual(['Easy-site minutes exceed hard-site minutes']);

    await (await loader.getHarness(MatButtonToggleHarness.with({ text: 'Flat rate' }))).check();
    await (await input('entry-form-first-unit')).setValue('85');
    await (await input('entry-form-additional-unit')).setValue('175');
    await save();
    expect(await errorsOf('Each additional unit ($)')).toEqual(['Each additional unit costs more than the first']);
    httpTesting.expectNone('/api/rate-book/entries');
  });

  it('changes an entry with its version, in cents, and warns that a sent quote keeps the old version', async () => {
    await render({ entry: GFCI_ENTRY });
    expect((fixture.nativeElement as HTMLElement).querySelector('[data-testid="entry-form-versioned"]')).not.toBeNull();
    await (await input('entry-form-materials-cost')).setValue('26.50');
    await (await input('entry-form-markup')).setValue('40');
    await save();

    const req = httpTesting.expectOne({ method: 'PATCH', url: '/api/rate-book/entries/11' });
    expect(req.request.body).toEqual({
      version: 2,
      code: 'gfci-inoperative',
      name: 'Replace inoperative GFCI receptacle',
      unit: 'device',
      pricing: { mode: 'time-and-materials', labourMinutesPerUnit: 20, materialsCentsPerUnit: 2_650, markupBp: 4_000, materials: [], minutesLow: 15, minutesHigh: 25 },
    });
    req.flush({ ...GFCI_ENTRY, version: 3 });
    expect(close).toHaveBeenCalledWith(expect.objectContaining({ version: 3 }));
  });

  it('says so when someone else changed the entry meanwhile', async () => {
    await render({ entry: GFCI_ENTRY });
    await (await input('entry-form-name')).setValue('Swap GFCI');
    await save();
    httpTesting.expectOne('/api/rate-book/entries/11').flush({ error: 'Stale', details: [] }, { status: 409, statusText: 'Conflict' });
    await fixture.whenStable();
    expect((fixture.nativeElement as HTMLElement).querySelector('[data-testid="entry-form-error"]')?.textContent).toContain('changed this entry meanwhile');
    expect(close).not.toHaveBeenCalled();
  });
});
