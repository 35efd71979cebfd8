import { timingSafeEqual } from 'node:crypto';
import { Router } from 'express';
import type { EntityManager } from '@mikro-orm/postgresql';
import { AppError } from '../../../shared/errors.ts';
import { formatMoney } from '../../../shared/money.ts';
import { checkoutInputSchema } from '../../../shared/schemas/checkout.ts';
import type { Payments } from '../../adapters/payments.ts';
import type { Env } from '../../env.ts';
import type { Orm } from '../../db/orm.ts';
import { hashToken, isUuid } from '../../lib/tokens.ts';
import { ShippingRate } from '../shipping/shipping-rate.entity.ts';
import { storefrontStudio } from '../studios/studios.service.ts';
import { placeOrder } from './checkout.service.ts';
import { Order } from './order.entity.ts';
import { orderView } from './order.views.ts';

/**
 * Checkout and the buyer's order page, under `/api/storefront/:studioSlug`. An order opens with
 * the key from its private link (compared as hashes, in constant time), never by id alone.
 */
export function storefrontOrdersRouter({ orm, env, payments }: { orm: Orm; env: Env; payments: Payments }): Router {
  const router = Router();
  const em = () => orm.em as EntityManager;

  router.get('/:studioSlug/delivery', async (req, res) => {
    const studio = await storefrontStudio(em(), req.params.studioSlug);
    const rates = await em().find(ShippingRate, { studio }, { orderBy: { sortOrder: 'asc', priceMinor: 'asc' } });
    res.json({
      rates: rates.map((r) => ({ id: r.id, name: r.name, priceMinor: r.priceMinor, price: formatMoney(r.priceMinor, studio.currency) })),
      pickup: studio.pickupEnabled ? { note: studio.pickupNote } : null,
      lowResolutionPolicy: studio.lowResolutionPolicy,
    });
  });

  router.post('/:studioSlug/orders', async (req, res) => {
    const studio = await storefrontStudio(em(), req.params.studioSlug, { open: true });
    const { order, paymentUrl } = await placeOrder(em(), { env, payments }, studio, checkoutInputSchema.parse(req.body));
    res.status(201).json({ orderId: order.id, paymentUrl });
  });

  router.get('/:studioSlug/orders/:orderId', async (req, res) => {
    const studio = await storefrontStudio(em(), req.params.studioSlug);
    const key = typeof req.query.key === 'string' ? req.query.key : '';
    const order = isUuid(req.params.orderId) ? await em().findOne(Order, { id: req.params.orderId, studio }, { populate: ['items', 'items.photo', 'events', 'studio'] }) : null;
    const expected = order ? Buffer.from(order.accessKeyHash, 'hex') : Buffer.alloc(32);
    const given = Buffer.from(hashToken(key), 'hex');
    if (!order || !key || !timingSafeEqual(expected, given)) throw new AppError('NOT_FOUND', 'There is no order at this link. Check that you used the whole link from the e-mail.');
    res.set('cache-control', 'no-store').json(orderView(order));
  });
  return router;
}
