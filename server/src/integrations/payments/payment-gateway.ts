// Card payments through the official stripe SDK. By default the SDK is pointed at the local fake
// payment service (host, port, protocol); the real service is used only when real keys are given
// by environment variables (STRIPE_SECRET_KEY, STRIPE_WEBHOOK_SECRET).
import Stripe from 'stripe';

export interface PaymentsConfig {
  secretKey: string;
  webhookSecret: string;
  /** Where the SDK sends its calls (the local fake); null for the real service. */
  apiBase: string | null;
}

export interface NewCheckout {
  paymentId: number;
  requestId: number;
  description: string;
  amountCents: number;
  successUrl: string;
  cancelUrl: string;
  customerEmail: string;
  idempotencyKey: string;
}

/** Why the payment service could not be reached or refused a call. */
export class PaymentServiceError extends Error {}

export class PaymentGateway {
  private readonly stripe: Stripe;

  constructor(private readonly config: PaymentsConfig) {
    const base = config.apiBase ? new URL(config.apiBase) : null;
    this.stripe = new Stripe(config.secretKey, {
      maxNetworkRetries: 0,
      telemetry: false,
      timeout: 20_000,
      ...(base ? { host: base.hostname, port: Number(base.port || (base.protocol === 'https:' ? 443 : 80)), protocol: base.protocol.replace(':', '') as 'http' | 'https' } : {}),
    });
  }

  /** A hosted payment page for one payment; the same idempotency key gives the same session. */
  async createCheckout(c: NewCheckout): Promise<{ sessionId: string; url: string }> {
    const metadata = { payment_id: String(c.paymentId), request_id: String(c.requestId) };
    const session = await this.call(() =>
      this.stripe.checkout.sessions.create(
        {
          mode: 'payment',
          line_items: [{ quantity: 1, price_data: { currency: 'usd', unit_amount: c.amountCents, product_data: { name: c.description } } }],
          client_reference_id: String(c.paymentId),
          customer_email: c.customerEmail,
          metadata,
          payment_intent_data: { metadata },
          success_url: c.successUrl,
          cancel_url: c.cancelUrl,
        },
        { idempotencyKey: c.idempotencyKey },
      ),
    );
    if (!session.url) throw new PaymentServiceError('The payment service gave no payment page');
    return { sessionId: session.id, url: session.url };
  }

  async refund(r: { paymentIntentId: string; amountCents: number; refundId: number; idempotencyKey: string }): Promise<{ providerRefundId: string }> {
    const refund = await this.call(() =>
      this.stripe.refunds.create(
        { payment_intent: r.paymentIntentId, amount: r.amountCents, metadata: { refund_id: String(r.refundId) } },
        { idempotencyKey: r.idempotencyKey },
      ),
    );
    return { providerRefundId: refund.id };
  }

  /** The event if its signature over the raw body verifies; throws otherwise. */
  verifyEvent(rawBody: Buffer, signature: string): Stripe.Event {
    return this.stripe.webhooks.constructEvent(rawBody, signature, this.config.webhookSecret);
  }

  private async call<T>(fn: () => Promise<T>): Promise<T> {
    try {
      return await fn();
    } catch (err) {
      if (err instanceof Stripe.errors.StripeError) throw new PaymentServiceError(err.message);
      throw err;
    }
  }
}
