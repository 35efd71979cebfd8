import type { EntityManager } from '@mikro-orm/postgresql';
import { workspacePaths } from '#shared/routes.ts';
import { UniqueConstraintViolationException } from '@mikro-orm/core';
import { AppError } from '#shared/errors.ts';
import type { BlankInput, MachineInput, MaterialInput, RecipeInput, SizeInput } from '#shared/schemas/catalog.ts';
import { isUuid } from '#server/lib/tokens.ts';
import type { Studio } from '../studios/studio.entity.ts';
import { Blank, BlankPhoto, BlankSize, Machine, Material, Recipe } from './catalog.entity.ts';
import { MATERIAL_LIBRARY } from './material-library.ts';
import type { Storage } from '#server/adapters/storage.ts';
import { MAX_IMAGE_UPLOAD_BYTES, type ImageUploadRequest, type UploadTicket } from '#shared/schemas/uploads.ts';
import { issueUpload, readUpload } from '../uploads/uploads.service.ts';
import { toWebPhoto } from '#server/imaging/web-photo.ts';
import type { User } from '../accounts/user.entity.ts';
import { describeChanges, describeFacts, recordAudit } from '../audit/audit.service.ts';
import { recipeFacts, recipeSubject, sizeSubject } from './catalog-audit.ts';
import { formatMoney } from '#shared/money.ts';
import { sizeFit, sizeFitMessage, type BlankShape } from '#shared/imaging/shape.ts';
import { formatSize, mmToUnitDown } from '#shared/units.ts';

const recipesLink = (studio: Studio) => workspacePaths.recipes(studio.slug);
const blankLink = (studio: Studio, blank: Blank) => workspacePaths.blank(studio.slug, blank.id);

/** Catalog rules. Every query runs under the tenant filter and names the studio as well. */

export async function findIn<T extends Material | Machine | Recipe | Blank | BlankSize | BlankPhoto>(
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
    if (error instanceof UniqueConstraintViolationException)
      throw new AppError('CONFLICT', message, { issues: [{ path: [field], message }] });
    throw error;
  }
}

/** Gives a new studio its own copy of the materials library (forbidden entries included, flagged). */
export function addMaterialLibrary(em: EntityManager, studio: Studio): Material[] {
  return MATERIAL_LIBRARY.map(({ suggestedLinesPerInch: _l, suggestedHalftone: _h, ...material }) =>
    em.create(Material, { ...material, studio }),
  );
}

/** The studio's materials, each with how many blanks use it (a material in use cannot be deleted). */
export async function listMaterials(em: EntityManager, studio: Studio): Promise<Array<{ material: Material; blankCount: number }>> {
  const materials = await em.find(Material, { studio }, { orderBy: { name: 'asc' } });
  const blanks = await em.find(Blank, { studio }, { fields: ['material'] });
  const counts = new Map<string, number>();
  for (const blank of blanks) counts.set(blank.material.id, (counts.get(blank.material.id) ?? 0) + 1);
  return materials.map((material) => ({ material, blankCount: counts.get(material.id) ?? 0 }));
}

export async function createMaterial(em: EntityManager, studio: Studio, input: MaterialInput): Promise<Material> {
  const material = em.create(Material, { ...input, studio });
  await flushUnique(em, 'name', 'The studio already has a material with this name.');
  return material;
}

/** A material no blank uses may go; its recipes go with it. One in use is refused, naming the blanks. */
export async function deleteMaterial(em: EntityManager, studio: Studio, id: string): Promise<void> {
  const material = await findIn(em, Material, studio, id, 'material');
  const blanks = await em.find(Blank, { studio, material }, { fields: ['name'], orderBy: { name: 'asc' } });
  if (blanks.length)
    throw new AppError(
      'CONFLICT',
      `${material.name} is used by ${blanks.map((b) => b.name).join(', ')}. Choose another material for those blanks first.`,
    );
  await em.nativeDelete(Recipe, { studio, material });
  em.remove(material);
  await em.flush();
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

/** Removes a machine and the recipes written for it. */
export async function deleteMachine(em: EntityManager, studio: Studio, id: string): Promise<void> {
  const machine = await findIn(em, Machine, studio, id, 'machine');
  await em.nativeDelete(Recipe, { studio, machine });
  em.remove(machine);
  await em.flush();
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

export const listRecipes = (em: EntityManager, studio: Studio) =>
  em.find(Recipe, { studio }, { populate: ['material', 'machine'], orderBy: { material: { name: 'asc' } } });

export async function createRecipe(em: EntityManager, studio: Studio, input: RecipeInput, actor: User): Promise<Recipe> {
  const { material, machine } = await checkedPair(em, studio, input);
  const { materialId: _m, machineId: _k, ...values } = input;
  const recipe = em.create(Recipe, { ...values, material, machine, studio });
  recordAudit(em, studio, actor, {
    action: 'recipe.created',
    subject: recipeSubject(recipe),
    summary: `New recipe: ${describeFacts(recipeFacts(recipe))}.`,
    link: recipesLink(studio),
    details: { recipeId: recipe.id, ...values },
  });
  await flushUnique(em, 'machineId', 'This material already has a recipe on this machine.');
  return recipe;
}

export async function updateRecipe(em: EntityManager, studio: Studio, id: string, input: RecipeInput, actor: User): Promise<Recipe> {
  const recipe = await findIn(em, Recipe, studio, id, 'recipe');
  await em.populate(recipe, ['material', 'machine']);
  const { material, machine } = await checkedPair(em, studio, input);
  const { materialId: _m, machineId: _k, ...values } = input;
  const before = { Recipe: recipeSubject(recipe), ...recipeFacts(recipe) };
  em.assign(recipe, { ...values, material, machine });
  const changes = describeChanges(before, { Recipe: recipeSubject(recipe), ...recipeFacts(recipe) });
  if (changes)
    recordAudit(em, studio, actor, {
      action: 'recipe.changed',
      subject: recipeSubject(recipe),
      summary: `${changes}.`,
      link: recipesLink(studio),
      details: { recipeId: recipe.id, ...values },
    });
  await flushUnique(em, 'machineId', 'This material already has a recipe on this machine.');
  return recipe;
}

export async function deleteRecipe(em: EntityManager, studio: Studio, id: string, actor: User): Promise<void> {
  const recipe = await findIn(em, Recipe, studio, id, 'recipe');
  await em.populate(recipe, ['material', 'machine']);
  recordAudit(em, studio, actor, {
    action: 'recipe.deleted',
    subject: recipeSubject(recipe),
    summary: `Deleted the recipe: ${describeFacts(recipeFacts(recipe))}.`,
    link: recipesLink(studio),
    details: { recipeId: recipe.id },
  });
  em.remove(recipe);
  await em.flush();
}

export const listBlanks = (em: EntityManager, studio: Studio) =>
  em.find(Blank, { studio }, { populate: ['material', 'sizes', 'photos'], orderBy: { sortOrder: 'asc', name: 'asc' } });

export async function getBlank(em: EntityManager, studio: Studio, id: string): Promise<Blank> {
  const blank = await findIn(em, Blank, studio, id, 'blank');
  await em.populate(blank, ['material', 'sizes', 'photos']);
  return blank;
}

const STATUS_WORDS: Record<Blank['status'], string> = { draft: 'a draft', active: 'on sale', archived: 'archived' };

export async function createBlank(em: EntityManager, studio: Studio, input: BlankInput, actor: User): Promise<Blank> {
  const material = await findIn(em, Material, studio, input.materialId, 'material');
  const { materialId: _m, ...values } = input;
  const blank = em.create(Blank, { ...values, material, studio });
  recordAudit(em, studio, actor, {
    action: 'blank.created',
    subject: `Blank: ${blank.name}`,
    summary: `New blank of ${material.name}, ${STATUS_WORDS[blank.status]}.`,
    link: blankLink(studio, blank),
    details: { blankId: blank.id, status: blank.status, materialId: material.id },
  });
  await em.flush();
  return getBlank(em, studio, blank.id);
}

/** Blanks are never deleted: archiving keeps them for the orders that name them. */
export async function updateBlank(em: EntityManager, studio: Studio, id: string, input: BlankInput, actor: User): Promise<Blank> {
  const blank = await findIn(em, Blank, studio, id, 'blank');
  const material = await findIn(em, Material, studio, input.materialId, 'material');
  const { materialId: _m, ...values } = input;
  const before = blank.status;
  em.assign(blank, { ...values, material });
  // Going on sale or coming off it changes what buyers can order: the audit log keeps it.
  if (blank.status !== before)
    recordAudit(em, studio, actor, {
      action: 'blank.status_changed',
      subject: `Blank: ${blank.name}`,
      summary: `From ${STATUS_WORDS[before]} to ${STATUS_WORDS[blank.status]}.`,
      link: blankLink(studio, blank),
      details: { blankId: blank.id, from: before, to: blank.status },
    });
  await em.flush();
  return getBlank(em, studio, blank.id);
}

/**
 * Refuses an engraving area that reaches past the blank's outline (a 90 × 90 mm square on a
 * 100 mm round coaster), naming the largest area of its proportions that fits.
 */
function assertAreaFits(studio: Studio, shape: BlankShape, input: SizeInput): void {
  const { fits, largest } = sizeFit(shape, input);
  if (fits) return;
  const unit = studio.units;
  const message = sizeFitMessage(
    shape,
    input,
    largest,
    (w, h) => formatSize(w, h, unit),
    (w, h) => `${mmToUnitDown(w, unit)} × ${mmToUnitDown(h, unit)} ${unit}`,
  );
  throw new AppError('VALIDATION_FAILED', message, {
    issues: [
      { path: ['areaWidthMm'], message },
      { path: ['areaHeightMm'], message: 'See the engraving width.' },
    ],
  });
}

export async function addSize(em: EntityManager, studio: Studio, blankId: string, input: SizeInput, actor: User): Promise<BlankSize> {
  const blank = await findIn(em, Blank, studio, blankId, 'blank');
  assertAreaFits(studio, blank.shape, input);
  const size = em.create(BlankSize, { ...input, blank, studio });
  recordAudit(em, studio, actor, {
    action: 'price.changed',
    subject: sizeSubject(size),
    summary: `New size offered at ${formatMoney(size.priceMinor, studio.currency)}.`,
    link: blankLink(studio, blank),
    details: { sizeId: size.id, priceMinor: size.priceMinor, currency: studio.currency },
  });
  await em.flush();
  return size;
}

export async function updateSize(em: EntityManager, studio: Studio, id: string, input: SizeInput, actor: User): Promise<BlankSize> {
  const size = await findIn(em, BlankSize, studio, id, 'size');
  await em.populate(size, ['blank']);
  assertAreaFits(studio, size.blank.shape, input);
  const fromMinor = size.priceMinor;
  em.assign(size, input);
  if (size.priceMinor !== fromMinor) {
    const money = (minor: number) => formatMoney(minor, studio.currency);
    recordAudit(em, studio, actor, {
      action: 'price.changed',
      subject: sizeSubject(size),
      summary: `Price: ${money(fromMinor)} → ${money(size.priceMinor)}.`,
      link: blankLink(studio, size.blank),
      details: { sizeId: size.id, fromMinor, toMinor: size.priceMinor, currency: studio.currency },
    });
  }
  await em.flush();
  return size;
}

export async function removeSize(em: EntityManager, studio: Studio, id: string, actor: User): Promise<void> {
  const size = await findIn(em, BlankSize, studio, id, 'size');
  await em.populate(size, ['blank']);
  recordAudit(em, studio, actor, {
    action: 'price.changed',
    subject: sizeSubject(size),
    summary: `Size taken off sale (it was ${formatMoney(size.priceMinor, studio.currency)}).`,
    link: blankLink(studio, size.blank),
    details: { sizeId: size.id, fromMinor: size.priceMinor, currency: studio.currency },
  });
  em.remove(size);
  await em.flush();
}

export const MAX_PHOTOS_PER_BLANK = 8;
const photoUploadPrefix = (studio: Studio) => `uploads/${studio.id}/blank-photos`;

/** A ticket for the browser to upload one product photo of a blank to storage. */
export async function startPhotoUpload(
  em: EntityManager,
  storage: Storage,
  studio: Studio,
  blankId: string,
  request: ImageUploadRequest,
): Promise<UploadTicket> {
  await findIn(em, Blank, studio, blankId, 'blank');
  return issueUpload(storage, photoUploadPrefix(studio), request);
}

/**
 * Takes an uploaded product photo: checks it is a photo, stores a web-ready copy beside the
 * blank and drops the original upload. At most MAX_PHOTOS_PER_BLANK photos per blank.
 */
export async function addPhoto(em: EntityManager, storage: Storage, studio: Studio, blankId: string, key: string): Promise<BlankPhoto> {
  const blank = await getBlank(em, studio, blankId);
  if (blank.photos.length >= MAX_PHOTOS_PER_BLANK)
    throw new AppError('CONFLICT', `A blank shows at most ${MAX_PHOTOS_PER_BLANK} photos. Remove one first.`);
  const web = await toWebPhoto(await readUpload(storage, photoUploadPrefix(studio), key, MAX_IMAGE_UPLOAD_BYTES));
  const photo = em.create(BlankPhoto, { studio, blank, key: '', width: web.width, height: web.height, sortOrder: blank.photos.length });
  photo.key = `studios/${studio.id}/blank-photos/${photo.id}.webp`;
  await storage.put(photo.key, web.data, 'image/webp');
  await em.flush();
  await storage.remove(key);
  return photo;
}

export async function removePhoto(em: EntityManager, storage: Storage, studio: Studio, id: string): Promise<void> {
  const photo = await findIn(em, BlankPhoto, studio, id, 'photo');
  em.remove(photo);
  await em.flush();
  // The row goes first: a stray object costs storage, a row without its object breaks a page.
  await storage.remove(photo.key);
}

/**
 * What an order item keeps of the catalog when it is ordered: later edits to the blank, its
 * price or the recipe never change an existing order.
 */
export function snapshotForOrder(blank: Blank, size: BlankSize, recipe: Recipe | null) {
  return structuredClone({
    blank: {
      id: blank.id,
      name: blank.name,
      shape: blank.shape,
      material: {
        id: blank.material.id,
        name: blank.material.name,
        surfaceColour: blank.material.surfaceColour,
        markColour: blank.material.markColour,
        defaultTone: blank.material.defaultTone,
        linesPerInchMax: blank.material.linesPerInchMax,
      },
    },
    size: {
      id: size.id,
      label: size.label,
      areaWidthMm: size.areaWidthMm,
      areaHeightMm: size.areaHeightMm,
      outerWidthMm: size.outerWidthMm,
      outerHeightMm: size.outerHeightMm,
      priceMinor: size.priceMinor,
      sku: size.sku,
    },
    recipe: recipe && {
      id: recipe.id,
      linesPerInch: recipe.linesPerInch,
      halftoneMethod: recipe.halftoneMethod,
      tone: recipe.tone,
      speed: recipe.speed,
      powerMinPercent: recipe.powerMinPercent,
      powerMaxPercent: recipe.powerMaxPercent,
      passes: recipe.passes,
    },
  });
}
