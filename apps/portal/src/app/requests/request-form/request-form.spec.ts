import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { HarnessLoader } from '@angular/cdk/testing';
import { TestbedHarnessEnvironment } from '@angular/cdk/testing/testbed';
import { ComponentFixture, TestBed } from '@angular/core/testing';
import { MatButtonHarness } from '@angular/material/button/testing';
import { MatDatepickerInputHarness } from '@angular/material/datepicker/testing';
import { MatFormFieldHarness } from '@angular/material/form-field/testing';
import { MatInputHarness } from '@angular/material/input/testing';
import { MatSelectHarness } from '@angular/material/select/testing';
import { provideRouter, Router } from '@angular/router';
import { Organisation } from '@cc/shared';
import { Auth } from '../../core/auth/auth';
import { RequestForm } from './request-form';

const CONTRACTORS: Organisation[] = [
  {
    id: 7,
    name: 'Foothill Wiring Co.',
    kind: 'contractor',
    phone: null,
    address: null,
    licenceNumber: 'EC-2231',
    licenceState: 'CO',
    licenceClass: 'Electrical contractor',
  },
];

describe('RequestForm', () => {
  let fixture: ComponentFixture<RequestForm>;
  let loader: HarnessLoader;
  let httpTesting: HttpTestingController;

  beforeEach(async () => {
    TestBed.configureTestingModule({
      providers: [provideRouter([]), provideHttpClient(), provideHttpClientTesting()],
    });
    TestBed.inject(Auth).useSession({
      user: { id: 3, email: 'ada@ridge.example', name: 'Ada Agent', role: 'agent', organisationId: 1, organisationName: 'Ridge Realty' },
      csrfToken: 't',
    });
    httpTesting = TestBed.inject(HttpTestingController);
    fixture = TestBed.createComponent(RequestForm);
    loader = TestbedHarnessEnvironment.loader(fixture);
    await fixture.whenStable();
    httpTesting.expectOne('/api/contractors').flush(CONTRACTORS);
  });

  afterEach(() => httpTesting.verify());

  const input = (testId: string) => loader.getHarness(MatInputHarness.with({ selector: `[data-testid="${testId}"]` }));
  const select = (testId: string) => loader.getHarness(MatSelectHarness.with({ selector: `[data-testid="${testId}"]` }));
  const field = (label: string) => loader.getHarness(MatFormFieldHarness.with({ floatingLabelText: label }));
  const submit = async () => (await loader.getHarness(MatButtonHarness.with({ text: 'Start request' }))).click();

  async function fillValidRequest(): Promise<void> {
    await (await input('request-form-street')).setValue('  418 Larkspur Lane ');
    await (await input('request-form-city')).setValue('Boulder');
    await (await select('request-form-state')).clickOptions({ text: 'Colorado (CO)' });
    await (await input('request-form-zip')).setValue('80302');
    await (await input('request-form-year-built')).setValue('1962');
    await (await loader.getHarness(MatDatepickerInputHarness)).setValue('6/30/2026');
    await (await input('request-form-seller-email')).setValue('Seller@Example.test');
    await (await select('request-form-contractor')).clickOptions({ text: /Foothill Wiring/ });
  }

  it('shows the shared schema messages for empty and malformed fields and posts nothing', async () => {
    await (await input('request-form-zip')).setValue('8030');
    await (await input('request-form-listing-agent-email')).setValue('listing@');
    await submit();

    expect(await (await field('Street address')).getTextErrors()).toEqual(['Enter the street address']);
    expect(await (await field('State')).getTextErrors()).toEqual(['Choose a US state']);
    expect(await (await field('ZIP code')).getTextErrors()).toEqual(['Enter a 5-digit ZIP code (or ZIP+4)']);
    expect(await (await field('Year built')).getTextErrors()).toEqual(['Enter the year the house was built']);
    expect(await (await field('Listing agent e-mail')).getTextErrors()).toEqual(['Enter a valid e-mail address']);
    httpTesting.expectNone('/api/requests');
  });

  it('asks for the closing date in the form its hint shows (MM/DD/YYYY), empty or unreadable', async () => {
    const date = await field('Closing date');
    expect(await date.getTextHints()).toEqual(['MM/DD/YYYY']);
    await submit();
    expect(await date.getTextErrors()).toEqual(['Enter the date as MM/DD/YYYY, or pick it from the calendar']);
    await (await loader.getHarness(MatDatepickerInputHarness)).setValue('2026-13-45');
    await submit();
    const [message] = await date.getTextErrors();
    expect(message).toContain('MM/DD/YYYY');
    expect(message).not.toContain('YYYY-MM-DD');
    httpTesting.expectNone('/api/requests');
  });

  it('lists every state by name with its USPS code and sends the code', async () => {
    const state = await select('request-form-state');
    await state.open();
    const options = await state.getOptions();
    // 50 states and the District of Columbia (USPS state abbreviations).
    expect(options).toHaveLength(51);
    expect(await options[5].getText()).toBe('Colorado (CO)');
    expect(await options[8].getText()).toBe('District of Columbia (DC)');
    await state.close();
  });

  it("fills the state's usual NEC edition when the state is chosen", async () => {
    await (await select('request-form-state')).clickOptions({ text: 'Colorado (CO)' });
    // Colorado's default in shared DEFAULT_NEC_EDITION_BY_STATE is 2023 (a setting, from memory).
    expect(await (await select('request-form-nec-edition')).getValueText()).toBe('NEC 2023');
    await (await select('request-form-state')).clickOptions({ text: 'Wyoming (WY)' });
    // A state without an entry falls back to FALLBACK_NEC_EDITION (2020).
    expect(await (await select('request-form-nec-edition')).getValueText()).toBe('NEC 2020');
  });

  it('posts the DTO the shared schema describes and opens the new request', async () => {
    const navigate = jest.spyOn(TestBed.inject(Router), 'navigate').mockResolvedValue(true);
    await fillValidRequest();
    await submit();

    const req = httpTesting.expectOne('/api/requests');
    expect(req.request.method).toBe('POST');
    expect(req.request.body).toEqual({
      street: '418 Larkspur Lane',
      city: 'Boulder',
      state: 'CO',
      zip: '80302',
      yearBuilt: 1962,
      closingDate: '2026-06-30',
      necEdition: 2023,
      listingAgentEmail: null,
      sellerEmail: 'seller@example.test',
      inspectorEmail: null,
      buyerAgentEmail: null,
      contractorOrganisationId: 7,
    });
    req.flush({ id: 91, reference: 'CC-0091' });
    expect(navigate).toHaveBeenCalledWith(['/requests', 91]);
  });

  it("shows the server's 400 details on the matching fields", async () => {
    await fillValidRequest();
    await submit();
    httpTesting.expectOne('/api/requests').flush(
      {
        error: 'Invalid input',
        details: [
          { path: 'zip', message: 'This ZIP code is not in Colorado' },
          { path: 'closingDate', message: 'The closing date must be after today' },
        ],
      },
      { status: 400, statusText: 'Bad Request' },
    );
    await fixture.whenStable();

    expect(await (await field('ZIP code')).getTextErrors()).toEqual(['This ZIP code is not in Colorado']);
    expect(await (await field('Closing date')).getTextErrors()).toEqual(['The closing date must be after today']);
    expect(await (await field('City')).getTextErrors()).toEqual([]);
  });
});
