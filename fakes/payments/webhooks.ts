import Stripe from 'stripe';
import type { PaymentsState, PaymentEvent } from './state.ts';

export type WebhookEndpoint = { url: string; secret: string };

/**
 * Delivers events to the configured endpoints, signed the way the payments SDK's
 * `webhooks.constructEvent` verifies. A delivery that gets no 2xx is retried with exponential
 * backoff; pending deliveries are kept in the state file, so a restart loses none.
 */
export class WebhookDeliverer {
  private readonly signer = new Stripe('sk_test_signing_only', { telemetry: false }).webhooks;
  private timer?: NodeJS.Timeout;
  private paused = false;
  private busy = false;

  constructor(
    private readonly state: PaymentsState,
    private readonly endpoints: WebhookEndpoint[],
    private readonly options: { retryBaseMs: number; maxAttempts: number; log: (line: string) => void },
  ) {}

  start(): void {
    this.timer = setInterval(() => void this.tick(), Math.min(this.options.retryBaseMs, 200));
    this.timer.unref();
  }

  stop(): void {
    clearInterval(this.timer);
  }

  /** Queues one delivery of the event to every endpoint. */
  enqueue(event: PaymentEvent): void {
    this.endpoints.forEach((_, endpoint) =>
      this.state.data.deliveries.push({ eventId: event.id, endpoint, attempts: 0, nextAt: Date.now(), done: false }),
    );
    event.pending_webhooks = this.endpoints.length;
    this.state.save();
    void this.tick();
  }

  /** Holds deliveries until `resume`; for tests of late and out-of-order delivery. */
  pause(): void {
    this.paused = true;
  }

  /** Releases held deliveries, oldest first or (for out-of-order tests) newest first. */
  async resume(order: 'oldest-first' | 'newest-first' = 'oldest-first'): Promise<void> {
    this.paused = false;
    if (order === 'newest-first') this.state.data.deliveries.reverse();
    await this.tick();
  }

  /** Sends one event again right now, as a duplicate delivery would arrive. */
  async deliverAgain(event: PaymentEvent): Promise<Array<number | string>> {
    return Promise.all(this.endpoints.map((endpoint) => this.post(endpoint, event)));
  }

  private async tick(): Promise<void> {
    if (this.paused || this.busy) return;
    this.busy = true;
    try {
      const due = this.state.data.deliveries.filter((d) => !d.done && d.nextAt <= Date.now());
      for (const delivery of due) {
        const event = this.state.data.events[delivery.eventId];
        const endpoint = this.endpoints[delivery.endpoint];
        if (!event || !endpoint) {
          delivery.done = true;
          continue;
        }
        const status = await this.post(endpoint, event);
        delivery.attempts++;
        delivery.lastStatus = status;
        if (typeof status === 'number' && status >= 200 && status < 300) {
          delivery.done = true;
          event.pending_webhooks = Math.max(0, event.pending_webhooks - 1);
        } else if (delivery.attempts >= this.options.maxAttempts) {
          delivery.done = true;
          this.options.log(`webhook ${event.type} ${event.id} to ${endpoint.url}: gave up after ${delivery.attempts} attempts`);
        } else {
          delivery.nextAt = Date.now() + Math.min(this.options.retryBaseMs * 2 ** (delivery.attempts - 1), 60 * 60 * 1000);
        }
      }
      if (due.length) {
        this.state.data.deliveries = this.state.data.deliveries.filter((d) => !d.done);
        this.state.save();
      }
    } finally {
      this.busy = false;
    }
  }

  private async post(endpoint: WebhookEndpoint, event: PaymentEvent): Promise<number | string> {
    const payload = JSON.stringify(event, null, 2);
    const signature = this.signer.generateTestHeaderString({ payload, secret: endpoint.secret });
    try {
      const response = await fetch(endpoint.url, {
        method: 'POST',
        headers: {
          'content-type': 'application/json; charset=utf-8',
          'stripe-signature': signature,
          'user-agent': 'payments-fake/1.0 (+webhooks)',
        },
        body: payload,
        signal: AbortSignal.timeout(10_000),
      });
      await response.arrayBuffer();
      this.options.log(`webhook ${event.type} ${event.id} -> ${endpoint.url} ${response.status}`);
      return response.status;
    } catch (error) {
      this.options.log(`webhook ${event.type} ${event.id} -> ${endpoint.url} failed: ${(error as Error).message}`);
      return (error as Error).message;
    }
  }
}
