import type { EntityManager } from '@mikro-orm/postgresql';
import { UniqueConstraintViolationException } from '@mikro-orm/core';
import { AppError } from '../../../shared/errors.ts';
import type { BlankInput, MachineInput, MaterialInput, RecipeInput, SizeInput } from '../../../shared/schemas/catalog.ts';
import { isUuid } from '../../lib/tokens.ts';
import type { Studio } from '../studios/studio.entity.ts';
import { Blank, BlankSize, Machine, Material, Recipe } from './catalog.entity.ts';
import { MATERIAL_LIBRARY } from './material-library.ts';

/** Catalog rules. Every query runs under the tenant filter and names the studio as well. */

async function findIn<T extends Material | Machine | Recipe | Blank | BlankSize>(
  em: EntityManager,
  entity: new () => T,
  studio: Studio,
  id: string,
  what: string,
): Promise<T> {
  const found = isUuid(id) ? await em.findOne(entity, { id, studio } as never) : null;
  if (!found) throw new AppError('NOT_FOUND', `There is no such ${what}.`);
  return found as T;
}

/** Saves, turning a duplicate into a 409 on the field that must be unique. */
async function flushUnique(em: EntityManager, field: string, message: string): Promise<void> {
  try {
    await em.flush();
  } catch (error) {
    if (error instanceof UniqueConstraintViolationException) throw new AppError('CONFLICT', message, { issues: [{ path: [field], message }] });
    throw error;
  }
}

/** Gives a new studio its own copy of the materials library (forbidden entries included, flagged). */
export function addMaterialLibrary(em: EntityManager, studio: Studio): Material[] {
  return MATERIAL_LIBRARY.map(({ suggestedLinesPerInch: _l, suggestedHalftone: _h, ...material }) => em.create(Material, { ...material, studio }));
}

export const listMaterials = (em: EntityManager, studio: Studio) => em.find(Material, { studio }, { orderBy: { name: 'asc' } });

export async function createMaterial(em: EntityManager, studio: Studio, input: MaterialInput): Promise<Material> {
  const material = em.create(Material, { ...input, studio });
  await flushUnique(em, 'name', 'The studio already has a material with this name.');
  return material;
}

export async function updateMaterial(em: EntityManager, studio: Studio, id: string, input: MaterialInput): Promise<Material> {
  const material = await findIn(em, Material, studio, id, 'material');
  em.assign(material, input);
  await flushUnique(em, 'name', 'The studio already has a material with this name.');
  return material;
}

export const listMachines = (em: EntityManager, studio: Studio) => em.find(Machine, { studio }, { orderBy: { name: 'asc' } });

export async function createMachine(em: EntityManager, studio: Studio, input: MachineInput): Promise<Machine> {
  const machine = em.create(Machine, { ...input, studio });
  await em.flush();
  return machine;
}

export async function updateMachine(em: EntityManager, studio: Studio, id: string, input: MachineInput): Promise<Machine> {
  const machine = await findIn(em, Machine, studio, id, 'machine');
  em.assign(machine, input);
  await em.flush();
  return machine;
}

/** A material the machine's laser kind must never touch is refused, with the reason. */
async function checkedPair(em: EntityManager, studio: Studio, input: RecipeInput): Promise<{ material: Material; machine: Machine }> {
  const material = await findIn(em, Material, studio, input.materialId, 'material');
  const machine = await findIn(em, Machine, studio, input.machineId, 'machine');
  if (material.forbiddenOn.includes(machine.laserKind)) {
    const message = `${material.name} must never be engraved on a ${machine.laserKind.toUpperCase()} laser: ${material.forbiddenReason}`;
    throw new AppError('VALIDATION_FAILED', message, { issues: [{ path: ['materialId'], message }] });
  }
  return { material, machine };
}

export const listRecipes = (em: EntityManager, studio: Studio) => em.find(Recipe, { studio }, { populate: ['material', 'machine'], orderBy: { material: { name: 'asc' } } });

export async function createRecipe(em: EntityManager, studio: Studio, input: RecipeInput): Promise<Recipe> {
  const { material, machine } = await checkedPair(em, studio, input);
  const { materialId: _m, machineId: _k, ...values } = input;
  const recipe = em.create(Recipe, { ...values, material, machine, studio });
  await flushUnique(em, 'machineId', 'This material already has a recipe on this machine.');
  return recipe;
}

export async function updateRecipe(em: EntityManager, studio: Studio, id: string, input: RecipeInput): Promise<Recipe> {
  const recipe = await findIn(em, Recipe, studio, id, 'recipe');
  const { material, machine } = await checkedPair(em, studio, input);
  const { materialId: _m, machineId: _k, ...values } = input;
  em.assign(recipe, { ...values, material, machine });
  await flushUnique(em, 'machineId', 'This material already has a recipe on this machine.');
  return recipe;
}

export async function deleteRecipe(em: EntityManager, studio: Studio, id: string): Promise<void> {
  em.remove(await findIn(em, Recipe, studio, id, 'recipe'));
  await em.flush();
}

export const listBlanks = (em: EntityManager, studio: Studio) =>
  em.find(Blank, { studio }, { populate: ['material', 'sizes'], orderBy: { sortOrder: 'asc', name: 'asc' } });

export async function createBlank(em: EntityManager, studio: Studio, input: BlankInput): Promise<Blank> {
  const material = await findIn(em, Material, studio, input.materialId, 'material');
  const { materialId: _m, ...values } = input;
  const blank = em.create(Blank, { ...values, material, studio });
  await em.flush();
  return blank;
}

/** Blanks are never deleted: archiving keeps them for the orders that name them. */
export async function updateBlank(em: EntityManager, studio: Studio, id: string, input: BlankInput): Promise<Blank> {
  const blank = await findIn(em, Blank, studio, id, 'blank');
  const material = await findIn(em, Material, studio, input.materialId, 'material');
  const { materialId: _m, ...values } = input;
  em.assign(blank, { ...values, material });
  await em.flush();
  return blank;
}

export async function addSize(em: EntityManager, studio: Studio, blankId: string, input: SizeInput): Promise<BlankSize> {
  const blank = await findIn(em, Blank, studio, blankId, 'blank');
  const size = em.create(BlankSize, { ...input, blank, studio });
  await em.flush();
  return size;
}

export async function updateSize(em: EntityManager, studio: Studio, id: string, input: SizeInput): Promise<BlankSize> {
  const size = await findIn(em, BlankSize, studio, id, 'size');
  em.assign(size, input);
  await em.flush();
  return size;
}

export async function removeSize(em: EntityManager, studio: Studio, id: string): Promise<void> {
  em.remove(await findIn(em, BlankSize, studio, id, 'size'));
  await em.flush();
}

/**
 * What an order item keeps of the catalog when it is ordered: later edits to the blank, its
 * price or the recipe never change an existing order.
 */
export function snapshotForOrder(blank: Blank, size: BlankSize, recipe: Recipe | null) {
  return structuredClone({
    blank: { id: blank.id, name: blank.name, shape: blank.shape, material: { id: blank.material.id, name: blank.material.name, surfaceColour: blank.material.surfaceColour, markColour: blank.material.markColour } },
    size: { id: size.id, label: size.label, areaWidthMm: size.areaWidthMm, areaHeightMm: size.areaHeightMm, outerWidthMm: size.outerWidthMm, outerHeightMm: size.outerHeightMm, priceMinor: size.priceMinor, sku: size.sku },
    recipe: recipe && { id: recipe.id, linesPerInch: recipe.linesPerInch, halftoneMethod: recipe.halftoneMethod, tone: recipe.tone, speed: recipe.speed, powerMinPercent: recipe.powerMinPercent, powerMaxPercent: recipe.powerMaxPercent, passes: recipe.passes },
  });
}
