import { Router } from 'express';
import { formatMoney } from '#shared/money.ts';
import type { MyOrders } from '#shared/schemas/checkout.ts';
import type { Auth } from '#server/auth/auth.ts';
import type { Orm } from '#server/db/orm.ts';
import { withoutTenantFilter } from '#server/db/tenant.ts';
import { requireUser, signedInUser } from '#server/middleware/auth-guards.ts';
import { Order } from './order.entity.ts';

/**
 * `GET /api/me/orders`: every order placed with the signed-in person's confirmed address, at any
 * studio (a read across studios, by the buyer's own address only).
 */
export function myOrdersRouter({ orm, auth }: { orm: Orm; auth: Auth }): Router {
  const router = Router();
  router.get('/me/orders', requireUser(auth), async (req, res) => {
    const user = signedInUser(req);
    if (!user.emailVerifiedAt) return void res.json({ confirmed: false, orders: [] } satisfies MyOrders);
    const orders = await orm.em.find(
      Order,
      { buyerEmail: user.email },
      { ...withoutTenantFilter, populate: ['studio', 'items'], orderBy: { createdAt: 'desc' }, limit: 100 },
    );
    res.json({
      confirmed: true,
      orders: orders.map((o) => ({
        id: o.id,
        number: o.number,
        status: o.status,
        createdAt: o.createdAt.toISOString(),
        total: formatMoney(o.totalMinor, o.currency),
        studio: { slug: o.studio.slug, name: o.studio.name },
        items: o.items.getItems().map((i) => `${i.quantity} × ${i.snapshot.blank.name}, ${i.snapshot.size.label}`),
      })),
    } satisfies MyOrders);
  });
  return router;
}
