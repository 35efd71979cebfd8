import type { EntityManager } from '@mikro-orm/postgresql';
import { AppError } from '#shared/errors.ts';
import { formatMoney } from '#shared/money.ts';
import { assertMove, ORDER_TRANSITIONS, type ItemStage } from '#shared/orders/stages.ts';
import type { Payments } from '#server/adapters/payments.ts';
import { displayName, type User } from '#server/features/accounts/user.entity.ts';
import { dropHeldEmails, fromStudio, queueEmail } from '#server/features/outbox/outbox.service.ts';
import type { Studio } from '#server/features/studios/studio.entity.ts';
import { cancelledMail, refundedMail } from '../orders/order-mail.ts';
import { move } from '#server/features/orders/order-stages.service.ts';
import { OrderEvent, type Order } from '../orders/order.entity.ts';
import { findOrder } from '#server/features/orders/orders.service.ts';
import { recordAudit } from '#server/features/audit/audit.service.ts';
import { workspaceOrderPath } from '../orders/order.views.ts';

/** Once an item is on the machine its blank is used: the order can be refunded, not cancelled. */
const CANCELLABLE: readonly ItemStage[] = [
  'unpaid',
  'photo_review',
  'needs_new_photo',
  'prep',
  'proof_sent',
  'changes_requested',
  'approved',
];

async function payBack(payments: Payments, order: Order, amount: number, reason: string): Promise<void> {
  if (!order.paymentIntentId) throw new AppError('CONFLICT', 'This order has no payment to refund.');
  // The key names the order and how much was refunded before: a retried call refunds once.
  await payments.stripe.refunds.create(
    {
      payment_intent: order.paymentIntentId,
      amount,
      reason: 'requested_by_customer',
      metadata: { orderId: order.id, note: reason.slice(0, 200) },
    },
    { idempotencyKey: `refund-${order.id}-${order.refundedMinor}-${amount}` },
  );
  order.refundedMinor += amount;
}

/** A whole or part refund through the payment provider, recorded on the order and e-mailed. */
export async function refundOrder(
  em: EntityManager,
  payments: Payments,
  studio: Studio,
  orderId: string,
  user: User,
  input: { amountMinor?: number; reason: string },
): Promise<Order> {
  const order = await findOrder(em, studio, orderId);
  if (order.status !== 'paid' && order.status !== 'fulfilled')
    throw new AppError('CONFLICT', `Order ${order.number} is ${order.status.replaceAll('_', ' ')}: there is nothing to refund.`);
  const left = order.totalMinor - order.refundedMinor;
  const amount = input.amountMinor ?? left;
  if (amount > left)
    throw new AppError('VALIDATION_FAILED', `At most ${formatMoney(left, order.currency)} is left to refund.`, {
      issues: [{ path: ['amountMinor'], message: `At most ${formatMoney(left, order.currency)}.` }],
    });
  await payBack(payments, order, amount, input.reason);
  const whole = order.refundedMinor === order.totalMinor;
  const money = formatMoney(amount, order.currency);
  const line = {
    type: 'refunded',
    actor: displayName(user),
    text: `${whole ? 'Refunded in full' : 'Refunded in part'}: ${money}, by ${displayName(user)}. Reason: ${input.reason}`,
  };
  // A refund in part is money only; the whole amount back ends the order.
  if (whole) move(em, { order, status: 'refunded' }, line);
  else em.create(OrderEvent, { studio, order, ...line });
  recordAudit(em, studio, user, {
    action: 'order.refunded',
    subject: `Order ${order.number}`,
    summary: `Refunded ${money} ${whole ? 'in full' : 'in part'}; ${formatMoney(order.refundedMinor, order.currency)} of ${formatMoney(order.totalMinor, order.currency)} refunded so far. Reason: ${input.reason}`,
    link: workspaceOrderPath(studio.slug, order.id),
    details: {
      orderId: order.id,
      amountMinor: amount,
      refundedMinor: order.refundedMinor,
      totalMinor: order.totalMinor,
      currency: order.currency,
    },
  });
  queueEmail(em, {
    to: order.buyerEmail,
    ...fromStudio(studio),
    ...refundedMail({ studioName: studio.name, number: order.number, buyerName: order.buyerName, amount: money, reason: input.reason }),
  });
  await em.flush();
  return order;
}

/** Cancels an order before production: items cancelled, stock returned, what was paid refunded. */
export async function cancelOrder(
  em: EntityManager,
  payments: Payments,
  studio: Studio,
  orderId: string,
  user: User,
  reason: string,
): Promise<Order> {
  const order = await findOrder(em, studio, orderId);
  const items = order.items.getItems();
  const started = items.find((i) => !CANCELLABLE.includes(i.stage));
  if (started)
    throw new AppError(
      'CONFLICT',
      `${started.snapshot.blank.name} is already ${started.stage.replaceAll('_', ' ')}: the order can be refunded but no longer cancelled.`,
    );
  // Asked before any money moves; `move` below asks again as it changes the stages.
  assertMove('order', ORDER_TRANSITIONS, order.status, 'cancelled');
  const wasPaid = order.status === 'paid';
  const left = order.totalMinor - order.refundedMinor;
  if (wasPaid && left > 0) await payBack(payments, order, left, reason);
  const refunded = wasPaid && left > 0 ? ` ${formatMoney(left, order.currency)} refunded.` : '';
  move(
    em,
    { order, status: 'cancelled', items: 'cancelled' },
    { type: 'cancelled', actor: displayName(user), text: `Cancelled by ${displayName(user)}. Reason: ${reason}.${refunded}` },
  );
  // An unpaid order's receipt was waiting for the payment that will not come.
  if (!wasPaid) await dropHeldEmails(em, order.id);
  for (const item of items) {
    // Stock was taken at payment; it goes back.
    if (wasPaid && item.size)
      await em.execute('update "blank_size" set "stock" = "stock" + ? where "id" = ? and "studio_id" = ? and "stock" is not null', [
        item.quantity,
        item.size.id,
        studio.id,
      ]);
  }
  recordAudit(em, studio, user, {
    action: 'order.cancelled',
    subject: `Order ${order.number}`,
    summary: `Cancelled. Reason: ${reason}.${refunded || ' Nothing was paid, so nothing was refunded.'}`,
    link: workspaceOrderPath(studio.slug, order.id),
    details: { orderId: order.id, refundedMinor: wasPaid ? left : 0, currency: order.currency },
  });
  queueEmail(em, {
    to: order.buyerEmail,
    ...fromStudio(studio),
    ...cancelledMail({ studioName: studio.name, number: order.number, buyerName: order.buyerName, reason, refund: refunded.trim() }),
  });
  await em.flush();
  return order;
}
