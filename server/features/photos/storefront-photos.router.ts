import { Router } from 'express';
import { claimUploadSchema, imageUploadRequestSchema } from '#shared/schemas/uploads.ts';
import type { Storage } from '#server/adapters/storage.ts';
import type { Orm } from '#server/db/orm.ts';
import type { RateLimits } from '#server/lib/rate-limits.ts';
import { storefrontStudio } from '../studios/studios.service.ts';
import { acceptBuyerPhoto, buyerPhotoView, findBuyerPhoto, startBuyerPhotoUpload } from './photos.service.ts';

/**
 * A buyer's photo on its way in, under `/api/storefront/:studioSlug`: a ticket to upload it
 * straight to storage, then the claim that checks it and answers its size and quality; the
 * designer then loads the preview. No sign-in: the photo's id is the buyer's handle on it.
 */
export function storefrontPhotosRouter({ orm, storage, limits }: { orm: Orm; storage: Storage; limits: RateLimits }): Router {
  const router = Router();
  const em = () => orm.em;

  router.post('/:studioSlug/photo-uploads', async (req, res) => {
    const studio = await storefrontStudio(em(), req.params.studioSlug, { open: true });
    res.status(201).json(await startBuyerPhotoUpload(storage, studio, imageUploadRequestSchema.parse(req.body)));
  });

  router.post('/:studioSlug/buyer-photos', async (req, res) => {
    const studio = await storefrontStudio(em(), req.params.studioSlug, { open: true });
    const { key } = claimUploadSchema.parse(req.body);
    await limits.consume('photoAccept', req.ip ?? 'unknown');
    res.status(201).json(buyerPhotoView(studio, await acceptBuyerPhoto(em(), storage, studio, key)));
  });

  router.get('/:studioSlug/buyer-photos/:photoId', async (req, res) => {
    const studio = await storefrontStudio(em(), req.params.studioSlug);
    res.json(buyerPhotoView(studio, await findBuyerPhoto(em(), studio, req.params.photoId)));
  });

  for (const variant of ['preview', 'thumb'] as const) {
    router.get(`/:studioSlug/buyer-photos/:photoId/${variant}`, async (req, res) => {
      const studio = await storefrontStudio(em(), req.params.studioSlug);
      const photo = await findBuyerPhoto(em(), studio, req.params.photoId);
      const object = await storage.get(variant === 'preview' ? photo.previewKey : photo.thumbKey);
      res.set({ 'content-type': 'image/webp', 'cache-control': 'private, max-age=86400, immutable' }).end(Buffer.from(object.body));
    });
  }
  return router;
}
