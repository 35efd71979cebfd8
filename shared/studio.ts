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
  lowResolutionPolicy: z.enum(['confirm', 'refuse']),
});
export type PublicStudio = z.infer<typeof publicStudioSchema>;

/** Currencies Intl knows (its ISO 4217 list), so prices always format. */
const CURRENCIES = new Set(Intl.supportedValuesOf('currency'));
const knownCurrency = (code: string) => CURRENCIES.has(code);

/** What an owner may change about the studio: its name, storefront colour, money and units. */
export const studioSettingsInputSchema = z.object({
  name: z.string().trim().min(2, 'Enter the studio’s name.').max(120, 'Use at most 120 characters.'),
  accentColour: z.string().regex(/^#[0-9a-f]{6}$/i, 'Use a colour like #1f6f8b.'),
  currency: z.string().trim().toUpperCase().refine(knownCurrency, 'Use a three-letter currency code, such as USD, EUR or GBP.'),
  units: z.enum(['in', 'mm']),
  contactEmail: z.union([z.literal(''), z.string().trim().toLowerCase().pipe(z.email('Enter a valid e-mail address.'))]).transform((v) => v || null),
});
export type StudioSettingsInput = z.infer<typeof studioSettingsInputSchema>;
