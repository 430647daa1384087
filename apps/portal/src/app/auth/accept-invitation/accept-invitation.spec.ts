import { provideHttpClient, withInterceptors } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { HarnessLoader } from '@angular/cdk/testing';
import { TestbedHarnessEnvironment } from '@angular/cdk/testing/testbed';
import { ComponentFixture, TestBed } from '@angular/core/testing';
import { MatButtonHarness } from '@angular/material/button/testing';
import { MatInputHarness } from '@angular/material/input/testing';
import { provideRouter, Router } from '@angular/router';
import { Invitation } from '@cc/shared';
import { Auth } from '../../core/auth/auth';
import { authInterceptor } from '../../core/auth/auth-interceptor';
import { AcceptInvitation } from './accept-invitation';

const INVITATION: Invitation = {
  email: 'sam@seller.example',
  role: 'seller',
  requestReference: 'CC-0003',
  propertyAddress: '103 Aspen Court, Fort Collins, CO 80521',
  invitedByName: 'Ada Quill',
  hasAccount: false,
};

describe('AcceptInvitation', () => {
  let fixture: ComponentFixture<AcceptInvitation>;
  let loader: HarnessLoader;
  let httpTesting: HttpTestingController;

  async function render(invitation: Invitation | null): Promise<HTMLElement> {
    TestBed.configureTestingModule({
      providers: [provideRouter([]), provideHttpClient(withInterceptors([authInterceptor])), provideHttpClientTesting()],
    });
    httpTesting = TestBed.inject(HttpTestingController);
    fixture = TestBed.createComponent(AcceptInvitation);
    fixture.componentRef.setInput('token', 'tok-123');
    loader = TestbedHarnessEnvironment.loader(fixture);
    await fixture.whenStable();
    const req = httpTesting.expectOne('/api/invitations/tok-123');
    if (invitation) req.flush(invitation);
    else req.flush({ error: 'Not found', details: [] }, { status: 404, statusText: 'Not Found' });
    await fixture.whenStable();
    return fixture.nativeElement;
  }

  afterEach(() => httpTesting.verify());

  it('shows who invited the person, for which property and part', async () => {
    const host = await render(INVITATION);
    expect(host.textContent).toContain('Ada Quill invited you as Seller');
    expect(host.querySelector('[data-testid="invitation-address"]')?.textContent).toContain('103 Aspen Court');
  });

  it('makes the account, signs in with the answered session and opens the request it was invited to', async () => {
    await render(INVITATION);
    const navigate = jest.spyOn(TestBed.inject(Router), 'navigate').mockResolvedValue(true);
    await (await loader.getHarness(MatInputHarness.with({ selector: '[data-testid="invitation-name"]' }))).setValue('Sam Seller');
    await (await loader.getHarness(MatInputHarness.with({ selector: '[data-testid="invitation-password"]' }))).setValue('porch-light-42');
    await (await loader.getHarness(MatButtonHarness.with({ text: /Make account/ }))).click();

    httpTesting.expectOne('/api/auth/csrf').flush({ csrfToken: 'visitor' });
    const req = httpTesting.expectOne('/api/invitations/tok-123/accept');
    expect(req.request.body).toEqual({ name: 'Sam Seller', password: 'porch-light-42' });
    expect(req.request.headers.get('x-csrf-token')).toBe('visitor');
    req.flush({
      user: { id: 9, email: 'sam@seller.example', name: 'Sam Seller', role: 'seller', organisationId: null, organisationName: null },
      csrfToken: 'seller-session',
      requestId: 41,
    });
    expect(TestBed.inject(Auth).user()?.email).toBe('sam@seller.example');
    expect(navigate).toHaveBeenCalledWith(['/requests', 41]);
  });

  it('says the link no longer works when the invitation is unknown', async () => {
    const host = await render(null);
    expect(host.querySelector('[role="alert"]')?.textContent).toContain('does not work any more');
  });
});
