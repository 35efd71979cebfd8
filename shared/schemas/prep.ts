import { z } from 'zod';
import { halftoneMethodSchema } from './catalog.ts';

/**
 * How an item's photo is prepared for burning: tone, sharpening, halftone and edge. Defaults
 * come from the item's recipe; staff may override per item. Sharpening is in pixels at the
 * output's resolution; each save is kept as a new version.
 */
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
});
export type PrepSettings = z.infer<typeof prepSettingsSchema>;

export const prepVersionSchema = z.object({ version: z.number().int(), settings: prepSettingsSchema, savedBy: z.string(), savedAt: z.string() });
export type PrepVersion = z.infer<typeof prepVersionSchema>;

export const proofDecisionSchema = z.discriminatedUnion('decision', [
  z.object({ decision: z.literal('approve') }),
  z.object({ decision: z.literal('changes'), message: z.string().trim().min(1, 'Say what you would like changed.').max(1000, 'Use at most 1000 characters.') }),
]);
export type ProofDecision = z.infer<typeof proofDecisionSchema>;
