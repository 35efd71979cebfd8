import { z } from 'zod';

/** A studio's public address part: lower-case letters, digits and single hyphens. */
export const studioSlugSchema = z
  .string()
  .min(3, 'A studio address needs at least 3 characters.')
  .max(40, 'A studio address has at most 40 characters.')
  .regex(/^[a-z0-9]+(?:-[a-z0-9]+)*$/, 'Use lower-case letters, digits and single hyphens.');

export const studioStatusSchema = z.enum(['active', 'suspended']);
export type StudioStatus = z.infer<typeof studioStatusSchema>;

/** What anyone may see of a studio on its storefront. */
export const publicStudioSchema = z.object({
  slug: studioSlugSchema,
  name: z.string(),
  accentColour: z.string().regex(/^#[0-9a-f]{6}$/i),
  status: studioStatusSchema,
  currency: z.string().length(3),
  units: z.enum(['in', 'mm']),
});
export type PublicStudio = z.infer<typeof publicStudioSchema>;
