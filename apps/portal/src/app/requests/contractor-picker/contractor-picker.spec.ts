import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { TestBed } from '@angular/core/testing';
import { TestbedHarnessEnvironment } from '@angular/cdk/testing/testbed';
import { MatButtonHarness } from '@angular/material/button/testing';
import { MatSelectHarness } from '@angular/material/select/testing';
import { ContractorPicker } from './contractor-picker';

const CONTRACTORS = [
  { id: 3, name: 'Alder Wiring', kind: 'contractor', phone: null, address: null, licenceNumber: 'EC-1', licenceState: 'CO', licenceClass: null },
  { id: 4, name: 'Birch Electric', kind: 'contractor', phone: null, address: null, licenceNumber: 'EC-2', licenceState: 'CO', licenceClass: null },
];

describe('ContractorPicker', () => {
  async function setUp(currentId: number | null) {
    TestBed.configureTestingModule({ providers: [provideHttpClient(), provideHttpClientTesting()] });
    const fixture = TestBed.createComponent(ContractorPicker);
    fixture.componentRef.setInput('requestId', 9);
    fixture.componentRef.setInput('currentId', currentId);
    const http = TestBed.inject(HttpTestingController);
    http.expectOne('/api/contractors').flush(CONTRACTORS);
    await fixture.whenStable();
    return { fixture, http, loader: TestbedHarnessEnvironment.loader(fixture) };
  }

  afterEach(() => TestBed.inject(HttpTestingController).verify());

  it('assigns the chosen contractor and passes on the answer', async () => {
    const { fixture, http, loader } = await setUp(3);
    const changed: unknown[] = [];
    fixture.componentInstance.changed.subscribe((d) => changed.push(d));
    const select = await loader.getHarness(MatSelectHarness);
    await select.open();
    const options = await select.getOptions();
    expect(await options[0].isDisabled()).toBe(true); // the current one
    await options[1].click();
    await (await loader.getHarness(MatButtonHarness.with({ text: 'Assign' }))).click();
    const req = http.expectOne('/api/requests/9/contractor');
    expect(req.request.method).toBe('PUT');
    expect(req.request.body).toEqual({ contractorOrganisationId: 4 });
    req.flush({ id: 9 });
    expect(changed).toEqual([{ id: 9 }]);
  });

  it('shows the server’s refusal', async () => {
    const { fixture, http, loader } = await setUp(null);
    const select = await loader.getHarness(MatSelectHarness);
    await select.clickOptions({ text: /Alder Wiring/ });
    await (await loader.getHarness(MatButtonHarness.with({ text: 'Assign' }))).click();
    http.expectOne('/api/requests/9/contractor').flush({ error: 'A quote was sent already', details: [] }, { status: 409, statusText: 'Conflict' });
    await fixture.whenStable();
    expect(fixture.nativeElement.querySelector('[role=alert]').textContent).toContain('A quote was sent already');
  });
});
