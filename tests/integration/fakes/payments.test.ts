import { createServer, type Server } from 'node:http';
import { afterAll, beforeAll, beforeEach, describe, expect, it } from 'vitest';
import Stripe from 'stripe';
import { startPaymentsFake, type PaymentsFake } from '#fakes/payments/server.ts';
import { createPayments } from '#server/adapters/payments.ts';
import { loadEnv } from '#server/env.ts';
import { eventually, settle, temporaryDataDir } from '#tests/support/fakes.ts';

// Behaviour follows the payments API reference (docs.stripe.com/api: Checkout Sessions,
// PaymentIntents, Refunds, Events, Errors, Idempotent requests), its webhook guide
// (docs.stripe.com/webhooks: signatures, retries) and its testing guide (docs.stripe.com/testing:
// test card numbers and their outcomes).
const SECRET_KEY = 'sk_test_payments_fake';
const WEBHOOK_SECRET = 'whsec_payments_fake';

type Received = { event: Stripe.Event; verified: boolean };

describe('payments stand-in, through the stripe SDK', () => {
  const data = temporaryDataDir('payments');
  let fake: PaymentsFake;
  let hook: Server;
  let hookUrl: string;
  let received: Received[] = [];
  let failNext = 0;
  const payments = () =>
    createPayments(loadEnv({ STRIPE_API_URL: fake.url, STRIPE_SECRET_KEY: SECRET_KEY, STRIPE_WEBHOOK_SECRET: WEBHOOK_SECRET }));
  const start = (port = 0) =>
    startPaymentsFake({
      port,
      dataDir: data.dir,
      secretKeys: [SECRET_KEY],
      webhooks: [{ url: hookUrl, secret: WEBHOOK_SECRET }],
      retryBaseMs: 40,
      merchantName: 'Test studio',
    });

  beforeAll(async () => {
    // The app side of the webhook: verifies each delivery with constructEvent, as the app will.
    hook = createServer((req, res) => {
      const chunks: Buffer[] = [];
      req.on('data', (c: Buffer) => chunks.push(c));
      req.on('end', () => {
        if (failNext > 0) {
          failNext--;
          return void res.writeHead(500).end();
        }
        const payload = Buffer.concat(chunks);
        try {
          const event = new Stripe('sk_test_unused').webhooks.constructEvent(
            payload,
            String(req.headers['stripe-signature']),
            WEBHOOK_SECRET,
          );
          received.push({ event, verified: true });
          res.writeHead(200).end();
        } catch {
          res.writeHead(400).end();
        }
      });
    });
    await new Promise<void>((resolve) => hook.listen(0, '127.0.0.1', resolve));
    const address = hook.address();
    hookUrl = `http://127.0.0.1:${typeof address === 'object' && address ? address.port : 0}/webhook`;
    fake = await start();
  });
  beforeEach(() => {
    received = [];
    failNext = 0;
  });
  afterAll(async () => {
    await fake.stop();
    await new Promise((resolve) => hook.close(resolve));
    data.remove();
  });

  const createSession = (overrides: Partial<Stripe.Checkout.SessionCreateParams> = {}, options?: Stripe.RequestOptions) =>
    payments().stripe.checkout.sessions.create(
      {
        mode: 'payment',
        line_items: [
          { quantity: 1, price_data: { currency: 'usd', unit_amount: 4500, product_data: { name: 'Glass portrait 8 × 10 in' } } },
          { quantity: 2, price_data: { currency: 'usd', unit_amount: 1250, product_data: { name: 'Slate coaster' } } },
        ],
        customer_email: 'buyer@example.com',
        metadata: { order_id: 'order-1' },
        success_url: 'http://127.0.0.1:3000/orders/1?paid={CHECKOUT_SESSION_ID}',
        cancel_url: 'http://127.0.0.1:3000/cart',
        ...overrides,
      },
      options,
    );

  const pay = (session: Stripe.Checkout.Session, card: string) =>
    fetch(session.url!, {
      method: 'POST',
      redirect: 'manual',
      headers: { 'content-type': 'application/x-www-form-urlencoded' },
      body: new URLSearchParams({ email: 'buyer@example.com', card, expiry: '12 / 34', cvc: '123', name: 'Test Buyer' }),
    });

  it('creates and retrieves a Checkout Session with its line items, in minor units', async () => {
    const expiresAt = Math.floor(Date.now() / 1000) + 3600;
    const session = await createSession({ expires_at: expiresAt });
    expect(session).toMatchObject({
      object: 'checkout.session',
      status: 'open',
      payment_status: 'unpaid',
      amount_total: 7000,
      currency: 'usd',
      customer_email: 'buyer@example.com',
      metadata: { order_id: 'order-1' },
      expires_at: expiresAt,
    });
    expect(session.id).toMatch(/^cs_test_/);
    expect(session.url).toBe(`${fake.url}/pay/${session.id}`);
    const again = await payments().stripe.checkout.sessions.retrieve(session.id);
    expect(again.id).toBe(session.id);
    const items = await payments().stripe.checkout.sessions.listLineItems(session.id);
    expect(items.data.map((i) => [i.description, i.quantity, i.amount_total])).toEqual([
      ['Glass portrait 8 × 10 in', 1, 4500],
      ['Slate coaster', 2, 2500],
    ]);
    const intent = await payments().stripe.paymentIntents.retrieve(session.payment_intent as string);
    expect(intent).toMatchObject({ amount: 7000, status: 'requires_payment_method' });
  });

  it('pays with 4242 4242 4242 4242: redirects to success_url and delivers a verified checkout.session.completed', async () => {
    const session = await createSession();
    const page = await fetch(session.url!);
    expect(await page.text()).toContain('Test studio');
    const res = await pay(session, '4242 4242 4242 4242');
    expect(res.status).toBe(303);
    expect(res.headers.get('location')).toBe(`http://127.0.0.1:3000/orders/1?paid=${session.id}`);
    const completed = await eventually(() => received.find((r) => r.event.type === 'checkout.session.completed'));
    expect(completed.verified).toBe(true);
    expect((completed.event.data.object as Stripe.Checkout.Session).id).toBe(session.id);
    const paid = await payments().stripe.checkout.sessions.retrieve(session.id);
    expect(paid).toMatchObject({ status: 'complete', payment_status: 'paid' });
    const intent = await payments().stripe.paymentIntents.retrieve(paid.payment_intent as string);
    expect(intent).toMatchObject({ status: 'succeeded', amount_received: 7000 });
    // The event can be fetched back through the API, as the app may do to double-check.
    expect((await payments().stripe.events.retrieve(completed.event.id)).type).toBe('checkout.session.completed');
  });

  it('declines 4000 0000 0000 0002 and 4000 0000 0000 9995: our words on the page, the documented messages in the API, no completed event', async () => {
    const session = await createSession();
    const declined = await pay(session, '4000000000000002');
    expect(declined.status).toBe(402);
    expect(await declined.text()).toContain('Refused: this card was not accepted. Nothing was charged.');
    const poor = await pay(session, '4000 0000 0000 9995');
    expect(await poor.text()).toContain('Not enough funds on this card. Nothing was charged.');
    const failed = await eventually(() =>
      received.filter((r) => r.event.type === 'payment_intent.payment_failed').length === 2 ? received : undefined,
    );
    const decline = (failed.at(-1)!.event.data.object as Stripe.PaymentIntent).last_payment_error;
    // The processor's testing guide: the API's own message for this decline, unchanged for the SDK.
    expect(decline).toMatchObject({
      code: 'card_declined',
      decline_code: 'insufficient_funds',
      message: 'Your card has insufficient funds.',
    });
    await new Promise((resolve) => setTimeout(resolve, 150));
    expect(received.some((r) => r.event.type === 'checkout.session.completed')).toBe(false);
    expect(await payments().stripe.checkout.sessions.retrieve(session.id)).toMatchObject({ status: 'open', payment_status: 'unpaid' });
  });

  it('redelivers an event with the same id on request (a duplicate delivery)', async () => {
    const session = await createSession();
    await pay(session, '4242424242424242');
    const first = await eventually(() => received.find((r) => r.event.type === 'checkout.session.completed'));
    const replay = await fetch(`${fake.url}/_fake/events/${first.event.id}/deliver`, { method: 'POST' });
    expect(await replay.json()).toEqual({ statuses: [200] });
    const deliveries = received.filter((r) => r.event.type === 'checkout.session.completed');
    expect(deliveries.map((r) => r.event.id)).toEqual([first.event.id, first.event.id]);
  });

  it('retries a delivery that got no 2xx, with backoff, until it is taken', async () => {
    failNext = 2;
    const session = await createSession();
    await payments().stripe.checkout.sessions.expire(session.id);
    const expired = await eventually(() => received.find((r) => r.event.type === 'checkout.session.expired'));
    expect((expired.event.data.object as Stripe.Checkout.Session).id).toBe(session.id);
    expect(failNext).toBe(0);
  });

  it('refunds in part and in full, and refuses a refund over the amount paid', async () => {
    const session = await createSession();
    await pay(session, '4242424242424242');
    const intentId = (await payments().stripe.checkout.sessions.retrieve(session.id)).payment_intent as string;
    const part = await payments().stripe.refunds.create({ payment_intent: intentId, amount: 2000 });
    expect(part).toMatchObject({ object: 'refund', amount: 2000, status: 'succeeded' });
    const tooMuch = await payments()
      .stripe.refunds.create({ payment_intent: intentId, amount: 6000 })
      .catch((e: unknown) => e);
    expect(tooMuch).toBeInstanceOf(Stripe.errors.StripeInvalidRequestError);
    expect((tooMuch as Stripe.errors.StripeInvalidRequestError).code).toBe('amount_too_large');
    const rest = await payments().stripe.refunds.create({ payment_intent: intentId });
    expect(rest.amount).toBe(5000);
    const again = await payments()
      .stripe.refunds.create({ payment_intent: intentId })
      .catch((e: unknown) => e);
    expect((again as Stripe.errors.StripeInvalidRequestError).code).toBe('charge_already_refunded');
    const refunded = await eventually(() =>
      received.filter((r) => r.event.type === 'charge.refunded').length === 2 ? received : undefined,
    );
    expect((refunded.at(-1)!.event.data.object as Stripe.Charge).refunded).toBe(true);
  });

  it('raises the SDK’s authentication error without the right secret key', async () => {
    const wrong = createPayments(loadEnv({ STRIPE_API_URL: fake.url, STRIPE_SECRET_KEY: 'sk_test_wrong_key' }));
    const error = await wrong.stripe.checkout.sessions.retrieve('cs_test_x').catch((e: unknown) => e);
    expect(error).toBeInstanceOf(Stripe.errors.StripeAuthenticationError);
    expect((error as Stripe.errors.StripeError).statusCode).toBe(401);
    const none = await fetch(`${fake.url}/v1/checkout/sessions/cs_test_x`);
    expect(none.status).toBe(401);
    expect(((await none.json()) as { error: { type: string } }).error.type).toBe('invalid_request_error');
  });

  it('answers an idempotent retry with the same object, and refuses the key with other parameters', async () => {
    const first = await createSession({}, { idempotencyKey: 'order-7-attempt-1' });
    const retry = await createSession({}, { idempotencyKey: 'order-7-attempt-1' });
    expect(retry.id).toBe(first.id);
    const other = await createSession({ customer_email: 'other@example.com' }, { idempotencyKey: 'order-7-attempt-1' }).catch(
      (e: unknown) => e,
    );
    expect(other).toBeInstanceOf(Stripe.errors.StripeIdempotencyError);
  });

  it('requires a currency and integer amounts, naming the parameter', async () => {
    const noCurrency = await createSession({
      line_items: [
        {
          quantity: 1,
          price_data: { unit_amount: 100, product_data: { name: 'x' } } as Stripe.Checkout.SessionCreateParams.LineItem.PriceData,
        },
      ],
    }).catch((e: unknown) => e);
    expect(noCurrency).toBeInstanceOf(Stripe.errors.StripeInvalidRequestError);
    expect((noCurrency as Stripe.errors.StripeInvalidRequestError).param).toBe('line_items[0][price_data][currency]');
    const fractional = await createSession({
      line_items: [{ quantity: 1, price_data: { currency: 'usd', unit_amount: 12.5, product_data: { name: 'x' } } }],
    }).catch((e: unknown) => e);
    expect((fractional as Stripe.errors.StripeInvalidRequestError).param).toBe('line_items[0][price_data][unit_amount]');
  });

  it('expires an open session once, with a checkout.session.expired event', async () => {
    const session = await createSession();
    const expired = await payments().stripe.checkout.sessions.expire(session.id);
    expect(expired).toMatchObject({ status: 'expired', url: null });
    const twice = await payments()
      .stripe.checkout.sessions.expire(session.id)
      .catch((e: unknown) => e);
    expect(twice).toBeInstanceOf(Stripe.errors.StripeInvalidRequestError);
    await eventually(() =>
      received.find(
        (r) => r.event.type === 'checkout.session.expired' && (r.event.data.object as Stripe.Checkout.Session).id === session.id,
      ),
    );
    expect((await pay(session, '4242424242424242')).status).toBe(409);
  });

  it('keeps its records across a restart', async () => {
    const session = await createSession();
    const port = fake.port;
    await fake.stop();
    await settle();
    fake = await start(port);
    expect((await payments().stripe.checkout.sessions.retrieve(session.id)).amount_total).toBe(7000);
  });
});
