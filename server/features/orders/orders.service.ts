import type { EntityManager, FilterQuery } from '@mikro-orm/postgresql';
import type { z } from 'zod';
import { AppError } from '#shared/errors.ts';
import { formatMoney } from '#shared/money.ts';
import type { OrderList, orderListQuerySchema } from '#shared/schemas/workspace-orders.ts';
import { isUuid } from '#server/lib/tokens.ts';
import type { Studio } from '#server/features/studios/studio.entity.ts';
import { Order } from './order.entity.ts';

/** Orders of the studio, searched, filtered, sorted and paged in the database. */
export async function listOrders(em: EntityManager, studio: Studio, query: z.output<typeof orderListQuerySchema>): Promise<OrderList> {
  const where: FilterQuery<Order> = { studio };
  const and: FilterQuery<Order>[] = [];
  if (query.search) {
    const like = `%${query.search.replace(/[%_\\]/g, (c) => `\\${c}`)}%`;
    const number = /^#?\d+$/.test(query.search) ? Number(query.search.replace('#', '')) : undefined;
    and.push({ $or: [{ buyerEmail: { $ilike: like } }, { buyerName: { $ilike: like } }, ...(number ? [{ number }] : [])] });
  }
  if (query.status) and.push({ status: query.status });
  if (query.stage) and.push({ items: { stage: query.stage } });
  if (query.material) and.push({ items: { snapshot: { blank: { material: { name: query.material } } } } } as FilterQuery<Order>);
  if (query.from) and.push({ createdAt: { $gte: new Date(`${query.from}T00:00:00Z`) } });
  if (query.to) and.push({ createdAt: { $lt: new Date(new Date(`${query.to}T00:00:00Z`).getTime() + 86_400_000) } });
  const orderBy = {
    newest: { createdAt: 'desc' },
    oldest: { createdAt: 'asc' },
    'total-high': { totalMinor: 'desc' },
    'total-low': { totalMinor: 'asc' },
  }[query.sort] as Record<string, 'asc' | 'desc'>;
  const [orders, total] = await em.findAndCount(Order, and.length ? { ...where, $and: and } : where, {
    populate: ['items'],
    orderBy: [orderBy, { number: 'desc' }],
    limit: query.pageSize,
    offset: (query.page - 1) * query.pageSize,
  });
  return {
    orders: orders.map((o) => ({
      id: o.id,
      number: o.number,
      createdAt: o.createdAt.toISOString(),
      status: o.status,
      buyerName: o.buyerName,
      buyerEmail: o.buyerEmail,
      total: formatMoney(o.totalMinor, o.currency),
      items: o.items
        .getItems()
        .map((i) => ({ id: i.id, stage: i.stage, label: `${i.quantity} × ${i.snapshot.blank.name}, ${i.snapshot.size.label}` })),
    })),
    total,
    page: query.page,
    pageSize: query.pageSize,
  };
}

export async function findOrder(em: EntityManager, studio: Studio, id: string): Promise<Order> {
  const order = isUuid(id) ? await em.findOne(Order, { id, studio }, { populate: ['items', 'items.photo', 'events', 'studio'] }) : null;
  if (!order) throw new AppError('NOT_FOUND', 'There is no such order.');
  return order;
}
