import type { Request } from 'express';
import { assetPaths } from '#shared/routes.ts';
import { blankInputSchema, machineInputSchema, materialInputSchema, recipeInputSchema, sizeInputSchema } from '#shared/schemas/catalog.ts';
import { claimUploadSchema, imageUploadRequestSchema } from '#shared/schemas/uploads.ts';
import type { Storage } from '#server/adapters/storage.ts';
import type { WorkspaceContext, WorkspaceRoute } from '#server/middleware/workspace-routes.ts';
import { Blank, BlankPhoto, type Material } from './catalog.entity.ts';
import * as catalog from './catalog.service.ts';
import { blankView, machineView, materialView, photoView, recipeView, sizeView } from './catalog.views.ts';

/**
 * The catalog's workspace API: staff read it, owners change it (catalog:read / catalog:write).
 * Updates are PUTs of the whole record, checked by the same schema as creation.
 */
const material = {
  name: 'Test slate',
  family: 'stone',
  surfaceColour: '#333333',
  markColour: '#cccccc',
  defaultTone: 'negative',
  linesPerInchMin: 250,
  linesPerInchMax: 330,
};
const machine = { name: 'Test CO2', laserKind: 'co2', powerWatts: 60, bedWidthMm: 600, bedHeightMm: 400, speedUnit: 'mm/s' };
const blank = (materialId: string) => ({ name: 'Test tile', materialId, shape: 'rectangle' });
const size = {
  label: '4 × 4 in',
  outerWidthMm: 101.6,
  outerHeightMm: 101.6,
  areaWidthMm: 71,
  areaHeightMm: 71,
  orientation: 'either',
  priceMinor: 2500,
  stock: null,
};
const recipe = (materialId: string, machineId: string) => ({
  materialId,
  machineId,
  linesPerInch: 300,
  halftoneMethod: 'jarvis-judice-ninke',
  tone: 'negative',
  speed: 300,
  powerMinPercent: 10,
  powerMaxPercent: 20,
  passes: 1,
});

/** Where the workspace loads a product photo from. */
export const workspacePhotoUrl = (ctx: WorkspaceContext) => (photo: BlankPhoto) =>
  assetPaths.workspaceBlankPhoto(ctx.studio.slug, photo.id);

export function catalogRoutes({ storage }: { storage: Storage }): WorkspaceRoute[] {
  const withCount = async (ctx: WorkspaceContext, m: Material) =>
    materialView(m, await ctx.em.count(Blank, { studio: ctx.studio, material: m }));
  const id = (req: Request, name: string) => String(req.params[name]);
  return [
    {
      method: 'get',
      path: '/catalog/materials',
      permission: 'catalog:read',
      handler: async (ctx, req, res) =>
        void res.json({
          materials: (await catalog.listMaterials(ctx.em, ctx.studio)).map(({ material: m, blankCount }) => materialView(m, blankCount)),
        }),
    },
    {
      method: 'post',
      path: '/catalog/materials',
      permission: 'catalog:write',
      sample: () => ({ body: { ...material, name: `Material ${Math.random()}` } }),
      handler: async (ctx, req, res) =>
        void res.status(201).json(materialView(await catalog.createMaterial(ctx.em, ctx.studio, materialInputSchema.parse(req.body)), 0)),
    },
    {
      method: 'put',
      path: '/catalog/materials/:materialId',
      permission: 'catalog:write',
      sample: async (f) => ({
        params: { materialId: await f.catalog('material') },
        body: { ...material, name: `Material ${Math.random()}` },
      }),
      handler: async (ctx, req, res) =>
        void res.json(
          await withCount(
            ctx,
            await catalog.updateMaterial(ctx.em, ctx.studio, id(req, 'materialId'), materialInputSchema.parse(req.body)),
          ),
        ),
    },
    {
      method: 'delete',
      path: '/catalog/materials/:materialId',
      permission: 'catalog:write',
      sample: async (f) => ({ params: { materialId: await f.catalog('material') } }),
      handler: async (ctx, req, res) => {
        await catalog.deleteMaterial(ctx.em, ctx.studio, id(req, 'materialId'));
        res.status(204).end();
      },
    },
    {
      method: 'get',
      path: '/catalog/machines',
      permission: 'catalog:read',
      handler: async (ctx, req, res) => void res.json({ machines: (await catalog.listMachines(ctx.em, ctx.studio)).map(machineView) }),
    },
    {
      method: 'post',
      path: '/catalog/machines',
      permission: 'catalog:write',
      sample: () => ({ body: machine }),
      handler: async (ctx, req, res) =>
        void res.status(201).json(machineView(await catalog.createMachine(ctx.em, ctx.studio, machineInputSchema.parse(req.body)))),
    },
    {
      method: 'put',
      path: '/catalog/machines/:machineId',
      permission: 'catalog:write',
      sample: async (f) => ({ params: { machineId: await f.catalog('machine') }, body: machine }),
      handler: async (ctx, req, res) =>
        void res.json(
          machineView(await catalog.updateMachine(ctx.em, ctx.studio, id(req, 'machineId'), machineInputSchema.parse(req.body))),
        ),
    },
    {
      method: 'delete',
      path: '/catalog/machines/:machineId',
      permission: 'catalog:write',
      sample: async (f) => ({ params: { machineId: await f.catalog('machine') } }),
      handler: async (ctx, req, res) => {
        await catalog.deleteMachine(ctx.em, ctx.studio, id(req, 'machineId'));
        res.status(204).end();
      },
    },
    {
      method: 'get',
      path: '/catalog/recipes',
      permission: 'catalog:read',
      handler: async (ctx, req, res) => void res.json({ recipes: (await catalog.listRecipes(ctx.em, ctx.studio)).map(recipeView) }),
    },
    {
      method: 'post',
      path: '/catalog/recipes',
      permission: 'catalog:write',
      sample: async (f) => ({ body: recipe(await f.catalog('material'), await f.catalog('machine')) }),
      handler: async (ctx, req, res) =>
        void res.status(201).json(recipeView(await catalog.createRecipe(ctx.em, ctx.studio, recipeInputSchema.parse(req.body), ctx.user))),
    },
    {
      method: 'put',
      path: '/catalog/recipes/:recipeId',
      permission: 'catalog:write',
      sample: async (f) => ({
        params: { recipeId: await f.catalog('recipe') },
        body: recipe(await f.catalog('material'), await f.catalog('machine')),
      }),
      handler: async (ctx, req, res) =>
        void res.json(
          recipeView(await catalog.updateRecipe(ctx.em, ctx.studio, id(req, 'recipeId'), recipeInputSchema.parse(req.body), ctx.user)),
        ),
    },
    {
      method: 'delete',
      path: '/catalog/recipes/:recipeId',
      permission: 'catalog:write',
      sample: async (f) => ({ params: { recipeId: await f.catalog('recipe') } }),
      handler: async (ctx, req, res) => {
        await catalog.deleteRecipe(ctx.em, ctx.studio, id(req, 'recipeId'), ctx.user);
        res.status(204).end();
      },
    },
    {
      method: 'get',
      path: '/catalog/blanks',
      permission: 'catalog:read',
      handler: async (ctx, req, res) =>
        void res.json({ blanks: (await catalog.listBlanks(ctx.em, ctx.studio)).map((b) => blankView(b, workspacePhotoUrl(ctx))) }),
    },
    {
      method: 'get',
      path: '/catalog/blanks/:blankId',
      permission: 'catalog:read',
      sample: async (f) => ({ params: { blankId: await f.catalog('blank') } }),
      handler: async (ctx, req, res) =>
        void res.json(blankView(await catalog.getBlank(ctx.em, ctx.studio, id(req, 'blankId')), workspacePhotoUrl(ctx))),
    },
    {
      method: 'post',
      path: '/catalog/blanks',
      permission: 'catalog:write',
      sample: async (f) => ({ body: blank(await f.catalog('material')) }),
      handler: async (ctx, req, res) =>
        void res
          .status(201)
          .json(
            blankView(await catalog.createBlank(ctx.em, ctx.studio, blankInputSchema.parse(req.body), ctx.user), workspacePhotoUrl(ctx)),
          ),
    },
    {
      method: 'put',
      path: '/catalog/blanks/:blankId',
      permission: 'catalog:write',
      sample: async (f) => ({ params: { blankId: await f.catalog('blank') }, body: blank(await f.catalog('material')) }),
      handler: async (ctx, req, res) =>
        void res.json(
          blankView(
            await catalog.updateBlank(ctx.em, ctx.studio, id(req, 'blankId'), blankInputSchema.parse(req.body), ctx.user),
            workspacePhotoUrl(ctx),
          ),
        ),
    },
    {
      method: 'post',
      path: '/catalog/blanks/:blankId/sizes',
      permission: 'catalog:write',
      sample: async (f) => ({ params: { blankId: await f.catalog('blank') }, body: size }),
      handler: async (ctx, req, res) => {
        const size = await catalog.addSize(ctx.em, ctx.studio, id(req, 'blankId'), sizeInputSchema.parse(req.body), ctx.user);
        res.status(201).json(sizeView(size, size.blank.shape));
      },
    },
    {
      method: 'put',
      path: '/catalog/sizes/:sizeId',
      permission: 'catalog:write',
      sample: async (f) => ({ params: { sizeId: await f.catalog('size') }, body: size }),
      handler: async (ctx, req, res) => {
        const size = await catalog.updateSize(ctx.em, ctx.studio, id(req, 'sizeId'), sizeInputSchema.parse(req.body), ctx.user);
        res.json(sizeView(size, size.blank.shape));
      },
    },
    {
      method: 'delete',
      path: '/catalog/sizes/:sizeId',
      permission: 'catalog:write',
      sample: async (f) => ({ params: { sizeId: await f.catalog('size') } }),
      handler: async (ctx, req, res) => {
        await catalog.removeSize(ctx.em, ctx.studio, id(req, 'sizeId'), ctx.user);
        res.status(204).end();
      },
    },
    {
      method: 'post',
      path: '/catalog/blanks/:blankId/photo-uploads',
      permission: 'catalog:write',
      sample: async (f) => ({ params: { blankId: await f.catalog('blank') }, body: { contentType: 'image/jpeg', contentLength: 1000 } }),
      handler: async (ctx, req, res) =>
        void res
          .status(201)
          .json(await catalog.startPhotoUpload(ctx.em, storage, ctx.studio, id(req, 'blankId'), imageUploadRequestSchema.parse(req.body))),
    },
    {
      method: 'post',
      path: '/catalog/blanks/:blankId/photos',
      permission: 'catalog:write',
      sample: async (f) => ({ params: { blankId: await f.catalog('blank') }, body: { key: await f.upload('blank-photos') } }),
      handler: async (ctx, req, res) => {
        const { key } = claimUploadSchema.parse(req.body);
        res
          .status(201)
          .json(photoView(await catalog.addPhoto(ctx.em, storage, ctx.studio, id(req, 'blankId'), key), workspacePhotoUrl(ctx)));
      },
    },
    {
      method: 'get',
      path: '/catalog/photos/:photoId',
      permission: 'catalog:read',
      sample: async (f) => ({ params: { photoId: await f.catalog('photo') } }),
      handler: async (ctx, req, res) => {
        const photo = await catalog.findIn(ctx.em, BlankPhoto, ctx.studio, id(req, 'photoId'), 'photo');
        const object = await storage.get(photo.key);
        res.set({ 'content-type': 'image/webp', 'cache-control': 'private, max-age=86400, immutable' }).end(Buffer.from(object.body));
      },
    },
    {
      method: 'delete',
      path: '/catalog/photos/:photoId',
      permission: 'catalog:write',
      sample: async (f) => ({ params: { photoId: await f.catalog('photo') } }),
      handler: async (ctx, req, res) => {
        await catalog.removePhoto(ctx.em, storage, ctx.studio, id(req, 'photoId'));
        res.status(204).end();
      },
    },
  ];
}
