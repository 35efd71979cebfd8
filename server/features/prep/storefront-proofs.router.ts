import { Router } from 'express';
import { assetPaths } from '#shared/routes.ts';
import { AppError } from '#shared/errors.ts';
import { proofDecisionSchema } from '#shared/schemas/prep.ts';
import type { Storage } from '#server/adapters/storage.ts';
import type { Orm } from '#server/db/orm.ts';
import { orderView } from '#server/features/orders/order.views.ts';
import { storefrontStudio } from '#server/features/studios/studios.service.ts';
import { answerProof, currentPrep, findProof } from './prep.service.ts';

/** The buyer's proof, opened from its link: the picture, and approving it or asking for changes. */
export function storefrontProofsRouter({ orm, storage }: { orm: Orm; storage: Storage }): Router {
  const router = Router();
  const em = () => orm.em;

  router.get('/:studioSlug/proofs/:token', async (req, res) => {
    const studio = await storefrontStudio(em(), req.params.studioSlug);
    const item = await findProof(em(), studio, req.params.token);
    await em().populate(item.order, ['items', 'items.photo', 'events']);
    res.set('cache-control', 'no-store').json({
      orderNumber: item.order.number,
      item: orderView(item.order).items.find((i) => i.id === item.id)!,
      prep: currentPrep(item),
      imageUrl: assetPaths.proofImage(studio.slug, req.params.token),
    });
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
