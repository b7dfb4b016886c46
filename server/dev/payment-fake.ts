/**
 * A local stand-in for the payment provider's API, for development and tests on loopback. It implements only
 * the calls Sheetsmith makes through the provider's official SDK — checkout session create and retrieve, and
 * refunds — plus a plain pay page of our own ("Pay" / "Cancel"). Paying or refunding POSTs a signed event to
 * `webhookUrl`; the signature header is `t=<unix seconds>,v1=<hex HMAC-SHA256 of "<t>.<payload>">`, the scheme
 * the SDK's `webhooks.constructEvent` verifies. State lives in memory and ends with the process.
 */
import { createHmac, randomBytes } from 'node:crypto';
import type { Server } from 'node:http';
import type { AddressInfo } from 'node:net';
import express, { type NextFunction, type Request, type Response } from 'express';
import { escapeHtml } from '../mail/templates/mail-layout';
import { formatAmount } from '../mail/templates/receipt-mail';

export interface PaymentFakeOptions {
  /** 0 picks a free port. */
  port: number;
  host?: string;
  /** Where events are POSTed (our API's /api/pay/webhook). */
  webhookUrl: string;
  webhookSecret: string;
  /** The secret key clients must send as `Authorization: Bearer <key>`. */
  apiKey: string;
}

export interface PaymentFake {
  /** Base URL of the fake, e.g. http://127.0.0.1:8473. */
  url: string;
  port: number;
  /** Events sent so far (newest last) with the status our webhook answered, for tests and debugging. */
  events(): ReadonlyArray<{ id: string; type: string; status: number | null }>;
  close(): Promise<void>;
}

interface FakeSession {
  id: string;
  object: 'checkout.session';
  mode: string;
  status: 'open' | 'complete' | 'expired';
  payment_status: 'unpaid' | 'paid';
  amount_total: number;
  currency: string;
  customer_email: string | null;
  metadata: Record<string, string>;
  success_url: string;
  cancel_url: string;
  payment_intent: string | null;
  url: string | null;
  created: number;
  livemode: false;
}

/**
 * Returns the signature header value for `payload` signed with `secret` at `timestampSec`, in the provider's
 * scheme `t=<ts>,v1=<hex HMAC-SHA256 of "<ts>.<payload>">`.
 */
export function signWebhookPayload(payload: string, secret: string, timestampSec: number): string {
  const mac = createHmac('sha256', secret).update(`${timestampSec}.${payload}`, 'utf8').digest('hex');
  return `t=${timestampSec},v1=${mac}`;
}

/** The header our webhook reads the signature from (the provider's name for it). */
export const SIGNATURE_HEADER = 'stripe-signature';

function newId(prefix: string): string {
  return `${prefix}_local_${randomBytes(12).toString('hex')}`;
}

function apiError(res: Response, status: number, message: string, param?: string): void {
  res.status(status).json({ error: { type: 'invalid_request_error', message, ...(param ? { param } : {}) } });
}

/** The fake's own pay page: what is bought, for how much, and two buttons. Plain HTML, no scripts. */
function payPage(session: FakeSession, title: string): string {
  const done = session.payment_status === 'paid';
  return `<!doctype html><html lang="en"><head><meta charset="utf-8"><meta name="viewport" content="width=device-width, initial-scale=1">
<title>Local test payment</title>
<style>body{font-family:system-ui,sans-serif;background:#f3efe6;margin:0;padding:24px}main{max-width:420px;margin:0 auto;background:#fff;border:2px solid #2d2a26;border-radius:10px;padding:20px}
h1{font-size:20px;margin:0 0 8px}.amount{font-size:28px;font-weight:700;margin:12px 0}.note{color:#5b554c;font-size:14px}
form{display:inline}button{font-size:16px;padding:10px 18px;margin:8px 8px 0 0;border-radius:6px;border:2px solid #2d2a26;cursor:pointer}
.pay{background:#2d2a26;color:#fff}.cancel{background:#fff;color:#2d2a26}</style></head>
<body><main><p class="note">Local test payment — no money moves.</p>
<h1>${escapeHtml(title)}</h1>
<div class="amount">${escapeHtml(formatAmount(session.amount_total, session.currency))}</div>
<p class="note">Buyer: ${escapeHtml(session.customer_email ?? 'not given')}</p>
${
  done
    ? '<p>This payment is complete.</p>'
    : `<form method="post" action="/pay/${session.id}"><button class="pay" type="submit" aria-label="Pay">Pay</button></form>
<form method="post" action="/pay/${session.id}/cancel"><button class="cancel" type="submit" aria-label="Cancel">Cancel</button></form>`
}
</main></body></html>`;
}

interface LineItemInput {
  quantity?: string;
  price_data?: { currency?: string; unit_amount?: string; product_data?: { name?: string } };
}

/** Starts the fake on loopback and returns its URL and a close function. */
export async function startPaymentFake(options: PaymentFakeOptions): Promise<PaymentFake> {
  const host = options.host ?? '127.0.0.1';
  const sessions = new Map<string, FakeSession>();
  const titles = new Map<string, string>();
  const byIntent = new Map<string, string>();
  const sent: Array<{ id: string; type: string; status: number | null }> = [];
  let baseUrl = '';

  async function sendEvent(type: string, object: unknown): Promise<void> {
    const event = { id: newId('evt'), object: 'event', type, created: Math.floor(Date.now() / 1000), livemode: false, data: { object } };
    const payload = JSON.stringify(event);
    const record = { id: event.id, type, status: null as number | null };
    sent.push(record);
    try {
      const res = await fetch(options.webhookUrl, {
        method: 'POST',
        headers: { 'content-type': 'application/json', [SIGNATURE_HEADER]: signWebhookPayload(payload, options.webhookSecret, event.created) },
        body: payload,
      });
      record.status = res.status;
    } catch {
      record.status = null;
    }
  }

  const app = express();
  app.disable('x-powered-by');
  app.use(express.urlencoded({ extended: true, limit: '100kb' }));

  const requireKey = (req: Request, res: Response, next: NextFunction) => {
    if (req.headers.authorization !== `Bearer ${options.apiKey}`) {
      res.status(401).json({ error: { type: 'authentication_error', message: 'Invalid API key provided' } });
      return;
    }
    next();
  };

  app.post('/v1/checkout/sessions', requireKey, (req, res) => {
    const body = req.body as Record<string, unknown>;
    const items = (Array.isArray(body.line_items) ? body.line_items : Object.values((body.line_items as object) ?? {})) as LineItemInput[];
    if (items.length === 0) return apiError(res, 400, 'Missing required param: line_items.', 'line_items');
    if (typeof body.success_url !== 'string') return apiError(res, 400, 'Missing required param: success_url.', 'success_url');
    if (typeof body.cancel_url !== 'string') return apiError(res, 400, 'Missing required param: cancel_url.', 'cancel_url');
    let total = 0;
    let currency = '';
    for (const [i, item] of items.entries()) {
      const amount = Number(item.price_data?.unit_amount);
      const quantity = Number(item.quantity ?? 1);
      if (!Number.isInteger(amount) || amount < 0) return apiError(res, 400, `Invalid integer: line_items[${i}][price_data][unit_amount]`, `line_items[${i}][price_data][unit_amount]`);
      if (!item.price_data?.currency) return apiError(res, 400, `Missing required param: line_items[${i}][price_data][currency].`);
      total += amount * quantity;
      currency = item.price_data.currency.toLowerCase();
    }
    const id = newId('cs');
    const session: FakeSession = {
      id,
      object: 'checkout.session',
      mode: typeof body.mode === 'string' ? body.mode : 'payment',
      status: 'open',
      payment_status: 'unpaid',
      amount_total: total,
      currency,
      customer_email: typeof body.customer_email === 'string' ? body.customer_email : null,
      metadata: (body.metadata as Record<string, string>) ?? {},
      success_url: body.success_url,
      cancel_url: body.cancel_url,
      payment_intent: null,
      url: `${baseUrl}/pay/${id}`,
      created: Math.floor(Date.now() / 1000),
      livemode: false,
    };
    sessions.set(id, session);
    titles.set(id, items.map((i) => i.price_data?.product_data?.name ?? 'Item').join(', '));
    res.json(session);
  });

  app.get('/v1/checkout/sessions/:id', requireKey, (req, res) => {
    const session = sessions.get(String(req.params.id));
    if (!session) return apiError(res, 404, `No such checkout.session: '${String(req.params.id)}'`, 'id');
    res.json(session);
  });

  app.post('/v1/refunds', requireKey, (req, res) => {
    const intent = (req.body as Record<string, unknown>).payment_intent;
    if (typeof intent !== 'string') return apiError(res, 400, 'Missing required param: payment_intent.', 'payment_intent');
    const session = sessions.get(byIntent.get(intent) ?? '');
    if (!session) return apiError(res, 404, `No such payment_intent: '${intent}'`, 'payment_intent');
    const refund = { id: newId('re'), object: 'refund', amount: session.amount_total, currency: session.currency, payment_intent: intent, status: 'succeeded' };
    res.json(refund);
    // The provider reports the refund by event after answering, as the real service does.
    const charge = { id: newId('ch'), object: 'charge', payment_intent: intent, amount: session.amount_total, amount_refunded: session.amount_total, currency: session.currency, refunded: true };
    void sendEvent('charge.refunded', charge);
  });

  app.get('/pay/:id', (req, res) => {
    const session = sessions.get(String(req.params.id));
    if (!session) {
      res.status(404).type('text/plain').send(`There is no payment ${String(req.params.id)} on this local test service`);
      return;
    }
    res.type('html').send(payPage(session, titles.get(session.id) ?? ''));
  });

  app.post('/pay/:id', async (req, res) => {
    const session = sessions.get(String(req.params.id));
    if (!session) {
      res.status(404).type('text/plain').send(`There is no payment ${String(req.params.id)} on this local test service`);
      return;
    }
    if (session.payment_status !== 'paid') {
      session.payment_status = 'paid';
      session.status = 'complete';
      session.payment_intent = newId('pi');
      session.url = null;
      byIntent.set(session.payment_intent, session.id);
      // Delivered before the redirect, so the buyer's return page already sees the order paid.
      await sendEvent('checkout.session.completed', session);
    }
    res.redirect(303, session.success_url.replace('{CHECKOUT_SESSION_ID}', session.id));
  });

  app.post('/pay/:id/cancel', (req, res) => {
    const session = sessions.get(String(req.params.id));
    if (!session) {
      res.status(404).type('text/plain').send(`There is no payment ${String(req.params.id)} on this local test service`);
      return;
    }
    res.redirect(303, session.cancel_url);
  });

  app.use((req, res) => apiError(res, 404, `Unrecognized request URL (${req.method}: ${req.path}); this local fake serves only checkout sessions, refunds and its pay page.`));

  const server: Server = await new Promise((resolve, reject) => {
    const s = app.listen(options.port, host, () => resolve(s));
    s.on('error', reject);
  });
  const port = (server.address() as AddressInfo).port;
  baseUrl = `http://${host}:${port}`;
  return {
    url: baseUrl,
    port,
    events: () => sent.map((e) => ({ ...e })),
    close: () =>
      new Promise<void>((resolve) => {
        server.close(() => resolve());
        server.closeAllConnections();
      }),
  };
}
