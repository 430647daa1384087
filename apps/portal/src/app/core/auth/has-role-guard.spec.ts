import { Component } from '@angular/core';
import { TestBed } from '@angular/core/testing';
import { provideRouter } from '@angular/router';
import { RouterTestingHarness } from '@angular/router/testing';
import { Role } from '@cc/shared';
import { NotForRole } from '../../not-for-role/not-for-role';
import { Auth } from './auth';
import { hasRole } from './has-role-guard';

@Component({ selector: 'cc-queue-stub', template: '<h1>Queue</h1>' })
class QueueStub {}

describe('hasRole', () => {
  async function open(role: Role): Promise<HTMLElement> {
    TestBed.configureTestingModule({
      providers: [
        provideRouter([
          { path: 'pricing', title: 'Job queue · Closing Circuit', canActivate: [hasRole('contractor')], component: QueueStub },
          { path: 'not-for-your-role', component: NotForRole },
        ]),
      ],
    });
    TestBed.inject(Auth).useSession({ user: { id: 1, email: 'a@b.test', name: 'A', role, organisationId: null, organisationName: null }, csrfToken: 't' });
    const harness = await RouterTestingHarness.create();
    await harness.navigateByUrl('/pricing');
    return harness.routeNativeElement!;
  }

  it('lets the role in', async () => {
    expect((await open('contractor')).textContent).toContain('Queue');
  });

  it('tells another role whom the page is for instead of redirecting silently', async () => {
    const page = await open('seller');
    expect(page.querySelector('[data-testid="not-for-role-heading"]')?.textContent).toContain('Job queue is not part of your account');
    expect(page.querySelector('[data-testid="not-for-role-text"]')?.textContent).toContain('for electrical contractors');
  });
});
