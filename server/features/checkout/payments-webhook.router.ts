import express, { Router } from 'express';
import type { Payments } from '#server/adapters/payments.ts';
import type { Env } from '#server/env.ts';
import type { Logger } from '#server/logger.ts';
import type { Orm } from '#server/db/orm.ts';
import { AppError } from '#shared/errors.ts';
import { handlePaymentEvent } from './payment-events.service.ts';

/**
 * `POST /api/payments/webhook`: the payment provider's events. The raw body is kept for the
 * signature check; a bad signature is refused with 400 and changes nothing. Mounted before the
 * JSON parser.
 */
export function paymentsWebhookRouter({ orm, env, payments, logger }: { orm: Orm; env: Env; payments: Payments; logger: Logger }): Router {
  const router = Router();
  router.post('/', express.raw({ type: '*/*', limit: '1mb' }), async (req, res) => {
    let event;
    try {
      event = payments.parseWebhook(req.body as Buffer, req.header('stripe-signature'));
    } catch (cause) {
      throw new AppError('BAD_REQUEST', 'The webhook signature does not match.', { cause });
    }
    const outcome = await handlePaymentEvent(orm, { payments, env }, event);
    logger.info({ event: event.id, type: event.type, outcome }, 'payment event');
    res.json({ received: true, outcome });
  });
  return router;
}
