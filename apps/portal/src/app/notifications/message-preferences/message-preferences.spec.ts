import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { TestbedHarnessEnvironment } from '@angular/cdk/testing/testbed';
import { TestBed } from '@angular/core/testing';
import { MatButtonHarness } from '@angular/material/button/testing';
import { MatButtonToggleHarness } from '@angular/material/button-toggle/testing';
import { NotificationPreference } from '@cc/shared';
import { MessagePreferences } from './message-preferences';

const LIST: NotificationPreference[] = [
  { kind: 'quote-sent', label: 'Quote sent', delivery: 'immediate', isDigestOnly: false },
  { kind: 'closing-at-risk', label: 'Closing at risk (daily digest)', delivery: 'digest', isDigestOnly: true },
];

describe('MessagePreferences', () => {
  it('offers no “At once” for a digest-only message, and saves the choices made', async () => {
    TestBed.configureTestingModule({ providers: [provideHttpClient(), provideHttpClientTesting()] });
    const http = TestBed.inject(HttpTestingController);
    const fixture = TestBed.createComponent(MessagePreferences);
    await fixture.whenStable();
    http.expectOne('/api/notifications/preferences').flush(LIST);
    await fixture.whenStable();
    const loader = TestbedHarnessEnvironment.loader(fixture);
    const riskToggles = await loader.getAllHarnesses(MatButtonToggleHarness.with({ ancestor: '[data-testid="pref-closing-at-risk"]' }));
    expect(await Promise.all(riskToggles.map((t) => t.getText()))).toEqual(['Daily digest', 'Off']);

    await (await loader.getHarness(MatButtonToggleHarness.with({ ancestor: '[data-testid="pref-quote-sent"]', text: 'Off' }))).check();
    await (await loader.getHarness(MatButtonHarness.with({ text: 'Save e-mail choices' }))).click();
    const req = http.expectOne('/api/notifications/preferences');
    expect(req.request.method).toBe('PUT');
    expect(req.request.body).toEqual({
      preferences: [
        { kind: 'quote-sent', delivery: 'off' },
        { kind: 'closing-at-risk', delivery: 'digest' },
      ],
    });
    req.flush(LIST.map((p) => (p.kind === 'quote-sent' ? { ...p, delivery: 'off' } : p)));
    http.verify();
  });
});
