/**
 * The payment provider as Sheetsmith uses it: open a checkout session for one order, refund a payment, and
 * verify a webhook event's signature. Implemented with the provider's official SDK, pointed at PAY_API_URL
 * (locally the fake of server/dev/payment-fake.ts).
 */
import Stripe from 'stripe';
import { AppError } from '../errors';

export interface CheckoutRequest {
  orderId: string;
  title: string;
  amountCents: number;
  currency: string;
  email: string;
  successUrl: string;
  cancelUrl: string;
}

/** A verified event, reduced to what the webhook acts on. */
export type PaymentEvent =
  | { id: string; type: 'checkout.session.completed'; sessionId: string; orderId: string | null; paymentIntentId: string | null; paid: boolean }
  | { id: string; type: 'charge.refunded'; paymentIntentId: string | null }
  | { id: string; type: 'other'; eventType: string };

export interface PaymentGateway {
  /** Returns the new session's id and the URL to send the buyer to. */
  createCheckout(req: CheckoutRequest): Promise<{ sessionId: string; url: string }>;
  /** Refunds the whole payment `paymentIntentId`. */
  refund(paymentIntentId: string): Promise<void>;
  /** Returns the event in `rawBody` after checking `signatureHeader`; throws 400 BAD_SIGNATURE when it fails. */
  verifyEvent(rawBody: Buffer, signatureHeader: string | undefined): PaymentEvent;
}

export interface PaymentSettings {
  /** Base URL of the payment API, e.g. http://127.0.0.1:8473. */
  PAY_API_URL: string;
  PAY_API_KEY: string;
  PAY_WEBHOOK_SECRET: string;
}

/** Returns a 502 PAYMENT_UNAVAILABLE error saying what failed; the provider's own message is kept for the log. */
function unavailable(what: string, err: unknown): AppError {
  const detail = err instanceof Error ? err.message : String(err);
  return new AppError('PAYMENT_UNAVAILABLE', 502, `The payment service could not ${what} (${detail}); try again in a moment`);
}

/** Returns a gateway over the provider's SDK with the given settings; no connection is opened until used. */
export function createPaymentGateway(settings: PaymentSettings): PaymentGateway {
  const api = new URL(settings.PAY_API_URL);
  const protocol = api.protocol === 'https:' ? 'https' : 'http';
  const client = new Stripe(settings.PAY_API_KEY, {
    host: api.hostname,
    port: api.port ? Number(api.port) : protocol === 'https' ? 443 : 80,
    protocol,
    maxNetworkRetries: 1,
    timeout: 15_000,
  });
  return {
    async createCheckout(req) {
      try {
        const session = await client.checkout.sessions.create({
          mode: 'payment',
          customer_email: req.email,
          line_items: [{ quantity: 1, price_data: { currency: req.currency, unit_amount: req.amountCents, product_data: { name: req.title } } }],
          success_url: req.successUrl,
          cancel_url: req.cancelUrl,
          metadata: { orderId: req.orderId },
        });
        if (!session.url) throw new Error('the new session has no payment page URL');
        return { sessionId: session.id, url: session.url };
      } catch (err) {
        throw unavailable('open a checkout', err);
      }
    },
    async refund(paymentIntentId) {
      try {
        await client.refunds.create({ payment_intent: paymentIntentId });
      } catch (err) {
        throw unavailable(`refund payment ${paymentIntentId}`, err);
      }
    },
    verifyEvent(rawBody, signatureHeader) {
      let event: Stripe.Event;
      try {
        event = client.webhooks.constructEvent(rawBody, signatureHeader ?? '', settings.PAY_WEBHOOK_SECRET);
      } catch (err) {
        throw new AppError('BAD_SIGNATURE', 400, `The webhook's signature does not verify: ${err instanceof Error ? err.message : String(err)}`);
      }
      if (event.type === 'checkout.session.completed') {
        const s = event.data.object;
        const intent = typeof s.payment_intent === 'string' ? s.payment_intent : (s.payment_intent?.id ?? null);
        return { id: event.id, type: event.type, sessionId: s.id, orderId: s.metadata?.orderId ?? null, paymentIntentId: intent, paid: s.payment_status === 'paid' };
      }
      if (event.type === 'charge.refunded') {
        const c = event.data.object;
        const intent = typeof c.payment_intent === 'string' ? c.payment_intent : (c.payment_intent?.id ?? null);
        return { id: event.id, type: event.type, paymentIntentId: intent };
      }
      return { id: event.id, type: 'other', eventType: event.type };
    },
  };
}
