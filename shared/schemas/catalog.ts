import { z } from 'zod';
import { HALFTONE_METHODS, type HalftoneMethod } from '../imaging/halftone/halftone.ts';
import { BLANK_SHAPES, type BlankShape } from '../imaging/shape.ts';

/**
 * The catalog's contracts: materials, machines, recipes, blanks and their sizes. Lengths are
 * kept in mm and money in minor units; screens convert for display. Each record has a field
 * object (extended by the response schemas) and an input schema with the cross-field rules.
 */
export const LASER_KINDS = ['co2', 'fibre', 'diode'] as const;
export const laserKindSchema = z.enum(LASER_KINDS);
export type LaserKind = z.infer<typeof laserKindSchema>;
export const LASER_KIND_LABELS: Record<LaserKind, string> = { co2: 'CO2', fibre: 'Fibre', diode: 'Diode' };

export const MATERIAL_FAMILIES = [
  'glass',
  'stone',
  'wood',
  'metal',
  'acrylic',
  'leather',
  'cork',
  'plastic',
  'composite',
  'other',
] as const;
export const TONES = ['positive', 'negative'] as const;
export const toneSchema = z.enum(TONES);
export type Tone = z.infer<typeof toneSchema>;

const colour = z.string().regex(/^#[0-9a-f]{6}$/i, 'Use a colour like #1a2b3c.');
const text = (max: number) => z.string().trim().max(max, `Use at most ${max} characters.`);
/** A number field: an empty or non-numeric entry gets a plain message instead of a type error. */
const num = (missing: string) => z.number({ error: missing });
const id = z.uuid();

const materialFields = z.object({
  name: text(80).min(1, 'Enter a name.'),
  family: z.enum(MATERIAL_FAMILIES),
  surfaceColour: colour,
  markColour: colour,
  defaultTone: toneSchema,
  linesPerInchMin: num('Enter the lowest line density.').int('Use a whole number.').min(100, 'At least 100.').max(1200, 'At most 1200.'),
  linesPerInchMax: num('Enter the highest line density.').int('Use a whole number.').min(100, 'At least 100.').max(1200, 'At most 1200.'),
  safetyNotes: text(1000).default(''),
  forbiddenOn: z.array(laserKindSchema).default([]),
  forbiddenReason: text(300).default(''),
});
export const materialInputSchema = materialFields
  .refine((m) => m.linesPerInchMin <= m.linesPerInchMax, {
    path: ['linesPerInchMax'],
    message: 'The highest density must not be below the lowest.',
  })
  .refine((m) => m.forbiddenOn.length === 0 || m.forbiddenReason.length > 0, {
    path: ['forbiddenReason'],
    message: 'Say why it must not be engraved.',
  });
export type MaterialInput = z.infer<typeof materialInputSchema>;
export const materialSchema = materialFields.extend({ id, blankCount: z.number().int() });
export type MaterialView = z.infer<typeof materialSchema>;

export const SPEED_UNITS = ['mm/s', 'in/s', 'percent'] as const;
export type SpeedUnit = (typeof SPEED_UNITS)[number];
export const SPEED_UNIT_LABELS: Record<SpeedUnit, string> = { 'mm/s': 'mm/s', 'in/s': 'in/s', percent: '% of maximum' };

const machineFields = z.object({
  name: text(80).min(1, 'Enter a name.'),
  laserKind: laserKindSchema,
  powerWatts: num('Enter the power in watts.').positive('Enter the power in watts.').max(10_000, 'At most 10 000 W.'),
  bedWidthMm: num('Enter the bed width.').positive('Enter the bed width.').max(5000, 'At most 5 m.'),
  bedHeightMm: num('Enter the bed height.').positive('Enter the bed height.').max(5000, 'At most 5 m.'),
  speedUnit: z.enum(SPEED_UNITS),
  notes: text(1000).default(''),
});
export const machineInputSchema = machineFields;
export type MachineInput = z.infer<typeof machineInputSchema>;
export const machineSchema = machineFields.extend({ id });
export type MachineView = z.infer<typeof machineSchema>;

export const halftoneMethodSchema = z.enum(Object.keys(HALFTONE_METHODS) as [HalftoneMethod, ...HalftoneMethod[]]);

const recipeFields = z.object({
  materialId: z.uuid('Choose a material.'),
  machineId: z.uuid('Choose a machine.'),
  linesPerInch: num('Enter the line density.')
    .int('Use a whole number.')
    .min(100, 'At least 100 lines per inch.')
    .max(1200, 'At most 1200 lines per inch.'),
  halftoneMethod: halftoneMethodSchema,
  tone: toneSchema,
  speed: num('Enter the speed.').positive('Enter the speed.'),
  powerMinPercent: num('Enter the lowest power.').min(0, 'From 0 %.').max(100, 'Up to 100 %.'),
  powerMaxPercent: num('Enter the highest power.').min(0, 'From 0 %.').max(100, 'Up to 100 %.'),
  passes: num('Enter the number of passes.').int('Use a whole number.').min(1, 'At least one pass.').max(20, 'At most 20 passes.'),
  notes: text(1000).default(''),
});
export const recipeInputSchema = recipeFields.refine((r) => r.powerMinPercent <= r.powerMaxPercent, {
  path: ['powerMaxPercent'],
  message: 'The maximum power must not be below the minimum.',
});
export type RecipeInput = z.infer<typeof recipeInputSchema>;
export const recipeSchema = recipeFields.extend({
  id,
  material: z.object({ id, name: z.string() }),
  machine: z.object({ id, name: z.string(), laserKind: laserKindSchema, speedUnit: z.enum(SPEED_UNITS) }),
});
export type RecipeView = z.infer<typeof recipeSchema>;

export { BLANK_SHAPES, type BlankShape };
export const BLANK_STATUSES = ['draft', 'active', 'archived'] as const;
export const blankStatusSchema = z.enum(BLANK_STATUSES);
export type BlankStatus = z.infer<typeof blankStatusSchema>;
export const ORIENTATIONS = ['portrait', 'landscape', 'either'] as const;

const blankFields = z.object({
  name: text(120).min(1, 'Enter a name.'),
  description: text(2000).default(''),
  materialId: z.uuid('Choose a material.'),
  shape: z.enum(BLANK_SHAPES),
  status: blankStatusSchema.default('draft'),
  sortOrder: num('Enter a position.').int('Use a whole number.').min(0, 'From 0.').max(10_000, 'Up to 10 000.').default(0),
});
export const blankInputSchema = blankFields;
export type BlankInput = z.infer<typeof blankInputSchema>;

const length = (missing: string) => num(missing).positive(missing).max(2000, 'At most 2000 mm (about 78 in).');
const sizeFields = z.object({
  label: text(60).min(1, 'Enter a label, such as 8 × 10 in.'),
  outerWidthMm: length('Enter the width.'),
  outerHeightMm: length('Enter the height.'),
  areaWidthMm: length('Enter the engraving width.'),
  areaHeightMm: length('Enter the engraving height.'),
  orientation: z.enum(ORIENTATIONS),
  priceMinor: num('Enter a price.')
    .int('Prices are whole minor units (cents).')
    .min(0, 'A price cannot be negative.')
    .max(100_000_000, 'That price is too high.'),
  stock: num('Enter the stock, or choose unlimited.').int('Use a whole number.').min(0, 'Stock cannot be negative.').nullable(),
  sku: text(60).default(''),
});
export const sizeInputSchema = sizeFields
  .refine((s) => s.areaWidthMm <= s.outerWidthMm, { path: ['areaWidthMm'], message: 'The engraving area must fit inside the blank.' })
  .refine((s) => s.areaHeightMm <= s.outerHeightMm, { path: ['areaHeightMm'], message: 'The engraving area must fit inside the blank.' });
export type SizeInput = z.infer<typeof sizeInputSchema>;
export const sizeSchema = sizeFields.extend({
  id,
  /**
   * Whether the engraving area fits inside the blank's outline, and the largest area of its
   * proportions that does (`shape.ts`); a size saved before the check, or left behind when the
   * blank's shape changed, is flagged with it.
   */
  fit: z.object({ fits: z.boolean(), largest: z.object({ widthMm: z.number(), heightMm: z.number() }) }),
});
export type SizeView = z.infer<typeof sizeSchema>;

/** A product photo of a blank; `url` is where the signed-in workspace or the storefront loads it. */
export const blankPhotoSchema = z.object({ id, url: z.string(), width: z.number().int(), height: z.number().int() });
export type BlankPhotoView = z.infer<typeof blankPhotoSchema>;

export const blankSchema = blankFields.extend({
  id,
  material: z.object({ id, name: z.string(), surfaceColour: z.string(), markColour: z.string() }),
  sizes: z.array(sizeSchema),
  photos: z.array(blankPhotoSchema),
});
export type BlankView = z.infer<typeof blankSchema>;

export const catalogListSchemas = {
  materials: z.object({ materials: z.array(materialSchema) }),
  machines: z.object({ machines: z.array(machineSchema) }),
  recipes: z.object({ recipes: z.array(recipeSchema) }),
  blanks: z.object({ blanks: z.array(blankSchema) }),
};

/** What a storefront shows of a studio's catalog. */
export const storefrontCatalogSchema = z.object({
  open: z.boolean(),
  blanks: z.array(
    z.object({
      id,
      name: z.string(),
      description: z.string(),
      shape: z.enum(BLANK_SHAPES),
      material: z.object({ name: z.string(), family: z.string(), surfaceColour: z.string(), markColour: z.string(), notes: z.string() }),
      /** How the studio burns this blank, for the mock-up: its recipe, or the material's usual tone. */
      look: z.object({ tone: toneSchema, halftoneMethod: halftoneMethodSchema, linesPerInch: z.number() }),
      photos: z.array(blankPhotoSchema),
      sizes: z.array(
        z.object({
          id,
          label: z.string(),
          areaWidthMm: z.number(),
          areaHeightMm: z.number(),
          orientation: z.enum(ORIENTATIONS),
          priceMinor: z.number().int(),
          price: z.string(),
          stock: z.enum(['in-stock', 'few-left', 'sold-out']),
        }),
      ),
    }),
  ),
});
export type StorefrontCatalog = z.infer<typeof storefrontCatalogSchema>;
