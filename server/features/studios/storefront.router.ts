import { Router } from 'express';
import type { Orm } from '#server/db/orm.ts';
import type { Storage } from '#server/adapters/storage.ts';
import { AppError } from '#shared/errors.ts';
import { findStudioBySlug, toPublicStudio } from './studios.service.ts';

/** Public storefront routes under `/api/storefront/:studioSlug`. */
export function storefrontRouter({ orm, storage }: { orm: Orm; storage: Storage }): Router {
  const router = Router({ mergeParams: true });
  router.get('/:studioSlug', async (req, res) => {
    const studio = await findStudioBySlug(orm.em, req.params.studioSlug);
    res.json(toPublicStudio(studio));
  });
  router.get('/:studioSlug/logo', async (req, res) => {
    const studio = await findStudioBySlug(orm.em, req.params.studioSlug);
    if (!studio.logoKey) throw new AppError('NOT_FOUND', 'This studio has no logo.');
    const object = await storage.get(studio.logoKey);
    res.set({ 'content-type': 'image/webp', 'cache-control': 'public, max-age=86400' }).end(Buffer.from(object.body));
  });
  return router;
}
