import { Router } from 'express';
import type { EntityManager } from '@mikro-orm/postgresql';
import type { Orm } from '../../db/orm.ts';
import { findStudioBySlug, toPublicStudio } from './studios.service.ts';

/** Public storefront routes under `/api/storefront/:studioSlug`. */
export function storefrontRouter({ orm }: { orm: Orm }): Router {
  const router = Router({ mergeParams: true });
  router.get('/:studioSlug', async (req, res) => {
    const studio = await findStudioBySlug(orm.em as EntityManager, req.params.studioSlug);
    res.json(toPublicStudio(studio));
  });
  return router;
}
