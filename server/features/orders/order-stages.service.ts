import type { EntityManager } from '@mikro-orm/postgresql';
import { AppError } from '#shared/errors.ts';
import {
  assertItemAction,
  assertMove,
  ITEM_ACTIONS,
  ITEM_TRANSITIONS,
  ORDER_TRANSITIONS,
  type ItemAction,
  type ItemStage,
  type OrderStatus,
} from '#shared/orders/stages.ts';
import { isUuid } from '#server/lib/tokens.ts';
import type { Studio } from '#server/features/studios/studio.entity.ts';
import { Order, OrderEvent, OrderItem } from './order.entity.ts';

/** One item of the studio, with its order and photo; another studio's answers 404. */
export async function findItem(em: EntityManager, studio: Studio, id: string): Promise<OrderItem> {
  const item = isUuid(id) ? await em.findOne(OrderItem, { id, studio }, { populate: ['order', 'photo'] }) : null;
  if (!item) throw new AppError('NOT_FOUND', 'There is no such item.');
  return item;
}

/** The line a move writes on the order's timeline: what happened, who did it, in words. */
export type TimelineLine = { type: string; actor: string; text: string };

/**
 * A change of stage: work moves one item by one of its actions; money (payment, expiry,
 * cancellation, refund, completion) moves the order's status and, where the table says so, all
 * its items to one stage.
 */
export type StageMove = { item: OrderItem; action: ItemAction } | { order: Order; status: OrderStatus; items?: ItemStage };

/**
 * The one way an order or an item changes stage: the state machine is asked first (409 with the
 * allowed moves when it refuses, and then nothing has changed), then the stage is set and the
 * timeline gets its line. The items of an order move all or none.
 */
export function move(em: EntityManager, change: StageMove, line: TimelineLine): void {
  if ('item' in change) {
    const { item, action } = change;
    assertItemAction(action, item.stage);
    item.stage = ITEM_ACTIONS[action].to;
    em.create(OrderEvent, { studio: item.studio, order: item.order, item, ...line });
    return;
  }
  const { order, status, items: stage } = change;
  assertMove('order', ORDER_TRANSITIONS, order.status, status);
  const items = stage ? order.items.getItems() : [];
  for (const item of items) assertMove('item', ITEM_TRANSITIONS, item.stage, stage!);
  order.status = status;
  for (const item of items) item.stage = stage!;
  em.create(OrderEvent, { studio: order.studio, order, ...line });
}

/** Moves an item by one of its actions (409 from any other stage) and records who and why. */
export function moveItem(em: EntityManager, item: OrderItem, action: ItemAction, actor: string, text: string, type: string): void {
  move(em, { item, action }, { type, actor, text });
}
