import { HarnessLoader } from '@angular/cdk/testing';
import { TestbedHarnessEnvironment } from '@angular/cdk/testing/testbed';
import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { ComponentFixture, TestBed } from '@angular/core/testing';
import { MatButtonHarness } from '@angular/material/button/testing';
import { MAT_DIALOG_DATA, MatDialogRef } from '@angular/material/dialog';
import { MatFormFieldHarness } from '@angular/material/form-field/testing';
import { MatInputHarness } from '@angular/material/input/testing';
import { CancelVisitDialog, type CancelVisitData } from './cancel-visit-dialog';

const DATA: CancelVisitData = { requestId: 20, visitId: 41, visitNumber: 2, version: 3, what: 'Thu, Jan 7, 13:00–15:00 · Lee Park · 311 Spindle Way' };

describe('CancelVisitDialog', () => {
  let fixture: ComponentFixture<CancelVisitDialog>;
  let loader: HarnessLoader;
  let http: HttpTestingController;
  const close = jest.fn();

  beforeEach(async () => {
    close.mockReset();
    TestBed.configureTestingModule({
      providers: [provideHttpClient(), provideHttpClientTesting(), { provide: MAT_DIALOG_DATA, useValue: DATA }, { provide: MatDialogRef, useValue: { close } }],
    });
    http = TestBed.inject(HttpTestingController);
    fixture = TestBed.createComponent(CancelVisitDialog);
    loader = TestbedHarnessEnvironment.loader(fixture);
    await fixture.whenStable();
  });
  afterEach(() => http.verify());

  const reason = () => loader.getHarness(MatInputHarness.with({ selector: '[data-testid="cancel-visit-reason"]' }));
  const go = async () => (await loader.getHarness(MatButtonHarness.with({ text: 'Cancel the visit' }))).click();
  const host = () => fixture.nativeElement as HTMLElement;

  it('says which visit is called off', () => {
    expect(host().textContent).toContain('Cancel visit 2');
    expect(host().textContent).toContain(DATA.what);
  });

  it('asks for the reason under its field and sends nothing without one', async () => {
    await go();
    const field = await loader.getHarness(MatFormFieldHarness.with({ floatingLabelText: 'Why is the visit cancelled?' }));
    expect(await field.getTextErrors()).toEqual(['Say why the visit is cancelled']);
    expect(close).not.toHaveBeenCalled();
  });

  it('sends the trimmed reason with the version shown and closes with the cancelled visit', async () => {
    await (await reason()).setValue('  Occupant ill  ');
    await go();
    const req = http.expectOne('/api/requests/20/visits/41/cancel');
    expect(req.request.body).toEqual({ reason: 'Occupant ill', version: 3 });
    req.flush({ id: 41, status: 'cancelled' });
    expect(close).toHaveBeenCalledWith({ id: 41, status: 'cancelled' });
  });

  it('shows a visit moved or started meanwhile (409) as the dialog’s alert and stays open', async () => {
    await (await reason()).setValue('Occupant ill');
    await go();
    http
      .expectOne('/api/requests/20/visits/41/cancel')
      .flush({ error: 'The visit was changed meanwhile (moved or started). Reload and try again.', details: [] }, { status: 409, statusText: 'Conflict' });
    await fixture.whenStable();
    expect(host().querySelector('[role="alert"]')?.textContent).toContain('changed meanwhile');
    expect(close).not.toHaveBeenCalled();
  });

  it('puts a field message from the server under the reason', async () => {
    await (await reason()).setValue('Occupant ill');
    await go();
    http.expectOne('/api/requests/20/visits/41/cancel').flush({ error: 'Check the reason', details: [{ path: 'reason', message: 'Remove the NUL characters from this text' }] }, { status: 400, statusText: 'Bad Request' });
    await fixture.whenStable();
    const field = await loader.getHarness(MatFormFieldHarness.with({ floatingLabelText: 'Why is the visit cancelled?' }));
    expect(await field.getTextErrors()).toEqual(['Remove the NUL characters from this text']);
    expect(close).not.toHaveBeenCalled();
  });
});
