import { timingSafeEqual } from 'node:crypto';
import { Router } from 'express';
import { AppError } from '#shared/errors.ts';
import type { Auth } from '#server/auth/auth.ts';
import type { Orm } from '#server/db/orm.ts';
import type { User } from '#server/features/accounts/user.entity.ts';
import { storefrontStudio } from '#server/features/studios/studios.service.ts';
import { hashToken, isUuid } from '#server/lib/tokens.ts';
import { optionalUser } from '#server/middleware/auth-guards.ts';
import { Order } from './order.entity.ts';
import { buyerOrderView } from './order.views.ts';

/** A signed-in buyer whose confirmed address placed the order opens it without the link's key. */
export const ownsOrder = (user: User | undefined, order: Order) => Boolean(user?.emailVerifiedAt && user.email === order.buyerEmail);

/**
 * The buyer's order page, under `/api/storefront/:studioSlug`. An order opens with
 * the key from its private link (compared as hashes, in constant time) or for its buyer signed in
 * with the same confirmed address, never by id alone.
 */
export function storefrontOrdersRouter({ orm, auth }: { orm: Orm; auth: Auth }): Router {
  const router = Router();
  const em = () => orm.em;

  router.get('/:studioSlug/orders/:orderId', optionalUser(auth), async (req, res) => {
    const [slug, orderId] = [String(req.params.studioSlug), String(req.params.orderId)];
    const studio = await storefrontStudio(em(), slug);
    const key = typeof req.query.key === 'string' ? req.query.key : '';
    const order = isUuid(orderId)
      ? await em().findOne(Order, { id: orderId, studio }, { populate: ['items', 'items.photo', 'events', 'studio'] })
      : null;
    const expected = order ? Buffer.from(order.accessKeyHash, 'hex') : Buffer.alloc(32);
    const given = Buffer.from(hashToken(key), 'hex');
    const byKey = Boolean(order && key && timingSafeEqual(expected, given));
    if (!order || !(byKey || ownsOrder(req.user, order)))
      throw new AppError('NOT_FOUND', 'There is no order at this link. Check that you used the whole link from the e-mail.');
    res.set('cache-control', 'no-store').json(buyerOrderView(order));
  });
  return router;
}
