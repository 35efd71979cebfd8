import type { EntityManager } from '@mikro-orm/postgresql';
import { ITEM_STAGES, type ItemStage } from '#shared/orders/stages.ts';
import type { Today } from '#shared/schemas/workspace-orders.ts';
import type { Studio } from '../studios/studio.entity.ts';
import { OrderItem } from './order.entity.ts';

/** Stages where an item waits for the studio (not the buyer, not finished). */
const WAITING: ItemStage[] = ['photo_review', 'prep', 'changes_requested', 'approved', 'in_production', 'burned'];
export const TODAY_WEEKS = 12;

/** Counts by stage, the items waiting longest, and orders and revenue (after refunds) per week. */
export async function today(em: EntityManager, studio: Studio, now = new Date()): Promise<Today> {
  const counts = await em.execute<Array<{ stage: ItemStage; count: string }>>(
    `select "stage", count(*) as "count" from "order_item" where "studio_id" = ? and "stage" not in ('unpaid', 'cancelled') group by "stage"`,
    [studio.id],
  );
  const byStage = ITEM_STAGES.filter((s) => s !== 'unpaid' && s !== 'cancelled').map((stage) => ({
    stage,
    count: Number(counts.find((c) => c.stage === stage)?.count ?? 0),
  }));
  const oldest = await em.find(
    OrderItem,
    { studio, stage: { $in: WAITING } },
    { populate: ['order'], orderBy: { updatedAt: 'asc' }, limit: 5 },
  );
  // Weeks start on Monday (ISO 8601), as PostgreSQL's date_trunc('week') counts them.
  const rows = await em.execute<Array<{ week: Date; orders: string; revenue: string | null }>>(
    `select date_trunc('week', "paid_at") as "week", count(*) as "orders", sum("total_minor" - "refunded_minor") as "revenue"
       from "order" where "studio_id" = ? and "paid_at" >= date_trunc('week', ?::timestamptz) - interval '${TODAY_WEEKS - 1} weeks'
       group by 1 order by 1`,
    [studio.id, now.toISOString()],
  );
  const monday = new Date(Date.UTC(now.getUTCFullYear(), now.getUTCMonth(), now.getUTCDate() - ((now.getUTCDay() + 6) % 7)));
  const weeks = Array.from({ length: TODAY_WEEKS }, (_, i) => {
    const start = new Date(monday.getTime() - (TODAY_WEEKS - 1 - i) * 7 * 86_400_000);
    const row = rows.find((r) => new Date(r.week).toISOString().slice(0, 10) === start.toISOString().slice(0, 10));
    return { weekStart: start.toISOString().slice(0, 10), orders: Number(row?.orders ?? 0), revenueMinor: Number(row?.revenue ?? 0) };
  });
  return {
    byStage,
    oldest: oldest.map((i) => ({
      itemId: i.id,
      orderId: i.order.id,
      orderNumber: i.order.number,
      label: `${i.snapshot.blank.name}, ${i.snapshot.size.label}`,
      stage: i.stage,
      since: i.updatedAt.toISOString(),
    })),
    weeks,
    currency: studio.currency,
  };
}
