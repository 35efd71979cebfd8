import { randomBytes } from 'node:crypto';
import { join } from 'node:path';
import { readJsonFile, writeJsonFile } from '../support/json-file.ts';

/**
 * The payments stand-in's records, in the shapes of the payments API's objects (the subset the
 * app reads), kept in one JSON file under its data folder and written after every change.
 */
export type Metadata = Record<string, string>;

export type LineItem = {
  id: string;
  object: 'item';
  amount_subtotal: number;
  amount_total: number;
  currency: string;
  description: string;
  quantity: number;
  price: { id: string; object: 'price'; currency: string; unit_amount: number; product: string };
};

export type CheckoutSession = {
  id: string;
  object: 'checkout.session';
  amount_subtotal: number;
  amount_total: number;
  cancel_url: string | null;
  client_reference_id: string | null;
  created: number;
  currency: string;
  customer_details: { email: string | null; name: string | null } | null;
  customer_email: string | null;
  expires_at: number;
  livemode: false;
  metadata: Metadata;
  mode: 'payment';
  payment_intent: string | null;
  payment_status: 'unpaid' | 'paid';
  status: 'open' | 'complete' | 'expired';
  success_url: string | null;
  url: string | null;
};

export type PaymentIntent = {
  id: string;
  object: 'payment_intent';
  amount: number;
  amount_received: number;
  currency: string;
  created: number;
  latest_charge: string | null;
  last_payment_error: { type: 'card_error'; code: string; decline_code: string; message: string } | null;
  livemode: false;
  metadata: Metadata;
  status: 'requires_payment_method' | 'succeeded' | 'canceled';
};

export type Charge = {
  id: string;
  object: 'charge';
  amount: number;
  amount_captured: number;
  amount_refunded: number;
  created: number;
  currency: string;
  livemode: false;
  paid: true;
  payment_intent: string;
  refunded: boolean;
  status: 'succeeded';
};

export type Refund = {
  id: string;
  object: 'refund';
  amount: number;
  charge: string;
  created: number;
  currency: string;
  metadata: Metadata;
  payment_intent: string;
  reason: string | null;
  status: 'succeeded';
};

export type PaymentEvent = {
  id: string;
  object: 'event';
  api_version: string;
  created: number;
  data: { object: unknown };
  livemode: false;
  pending_webhooks: number;
  request: { id: string | null; idempotency_key: string | null };
  type: string;
};

export type Delivery = { eventId: string; endpoint: number; attempts: number; nextAt: number; done: boolean; lastStatus?: number | string };

type Saved = { fingerprint: string; status: number; body: unknown };

export type State = {
  sessions: Record<string, CheckoutSession>;
  lineItems: Record<string, LineItem[]>;
  paymentIntents: Record<string, PaymentIntent>;
  charges: Record<string, Charge>;
  refunds: Record<string, Refund>;
  events: Record<string, PaymentEvent>;
  deliveries: Delivery[];
  idempotency: Record<string, Saved>;
};

const empty = (): State => ({
  sessions: {},
  lineItems: {},
  paymentIntents: {},
  charges: {},
  refunds: {},
  events: {},
  deliveries: [],
  idempotency: {},
});

/** Object ids look like the real ones: a type prefix, `_test_` where the API uses it, random. */
export function newId(prefix: string): string {
  return `${prefix}_${randomBytes(12).toString('base64url').replace(/[-_]/g, 'x')}`;
}

export const nowSeconds = () => Math.floor(Date.now() / 1000);

export class PaymentsState {
  readonly data: State;
  private readonly file: string;

  constructor(dataDir: string) {
    this.file = join(dataDir, 'state.json');
    this.data = { ...empty(), ...readJsonFile<Partial<State>>(this.file, {}) };
  }

  save(): void {
    writeJsonFile(this.file, this.data);
  }
}
