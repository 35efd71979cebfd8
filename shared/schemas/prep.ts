import { z } from 'zod';
import { halftoneMethodSchema } from './catalog.ts';

/**
 * How an item's photo is prepared for burning: tone, sharpening, halftone and edge. Defaults
 * come from the item's recipe; staff may override per item. Sharpening is in pixels at the
 * output's resolution; each save is kept as a new version.
 */
/**
 * One brush stroke of the cut-out, in the engraving area's own coordinates: x and y from 0 to 1
 * across its width and height, `size` as a share of its width. So a stroke means the same at
 * the preview's size and at the machine's resolution.
 */
export const cutoutStrokeSchema = z.object({
  mode: z.enum(['keep', 'remove']),
  size: z.number().min(0.002, 'The brush is too small.').max(0.5, 'The brush is too large.'),
  points: z
    .array(z.tuple([z.number().min(-0.5).max(1.5), z.number().min(-0.5).max(1.5)]))
    .min(1)
    .max(4000, 'A stroke holds at most 4000 points.'),
});
export type CutoutStroke = z.infer<typeof cutoutStrokeSchema>;

/** The cut-out: where it starts (the whole photo, or without a plain background), then the strokes. */
export const cutoutSchema = z.object({
  start: z.enum(['whole', 'plain-background']).default('whole'),
  /** How far a colour may be from the border's and still count as background (RGB distance). */
  tolerance: z.number().int().min(4, 'From 4.').max(120, 'Up to 120.').default(28),
  strokes: z.array(cutoutStrokeSchema).max(300, 'At most 300 strokes; start again from a plain background.').default([]),
});
export type Cutout = z.infer<typeof cutoutSchema>;
export const NO_CUTOUT: Cutout = { start: 'whole', tolerance: 28, strokes: [] };

export const prepSettingsSchema = z.object({
  brightness: z.number().min(-100, 'From −100.').max(100, 'Up to 100.'),
  contrast: z.number().min(-100, 'From −100.').max(100, 'Up to 100.'),
  gamma: z.number().min(0.2, 'From 0.2.').max(5, 'Up to 5.'),
  autoLevels: z.boolean(),
  sharpenAmount: z.number().min(0, 'From 0 %.').max(500, 'Up to 500 %.'),
  sharpenRadius: z.number().min(0.3, 'From 0.3 px.').max(10, 'Up to 10 px.'),
  sharpenThreshold: z.number().min(0).max(50, 'Up to 50.'),
  halftoneMethod: halftoneMethodSchema,
  linesPerInch: z.number().int('Use a whole number.').min(100, 'At least 100 lines per inch.').max(1200, 'At most 1200 lines per inch.'),
  negative: z.boolean(),
  featherRadius: z.number().min(0).max(50, 'Up to 50 px.'),
  cutout: cutoutSchema.default(NO_CUTOUT),
});
export type PrepSettings = z.infer<typeof prepSettingsSchema>;
export type PrepSettingsInput = z.input<typeof prepSettingsSchema>;

export const prepVersionSchema = z.object({
  version: z.number().int(),
  settings: prepSettingsSchema,
  savedBy: z.string(),
  savedAt: z.string(),
});
export type PrepVersion = z.infer<typeof prepVersionSchema>;

export const proofDecisionSchema = z.discriminatedUnion('decision', [
  z.object({ decision: z.literal('approve') }),
  z.object({
    decision: z.literal('changes'),
    message: z.string().trim().min(1, 'Say what you would like changed.').max(1000, 'Use at most 1000 characters.'),
  }),
]);
export type ProofDecision = z.infer<typeof proofDecisionSchema>;

/** A region of the burn at the machine's own resolution: where (0–1 across the area) and with which settings. */
export const regionPreviewInputSchema = z.object({
  settings: prepSettingsSchema,
  centre: z.object({ x: z.number().min(0).max(1), y: z.number().min(0).max(1) }).default({ x: 0.5, y: 0.5 }),
});
export type RegionPreviewInput = z.input<typeof regionPreviewInputSchema>;
export const regionPreviewSchema = z.object({
  /** A 1-bit PNG as a data: URL; one image pixel is one dot of the burn. */
  image: z.string(),
  region: z.object({ left: z.number().int(), top: z.number().int(), width: z.number().int(), height: z.number().int() }),
  output: z.object({ width: z.number().int(), height: z.number().int() }),
});
export type RegionPreview = z.infer<typeof regionPreviewSchema>;
