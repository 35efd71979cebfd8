import type { EntityManager } from '@mikro-orm/postgresql';
import { blankInputSchema, machineInputSchema, materialInputSchema, recipeInputSchema, sizeInputSchema } from '../../../shared/schemas/catalog.ts';
import type { Orm } from '../../db/orm.ts';
import type { WorkspaceRoute } from '../../middleware/workspace-routes.ts';
import * as catalog from './catalog.service.ts';

/**
 * The catalog's workspace API: staff read it, owners change it (catalog:read / catalog:write).
 * Updates are PUTs of the whole record, checked by the same schema as creation.
 */
const material = { name: 'Test slate', family: 'stone', surfaceColour: '#333333', markColour: '#cccccc', defaultTone: 'negative', linesPerInchMin: 250, linesPerInchMax: 330 };
const machine = { name: 'Test CO2', laserKind: 'co2', powerWatts: 60, bedWidthMm: 600, bedHeightMm: 400, speedUnit: 'mm/s' };
const blank = (materialId: string) => ({ name: 'Test tile', materialId, shape: 'rectangle' });
const size = { label: '4 × 4 in', outerWidthMm: 101.6, outerHeightMm: 101.6, areaWidthMm: 90, areaHeightMm: 90, orientation: 'either', priceMinor: 2500, stock: null };
const recipe = (materialId: string, machineId: string) => ({ materialId, machineId, linesPerInch: 300, halftoneMethod: 'jarvis-judice-ninke', tone: 'negative', speed: 300, powerMinPercent: 10, powerMaxPercent: 20, passes: 1 });

export function catalogRoutes({ orm }: { orm: Orm }): WorkspaceRoute[] {
  const em = () => orm.em as EntityManager;
  return [
    { method: 'get', path: '/catalog/materials', permission: 'catalog:read', handler: async (req, res) => void res.json({ materials: await catalog.listMaterials(em(), req.studio!) }) },
    {
      method: 'post', path: '/catalog/materials', permission: 'catalog:write',
      sample: () => ({ body: { ...material, name: `Material ${Math.random()}` } }),
      handler: async (req, res) => void res.status(201).json(await catalog.createMaterial(em(), req.studio!, materialInputSchema.parse(req.body))),
    },
    {
      method: 'put', path: '/catalog/materials/:materialId', permission: 'catalog:write',
      sample: async (f) => ({ params: { materialId: await f.catalog('material') }, body: { ...material, name: `Material ${Math.random()}` } }),
      handler: async (req, res) => void res.json(await catalog.updateMaterial(em(), req.studio!, String(req.params.materialId), materialInputSchema.parse(req.body))),
    },
    { method: 'get', path: '/catalog/machines', permission: 'catalog:read', handler: async (req, res) => void res.json({ machines: await catalog.listMachines(em(), req.studio!) }) },
    {
      method: 'post', path: '/catalog/machines', permission: 'catalog:write',
      sample: () => ({ body: machine }),
      handler: async (req, res) => void res.status(201).json(await catalog.createMachine(em(), req.studio!, machineInputSchema.parse(req.body))),
    },
    {
      method: 'put', path: '/catalog/machines/:machineId', permission: 'catalog:write',
      sample: async (f) => ({ params: { machineId: await f.catalog('machine') }, body: machine }),
      handler: async (req, res) => void res.json(await catalog.updateMachine(em(), req.studio!, String(req.params.machineId), machineInputSchema.parse(req.body))),
    },
    { method: 'get', path: '/catalog/recipes', permission: 'catalog:read', handler: async (req, res) => void res.json({ recipes: await catalog.listRecipes(em(), req.studio!) }) },
    {
      method: 'post', path: '/catalog/recipes', permission: 'catalog:write',
      sample: async (f) => ({ body: recipe(await f.catalog('material'), await f.catalog('machine')) }),
      handler: async (req, res) => void res.status(201).json(await catalog.createRecipe(em(), req.studio!, recipeInputSchema.parse(req.body))),
    },
    {
      method: 'put', path: '/catalog/recipes/:recipeId', permission: 'catalog:write',
      sample: async (f) => ({ params: { recipeId: await f.catalog('recipe') }, body: recipe(await f.catalog('material'), await f.catalog('machine')) }),
      handler: async (req, res) => void res.json(await catalog.updateRecipe(em(), req.studio!, String(req.params.recipeId), recipeInputSchema.parse(req.body))),
    },
    {
      method: 'delete', path: '/catalog/recipes/:recipeId', permission: 'catalog:write',
      sample: async (f) => ({ params: { recipeId: await f.catalog('recipe') } }),
      handler: async (req, res) => {
        await catalog.deleteRecipe(em(), req.studio!, String(req.params.recipeId));
        res.status(204).end();
      },
    },
    { method: 'get', path: '/catalog/blanks', permission: 'catalog:read', handler: async (req, res) => void res.json({ blanks: await catalog.listBlanks(em(), req.studio!) }) },
    {
      method: 'post', path: '/catalog/blanks', permission: 'catalog:write',
      sample: async (f) => ({ body: blank(await f.catalog('material')) }),
      handler: async (req, res) => void res.status(201).json(await catalog.createBlank(em(), req.studio!, blankInputSchema.parse(req.body))),
    },
    {
      method: 'put', path: '/catalog/blanks/:blankId', permission: 'catalog:write',
      sample: async (f) => ({ params: { blankId: await f.catalog('blank') }, body: blank(await f.catalog('material')) }),
      handler: async (req, res) => void res.json(await catalog.updateBlank(em(), req.studio!, String(req.params.blankId), blankInputSchema.parse(req.body))),
    },
    {
      method: 'post', path: '/catalog/blanks/:blankId/sizes', permission: 'catalog:write',
      sample: async (f) => ({ params: { blankId: await f.catalog('blank') }, body: size }),
      handler: async (req, res) => void res.status(201).json(await catalog.addSize(em(), req.studio!, String(req.params.blankId), sizeInputSchema.parse(req.body))),
    },
    {
      method: 'put', path: '/catalog/sizes/:sizeId', permission: 'catalog:write',
      sample: async (f) => ({ params: { sizeId: await f.catalog('size') }, body: size }),
      handler: async (req, res) => void res.json(await catalog.updateSize(em(), req.studio!, String(req.params.sizeId), sizeInputSchema.parse(req.body))),
    },
    {
      method: 'delete', path: '/catalog/sizes/:sizeId', permission: 'catalog:write',
      sample: async (f) => ({ params: { sizeId: await f.catalog('size') } }),
      handler: async (req, res) => {
        await catalog.removeSize(em(), req.studio!, String(req.params.sizeId));
        res.status(204).end();
      },
    },
  ];
}
