import { Router } from 'express';
import { REVIEW_REASONS, replacementInputSchema, type ReviewReason } from '#shared/schemas/workspace-orders.ts';
import type { Orm } from '#server/db/orm.ts';
import { orderView } from '#server/features/orders/order.views.ts';
import { storefrontStudio } from '#server/features/studios/studios.service.ts';
import { findReplacement, submitReplacement } from './review.service.ts';

/** A new photo for an item, sent by the buyer from the link in the studio's e-mail. */
export function storefrontReplacementsRouter({ orm }: { orm: Orm }): Router {
  const router = Router();
  const em = () => orm.em;

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
  return router;
}
