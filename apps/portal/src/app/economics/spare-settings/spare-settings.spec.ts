import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { TestbedHarnessEnvironment } from '@angular/cdk/testing/testbed';
import { ComponentFixture, TestBed } from '@angular/core/testing';
import { MatExpansionPanelHarness } from '@angular/material/expansion/testing';
import { MatInputHarness } from '@angular/material/input/testing';
import type { SpareSettingsView } from '@cc/shared';
import { SpareSettings } from './spare-settings';

const view = (gfci: number): SpareSettingsView => ({
  entries: [
    { entryKey: 'gfci-replace', name: 'Replace inoperative GFCI receptacle', hasMaterials: true, spareUnits: gfci },
    { entryKey: 'panel-directory', name: 'Trace circuits and write panel directory', hasMaterials: false, spareUnits: 0 },
  ],
});

describe('SpareSettings', () => {
  let fixture: ComponentFixture<SpareSettings>;
  let httpTesting: HttpTestingController;

  beforeEach(async () => {
    TestBed.configureTestingModule({ providers: [provideHttpClient(), provideHttpClientTesting()] });
    httpTesting = TestBed.inject(HttpTestingController);
    fixture = TestBed.createComponent(SpareSettings);
    await fixture.whenStable();
  });

  afterEach(() => httpTesting.verify());

  it('loads the allowance when opened, lists only entries with materials, and saves the counts', async () => {
    const loader = TestbedHarnessEnvironment.loader(fixture);
    await (await loader.getHarness(MatExpansionPanelHarness)).expand();
    httpTesting.expectOne('/api/economics/spares').flush(view(0));
    await fixture.whenStable();
    const inputs = await loader.getAllHarnesses(MatInputHarness);
    expect(inputs).toHaveLength(1);
    await inputs[0].setValue('2');
    let saved = 0;
    fixture.componentInstance.saved.subscribe(() => saved++);
    (fixture.nativeElement as HTMLElement).querySelector<HTMLButtonElement>('[data-testid="spares-save"]')!.click();
    const req = httpTesting.expectOne({ method: 'PUT', url: '/api/economics/spares' });
    expect(req.request.body).toEqual({ spares: [{ entryKey: 'gfci-replace', spareUnits: 2 }, { entryKey: 'panel-directory', spareUnits: 0 }] });
    req.flush(view(2));
    await fixture.whenStable();
    expect(saved).toBe(1);
  });

  it('refuses a count above 20 before anything is sent', async () => {
    const loader = TestbedHarnessEnvironment.loader(fixture);
    await (await loader.getHarness(MatExpansionPanelHarness)).expand();
    httpTesting.expectOne('/api/economics/spares').flush(view(0));
    await fixture.whenStable();
    await (await loader.getHarness(MatInputHarness)).setValue('21');
    (fixture.nativeElement as HTMLElement).querySelector<HTMLButtonElement>('[data-testid="spares-save"]')!.click();
    await fixture.whenStable();
    httpTesting.expectNone({ method: 'PUT', url: '/api/economics/spares' });
  });
});
