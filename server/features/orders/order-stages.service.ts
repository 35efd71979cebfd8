import type { EntityManager } from '@mikro-orm/postgresql';
import { AppError } from '#shared/errors.ts';
import { assertItemAction, ITEM_ACTIONS, type ItemAction } from '#shared/orders/stages.ts';
import { isUuid } from '#server/lib/tokens.ts';
import type { Studio } from '#server/features/studios/studio.entity.ts';
import { OrderEvent, OrderItem } from './order.entity.ts';

/** One item of the studio, with its order and photo; another studio's answers 404. */
export async function findItem(em: EntityManager, studio: Studio, id: string): Promise<OrderItem> {
  const item = isUuid(id) ? await em.findOne(OrderItem, { id, studio }, { populate: ['order', 'photo'] }) : null;
  if (!item) throw new AppError('NOT_FOUND', 'There is no such item.');
  return item;
}

/** Moves an item by one of its actions (409 from any other stage) and records who and why. */
export function moveItem(em: EntityManager, item: OrderItem, action: ItemAction, actor: string, text: string, type: string): void {
  assertItemAction(action, item.stage);
  item.stage = ITEM_ACTIONS[action].to;
  em.create(OrderEvent, { studio: item.studio, order: item.order, item, type, actor, text });
}
