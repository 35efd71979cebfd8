import { Router } from 'express';
import { assetPaths } from '#shared/routes.ts';
import { AppError } from '#shared/errors.ts';
import { formatMoney } from '#shared/money.ts';
import type { StorefrontCatalog } from '#shared/schemas/catalog.ts';
import type { Storage } from '#server/adapters/storage.ts';
import type { Orm } from '#server/db/orm.ts';
import { isUuid } from '#server/lib/tokens.ts';
import { storefrontStudio } from '../studios/studios.service.ts';
import { Blank, BlankPhoto, Recipe } from './catalog.entity.ts';
import type { HalftoneMethod } from '#shared/imaging/halftone/halftone.ts';
import { DEFAULT_LOOK_METHOD } from '../orders/order.views.ts';
import { byPosition, photoView } from './catalog.views.ts';

/** Low stock: few enough left that a buyer should know. */
export const LOW_STOCK = 3;

export const stockState = (stock: number | null) =>
  stock === null ? 'in-stock' : stock === 0 ? 'sold-out' : stock <= LOW_STOCK ? 'few-left' : 'in-stock';

/**
 * What a studio sells, for anyone: `GET /api/storefront/:studioSlug/blanks` lists active blanks with sizes,
 * prices formatted in the studio's currency, the material's notes and a stock state;
 * `GET …/photos/:photoId` serves an active blank's photo. A suspended studio sells nothing.
 */
export function storefrontCatalogRouter({ orm, storage }: { orm: Orm; storage: Storage }): Router {
  const router = Router();
  router.get('/:studioSlug/blanks', async (req, res) => {
    const em = orm.em;
    const studio = await storefrontStudio(em, req.params.studioSlug);
    if (studio.status !== 'active') return void res.json({ open: false, blanks: [] } satisfies StorefrontCatalog);
    const blanks = await em.find(
      Blank,
      { studio, status: 'active' },
      { populate: ['material', 'sizes', 'photos'], orderBy: { sortOrder: 'asc', name: 'asc' } },
    );
    const photoUrl = (photo: BlankPhoto) => assetPaths.blankPhoto(studio.slug, photo.id);
    // Each material burns with its first recipe, as orders do (checkout.service recipeFor).
    const recipes = await em.find(Recipe, { studio }, { orderBy: { createdAt: 'asc' } });
    const lookOf = (b: Blank) => {
      const recipe = recipes.find((r) => r.material.id === b.material.id);
      return recipe
        ? { tone: recipe.tone, halftoneMethod: recipe.halftoneMethod as HalftoneMethod, linesPerInch: recipe.linesPerInch }
        : { tone: b.material.defaultTone, halftoneMethod: DEFAULT_LOOK_METHOD, linesPerInch: b.material.linesPerInchMax };
    };
    res.json({
      open: true,
      // A blank on sale without a size has nothing to buy yet.
      blanks: blanks
        .filter((b) => b.sizes.length > 0)
        .map((b) => ({
          id: b.id,
          name: b.name,
          description: b.description,
          shape: b.shape,
          material: {
            name: b.material.name,
            family: b.material.family,
            surfaceColour: b.material.surfaceColour,
            markColour: b.material.markColour,
            notes: b.material.safetyNotes,
          },
          look: lookOf(b),
          photos: b.photos
            .getItems()
            .sort(byPosition)
            .map((p) => photoView(p, photoUrl)),
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
              stock: stockState(s.stock),
            })),
        })),
    } satisfies StorefrontCatalog);
  });

  router.get('/:studioSlug/photos/:photoId', async (req, res) => {
    const em = orm.em;
    const studio = await storefrontStudio(em, req.params.studioSlug);
    const photo = isUuid(req.params.photoId)
      ? await em.findOne(BlankPhoto, { id: req.params.photoId, studio, blank: { status: 'active' } })
      : null;
    if (!photo || studio.status !== 'active') throw new AppError('NOT_FOUND', 'There is no such photo.');
    const object = await storage.get(photo.key);
    // A photo's id names its content for good: a replaced photo gets a new id.
    res.set({ 'content-type': 'image/webp', 'cache-control': 'public, max-age=604800, immutable' }).end(Buffer.from(object.body));
  });
  return router;
}
