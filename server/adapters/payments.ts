import Stripe from 'stripe';
import type { Env } from '../env.ts';

/**
 * The payments API client. STRIPE_API_URL points it at the local stand-in by default and at
 * https://api.stripe.com in production; nothing else in the app knows which one it talks to.
 */
export function createPayments(env: Pick<Env, 'STRIPE_API_URL' | 'STRIPE_SECRET_KEY' | 'STRIPE_WEBHOOK_SECRET'>) {
  const api = new URL(env.STRIPE_API_URL);
  const stripe = new Stripe(env.STRIPE_SECRET_KEY, {
    host: api.hostname,
    port: api.port ? Number(api.port) : api.protocol === 'https:' ? 443 : 80,
    protocol: api.protocol === 'https:' ? 'https' : 'http',
    maxNetworkRetries: 2,
    timeout: 15_000,
    telemetry: false,
  });
  return {
    stripe,
    /** Verifies a webhook's signature and parses its event; throws the SDK's signature error. */
    parseWebhook(payload: string | Buffer, signature: string | undefined): Stripe.Event {
      return stripe.webhooks.constructEvent(payload, signature ?? '', env.STRIPE_WEBHOOK_SECRET);
    },
  };
}

export type Payments = ReturnType<typeof createPayments>;
