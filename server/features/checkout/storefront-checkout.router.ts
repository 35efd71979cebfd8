import { Router } from 'express';
import { formatMoney } from '#shared/money.ts';
import { checkoutInputSchema } from '#shared/schemas/checkout.ts';
import type { Payments } from '#server/adapters/payments.ts';
import type { Orm } from '#server/db/orm.ts';
import type { Env } from '#server/env.ts';
import { ShippingRate } from '#server/features/shipping/shipping-rate.entity.ts';
import { storefrontStudio } from '#server/features/studios/studios.service.ts';
import { placeOrder } from './checkout.service.ts';

/** Checkout under `/api/storefront/:studioSlug`: the delivery choices, and placing an order. */
export function storefrontCheckoutRouter({ orm, env, payments }: { orm: Orm; env: Env; payments: Payments }): Router {
  const router = Router();
  const em = () => orm.em;

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
  return router;
}
