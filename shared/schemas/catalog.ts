import { z } from 'zod';
import { HALFTONE_METHODS, type HalftoneMethod } from '../imaging/halftone/halftone.ts';

/** The catalog's contracts: materials, machines, recipes, blanks and their sizes. Lengths in mm. */
export const LASER_KINDS = ['co2', 'fibre', 'diode'] as const;
export const laserKindSchema = z.enum(LASER_KINDS);
export type LaserKind = z.infer<typeof laserKindSchema>;

export const MATERIAL_FAMILIES = ['glass', 'stone', 'wood', 'metal', 'acrylic', 'leather', 'cork', 'plastic', 'composite', 'other'] as const;
export const toneSchema = z.enum(['positive', 'negative']);
const colour = z.string().regex(/^#[0-9a-f]{6}$/i, 'Use a colour like #1a2b3c.');
const text = (max: number) => z.string().trim().max(max, `Use at most ${max} characters.`);

export const materialInputSchema = z
  .object({
    name: text(80).min(1, 'Enter a name.'),
    family: z.enum(MATERIAL_FAMILIES),
    surfaceColour: colour,
    markColour: colour,
    defaultTone: toneSchema,
    linesPerInchMin: z.number().int().min(100, 'At least 100.').max(1200, 'At most 1200.'),
    linesPerInchMax: z.number().int().min(100, 'At least 100.').max(1200, 'At most 1200.'),
    safetyNotes: text(1000).default(''),
    forbiddenOn: z.array(laserKindSchema).default([]),
    forbiddenReason: text(300).default(''),
  })
  .refine((m) => m.linesPerInchMin <= m.linesPerInchMax, { path: ['linesPerInchMax'], message: 'The highest density must not be below the lowest.' })
  .refine((m) => m.forbiddenOn.length === 0 || m.forbiddenReason.length > 0, { path: ['forbiddenReason'], message: 'Say why it must not be engraved.' });
export type MaterialInput = z.infer<typeof materialInputSchema>;

export const SPEED_UNITS = ['mm/s', 'in/s', 'percent'] as const;
export const machineInputSchema = z.object({
  name: text(80).min(1, 'Enter a name.'),
  laserKind: laserKindSchema,
  powerWatts: z.number().positive('Enter the power in watts.').max(10_000),
  bedWidthMm: z.number().positive('Enter the bed width.').max(5000),
  bedHeightMm: z.number().positive('Enter the bed height.').max(5000),
  speedUnit: z.enum(SPEED_UNITS),
  notes: text(1000).default(''),
});
export type MachineInput = z.infer<typeof machineInputSchema>;

export const halftoneMethodSchema = z.enum(Object.keys(HALFTONE_METHODS) as [HalftoneMethod, ...HalftoneMethod[]]);

export const recipeInputSchema = z
  .object({
    materialId: z.uuid('Choose a material.'),
    machineId: z.uuid('Choose a machine.'),
    linesPerInch: z.number().int().min(100, 'At least 100 lines per inch.').max(1200, 'At most 1200 lines per inch.'),
    halftoneMethod: halftoneMethodSchema,
    tone: toneSchema,
    speed: z.number().positive('Enter the speed.'),
    powerMinPercent: z.number().min(0, 'From 0 %.').max(100, 'Up to 100 %.'),
    powerMaxPercent: z.number().min(0, 'From 0 %.').max(100, 'Up to 100 %.'),
    passes: z.number().int().min(1, 'At least one pass.').max(20, 'At most 20 passes.'),
    notes: text(1000).default(''),
  })
  .refine((r) => r.powerMinPercent <= r.powerMaxPercent, { path: ['powerMaxPercent'], message: 'The maximum power must not be below the minimum.' });
export type RecipeInput = z.infer<typeof recipeInputSchema>;

export const BLANK_SHAPES = ['rectangle', 'rounded-rectangle', 'oval', 'circle'] as const;
export const blankStatusSchema = z.enum(['draft', 'active', 'archived']);

export const blankInputSchema = z.object({
  name: text(120).min(1, 'Enter a name.'),
  description: text(2000).default(''),
  materialId: z.uuid('Choose a material.'),
  shape: z.enum(BLANK_SHAPES),
  status: blankStatusSchema.default('draft'),
  sortOrder: z.number().int().min(0).max(10_000).default(0),
});
export type BlankInput = z.infer<typeof blankInputSchema>;

export const sizeInputSchema = z
  .object({
    label: text(60).min(1, 'Enter a label, such as 8 × 10 in.'),
    outerWidthMm: z.number().positive('Enter the width.').max(2000),
    outerHeightMm: z.number().positive('Enter the height.').max(2000),
    areaWidthMm: z.number().positive('Enter the engraving width.').max(2000),
    areaHeightMm: z.number().positive('Enter the engraving height.').max(2000),
    orientation: z.enum(['portrait', 'landscape', 'either']),
    priceMinor: z.number().int('Prices are whole minor units (cents).').min(0, 'A price cannot be negative.'),
    stock: z.number().int().min(0, 'Stock cannot be negative.').nullable(),
    sku: text(60).default(''),
  })
  .refine((s) => s.areaWidthMm <= s.outerWidthMm, { path: ['areaWidthMm'], message: 'The engraving area must fit inside the blank.' })
  .refine((s) => s.areaHeightMm <= s.outerHeightMm, { path: ['areaHeightMm'], message: 'The engraving area must fit inside the blank.' });
export type SizeInput = z.infer<typeof sizeInputSchema>;

/** What a storefront shows of a studio's catalog. */
export const storefrontCatalogSchema = z.object({
  open: z.boolean(),
  blanks: z.array(
    z.object({
      id: z.uuid(),
      name: z.string(),
      description: z.string(),
      shape: z.enum(BLANK_SHAPES),
      material: z.object({ name: z.string(), family: z.string(), surfaceColour: z.string(), markColour: z.string(), notes: z.string() }),
      sizes: z.array(
        z.object({
          id: z.uuid(),
          label: z.string(),
          areaWidthMm: z.number(),
          areaHeightMm: z.number(),
          orientation: z.enum(['portrait', 'landscape', 'either']),
          priceMinor: z.number().int(),
          price: z.string(),
          stock: z.enum(['in-stock', 'few-left', 'sold-out']),
        }),
      ),
    }),
  ),
});
export type StorefrontCatalog = z.infer<typeof storefrontCatalogSchema>;
