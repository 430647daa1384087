import { provideHttpClient, withInterceptors } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { TestbedHarnessEnvironment } from '@angular/cdk/testing/testbed';
import { ComponentFixture, TestBed } from '@angular/core/testing';
import { MatButtonHarness } from '@angular/material/button/testing';
import { MatFormFieldHarness } from '@angular/material/form-field/testing';
import { MatInputHarness } from '@angular/material/input/testing';
import { provideRouter, Router } from '@angular/router';
import { HarnessLoader } from '@angular/cdk/testing';
import { Auth } from '../../core/auth/auth';
import { authInterceptor } from '../../core/auth/auth-interceptor';
import { SignIn } from './sign-in';

describe('SignIn', () => {
  let fixture: ComponentFixture<SignIn>;
  let loader: HarnessLoader;
  let httpTesting: HttpTestingController;

  beforeEach(() => {
    TestBed.configureTestingModule({
      providers: [provideRouter([]), provideHttpClient(withInterceptors([authInterceptor])), provideHttpClientTesting()],
    });
    httpTesting = TestBed.inject(HttpTestingController);
    fixture = TestBed.createComponent(SignIn);
    loader = TestbedHarnessEnvironment.loader(fixture);
  });

  afterEach(() => httpTesting.verify());

  async function fill(email: string, password: string): Promise<void> {
    await (await loader.getHarness(MatInputHarness.with({ selector: '[data-testid="sign-in-email"]' }))).setValue(email);
    await (await loader.getHarness(MatInputHarness.with({ selector: '[data-testid="sign-in-password"]' }))).setValue(password);
    await (await loader.getHarness(MatButtonHarness.with({ text: 'Sign in' }))).click();
  }

  function errorText(): string | undefined {
    return (fixture.nativeElement as HTMLElement).querySelector('[data-testid="sign-in-error"]')?.textContent?.trim();
  }

  it('shows field messages from the shared schema and sends nothing for bad input', async () => {
    await fill('not-an-address', '');
    const email = await loader.getHarness(MatFormFieldHarness.with({ floatingLabelText: 'E-mail address' }));
    const password = await loader.getHarness(MatFormFieldHarness.with({ floatingLabelText: 'Password' }));
    expect(await email.getTextErrors()).toEqual(['Enter a valid e-mail address']);
    expect(await password.getTextErrors()).toEqual(['Enter your password']);
    httpTesting.expectNone('/api/auth/sign-in');
  });

  it('says the e-mail or password was not recognised on 401, and stays signed out', async () => {
    await fill('Agent@Example.test', 'wrong password');
    httpTesting.expectOne('/api/auth/csrf').flush({ csrfToken: 'visitor' });
    const req = httpTesting.expectOne('/api/auth/sign-in');
    expect(req.request.body).toEqual({ email: 'agent@example.test', password: 'wrong password' });
    req.flush({ error: 'Wrong e-mail or password', details: [] }, { status: 401, statusText: 'Unauthorized' });
    await fixture.whenStable();
    expect(errorText()).toBe('That e-mail address or password was not recognised.');
    expect(TestBed.inject(Auth).isSignedIn()).toBe(false);
  });

  it('tells the person to wait after too many attempts (429)', async () => {
    await fill('agent@example.test', 'another try');
    httpTesting.expectOne('/api/auth/csrf').flush({ csrfToken: 'visitor' });
    httpTesting
      .expectOne('/api/auth/sign-in')
      .flush({ error: 'Too many attempts', details: [] }, { status: 429, statusText: 'Too Many Requests' });
    await fixture.whenStable();
    expect(errorText()).toContain('Too many sign-in attempts');
  });

  it('adopts the session and goes to the return address on success', async () => {
    const navigate = jest.spyOn(TestBed.inject(Router), 'navigateByUrl').mockResolvedValue(true);
    fixture.componentRef.setInput('returnUrl', '/requests/42');
    await fill('agent@example.test', 'correct horse battery');
    httpTesting.expectOne('/api/auth/csrf').flush({ csrfToken: 'visitor' });
    httpTesting.expectOne('/api/auth/sign-in').flush({
      user: { id: 5, email: 'agent@example.test', name: 'Ada Agent', role: 'agent', organisationId: 2, organisationName: 'Ridge Realty' },
      csrfToken: 'signed-in',
    });
    expect(TestBed.inject(Auth).csrfToken()).toBe('signed-in');
    expect(navigate).toHaveBeenCalledWith('/requests/42');
  });

  it('never follows a return address to another site', async () => {
    const navigate = jest.spyOn(TestBed.inject(Router), 'navigateByUrl').mockResolvedValue(true);
    fixture.componentRef.setInput('returnUrl', '//elsewhere.example/steal');
    await fill('agent@example.test', 'correct horse battery');
    httpTesting.expectOne('/api/auth/csrf').flush({ csrfToken: 'visitor' });
    httpTesting.expectOne('/api/auth/sign-in').flush({
      user: { id: 5, email: 'agent@example.test', name: 'Ada Agent', role: 'agent', organisationId: null, organisationName: null },
      csrfToken: 'signed-in',
    });
    expect(navigate).toHaveBeenCalledWith('/requests');
  });
});
