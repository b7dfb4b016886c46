/**
 * The payment provider's webhook. Its body must reach us as the exact bytes that were signed, so app.ts parses
 * this path with express.raw before the JSON parser runs (WEBHOOK_PATH).
 */
import type { Logger } from 'pino';
import type { Db } from '../../db/client';
import { SIGNATURE_HEADER } from '../dev/payment-fake';
import { AppError } from '../errors';
import { defineRoute, type MountableRoute } from '../http/define-route';
import type { FulfilSettings } from '../orders/fulfil-order';
import type { PackMailer } from '../packs/pack-mails';
import type { PaymentGateway } from './payment-gateway';
import { handlePaymentEvent } from './webhook-service';

export const WEBHOOK_PATH = '/api/pay/webhook';

/** Largest webhook body accepted (events are a few kilobytes). */
export const WEBHOOK_BODY_LIMIT = '512kb';

/** Returns the webhook route; without a gateway it answers 503 so the provider retries later. */
export function payRoutes(deps: { db: Db; payments: PaymentGateway | null; mailer: PackMailer | null; settings: FulfilSettings; logger: Logger }): MountableRoute[] {
  return [
    defineRoute({
      method: 'POST',
      path: WEBHOOK_PATH,
      access: 'public',
      handler: async ({ req }) => {
        if (!deps.payments) throw new AppError('PAYMENT_UNAVAILABLE', 503, 'Payments are not set up on this server');
        if (!Buffer.isBuffer(req.body)) throw new AppError('BAD_WEBHOOK', 400, 'The webhook body was not received as raw bytes; send it as application/json');
        const header = req.headers[SIGNATURE_HEADER];
        const event = deps.payments.verifyEvent(req.body, Array.isArray(header) ? header[0] : header);
        return { status: 200, json: { received: true, outcome: await handlePaymentEvent(deps, event) } };
      },
    }),
  ];
}
