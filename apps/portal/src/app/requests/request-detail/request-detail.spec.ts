import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { HarnessLoader } from '@angular/cdk/testing';
import { TestbedHarnessEnvironment } from '@angular/cdk/testing/testbed';
import { ComponentFixture, TestBed } from '@angular/core/testing';
import { MatButtonHarness } from '@angular/material/button/testing';
import { MatInputHarness } from '@angular/material/input/testing';
import { MatSelectHarness } from '@angular/material/select/testing';
import { provideRouter } from '@angular/router';
import { PartyRole, RepairRequestDetail, Role } from '@cc/shared';
import { Auth } from '../../core/auth/auth';
import { Clock } from '../../core/time/clock';
import { RequestDetail } from './request-detail';

function detail(myParts: PartyRole[]): RepairRequestDetail {
  return {
    id: 12,
    reference: 'CC-0012',
    street: '77 Juniper Row',
    city: 'Golden',
    state: 'CO',
    zip: '80401',
    yearBuilt: 1955,
    closingDate: '2026-05-01',
    necEdition: 2023,
    status: 'draft',
    contractorName: 'Foothill Wiring Co.',
    itemCount: 0,
    openWorkCount: 0,
    isAtRisk: false,
    createdAt: '2026-04-01T10:00:00Z',
    updatedAt: '2026-04-01T10:00:00Z',
    contractor: { id: 7, name: 'Foothill Wiring Co.', licenceNumber: 'EC-2231', licenceState: 'CO', licenceClass: 'Electrical contractor' },
    parties: [
      { role: 'buyer-agent', email: 'ada@ridge.example', name: 'Ada Agent', userId: 3, isPending: false, inviteUrl: null },
      { role: 'seller', email: 'sam@seller.example', name: null, userId: null, isPending: true, inviteUrl: 'http://localhost/invite/abc' },
    ],
    history: [{ from: null, to: 'draft', at: '2026-04-01T10:00:00Z', byName: 'Ada Agent', note: null }],
    myParts,
  };
}

describe('RequestDetail', () => {
  let fixture: ComponentFixture<RequestDetail>;
  let loader: HarnessLoader;
  let httpTesting: HttpTestingController;

  async function render(role: Role, myParts: PartyRole[], overrides: Partial<RepairRequestDetail> = {}): Promise<HTMLElement> {
    TestBed.configureTestingModule({
      providers: [
        provideRouter([]),
        provideHttpClient(),
        provideHttpClientTesting(),
        { provide: Clock, useValue: { today: () => '2026-04-20' } },
      ],
    });
    TestBed.inject(Auth).useSession({
      user: { id: 3, email: 'ada@ridge.example', name: 'Ada Agent', role, organisationId: null, organisationName: null },
      csrfToken: 't',
    });
    httpTesting = TestBed.inject(HttpTestingController);
    fixture = TestBed.createComponent(RequestDetail);
    fixture.componentRef.setInput('id', '12');
    loader = TestbedHarnessEnvironment.loader(fixture);
    await fixture.whenStable();
    httpTesting.expectOne('/api/requests/12').flush({ ...detail(myParts), ...overrides });
    // Rendering the page starts the photo panel's resource; it is answered before waiting for stability.
    fixture.detectChanges();
    flushActivity();
    await fixture.whenStable();
    // The line-items area loads the request's reports and items (none yet in these cases).
    httpTesting.expectOne('/api/requests/12/reports').flush([]);
    httpTesting.expectOne('/api/requests/12/items').flush({ items: [], editionNotes: {} });
    // Agents of a request in draft get the contractor picker, which lists the contractors.
    httpTesting.match('/api/contractors').forEach((req) => req.flush([]));
    flushActivity();
    await fixture.whenStable();
    return fixture.nativeElement;
  }

  /** The activity timeline reads the request's entries, the photo panel its intake photos (none in these cases). */
  function flushActivity(): void {
    httpTesting.match((r) => r.url === '/api/requests/12/activity').forEach((req) => req.flush({ items: [], total: 0, page: 0, pageSize: 20 }));
    httpTesting.match((r) => r.url === '/api/requests/12/visit-prep').forEach((req) => req.flush({ photos: [], evidence: [], canAddPhotos: false }));
  }

  afterEach(() => {
    flushActivity();
    httpTesting.verify();
  });

  it('shows the property, the countdown to closing, the contractor licence and the empty line items', async () => {
    const host = await render('agent', ['buyer-agent']);
    expect(host.querySelector('[data-testid="request-detail-heading"]')?.textContent).toContain('77 Juniper Row');
    // 2026-04-20 → 2026-05-01 is 11 calendar days.
    expect(host.textContent).toContain('in 11 days');
    expect(host.textContent).toContain('EC-2231');
    expect(host.querySelector('[data-testid="line-items-empty"]')?.textContent).toContain('No items yet');
    expect(host.querySelector('cc-safety-notice')).not.toBeNull();
  });

  it('flags the closing date at risk as the request list does, from the DTO flag', async () => {
    const host = await render('agent', ['buyer-agent'], { status: 'approved', openWorkCount: 3, isAtRisk: true });
    expect(host.querySelector('[data-testid="request-at-risk"]')?.textContent).toContain('At risk: 3 approved items still open close to closing');
  });

  it('shows no at-risk flag when the request is not at risk', async () => {
    const host = await render('agent', ['buyer-agent'], { status: 'approved', openWorkCount: 3, isAtRisk: false });
    expect(host.querySelector('[data-testid="request-at-risk"]')).toBeNull();
  });

  it('shows the pending invitation link and the invite form to an agent of the request', async () => {
    const host = await render('agent', ['buyer-agent']);
    expect(host.querySelector('[data-testid="invite-url"]')?.textContent).toBe('http://localhost/invite/abc');
    expect(host.textContent).toContain('Invitation pending');
    expect(host.querySelector('cc-invite-party-form')).not.toBeNull();
  });

  it('hides invitation links and the form from a seller', async () => {
    const host = await render('seller', ['seller']);
    expect(host.textContent).toContain('Invitation pending');
    expect(host.querySelector('[data-testid="invite-url"]')).toBeNull();
    expect(host.querySelector('cc-invite-party-form')).toBeNull();
  });

  it('invites a party, shows the link to pass on if the e-mail does not arrive and the request the server answers with', async () => {
    await render('agent', ['buyer-agent']);
    await (await loader.getHarness(MatSelectHarness.with({ selector: '[data-testid="invite-role"]' }))).clickOptions({
      text: 'Home inspector',
    });
    await (await loader.getHarness(MatInputHarness.with({ selector: '[data-testid="invite-email"]' }))).setValue('Ivy@Inspect.example');
    await (await loader.getHarness(MatButtonHarness.with({ text: 'Send invitation' }))).click();

    const req = httpTesting.expectOne('/api/requests/12/parties');
    expect(req.request.body).toEqual({ role: 'inspector', email: 'ivy@inspect.example' });
    const updated = detail(['buyer-agent']);
    updated.parties.push({ role: 'inspector', email: 'ivy@inspect.example', name: null, userId: null, isPending: true, inviteUrl: 'http://localhost/invite/def' });
    req.flush(updated);
    await fixture.whenStable();

    const links = Array.from((fixture.nativeElement as HTMLElement).querySelectorAll('[data-testid="invite-url"]')).map((el) => el.textContent);
    expect(links).toEqual(['http://localhost/invite/abc', 'http://localhost/invite/def']);
    const made = (fixture.nativeElement as HTMLElement).querySelector('[data-testid="invite-made"]')?.textContent ?? '';
    expect(made).toContain('If it does not arrive');
    expect(made).not.toContain('Invitation sent');
    expect((fixture.nativeElement as HTMLElement).querySelector('[data-testid="invite-made-url"]')?.textContent).toBe('http://localhost/invite/def');
  });
});
