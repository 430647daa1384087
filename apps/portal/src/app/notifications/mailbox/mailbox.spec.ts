import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { TestbedHarnessEnvironment } from '@angular/cdk/testing/testbed';
import { TestBed } from '@angular/core/testing';
import { MatButtonHarness } from '@angular/material/button/testing';
import { MatFormFieldHarness } from '@angular/material/form-field/testing';
import { MatInputHarness } from '@angular/material/input/testing';
import type { CapturedMail } from '@cc/shared';
import { Mailbox } from './mailbox';

const mail = (id: number, subject: string, to = 'seller@mail.test'): CapturedMail => ({
  id,
  messageId: `<m${id}@test>`,
  from: 'portal@closing-circuit.test',
  to: [to],
  subject,
  text: `${subject} in plain words`,
  html: `<p>${subject}</p>`,
  attachments: [],
  receivedAt: '2026-12-05T12:00:00.000Z',
});
const page = (items: CapturedMail[]) => ({ items, total: items.length, page: 0, pageSize: 20, outbox: { sent: items.length } });

describe('Mailbox', () => {
  async function setUp() {
    TestBed.configureTestingModule({ providers: [provideHttpClient(), provideHttpClientTesting()] });
    const http = TestBed.inject(HttpTestingController);
    const fixture = TestBed.createComponent(Mailbox);
    await fixture.whenStable();
    http.expectOne((r) => r.url === '/api/mailbox' && r.params.get('page') === '0' && !r.params.has('to') && !r.params.has('requestId')).flush(page([mail(2, 'Quote sent'), mail(1, 'You are invited')]));
    await fixture.whenStable();
    return { http, fixture, loader: TestbedHarnessEnvironment.loader(fixture), host: fixture.nativeElement as HTMLElement };
  }

  it('opens a tapped message in reading mode, with a way back to the list', async () => {
    const { fixture, loader, host } = await setUp();
    expect(host.querySelector('.layout')?.classList.contains('reading')).toBe(false);
    (host.querySelectorAll<HTMLButtonElement>('[data-testid="mailbox-item"]')[1]).click();
    await fixture.whenStable();
    expect(host.querySelector('.layout')?.classList.contains('reading')).toBe(true);
    expect(host.querySelector('[data-testid="mailbox-message"]')?.textContent).toContain('You are invited');
    expect(host.querySelectorAll('[data-testid="mailbox-item"]')[1].getAttribute('aria-current')).toBe('true');
    await (await loader.getHarness(MatButtonHarness.with({ text: /Back to the messages/ }))).click();
    expect(host.querySelector('.layout')?.classList.contains('reading')).toBe(false);
  });

  it('asks the server for one request’s messages to one address, and shows a typing mistake under its field', async () => {
    const { http, fixture, loader, host } = await setUp();
    const request = await loader.getHarness(MatInputHarness.with({ selector: '[data-testid="mailbox-filter-request"]' }));
    const to = await loader.getHarness(MatInputHarness.with({ selector: '[data-testid="mailbox-filter-to"]' }));
    const show = await loader.getHarness(MatButtonHarness.with({ text: 'Show' }));

    await request.setValue('house 12');
    await show.click();
    const requestField = await loader.getHarness(MatFormFieldHarness.with({ floatingLabelText: 'Request' }));
    expect(await requestField.getTextErrors()).toEqual(['Type a request reference, such as CC-00008']);
    http.expectNone('/api/mailbox');

    await request.setValue('CC-00008');
    await to.setValue('Seller@Mail.test');
    await show.click();
    const filtered = http.expectOne((r) => r.url === '/api/mailbox');
    expect(filtered.request.params.get('requestId')).toBe('8');
    expect(filtered.request.params.get('to')).toBe('Seller@Mail.test');
    expect(filtered.request.params.get('page')).toBe('0');
    filtered.flush(page([]));
    await fixture.whenStable();
    expect(host.textContent).toContain('No message matches these filters.');

    // A field message from the server shows under its field too.
    await request.setValue('');
    await to.setValue('seller@mail.test');
    await show.click();
    const refused = http.expectOne((r) => r.url === '/api/mailbox' && r.params.get('to') === 'seller@mail.test' && !r.params.has('requestId'));
    refused.flush({ error: 'Check the filters', details: [{ path: 'to', message: 'Type a whole e-mail address, such as name@example.com' }] }, { status: 400, statusText: 'Bad Request' });
    await fixture.whenStable();
    const toField = await loader.getHarness(MatFormFieldHarness.with({ floatingLabelText: "Recipient's e-mail" }));
    expect(await toField.getTextErrors()).toEqual(['Type a whole e-mail address, such as name@example.com']);
    http.verify();
  });
});
