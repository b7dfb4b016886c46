/**
 * The local payment fake, driven through the provider's official SDK (the reference client): the SDK's own
 * request encoding reaches the fake and its answers parse; the events the fake signs pass the SDK's
 * `webhooks.constructEvent`, and a tampered payload or a wrong secret fails it.
 */
import { createServer, type Server } from 'node:http';
import type { AddressInfo } from 'node:net';
import Stripe from 'stripe';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { signWebhookPayload, SIGNATURE_HEADER, startPaymentFake, type PaymentFake } from '../../server/dev/payment-fake';

const API_KEY = 'local-test-key-payment-fake';
const SECRET = 'local-test-webhook-secret-0123456789';

let fake: PaymentFake;
let hookServer: Server;
const received: Array<{ body: string; signature: string }> = [];
let client: Stripe;

beforeAll(async () => {
  hookServer = createServer((req, res) => {
    const chunks: Buffer[] = [];
    req.on('data', (c: Buffer) => chunks.push(c));
    req.on('end', () => {
      received.push({ body: Buffer.concat(chunks).toString('utf8'), signature: String(req.headers[SIGNATURE_HEADER] ?? '') });
      res.writeHead(200).end('{}');
    });
  });
  await new Promise<void>((r) => hookServer.listen(0, '127.0.0.1', () => r()));
  const hookPort = (hookServer.address() as AddressInfo).port;
  fake = await startPaymentFake({ port: 0, webhookUrl: `http://127.0.0.1:${hookPort}/hook`, webhookSecret: SECRET, apiKey: API_KEY });
  client = new Stripe(API_KEY, { host: '127.0.0.1', port: fake.port, protocol: 'http', maxNetworkRetries: 0 });
});
afterAll(async () => {
  await fake.close();
  await new Promise<void>((r) => hookServer.close(() => r()));
});

async function createSession() {
  return client.checkout.sessions.create({
    mode: 'payment',
    customer_email: 'buyer@example.com',
    line_items: [{ quantity: 1, price_data: { currency: 'eur', unit_amount: 1250, product_data: { name: 'Visor pack' } } }],
    success_url: 'http://127.0.0.1:9/packs/visor?paid=1&session={CHECKOUT_SESSION_ID}',
    cancel_url: 'http://127.0.0.1:9/packs/visor',
    metadata: { orderId: 'order-1' },
  });
}

describe('payment fake through the SDK', () => {
  it('creates and retrieves a checkout session with the amount, currency, metadata and a pay page', async () => {
    const session = await createSession();
    expect(session.amount_total).toBe(1250);
    expect(session.currency).toBe('eur');
    expect(session.metadata).toEqual({ orderId: 'order-1' });
    expect(session.payment_status).toBe('unpaid');
    expect(session.url).toBe(`${fake.url}/pay/${session.id}`);
    const again = await client.checkout.sessions.retrieve(session.id);
    expect(again.id).toBe(session.id);
    const page = await fetch(session.url!);
    expect(page.status).toBe(200);
    const html = await page.text();
    expect(html).toContain('12.50 EUR');
    expect(html).toContain('aria-label="Pay"');
  });

  it('refuses a wrong API key with the SDK’s authentication error', async () => {
    const wrong = new Stripe('not-the-key', { host: '127.0.0.1', port: fake.port, protocol: 'http', maxNetworkRetries: 0 });
    await expect(wrong.checkout.sessions.retrieve('cs_x')).rejects.toMatchObject({ type: 'StripeAuthenticationError', statusCode: 401 });
  });

  it('answers an unknown session with a 404 the SDK reports', async () => {
    await expect(client.checkout.sessions.retrieve('cs_missing')).rejects.toMatchObject({ statusCode: 404 });
  });

  it('paying sends checkout.session.completed, signed so that constructEvent accepts it, then redirects to the success URL', async () => {
    const session = await createSession();
    received.length = 0;
    const res = await fetch(`${fake.url}/pay/${session.id}`, { method: 'POST', redirect: 'manual' });
    expect(res.status).toBe(303);
    expect(res.headers.get('location')).toBe(`http://127.0.0.1:9/packs/visor?paid=1&session=${session.id}`);
    expect(received).toHaveLength(1);
    const event = client.webhooks.constructEvent(received[0].body, received[0].signature, SECRET);
    expect(event.type).toBe('checkout.session.completed');
    const paid = event.data.object as Stripe.Checkout.Session;
    expect(paid.id).toBe(session.id);
    expect(paid.payment_status).toBe('paid');
    expect(paid.payment_intent).toMatch(/^pi_/);
    expect((await client.checkout.sessions.retrieve(session.id)).payment_status).toBe('paid');
  });

  it('a tampered payload or another secret fails constructEvent', async () => {
    const session = await createSession();
    received.length = 0;
    await fetch(`${fake.url}/pay/${session.id}`, { method: 'POST', redirect: 'manual' });
    const { body, signature } = received[0];
    expect(() => client.webhooks.constructEvent(body.replace('"paid"', '"unpaid"'), signature, SECRET)).toThrow(/signature/i);
    expect(() => client.webhooks.constructEvent(body, signature, 'some-other-secret')).toThrow(/signature/i);
  });

  it('signWebhookPayload matches the SDK’s own test-header generator', () => {
    // The SDK's generateTestHeaderString computes the same scheme independently.
    const payload = JSON.stringify({ id: 'evt_1', type: 'x' });
    const ts = 1_700_000_000;
    expect(signWebhookPayload(payload, SECRET, ts)).toBe(client.webhooks.generateTestHeaderString({ payload, secret: SECRET, timestamp: ts }));
  });

  it('a refund of the paid intent answers succeeded and sends charge.refunded', async () => {
    const session = await createSession();
    received.length = 0;
    await fetch(`${fake.url}/pay/${session.id}`, { method: 'POST', redirect: 'manual' });
    const intent = String((await client.checkout.sessions.retrieve(session.id)).payment_intent);
    const refund = await client.refunds.create({ payment_intent: intent });
    expect(refund.status).toBe('succeeded');
    expect(refund.amount).toBe(1250);
    for (let i = 0; i < 50 && received.length < 2; i++) await new Promise((r) => setTimeout(r, 20));
    const event = client.webhooks.constructEvent(received[1].body, received[1].signature, SECRET);
    expect(event.type).toBe('charge.refunded');
    expect((event.data.object as Stripe.Charge).payment_intent).toBe(intent);
    await expect(client.refunds.create({ payment_intent: 'pi_unknown' })).rejects.toMatchObject({ statusCode: 404 });
  });
});
