// A stand-in for the card payment service, on loopback, for `npm start` and the tests. It answers
// only the calls the product makes with the official SDK (Checkout Sessions, refunds), honours
// Idempotency-Key like the real service, serves its own simple payment page where the payment
// service's published test card numbers succeed or decline, sends the payer back, and delivers
// signed webhook events to the product's endpoint. It never sees a real card: it refuses any number
// that is not a test number.
import { createHash, randomBytes } from 'node:crypto';
import type { AddressInfo } from 'node:net';
import type { Server } from 'node:http';
import express, { type Request, type Response } from 'express';
import Stripe from 'stripe';
import { renderPaymentPage } from './fake-payment-page';

/** What a test card number does on the fake page. */
export type TestCardOutcome = { succeeds: true } | { succeeds: false; code: string; declineCode: string; message: string };

/**
 * Test card numbers the payment service publishes for its test mode ("Testing" page of its
 * documentation, docs.stripe.com/testing): 4242… and 5555… succeed; 4000…0002 is a generic decline,
 * 4000…9995 declines for insufficient funds.
 */
export const TEST_CARDS: Readonly<Record<string, TestCardOutcome>> = {
  '4242424242424242': { succeeds: true },
  '5555555555554444': { succeeds: true },
  '4000000000000002': { succeeds: false, code: 'card_declined', declineCode: 'generic_decline', message: 'Your card was declined.' },
  '4000000000009995': { succeeds: false, code: 'card_declined', declineCode: 'insufficient_funds', message: 'Your card has insufficient funds.' },
};

export interface FakePaymentServiceOptions {
  secretKey: string;
  webhookSecret: string;
  /** Where events are delivered (the product's webhook endpoint); may be set after start. */
  webhookUrl?: string;
  host?: string;
  port?: number;
}

interface Session {
  id: string;
  object: 'checkout.session';
  mode: string;
  status: 'open' | 'complete' | 'expired';
  payment_status: 'unpaid' | 'paid';
  amount_total: number;
  currency: string;
  client_reference_id: string | null;
  customer_email: string | null;
  description: string;
  metadata: Record<string, string>;
  payment_intent: string | null;
  success_url: string;
  cancel_url: string;
  url: string;
  created: number;
  livemode: false;
}

interface PaymentIntent {
  id: string;
  object: 'payment_intent';
  amount: number;
  amount_received: number;
  currency: string;
  status: 'succeeded' | 'requires_payment_method';
  metadata: Record<string, string>;
  last_payment_error: { code: string; decline_code: string; message: string; type: 'card_error' } | null;
  created: number;
  livemode: false;
}

interface Refund {
  id: string;
  object: 'refund';
  amount: number;
  currency: string;
  payment_intent: string;
  status: 'succeeded';
  reason: string | null;
  metadata: Record<string, string>;
  created: number;
}

export interface DeliveredEvent {
  id: string;
  type: string;
  payload: string;
  status: number | null;
}

const now = () => Math.floor(Date.now() / 1000);
const newId = (prefix: string) => `${prefix}_${randomBytes(12).toString('hex')}`;
const stringMap = (value: unknown): Record<string, string> =>
  value && typeof value === 'object' ? Object.fromEntries(Object.entries(value).filter(([, v]) => typeof v === 'string')) as Record<string, string> : {};

function apiError(res: Response, status: number, type: string, message: string, param?: string): void {
  res.status(status).json({ error: { type, message, ...(param ? { param } : {}) } });
}

export class FakePaymentService {
  readonly sessions = new Map<string, Session>();
  readonly intents = new Map<string, PaymentIntent>();
  readonly refunds = new Map<string, Refund>();
  readonly delivered: DeliveredEvent[] = [];
  webhookUrl: string | null;
  private readonly idempotent = new Map<string, { fingerprint: string; status: number; body: unknown }>();
  private readonly pending = new Set<Promise<void>>();
  private readonly signer = new Stripe('sk_test_signer_only', { telemetry: false }).webhooks;
  private server: Server | null = null;
  private baseUrl = '';

  constructor(private readonly options: FakePaymentServiceOptions) {
    this.webhookUrl = options.webhookUrl ?? null;
  }

  get url(): string {
    return this.baseUrl;
  }

  get port(): number {
    return Number(new URL(this.baseUrl).port);
  }

  async start(): Promise<this> {
    const app = this.app();
    await new Promise<void>((resolve, reject) => {
      this.server = app.listen(this.options.port ?? 0, this.options.host ?? '127.0.0.1', (err?: Error) => (err ? reject(err) : resolve()));
    });
    const address = this.server!.address() as AddressInfo;
    this.baseUrl = `http://${address.address}:${address.port}`;
    return this;
  }

  async close(): Promise<void> {
    await this.settle();
    await new Promise<void>((resolve) => (this.server ? this.server.close(() => resolve()) : resolve()));
  }

  /** Resolves when every event queued so far has been delivered (or given up on). */
  async settle(): Promise<void> {
    while (this.pending.size) await Promise.all([...this.pending]);
  }

  /** Sends an event again, exactly as first sent but freshly signed (the service retries like this). */
  redeliver(eventId: string): Promise<number | null> {
    const event = this.delivered.find((e) => e.id === eventId);
    if (!event) throw new Error(`No event ${eventId} was delivered`);
    return this.post(event.payload);
  }

  /** Builds, signs and delivers a new event about `object`. */
  async emit(type: string, object: object): Promise<DeliveredEvent> {
    const event = { id: newId('evt'), object: 'event', api_version: '2026-10-28.endive', created: now(), livemode: false, pending_webhooks: 1, request: { id: null, idempotency_key: null }, type, data: { object } };
    const delivered: DeliveredEvent = { id: event.id, type, payload: JSON.stringify(event), status: null };
    this.delivered.push(delivered);
    const sending = this.post(delivered.payload).then((status) => {
      delivered.status = status;
    });
    this.pending.add(sending);
    await sending.finally(() => this.pending.delete(sending));
    return delivered;
  }

  /** Signs `payload` as the service does (the header the product's constructEvent checks). */
  signatureFor(payload: string, secret = this.options.webhookSecret): string {
    return this.signer.generateTestHeaderString({ payload, secret });
  }

  private async post(payload: string): Promise<number | null> {
    if (!this.webhookUrl) return null;
    // Like the service, a failed delivery is tried again (here: twice more, at once).
    for (let attempt = 0; attempt < 3; attempt++) {
      try {
        const res = await fetch(this.webhookUrl, { method: 'POST', headers: { 'content-type': 'application/json', 'stripe-signature': this.signatureFor(payload) }, body: payload });
        if (res.status < 500) return res.status;
      } catch {
        // the product is not listening (yet): try again
      }
    }
    return null;
  }

  private app(): express.Express {
    const app = express();
    app.disable('x-powered-by');
    app.use('/v1', express.urlencoded({ extended: true, limit: '64kb' }));
    app.use('/v1', (req, res, next) => {
      if (req.headers.authorization === `Bearer ${this.options.secretKey}`) next();
      else apiError(res, 401, 'invalid_request_error', 'Invalid API Key provided');
    });
    app.use('/v1', (req, res, next) => this.idempotency(req, res, next));
    app.post('/v1/checkout/sessions', (req, res) => this.createSession(req, res));
    app.get('/v1/checkout/sessions/:id', (req, res) => {
      const session = this.sessions.get(req.params.id);
      if (!session) return apiError(res, 404, 'invalid_request_error', `No such checkout.session: '${req.params.id}'`, 'id');
      res.json(session);
    });
    app.post('/v1/refunds', (req, res) => this.createRefund(req, res));
    app.use('/v1', (_req, res) => apiError(res, 404, 'invalid_request_error', 'This fake payment service does not offer that call'));

    app.use('/pay', express.urlencoded({ extended: false, limit: '8kb' }));
    app.get('/pay/:id', (req, res) => this.showPage(req, res));
    app.post('/pay/:id', (req, res) => this.pay(req, res));
    app.post('/pay/:id/cancel', (req, res) => {
      const session = this.sessions.get(req.params.id);
      if (!session) res.status(404).type('text/plain').send('No such payment page');
      else res.redirect(303, session.cancel_url);
    });
    return app;
  }

  /** Same key and same parameters: the first answer again. Same key, other parameters: an error. */
  private idempotency(req: Request, res: Response, next: () => void): void {
    const key = req.headers['idempotency-key'];
    if (req.method !== 'POST' || typeof key !== 'string') return next();
    const fingerprint = createHash('sha256').update(`${req.path} ${JSON.stringify(req.body)}`).digest('hex');
    const seen = this.idempotent.get(key);
    if (seen) {
      if (seen.fingerprint !== fingerprint) {
        return apiError(res, 400, 'idempotency_error', 'Keys for idempotent requests can only be used with the same parameters they were first used with.');
      }
      res.setHeader('idempotent-replayed', 'true');
      res.status(seen.status).json(seen.body);
      return;
    }
    const json = res.json.bind(res);
    res.json = (body: unknown) => {
      this.idempotent.set(key, { fingerprint, status: res.statusCode, body });
      return json(body);
    };
    next();
  }

  private createSession(req: Request, res: Response): void {
    const body = req.body as Record<string, unknown>;
    const items = Array.isArray(body.line_items) ? (body.line_items as Record<string, any>[]) : [];
    if (body.mode !== 'payment') return apiError(res, 400, 'invalid_request_error', 'Only mode=payment is offered here', 'mode');
    if (typeof body.success_url !== 'string' || typeof body.cancel_url !== 'string') return apiError(res, 400, 'invalid_request_error', 'success_url and cancel_url are required', 'success_url');
    let amount = 0;
    let currency = '';
    for (const item of items) {
      const unit = Number(item?.price_data?.unit_amount);
      const quantity = Number(item?.quantity ?? 1);
      if (!Number.isSafeInteger(unit) || unit < 1 || !Number.isSafeInteger(quantity) || quantity < 1) return apiError(res, 400, 'invalid_request_error', 'Each line needs a whole unit_amount and quantity', 'line_items');
      amount += unit * quantity;
      currency = String(item.price_data.currency ?? '');
    }
    if (!items.length || currency !== 'usd') return apiError(res, 400, 'invalid_request_error', 'One or more line items in usd are required', 'line_items');
    const id = newId('cs_test');
    const session: Session = {
      id,
      object: 'checkout.session',
      mode: 'payment',
      status: 'open',
      payment_status: 'unpaid',
      amount_total: amount,
      currency,
      client_reference_id: typeof body.client_reference_id === 'string' ? body.client_reference_id : null,
      customer_email: typeof body.customer_email === 'string' ? body.customer_email : null,
      description: String(items[0]?.price_data?.product_data?.name ?? 'Payment'),
      metadata: stringMap(body.metadata),
      payment_intent: null,
      success_url: body.success_url.replace('{CHECKOUT_SESSION_ID}', id),
      cancel_url: body.cancel_url,
      url: `${this.baseUrl}/pay/${id}`,
      created: now(),
      livemode: false,
    };
    this.sessions.set(id, session);
    res.json(session);
  }

  private createRefund(req: Request, res: Response): void {
    const body = req.body as Record<string, unknown>;
    const intent = typeof body.payment_intent === 'string' ? this.intents.get(body.payment_intent) : undefined;
    if (!intent || intent.status !== 'succeeded') return apiError(res, 400, 'invalid_request_error', 'No succeeded payment_intent to refund', 'payment_intent');
    const refunded = [...this.refunds.values()].filter((r) => r.payment_intent === intent.id).reduce((sum, r) => sum + r.amount, 0);
    const amount = body.amount === undefined ? intent.amount - refunded : Number(body.amount);
    if (!Number.isSafeInteger(amount) || amount < 1 || amount > intent.amount - refunded) {
      return apiError(res, 400, 'invalid_request_error', `Refund amount must be between 1 and ${intent.amount - refunded}`, 'amount');
    }
    const refund: Refund = { id: newId('re'), object: 'refund', amount, currency: intent.currency, payment_intent: intent.id, status: 'succeeded', reason: typeof body.reason === 'string' ? body.reason : null, metadata: stringMap(body.metadata), created: now() };
    this.refunds.set(refund.id, refund);
    res.json(refund);
    // The service reports the refund by event, after answering.
    setImmediate(() => void this.emit('refund.created', refund));
  }

  private showPage(req: Request, res: Response): void {
    const session = this.sessions.get(String(req.params.id));
    if (!session) return void res.status(404).type('text/plain').send('No such payment page');
    res.type('html').send(renderPaymentPage(session, null));
  }

  private async pay(req: Request, res: Response): Promise<void> {
    const session = this.sessions.get(String(req.params.id));
    if (!session) return void res.status(404).type('text/plain').send('No such payment page');
    if (session.status !== 'open') return void res.redirect(303, session.success_url);
    const number = String(req.body?.card ?? '').replace(/[\s-]/g, '');
    const expiry = String(req.body?.expiry ?? '').trim();
    const cvc = String(req.body?.cvc ?? '').trim();
    const problem = cardProblem(number, expiry, cvc);
    if (problem) return void res.status(422).type('html').send(renderPaymentPage(session, problem));
    const outcome = TEST_CARDS[number];
    const intent: PaymentIntent = {
      id: session.payment_intent ?? newId('pi'),
      object: 'payment_intent',
      amount: session.amount_total,
      amount_received: outcome.succeeds ? session.amount_total : 0,
      currency: session.currency,
      status: outcome.succeeds ? 'succeeded' : 'requires_payment_method',
      metadata: session.metadata,
      last_payment_error: outcome.succeeds ? null : { code: outcome.code, decline_code: outcome.declineCode, message: outcome.message, type: 'card_error' },
      created: now(),
      livemode: false,
    };
    this.intents.set(intent.id, intent);
    session.payment_intent = intent.id;
    if (!outcome.succeeds) {
      await this.emit('payment_intent.payment_failed', intent);
      return void res.status(402).type('html').send(renderPaymentPage(session, outcome.message));
    }
    session.status = 'complete';
    session.payment_status = 'paid';
    await this.emit('checkout.session.completed', session);
    res.redirect(303, session.success_url);
  }
}

/** What is wrong with the card details typed, in the page's words; null when they can be tried. */
function cardProblem(number: string, expiry: string, cvc: string): string | null {
  if (!/^\d{12,19}$/.test(number)) return 'Enter the card number (12 to 19 digits).';
  const match = /^(\d{2})\s*\/\s*(\d{2})$/.exec(expiry);
  if (!match || Number(match[1]) < 1 || Number(match[1]) > 12) return 'Enter the expiry date as MM / YY.';
  const now = new Date();
  const year = 2000 + Number(match[2]);
  if (year < now.getUTCFullYear() || (year === now.getUTCFullYear() && Number(match[1]) < now.getUTCMonth() + 1)) return 'This card has expired.';
  if (!/^\d{3,4}$/.test(cvc)) return 'Enter the 3 or 4 digit security code.';
  if (!TEST_CARDS[number]) return 'This test page takes only the payment service’s published test card numbers.';
  return null;
}

/** Starts the fake on loopback with the given keys. */
export function startFakePaymentService(options: FakePaymentServiceOptions): Promise<FakePaymentService> {
  return new FakePaymentService(options).start();
}

/** Keys for a fake started by the product itself: random per run, never a real key. */
export function fakeKeys(): { secretKey: string; webhookSecret: string } {
  return { secretKey: `sk_test_local_${randomBytes(16).toString('hex')}`, webhookSecret: `whsec_local_${randomBytes(24).toString('hex')}` };
}
