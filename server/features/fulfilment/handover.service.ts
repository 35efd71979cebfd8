import type { EntityManager } from '@mikro-orm/postgresql';
import { AppError } from '#shared/errors.ts';
import type { ShipInput } from '#shared/schemas/production.ts';
import { displayName, type User } from '#server/features/accounts/user.entity.ts';
import { fromStudio, queueEmail } from '#server/features/outbox/outbox.service.ts';
import type { Studio } from '#server/features/studios/studio.entity.ts';
import { moveItem, move } from '#server/features/orders/order-stages.service.ts';
import { handedOverMail } from '../orders/order-mail.ts';
import { type Order } from '../orders/order.entity.ts';
import { findOrder } from '#server/features/orders/orders.service.ts';

const DONE = ['shipped', 'picked_up', 'cancelled'];

/**
 * Burned items leave the studio: shipped with a carrier and tracking number, or picked up. The
 * buyer is told; the order is fulfilled once every item that is not cancelled has left.
 */
export async function handOver(em: EntityManager, studio: Studio, orderId: string, user: User, input: ShipInput): Promise<Order> {
  const order = await findOrder(em, studio, orderId);
  const items = [...new Set(input.itemIds)].map((id) => order.items.getItems().find((item) => item.id === id));
  if (items.some((item) => !item)) throw new AppError('NOT_FOUND', 'Some of these items are not in this order.');
  if (order.status !== 'paid')
    throw new AppError('CONFLICT', `This order is ${order.status.replaceAll('_', ' ')}: only paid orders are shipped.`);
  const by = displayName(user);
  const at = new Date().toISOString();
  for (const item of items) {
    if (input.method === 'ship') {
      moveItem(em, item!, 'ship', by, `Shipped with ${input.carrier}, tracking ${input.trackingNumber}, by ${by}.`, 'shipped');
      item!.handover = { method: 'ship', carrier: input.carrier, trackingNumber: input.trackingNumber, at, by };
    } else {
      moveItem(em, item!, 'handOverAtPickup', by, `Picked up at the studio; handed over by ${by}.`, 'picked_up');
      item!.handover = { method: 'pickup', carrier: null, trackingNumber: null, at, by };
    }
  }
  const complete = order.items.getItems().every((item) => DONE.includes(item.stage));
  if (complete) {
    move(
      em,
      { order, status: 'fulfilled' },
      { type: 'fulfilled', actor: by, text: 'Every item has left the studio: the order is complete.' },
    );
  }
  queueEmail(em, {
    to: order.buyerEmail,
    ...fromStudio(studio),
    ...handedOverMail({
      studioName: studio.name,
      number: order.number,
      buyerName: order.buyerName,
      what: items.map((i) => `${i!.snapshot.blank.name} (${i!.snapshot.size.label})`),
      method: input.method,
      carrier: input.method === 'ship' ? input.carrier : undefined,
      trackingNumber: input.method === 'ship' ? input.trackingNumber : undefined,
      complete,
    }),
  });
  await em.flush();
  return order;
}
