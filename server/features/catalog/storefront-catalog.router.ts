import { Router } from 'express';
import type { EntityManager } from '@mikro-orm/postgresql';
import { formatMoney } from '../../../shared/money.ts';
import type { Orm } from '../../db/orm.ts';
import { TENANT_FILTER } from '../../db/tenant.ts';
import { findStudioBySlug } from '../studios/studios.service.ts';
import { Blank } from './catalog.entity.ts';

/** Low stock: few enough left that a buyer should know. */
const LOW_STOCK = 3;

/**
 * `GET /api/storefront/:studioSlug/blanks`: what a studio sells, for anyone. Active blanks only,
 * prices formatted in the studio's currency, the material's notes and a stock state; a
 * suspended studio sells nothing.
 */
export function storefrontCatalogRouter({ orm }: { orm: Orm }): Router {
  const router = Router();
  router.get('/:studioSlug/blanks', async (req, res) => {
    const em = orm.em as EntityManager;
    const studio = await findStudioBySlug(em, req.params.studioSlug);
    if (studio.status !== 'active') return void res.json({ open: false, blanks: [] });
    em.setFilterParams(TENANT_FILTER, { studioId: studio.id });
    const blanks = await em.find(Blank, { studio, status: 'active' }, { populate: ['material', 'sizes'], orderBy: { sortOrder: 'asc', name: 'asc' } });
    res.json({
      open: true,
      blanks: blanks.map((b) => ({
        id: b.id,
        name: b.name,
        description: b.description,
        shape: b.shape,
        material: { name: b.material.name, family: b.material.family, surfaceColour: b.material.surfaceColour, markColour: b.material.markColour, notes: b.material.safetyNotes },
        sizes: b.sizes
          .getItems()
          .sort((x, y) => x.priceMinor - y.priceMinor)
          .map((s) => ({
            id: s.id,
            label: s.label,
            areaWidthMm: s.areaWidthMm,
            areaHeightMm: s.areaHeightMm,
            orientation: s.orientation,
            priceMinor: s.priceMinor,
            price: formatMoney(s.priceMinor, studio.currency),
            stock: s.stock === null ? 'in-stock' : s.stock === 0 ? 'sold-out' : s.stock <= LOW_STOCK ? 'few-left' : 'in-stock',
          })),
      })),
    });
  });
  return router;
}
