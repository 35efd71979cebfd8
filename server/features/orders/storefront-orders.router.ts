import { timingSafeEqual } from 'node:crypto';
import { Router } from 'express';
import type { EntityManager } from '@mikro-orm/postgresql';
import { AppError } from '../../../shared/errors.ts';
import type { Storage } from '../../adapters/storage.ts';
import { formatMoney } from '../../../shared/money.ts';
import { checkoutInputSchema } from '../../../shared/schemas/checkout.ts';
import type { Payments } from '../../adapters/payments.ts';
import type { Env } from '../../env.ts';
import type { Orm } from '../../db/orm.ts';
import { hashToken, isUuid } from '../../lib/tokens.ts';
import { ShippingRate } from '../shipping/shipping-rate.entity.ts';
import { storefrontStudio } from '../studios/studios.service.ts';
import { placeOrder } from './checkout.service.ts';
import { findReplacement, submitReplacement } from './review.service.ts';
import { answerProof, currentPrep, findProof } from './prep.service.ts';
import { proofDecisionSchema } from '../../../shared/schemas/prep.ts';
import { REVIEW_REASONS, replacementInputSchema, type ReviewReason } from '../../../shared/schemas/workspace-orders.ts';
import { Order } from './order.entity.ts';
import { orderView } from './order.views.ts';
import type { Auth } from '../../auth/auth.ts';
import { optionalUser } from '../../middleware/auth-guards.ts';
import type { User } from '../accounts/user.entity.ts';

/** A signed-in buyer whose confirmed address placed the order opens it without the link's key. */
export const ownsOrder = (user: User | undefined, order: Order) => Boolean(user?.emailVerifiedAt && user.email === order.buyerEmail);

/**
 * Checkout and the buyer's order page, under `/api/storefront/:studioSlug`. An order opens with
 * the key from its private link (compared as hashes, in constant time) or for its buyer signed in
 * with the same confirmed address, never by id alone.
 */
export function storefrontOrdersRouter({ orm, env, payments, auth, storage }: { orm: Orm; env: Env; payments: Payments; auth: Auth; storage: Storage }): Router {
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

  router.get('/:studioSlug/orders/:orderId', optionalUser(auth), async (req, res) => {
    const [slug, orderId] = [String(req.params.studioSlug), String(req.params.orderId)];
    const studio = await storefrontStudio(em(), slug);
    const key = typeof req.query.key === 'string' ? req.query.key : '';
    const order = isUuid(orderId) ? await em().findOne(Order, { id: orderId, studio }, { populate: ['items', 'items.photo', 'events', 'studio'] }) : null;
    const expected = order ? Buffer.from(order.accessKeyHash, 'hex') : Buffer.alloc(32);
    const given = Buffer.from(hashToken(key), 'hex');
    const byKey = Boolean(order && key && timingSafeEqual(expected, given));
    if (!order || !(byKey || ownsOrder(req.user, order))) throw new AppError('NOT_FOUND', 'There is no order at this link. Check that you used the whole link from the e-mail.');
    res.set('cache-control', 'no-store').json(orderView(order));
  });
  router.get('/:studioSlug/replacements/:token', async (req, res) => {
    const studio = await storefrontStudio(em(), req.params.studioSlug, { open: true });
    const item = await findReplacement(em(), studio, req.params.token);
    await em().populate(item.order, ['items', 'items.photo', 'events']);
    const view = orderView(item.order).items.find((i) => i.id === item.id)!;
    res.set('cache-control', 'no-store').json({
      orderNumber: item.order.number,
      blankName: item.snapshot.blank.name,
      sizeLabel: item.snapshot.size.label,
      reason: REVIEW_REASONS[item.replacementReason as ReviewReason] ?? 'The studio needs another photo',
      note: item.replacementNote,
      item: view,
    });
  });

  router.post('/:studioSlug/replacements/:token', async (req, res) => {
    const studio = await storefrontStudio(em(), req.params.studioSlug, { open: true });
    const item = await submitReplacement(em(), studio, req.params.token, replacementInputSchema.parse(req.body));
    res.json({ stage: item.stage });
  });
  router.get('/:studioSlug/proofs/:token', async (req, res) => {
    const studio = await storefrontStudio(em(), req.params.studioSlug);
    const item = await findProof(em(), studio, req.params.token);
    await em().populate(item.order, ['items', 'items.photo', 'events']);
    res.set('cache-control', 'no-store').json({ orderNumber: item.order.number, item: orderView(item.order).items.find((i) => i.id === item.id)!, prep: currentPrep(item), imageUrl: `/api/storefront/${studio.slug}/proofs/${encodeURIComponent(req.params.token)}/image` });
  });

  router.get('/:studioSlug/proofs/:token/image', async (req, res) => {
    const studio = await storefrontStudio(em(), req.params.studioSlug);
    const item = await findProof(em(), studio, req.params.token);
    if (!item.proofImageKey) throw new AppError('NOT_FOUND', 'This proof has no picture.');
    const object = await storage.get(item.proofImageKey);
    res.set({ 'content-type': 'image/png', 'cache-control': 'private, no-store' }).end(Buffer.from(object.body));
  });

  router.post('/:studioSlug/proofs/:token', async (req, res) => {
    const studio = await storefrontStudio(em(), req.params.studioSlug);
    const item = await answerProof(em(), studio, req.params.token, proofDecisionSchema.parse(req.body));
    res.json({ stage: item.stage });
  });
  return router;
}
