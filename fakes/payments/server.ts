import { createHash, timingSafeEqual } from 'node:crypto';
import { createServer } from 'node:http';
import express, { type NextFunction, type Request, type Response } from 'express';
import { close, listen } from '../support/listen.ts';
import { requestLogMiddleware, silentLogger, type RequestLogger } from '../support/request-log.ts';
import { payPage } from './pay-page.ts';
import {
  newId,
  nowSeconds,
  PaymentsState,
  type CheckoutSession,
  type LineItem,
  type Metadata,
  type PaymentEvent,
  type PaymentIntent,
  type Refund,
} from './state.ts';
import { WebhookDeliverer, type WebhookEndpoint } from './webhooks.ts';

/**
 * A local stand-in for the payments API subset the app uses — Checkout Sessions, Payment
 * Intents, Refunds, Events — driven by the real `stripe` SDK through its host/port/protocol
 * options; a hosted-style pay page at each session's `url`; signed webhooks with retries.
 * Behaviour follows the public API reference (docs.stripe.com/api) and its testing guide
 * (docs.stripe.com/testing) for the test card numbers.
 */
export type PaymentsFakeOptions = {
  port?: number;
  host?: string;
  dataDir: string;
  /** Secret keys accepted on API calls. */
  secretKeys: string[];
  webhooks?: WebhookEndpoint[];
  /** Name shown on the pay page (the account's business name). */
  merchantName?: string;
  retryBaseMs?: number;
  maxDeliveryAttempts?: number;
  log?: RequestLogger;
};

export type PaymentsFake = { url: string; port: number; deliverer: WebhookDeliverer; stop(): Promise<void> };

const API_VERSION = '2026-10-28.endive';

class ApiError extends Error {
  constructor(
    readonly status: number,
    readonly type: 'invalid_request_error' | 'idempotency_error' | 'card_error' | 'api_error',
    message: string,
    readonly extra: { param?: string; code?: string; decline_code?: string } = {},
  ) {
    super(message);
  }
}

const missing = (kind: string, id: string) =>
  new ApiError(404, 'invalid_request_error', `No such ${kind}: '${id}'`, { code: 'resource_missing', param: 'id' });

/**
 * Test card numbers from the processor's testing guide, which the SDK and the app rely on. The
 * API answers with the processor's own error message (`message`, as the real service would); the
 * pay page says it in our words (`words`).
 */
const TEST_CARDS: Record<string, { outcome: 'succeeded' } | { outcome: 'declined'; decline_code: string; message: string; words: string }> =
  {
    '4242424242424242': { outcome: 'succeeded' },
    '5555555555554444': { outcome: 'succeeded' },
    '4000000000000002': {
      outcome: 'declined',
      decline_code: 'generic_decline',
      message: 'Your card was declined.',
      words: 'Refused: this card was not accepted. Nothing was charged.',
    },
    '4000000000009995': {
      outcome: 'declined',
      decline_code: 'insufficient_funds',
      message: 'Your card has insufficient funds.',
      words: 'Not enough funds on this card. Nothing was charged.',
    },
  };

function luhnValid(digits: string): boolean {
  let sum = 0;
  for (let i = 0; i < digits.length; i++) {
    let d = Number(digits[digits.length - 1 - i]);
    if (i % 2 === 1) d = d * 2 > 9 ? d * 2 - 9 : d * 2;
    sum += d;
  }
  return digits.length >= 12 && sum % 10 === 0;
}

export async function startPaymentsFake(options: PaymentsFakeOptions): Promise<PaymentsFake> {
  const state = new PaymentsState(options.dataDir);
  const log = options.log ?? silentLogger;
  const deliverer = new WebhookDeliverer(state, options.webhooks ?? [], {
    retryBaseMs: options.retryBaseMs ?? 1000,
    maxAttempts: options.maxDeliveryAttempts ?? 16,
    log,
  });
  let baseUrl = '';

  function emit(type: string, object: unknown, idempotencyKey: string | null = null): PaymentEvent {
    const event: PaymentEvent = {
      id: newId('evt'),
      object: 'event',
      api_version: API_VERSION,
      created: nowSeconds(),
      data: { object: structuredClone(object) },
      livemode: false,
      pending_webhooks: 0,
      request: { id: null, idempotency_key: idempotencyKey },
      type,
    };
    state.data.events[event.id] = event;
    deliverer.enqueue(event);
    return event;
  }

  function expireSession(session: CheckoutSession): void {
    session.status = 'expired';
    session.url = null;
    const intent = session.payment_intent ? state.data.paymentIntents[session.payment_intent] : undefined;
    if (intent && intent.status !== 'succeeded') intent.status = 'canceled';
    emit('checkout.session.expired', session);
  }

  /** Sessions past their expires_at expire on their own, as on the real service. */
  const sweeper = setInterval(() => {
    for (const session of Object.values(state.data.sessions)) {
      if (session.status === 'open' && session.expires_at <= nowSeconds()) expireSession(session);
    }
  }, 1000);
  sweeper.unref();

  const app = express();
  app.disable('x-powered-by');
  app.use(requestLogMiddleware(log));
  app.use(express.urlencoded({ extended: true, limit: '1mb' }));

  // ---- API: secret key on every call ------------------------------------------------------
  const api = express.Router();
  api.use((req, _res, next) => {
    const header = req.headers.authorization ?? '';
    const key = header.startsWith('Bearer ')
      ? header.slice(7)
      : header.startsWith('Basic ')
        ? Buffer.from(header.slice(6), 'base64').toString().split(':')[0]!
        : '';
    const known = options.secretKeys.some((k) => k.length === key.length && timingSafeEqual(Buffer.from(k), Buffer.from(key)));
    if (!key)
      throw new ApiError(
        401,
        'invalid_request_error',
        "You did not provide an API key. You need to provide your API key in the Authorization header, using Bearer auth (e.g. 'Authorization: Bearer YOUR_SECRET_KEY').",
      );
    if (!known)
      throw new ApiError(
        401,
        'invalid_request_error',
        `Invalid API Key provided: ${key.slice(0, 8)}${'*'.repeat(Math.max(0, key.length - 12))}${key.slice(-4)}`,
        { code: 'api_key_invalid' },
      );
    next();
  });

  // Idempotency: the same key with the same parameters answers the saved response; with other
  // parameters it is an idempotency_error.
  api.use((req, res, next) => {
    const key = req.headers['idempotency-key'];
    if (req.method !== 'POST' || typeof key !== 'string') return next();
    const fingerprint = createHash('sha256')
      .update(`${req.method} ${req.path} ${JSON.stringify(req.body ?? {})}`)
      .digest('hex');
    const saved = state.data.idempotency[key];
    if (saved) {
      if (saved.fingerprint !== fingerprint) {
        throw new ApiError(
          400,
          'idempotency_error',
          `Keys for idempotent requests can only be used with the same parameters they were first used with. Try using a key other than '${key}' if you meant to execute a different request.`,
        );
      }
      res.setHeader('idempotent-replayed', 'true');
      return void res.status(saved.status).json(saved.body);
    }
    const json = res.json.bind(res);
    res.json = (body: unknown) => {
      if (res.statusCode < 500) {
        state.data.idempotency[key] = { fingerprint, status: res.statusCode, body };
        state.save();
      }
      return json(body);
    };
    next();
  });

  api.post('/checkout/sessions', (req, res) => {
    const body = req.body as Record<string, unknown>;
    if (body.mode !== 'payment')
      throw new ApiError(400, 'invalid_request_error', 'Only mode=payment is supported here.', { param: 'mode' });
    const rawItems = asArray(body.line_items);
    if (!rawItems.length)
      throw new ApiError(400, 'invalid_request_error', 'line_items is required in payment mode.', { param: 'line_items' });
    let currency: string | undefined;
    const items: LineItem[] = rawItems.map((raw, index) => {
      const item = raw as { quantity?: string; price_data?: { currency?: string; unit_amount?: string; product_data?: { name?: string } } };
      const param = `line_items[${index}]`;
      const priceData = item.price_data;
      if (!priceData)
        throw new ApiError(400, 'invalid_request_error', `Missing required param: ${param}[price_data].`, {
          param: `${param}[price_data]`,
        });
      if (!priceData.currency || !/^[a-z]{3}$/.test(priceData.currency)) {
        throw new ApiError(400, 'invalid_request_error', `Missing required param: ${param}[price_data][currency].`, {
          param: `${param}[price_data][currency]`,
        });
      }
      if (currency && priceData.currency !== currency)
        throw new ApiError(400, 'invalid_request_error', 'All line items must use the same currency.', { param });
      currency = priceData.currency;
      const unitAmount = integer(priceData.unit_amount, `${param}[price_data][unit_amount]`, 0);
      const quantity = integer(item.quantity ?? '1', `${param}[quantity]`, 1);
      const name = priceData.product_data?.name;
      if (!name)
        throw new ApiError(400, 'invalid_request_error', `Missing required param: ${param}[price_data][product_data][name].`, {
          param: `${param}[price_data][product_data][name]`,
        });
      return {
        id: newId('li'),
        object: 'item',
        amount_subtotal: unitAmount * quantity,
        amount_total: unitAmount * quantity,
        currency: priceData.currency,
        description: name,
        quantity,
        price: { id: newId('price'), object: 'price', currency: priceData.currency, unit_amount: unitAmount, product: newId('prod') },
      };
    });
    const created = nowSeconds();
    const expiresAt = body.expires_at === undefined ? created + 24 * 3600 : integer(body.expires_at, 'expires_at', 0);
    if (expiresAt < created + 30 * 60 - 5 || expiresAt > created + 24 * 3600) {
      throw new ApiError(
        400,
        'invalid_request_error',
        'The `expires_at` timestamp must be between 30 minutes and 24 hours from Checkout Session creation.',
        { param: 'expires_at' },
      );
    }
    for (const url of ['success_url', 'cancel_url'] as const) {
      if (body[url] !== undefined && !/^https?:\/\//.test(String(body[url])))
        throw new ApiError(400, 'invalid_request_error', `Not a valid URL`, { param: url });
    }
    const total = items.reduce((sum, i) => sum + i.amount_total, 0);
    const intentData = (body.payment_intent_data ?? {}) as { metadata?: Metadata };
    const intent: PaymentIntent = {
      id: newId('pi'),
      object: 'payment_intent',
      amount: total,
      amount_received: 0,
      currency: currency!,
      created,
      latest_charge: null,
      last_payment_error: null,
      livemode: false,
      metadata: metadata(intentData.metadata),
      status: 'requires_payment_method',
    };
    const id = newId('cs_test');
    const session: CheckoutSession = {
      id,
      object: 'checkout.session',
      amount_subtotal: total,
      amount_total: total,
      cancel_url: (body.cancel_url as string) ?? null,
      client_reference_id: (body.client_reference_id as string) ?? null,
      created,
      currency: currency!,
      customer_details: null,
      customer_email: (body.customer_email as string) ?? null,
      expires_at: expiresAt,
      livemode: false,
      metadata: metadata(body.metadata),
      mode: 'payment',
      payment_intent: intent.id,
      payment_status: 'unpaid',
      status: 'open',
      success_url: (body.success_url as string) ?? null,
      url: `${baseUrl}/pay/${id}`,
    };
    state.data.paymentIntents[intent.id] = intent;
    state.data.sessions[id] = session;
    state.data.lineItems[id] = items;
    state.save();
    res.json(session);
  });

  api.get('/checkout/sessions/:id', (req, res) => {
    const session = state.data.sessions[req.params.id];
    if (!session) throw missing('checkout.session', req.params.id);
    res.json(session);
  });

  api.get('/checkout/sessions/:id/line_items', (req, res) => {
    const items = state.data.lineItems[req.params.id];
    if (!items) throw missing('checkout.session', req.params.id);
    res.json({ object: 'list', data: items, has_more: false, url: `/v1/checkout/sessions/${req.params.id}/line_items` });
  });

  api.post('/checkout/sessions/:id/expire', (req, res) => {
    const session = state.data.sessions[req.params.id];
    if (!session) throw missing('checkout.session', req.params.id);
    if (session.status !== 'open') {
      throw new ApiError(
        400,
        'invalid_request_error',
        `Only Checkout Sessions with a status in ["open"] can be expired. This Checkout Session has a status of "${session.status}".`,
        { code: 'checkout_session_not_open' },
      );
    }
    expireSession(session);
    state.save();
    res.json(session);
  });

  api.get('/payment_intents/:id', (req, res) => {
    const intent = state.data.paymentIntents[req.params.id];
    if (!intent) throw missing('payment_intent', req.params.id);
    res.json(intent);
  });

  api.get('/charges/:id', (req, res) => {
    const charge = state.data.charges[req.params.id];
    if (!charge) throw missing('charge', req.params.id);
    res.json(charge);
  });

  api.post('/refunds', (req, res) => {
    const body = req.body as Record<string, unknown>;
    const intentId = body.payment_intent as string | undefined;
    const chargeId =
      (body.charge as string | undefined) ?? (intentId ? (state.data.paymentIntents[intentId]?.latest_charge ?? undefined) : undefined);
    if (!intentId && !body.charge)
      throw new ApiError(
        400,
        'invalid_request_error',
        'One of the following params should be provided for this request: payment_intent or charge.',
      );
    if (intentId && !state.data.paymentIntents[intentId]) throw missing('payment_intent', intentId);
    const charge = chargeId ? state.data.charges[chargeId] : undefined;
    if (!charge) {
      throw new ApiError(400, 'invalid_request_error', `This PaymentIntent (${intentId}) does not have a successful charge to refund.`, {
        code: 'charge_not_refundable',
      });
    }
    const remaining = charge.amount - charge.amount_refunded;
    if (remaining === 0)
      throw new ApiError(400, 'invalid_request_error', `Charge ${charge.id} has already been refunded.`, {
        code: 'charge_already_refunded',
      });
    const amount = body.amount === undefined ? remaining : integer(body.amount, 'amount', 1);
    if (amount > remaining) {
      throw new ApiError(
        400,
        'invalid_request_error',
        `Refund amount (${amount}) is greater than unrefunded amount on charge (${remaining})`,
        { param: 'amount', code: 'amount_too_large' },
      );
    }
    const refund: Refund = {
      id: newId('re'),
      object: 'refund',
      amount,
      charge: charge.id,
      created: nowSeconds(),
      currency: charge.currency,
      metadata: metadata(body.metadata),
      payment_intent: charge.payment_intent,
      reason: (body.reason as string) ?? null,
      status: 'succeeded',
    };
    charge.amount_refunded += amount;
    charge.refunded = charge.amount_refunded === charge.amount;
    state.data.refunds[refund.id] = refund;
    emit('charge.refunded', charge, (req.headers['idempotency-key'] as string) ?? null);
    state.save();
    res.json(refund);
  });

  api.get('/refunds/:id', (req, res) => {
    const refund = state.data.refunds[req.params.id];
    if (!refund) throw missing('refund', req.params.id);
    res.json(refund);
  });

  api.get('/events/:id', (req, res) => {
    const event = state.data.events[req.params.id];
    if (!event) throw missing('event', req.params.id);
    res.json(event);
  });

  api.get('/events', (req, res) => {
    const type = req.query.type as string | undefined;
    const limit = Math.min(Number(req.query.limit ?? 10) || 10, 100);
    const all = Object.values(state.data.events)
      .filter((e) => !type || e.type === type)
      .reverse();
    res.json({ object: 'list', data: all.slice(0, limit), has_more: all.length > limit, url: '/v1/events' });
  });

  api.use((req) => {
    throw new ApiError(404, 'invalid_request_error', `Unrecognized request URL (${req.method}: /v1${req.path}).`);
  });
  app.use('/v1', api);

  // ---- the pay page ------------------------------------------------------------------------
  const merchant = options.merchantName ?? 'Etchwell test shop';
  app.get('/pay/:id', (req, res) => {
    const session = state.data.sessions[req.params.id];
    if (!session) return void res.status(404).type('text/plain').send('No such payment page.');
    res
      .type('html')
      .send(payPage({ session, items: state.data.lineItems[session.id] ?? [], merchant: session.metadata.shop_name ?? merchant }));
  });

  app.post('/pay/:id', (req, res) => {
    const session = state.data.sessions[req.params.id];
    if (!session) return void res.status(404).type('text/plain').send('No such payment page.');
    const items = state.data.lineItems[session.id] ?? [];
    const shopName = session.metadata.shop_name ?? merchant;
    const form = req.body as { card?: string; email?: string; expiry?: string; cvc?: string; name?: string };
    const again = (error: string, status = 402) =>
      res
        .status(status)
        .type('html')
        .send(payPage({ session, items, merchant: shopName, error, email: form.email }));
    if (session.status !== 'open')
      return again(session.status === 'expired' ? 'The time to pay on this page has run out.' : 'This has been paid already.', 409);

    const digits = String(form.card ?? '').replace(/[\s-]/g, '');
    const expiry = /^(\d{2})\s*\/\s*(\d{2})$/.exec(String(form.expiry ?? '').trim());
    if (!/^\d+$/.test(digits) || !luhnValid(digits)) return again('That card number does not add up: check the digits.', 400);
    if (!expiry || Number(expiry[1]) < 1 || Number(expiry[1]) > 12) return again('Give the expiry as month / year, such as 12 / 34.', 400);
    const expiryEnd = Date.UTC(2000 + Number(expiry[2]), Number(expiry[1]), 1);
    if (expiryEnd <= Date.now()) return again('That expiry date has passed.', 400);
    if (!/^\d{3,4}$/.test(String(form.cvc ?? ''))) return again('The security code is three or four digits.', 400);
    const card = TEST_CARDS[digits];
    if (!card) return again('This practice page takes only the practice cards above: pick what should happen.', 400);

    const intent = state.data.paymentIntents[session.payment_intent!]!;
    if (card.outcome === 'declined') {
      intent.last_payment_error = { type: 'card_error', code: 'card_declined', decline_code: card.decline_code, message: card.message };
      emit('payment_intent.payment_failed', intent);
      state.save();
      return again(card.words);
    }
    const charge = {
      id: newId('ch'),
      object: 'charge' as const,
      amount: intent.amount,
      amount_captured: intent.amount,
      amount_refunded: 0,
      created: nowSeconds(),
      currency: intent.currency,
      livemode: false as const,
      paid: true as const,
      payment_intent: intent.id,
      refunded: false,
      status: 'succeeded' as const,
    };
    state.data.charges[charge.id] = charge;
    Object.assign(intent, { status: 'succeeded', amount_received: intent.amount, latest_charge: charge.id, last_payment_error: null });
    Object.assign(session, {
      status: 'complete',
      payment_status: 'paid',
      url: null,
      customer_details: { email: form.email || session.customer_email, name: form.name ?? null },
    });
    emit('checkout.session.completed', session);
    state.save();
    const target = (session.success_url ?? `${baseUrl}/pay/${session.id}`).replace('{CHECKOUT_SESSION_ID}', session.id);
    res.redirect(303, target);
  });

  // ---- hooks for tests (not part of the payments API) --------------------------------------
  app.post('/_fake/events/:id/deliver', async (req, res) => {
    const event = state.data.events[req.params.id];
    if (!event) return void res.status(404).json({ error: 'no such event' });
    res.json({ statuses: await deliverer.deliverAgain(event) });
  });
  app.post('/_fake/webhooks/pause', (_req, res) => {
    deliverer.pause();
    res.json({ paused: true });
  });
  app.post('/_fake/webhooks/resume', async (req, res) => {
    await deliverer.resume(req.query.order === 'newest-first' ? 'newest-first' : 'oldest-first');
    res.json({ paused: false });
  });
  app.get('/_fake/deliveries', (_req, res) => res.json({ pending: state.data.deliveries }));

  app.use((error: unknown, req: Request, res: Response, _next: NextFunction) => {
    const apiError =
      error instanceof ApiError
        ? error
        : (error as { type?: string }).type === 'entity.parse.failed'
          ? new ApiError(400, 'invalid_request_error', 'Invalid request body.')
          : new ApiError(500, 'api_error', 'An unexpected error occurred in the payments stand-in.');
    if (apiError.status >= 500) console.warn('[fake:payments]', error);
    res
      .status(apiError.status)
      .json({ error: { type: apiError.type, message: apiError.message, ...apiError.extra, request_log_url: null } });
  });

  const server = createServer(app);
  const port = await listen(server, options.port ?? 0, options.host ?? '127.0.0.1');
  baseUrl = `http://${options.host ?? '127.0.0.1'}:${port}`;
  deliverer.start();
  return {
    url: baseUrl,
    port,
    deliverer,
    async stop() {
      clearInterval(sweeper);
      deliverer.stop();
      await close(server);
    },
  };
}

function asArray(value: unknown): unknown[] {
  if (Array.isArray(value)) return value;
  if (value && typeof value === 'object')
    return Object.keys(value)
      .sort((a, b) => Number(a) - Number(b))
      .map((k) => (value as Record<string, unknown>)[k]);
  return [];
}

function integer(value: unknown, param: string, min: number): number {
  const text = String(value ?? '');
  if (!/^-?\d+$/.test(text)) throw new ApiError(400, 'invalid_request_error', `Invalid integer: ${text}`, { param });
  const number = Number(text);
  if (number < min) throw new ApiError(400, 'invalid_request_error', `This value must be greater than or equal to ${min}.`, { param });
  return number;
}

function metadata(value: unknown): Metadata {
  if (!value || typeof value !== 'object') return {};
  return Object.fromEntries(Object.entries(value as Record<string, unknown>).map(([k, v]) => [k, String(v)]));
}
