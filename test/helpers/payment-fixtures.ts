// The app listening on loopback with the local fake payment service beside it, as `npm start` runs
// them, and requests carried to a sent (and signed) quote through the API.
import { createServer, type Server } from 'node:http';
import type { AddressInfo } from 'node:net';
import type { ApprovalView, SignApproval } from '@cc/shared';
import { startFakePaymentService, type FakePaymentService } from '../../server/src/integrations/payments/fake-payment-service';
import type { SignedIn } from './fixtures';
import { createPricedRequest, type DemoItem, type PricingCast, type StoredBook } from './pricing-fixtures';
import { createTestApp, type TestApp } from './test-app';

export interface PaymentsTestApp extends TestApp {
  fake: FakePaymentService;
  /** Where the app listens (the fake delivers its events there). */
  baseUrl: string;
}

export const TEST_SECRET_KEY = 'sk_test_api_tests_only_0123456789';
export const TEST_WEBHOOK_SECRET = 'whsec_api_tests_only_0123456789abcdef';

export async function createPaymentsTestApp(): Promise<PaymentsTestApp> {
  const fake = await startFakePaymentService({ secretKey: TEST_SECRET_KEY, webhookSecret: TEST_WEBHOOK_SECRET });
  const t = createTestApp({ STRIPE_SECRET_KEY: TEST_SECRET_KEY, STRIPE_WEBHOOK_SECRET: TEST_WEBHOOK_SECRET, STRIPE_API_BASE: fake.url });
  const server: Server = createServer(t.app);
  await new Promise<void>((resolve) => server.listen(0, '127.0.0.1', resolve));
  const baseUrl = `http://127.0.0.1:${(server.address() as AddressInfo).port}`;
  fake.webhookUrl = `${baseUrl}/api/payments/webhook`;
  return {
    ...t,
    fake,
    baseUrl,
    async close() {
      await fake.close();
      await new Promise<void>((resolve) => server.close(() => resolve()));
      await t.close();
    },
  };
}

export const write = (who: SignedIn, method: 'post' | 'put' | 'patch', path: string) => who.agent[method](path).set('x-csrf-token', who.csrfToken);

/** Items priced with the given entries (by rate-book key), then the quote sent by the contractor. */
export async function quotedRequest(cast: PricingCast, t: TestApp, book: StoredBook, lines: (DemoItem & { entry: string })[]): Promise<{ requestId: number; itemIds: number[] }> {
  const { requestId, itemIds } = await createPricedRequest(cast, t.db, { items: lines });
  const contractor = cast.s.contractor;
  for (let i = 0; i < itemIds.length; i++) {
    const pricing = (await contractor.agent.get(`/api/requests/${requestId}/pricing`).expect(200)).body;
    const version = pricing.items.find((p: { id: number }) => p.id === itemIds[i]).version;
    const res = await write(contractor, 'patch', `/api/requests/${requestId}/pricing`).send({ items: [{ id: itemIds[i], version }], set: { entryId: book.entry[lines[i].entry] } });
    if (res.status !== 200) throw new Error(`pricing failed: ${res.status} ${JSON.stringify(res.body)}`);
  }
  const sent = await write(contractor, 'post', `/api/requests/${requestId}/quotes`).send({});
  if (sent.status !== 201) throw new Error(`quote not sent: ${sent.status} ${JSON.stringify(sent.body)}`);
  return { requestId, itemIds };
}

export function signBody(itemIds: number[], decisions: ('approved' | 'declined')[], overrides: Partial<SignApproval> = {}): SignApproval {
  return { quoteVersion: 1, decisions: itemIds.map((lineItemId, i) => ({ lineItemId, decision: decisions[i] })), signerName: 'Pat Seller', hasConsented: true, ...overrides };
}

export async function sign(who: SignedIn, requestId: number, body: SignApproval): Promise<ApprovalView> {
  const res = await write(who, 'post', `/api/requests/${requestId}/approval`).send(body);
  if (res.status !== 201) throw new Error(`not signed: ${res.status} ${JSON.stringify(res.body)}`);
  return res.body;
}

/** A change order adding a second GFCI found on site, priced with `gfci-replace` of `book`. */
export const gfciFoundOnSite = (book: StoredBook) => ({
  reason: 'Metal box without a ground path found behind the vanity',
  lines: [{ kind: 'add' as const, code: 'gfci-inoperative', room: 'bathroom', location: 'primary bath', entryId: String(book.entry['gfci-replace']), quantity: 1 }],
});

let keyCounter = 0;
/** A fresh idempotency key, as the portal makes one per attempt. */
export const newKey = () => `test-key-${Date.now().toString(36)}-${(keyCounter++).toString().padStart(6, '0')}`;

/** Types a card on the fake payment page, as a person would; answers the page's status and where it sends the payer. */
export async function payOnFakePage(checkoutUrl: string, card: string): Promise<{ status: number; location: string | null; html: string }> {
  const res = await fetch(checkoutUrl, { method: 'POST', body: new URLSearchParams({ card, expiry: '12 / 39', cvc: '123' }), redirect: 'manual' });
  return { status: res.status, location: res.headers.get('location'), html: await res.text() };
}
