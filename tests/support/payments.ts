import type { Express } from 'express';
import request from 'supertest';
import { afterAll } from 'vitest';
import type { TestApp } from './test-app.ts';
import { startPaymentsFake, type PaymentsFake } from '#fakes/payments/server.ts';
import type { WebhookEndpoint } from '#fakes/payments/webhooks.ts';
import { temporaryDataDir } from './fakes.ts';

const SECRET_KEY = 'sk_test_checkout_tests';

/**
 * Pays on a payments stand-in's pay page as a person would, with a test card (any stand-in: the
 * test stack's or a file's own); answers the page's status.
 */
export async function payWithTestCard(paymentUrl: string, card = '4242 4242 4242 4242'): Promise<number> {
  const res = await fetch(paymentUrl, {
    method: 'POST',
    headers: { 'content-type': 'application/x-www-form-urlencoded' },
    body: new URLSearchParams({ card, expiry: '12/34', cvc: '123', email: 'buyer@example.test', name: 'Test Buyer' }),
    redirect: 'manual',
  });
  return res.status;
}
const WEBHOOK_SECRET = 'whsec_checkout_tests';

/**
 * For a test file that takes payments: a payments stand-in of its own, whose webhooks reach the
 * app once it listens (`connect`). `start` answers the app's environment for it.
 */
export function usePaymentsFake() {
  const data = temporaryDataDir('payments');
  const endpoints: WebhookEndpoint[] = [];
  let fake: PaymentsFake | undefined;
  afterAll(async () => {
    await fake?.stop();
    data.remove();
  });
  return {
    async start(): Promise<Record<string, string>> {
      fake = await startPaymentsFake({
        dataDir: data.dir,
        secretKeys: [SECRET_KEY],
        webhooks: endpoints,
        retryBaseMs: 50,
        merchantName: 'Test studio',
      });
      return { STRIPE_API_URL: fake.url, STRIPE_SECRET_KEY: SECRET_KEY, STRIPE_WEBHOOK_SECRET: WEBHOOK_SECRET };
    },
    /** Sends webhooks to the app at this base URL from now on. */
    connect(appUrl: string) {
      endpoints.splice(0, endpoints.length, { url: `${appUrl}/api/payments/webhook`, secret: WEBHOOK_SECRET });
    },
    get url() {
      return fake!.url;
    },
    pay: payWithTestCard,
    /** Delivers an event again, as the provider does after a lost answer. */
    async redeliver(eventId: string): Promise<void> {
      await fetch(`${fake!.url}/_fake/events/${eventId}/deliver`, { method: 'POST' });
    },
  };
}

/**
 * Posts an event to the app's payment webhook as the provider would: the raw JSON, signed with
 * `secret` (the app's own unless a test forges one).
 */
export function postSignedEvent(t: Pick<TestApp, 'app' | 'payments' | 'env'>, event: object, secret = t.env.STRIPE_WEBHOOK_SECRET) {
  const payload = JSON.stringify(event);
  const signature = t.payments.stripe.webhooks.generateTestHeaderString({ payload, secret });
  return request(t.app as Express)
    .post('/api/payments/webhook')
    .set('content-type', 'application/json')
    .set('stripe-signature', signature)
    .send(payload);
}
