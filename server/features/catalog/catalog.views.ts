import type { BlankPhotoView, BlankView, MachineView, MaterialView, RecipeView, SizeView } from '#shared/schemas/catalog.ts';
import { sizeFit, type BlankShape } from '#shared/imaging/shape.ts';
import type { Blank, BlankPhoto, BlankSize, Machine, Material, Recipe } from './catalog.entity.ts';

/**
 * Catalog records as the API answers them, in the shapes of the shared response schemas: ids for
 * relations, never the studio, nothing the client has no use for.
 */
export const materialView = (m: Material, blankCount: number): MaterialView => ({
  id: m.id,
  name: m.name,
  family: m.family as MaterialView['family'],
  surfaceColour: m.surfaceColour,
  markColour: m.markColour,
  defaultTone: m.defaultTone,
  linesPerInchMin: m.linesPerInchMin,
  linesPerInchMax: m.linesPerInchMax,
  safetyNotes: m.safetyNotes,
  forbiddenOn: m.forbiddenOn,
  forbiddenReason: m.forbiddenReason,
  blankCount,
});

export const machineView = (k: Machine): MachineView => ({
  id: k.id,
  name: k.name,
  laserKind: k.laserKind,
  powerWatts: k.powerWatts,
  bedWidthMm: k.bedWidthMm,
  bedHeightMm: k.bedHeightMm,
  speedUnit: k.speedUnit,
  notes: k.notes,
});

export const recipeView = (r: Recipe): RecipeView => ({
  id: r.id,
  materialId: r.material.id,
  machineId: r.machine.id,
  material: { id: r.material.id, name: r.material.name },
  machine: { id: r.machine.id, name: r.machine.name, laserKind: r.machine.laserKind, speedUnit: r.machine.speedUnit },
  linesPerInch: r.linesPerInch,
  halftoneMethod: r.halftoneMethod as RecipeView['halftoneMethod'],
  tone: r.tone,
  speed: r.speed,
  powerMinPercent: r.powerMinPercent,
  powerMaxPercent: r.powerMaxPercent,
  passes: r.passes,
  notes: r.notes,
});

export const sizeView = (s: BlankSize, shape: BlankShape): SizeView => ({
  id: s.id,
  label: s.label,
  outerWidthMm: s.outerWidthMm,
  outerHeightMm: s.outerHeightMm,
  areaWidthMm: s.areaWidthMm,
  areaHeightMm: s.areaHeightMm,
  orientation: s.orientation,
  priceMinor: s.priceMinor,
  stock: s.stock,
  sku: s.sku,
  fit: sizeFit(shape, s),
});

export const photoView = (p: BlankPhoto, url: (photo: BlankPhoto) => string): BlankPhotoView => ({
  id: p.id,
  url: url(p),
  width: p.width,
  height: p.height,
});

export const byPosition = <T extends { sortOrder: number; createdAt: Date }>(a: T, b: T) =>
  a.sortOrder - b.sortOrder || a.createdAt.getTime() - b.createdAt.getTime();

/** Sizes cheapest first, photos in their order. */
export const blankView = (b: Blank, photoUrl: (photo: BlankPhoto) => string): BlankView => ({
  id: b.id,
  name: b.name,
  description: b.description,
  materialId: b.material.id,
  material: { id: b.material.id, name: b.material.name, surfaceColour: b.material.surfaceColour, markColour: b.material.markColour },
  shape: b.shape,
  status: b.status,
  sortOrder: b.sortOrder,
  sizes: b.sizes
    .getItems()
    .sort((x, y) => x.priceMinor - y.priceMinor || x.label.localeCompare(y.label))
    .map((s) => sizeView(s, b.shape)),
  photos: b.photos
    .getItems()
    .sort(byPosition)
    .map((p) => photoView(p, photoUrl)),
});
