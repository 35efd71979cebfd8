import { LockMode } from '@mikro-orm/core';
import { absolute, workspacePaths } from '#shared/routes.ts';
import type { EntityManager } from '@mikro-orm/postgresql';
import type Stripe from 'stripe';
import { formatMoney } from '#shared/money.ts';
import type { Payments } from '#server/adapters/payments.ts';
import type { Env } from '#server/env.ts';
import type { Orm } from '#server/db/orm.ts';
import { TENANT_FILTER } from '#server/db/tenant.ts';
import { BlankSize } from '#server/features/catalog/catalog.entity.ts';
import { dropHeldEmails, fromStudio, queueEmail, releaseHeldEmails } from '#server/features/outbox/outbox.service.ts';
import { Membership } from '#server/features/team/membership.entity.ts';
import { latePaymentMail, mailLines, newOrderMail, soldOutMail } from '#server/features/orders/order-mail.ts';
import { move } from '#server/features/orders/order-stages.service.ts';
import { Order, OrderEvent } from '../orders/order.entity.ts';

export type EventOutcome = 'handled' | 'duplicate' | 'ignored';

/**
 * Acts on one payment event, once: its id is recorded in the same transaction as what it
 * changes, so a second delivery (or a retry after a crash) finds it and does nothing. A failure
 * rolls everything back, the webhook answers 500, and the provider delivers it again.
 */
export async function handlePaymentEvent(orm: Orm, deps: { payments: Payments; env: Env }, event: Stripe.Event): Promise<EventOutcome> {
  return orm.em.fork().transactional(async (em) => {
    const claimed = await em.execute<Array<{ id: string }>>(
      'insert into "payment_event" ("id", "type") values (?, ?) on conflict do nothing returning "id"',
      [event.id, event.type],
    );
    if (!claimed.length) return 'duplicate';
    switch (event.type) {
      case 'checkout.session.completed':
        return sessionCompleted(em, deps, event.data.object);
      case 'checkout.session.expired':
        return sessionExpired(em, event.data.object);
      case 'payment_intent.payment_failed':
        return paymentFailed(em, event.data.object);
      default:
        return 'ignored';
    }
  });
}

async function orderFor(em: EntityManager, orderId: string | undefined): Promise<Order | null> {
  if (!orderId) return null;
  const order = await em.findOne(
    Order,
    { id: orderId },
    { filters: { [TENANT_FILTER]: false }, populate: ['studio'], lockMode: LockMode.PESSIMISTIC_WRITE },
  );
  if (order) em.setFilterParams(TENANT_FILTER, { studioId: order.studio.id });
  return order;
}

/**
 * A payment that arrives after its order had lapsed (its session's expiry was handled first, or
 * the events came out of order): the stock is no longer held, so the money goes back in full and
 * the buyer is told. Acted on once, like every event.
 */
async function latePayment(
  em: EntityManager,
  deps: { payments: Payments },
  order: Order,
  session: Stripe.Checkout.Session,
): Promise<EventOutcome> {
  const paymentIntentId = typeof session.payment_intent === 'string' ? session.payment_intent : (session.payment_intent?.id ?? null);
  if (!paymentIntentId) return 'ignored';
  await deps.payments.stripe.refunds.create(
    { payment_intent: paymentIntentId, reason: 'requested_by_customer', metadata: { orderId: order.id } },
    { idempotencyKey: `late-payment-${order.id}` },
  );
  const total = formatMoney(order.totalMinor, order.currency);
  order.paymentIntentId = paymentIntentId;
  order.refundedMinor = order.totalMinor;
  order.note = `Your payment of ${total} arrived after this order had lapsed, so it was refunded in full. Please order again.`;
  em.create(OrderEvent, {
    studio: order.studio,
    order,
    type: 'late_payment_refunded',
    actor: 'payments',
    text: `A payment of ${total} arrived after the order had lapsed: refunded in full.`,
  });
  queueEmail(em, {
    to: order.buyerEmail,
    ...fromStudio(order.studio),
    ...latePaymentMail({ studioName: order.studio.name, number: order.number, buyerName: order.buyerName, total }),
  });
  return 'handled';
}

async function sessionCompleted(
  em: EntityManager,
  deps: { payments: Payments; env: Env },
  session: Stripe.Checkout.Session,
): Promise<EventOutcome> {
  const order = await orderFor(em, session.metadata?.orderId);
  if (!order || order.checkoutSessionId !== session.id || session.payment_status !== 'paid') return 'ignored';
  if (order.status === 'cancelled' && !order.paymentIntentId) return latePayment(em, deps, order, session);
  if (order.status !== 'awaiting_payment') return 'ignored';
  const studio = order.studio;
  await em.populate(order, ['items']);
  const items = order.items.getItems();
  const paymentIntentId = typeof session.payment_intent === 'string' ? session.payment_intent : (session.payment_intent?.id ?? null);
  order.paymentIntentId = paymentIntentId;
  const total = formatMoney(order.totalMinor, order.currency);

  // Stock is taken when the money is in, under row locks, all or nothing.
  const sizeIds = [...new Set(items.flatMap((i) => (i.size ? [i.size.id] : [])))];
  const sizes = sizeIds.length ? await em.find(BlankSize, { id: { $in: sizeIds }, studio }, { lockMode: LockMode.PESSIMISTIC_WRITE }) : [];
  const short = items.find((item) => {
    const size = sizes.find((s) => s.id === item.size?.id);
    const wanted = items.filter((i) => i.size?.id === item.size?.id).reduce((n, i) => n + i.quantity, 0);
    return size && size.stock !== null && size.stock < wanted;
  });
  if (short) {
    const what = `${short.snapshot.blank.name}, ${short.snapshot.size.label}`;
    if (paymentIntentId)
      await deps.payments.stripe.refunds.create(
        { payment_intent: paymentIntentId, reason: 'requested_by_customer', metadata: { orderId: order.id } },
        { idempotencyKey: `sold-out-${order.id}` },
      );
    move(
      em,
      { order, status: 'cancelled', items: 'cancelled' },
      { type: 'sold_out', actor: 'payments', text: `Paid, but ${what} had sold out: refunded ${total} and cancelled.` },
    );
    order.note = `${what} sold out while you were paying. Your payment of ${total} was refunded in full.`;
    await dropHeldEmails(em, order.id);
    queueEmail(em, {
      to: order.buyerEmail,
      ...fromStudio(studio),
      ...soldOutMail({ studioName: studio.name, number: order.number, buyerName: order.buyerName, what, total }),
    });
    return 'handled';
  }
  for (const size of sizes) {
    if (size.stock === null) continue;
    size.stock -= items.filter((i) => i.size?.id === size.id).reduce((n, i) => n + i.quantity, 0);
  }
  move(
    em,
    { order, status: 'paid', items: 'photo_review' },
    { type: 'paid', actor: 'payments', text: `Payment of ${total} received. The photos are waiting for review.` },
  );
  order.paidAt = new Date();

  const mail = {
    studioName: studio.name,
    number: order.number,
    buyerName: order.buyerName,
    lines: mailLines(items, order.currency),
    total,
  };
  // The buyer's receipt, with the private link, was written at checkout and waited for this.
  await releaseHeldEmails(em, order.id);
  for (const to of await studioAddresses(em, order))
    queueEmail(em, { to, ...newOrderMail({ ...mail, url: absolute(deps.env.APP_URL, workspacePaths.home(studio.slug)) }) });
  return 'handled';
}

/** The studio's contact address, or else its owners'. */
async function studioAddresses(em: EntityManager, order: Order): Promise<string[]> {
  if (order.studio.contactEmail) return [order.studio.contactEmail];
  const owners = await em.find(
    Membership,
    { studio: order.studio, role: 'owner' },
    { populate: ['user'], filters: { [TENANT_FILTER]: false } },
  );
  return owners.map((m) => m.user.email);
}

async function sessionExpired(em: EntityManager, session: Stripe.Checkout.Session): Promise<EventOutcome> {
  const order = await orderFor(em, session.metadata?.orderId);
  // An expiry that arrives after the payment (events may come in any order) changes nothing.
  if (!order || order.checkoutSessionId !== session.id || order.status !== 'awaiting_payment') return 'ignored';
  await em.populate(order, ['items']);
  move(
    em,
    { order, status: 'cancelled', items: 'cancelled' },
    { type: 'expired', actor: 'payments', text: 'The time to pay ran out; the order was released. Nothing was charged.' },
  );
  order.note = 'The time to pay ran out, so the order was not placed. Nothing was charged.';
  await dropHeldEmails(em, order.id);
  return 'handled';
}

async function paymentFailed(em: EntityManager, intent: Stripe.PaymentIntent): Promise<EventOutcome> {
  const order = await orderFor(em, intent.metadata?.orderId);
  if (!order || order.status !== 'awaiting_payment') return 'ignored';
  const reason = intent.last_payment_error?.message ?? 'The payment was declined.';
  em.create(OrderEvent, {
    studio: order.studio,
    order,
    type: 'payment_failed',
    actor: 'payments',
    text: `A payment attempt failed: ${reason}`,
  });
  return 'handled';
}
