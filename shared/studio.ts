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
  logoUrl: z.string().nullable(),
});
export type PublicStudio = z.infer<typeof publicStudioSchema>;

/** Currencies Intl knows (its ISO 4217 list), so prices always format. */
const CURRENCIES = new Set(Intl.supportedValuesOf('currency'));
const knownCurrency = (code: string) => CURRENCIES.has(code);

/** Every currency an owner may choose, by code and English name (ISO 4217 through Intl), A to Z. */
export const currencyOptions = () => {
  const names = new Intl.DisplayNames(['en'], { type: 'currency' });
  return [...CURRENCIES].sort().map((code) => ({ value: code, label: `${code} · ${names.of(code) ?? code}` }));
};

/** What an owner may change about the studio: its name, storefront colour, money and units. */
export const studioSettingsInputSchema = z.object({
  name: z.string().trim().min(2, 'Enter the studio’s name.').max(120, 'Use at most 120 characters.'),
  accentColour: z.string().regex(/^#[0-9a-f]{6}$/i, 'Use a colour like #1f6f8b.'),
  currency: z.string().trim().toUpperCase().refine(knownCurrency, 'Use a three-letter currency code, such as USD, EUR or GBP.'),
  units: z.enum(['in', 'mm']),
  contactEmail: z
    .union([z.literal(''), z.string().trim().toLowerCase().pipe(z.email('Enter a valid e-mail address.'))])
    .transform((v) => v || null),
});
export type StudioSettingsInput = z.infer<typeof studioSettingsInputSchema>;

/**
 * The grayscale master's resolution. 1000 ppi is the trade's usual choice for machine software
 * that resamples and halftones the picture itself (common practice, no source); "recipe" writes
 * it at the recipe's line density, dot for dot with the engrave file.
 */
export const MASTER_RESOLUTIONS = { '1000-ppi': '1000 pixels per inch', recipe: 'The recipe’s line density' } as const;
export type MasterResolution = keyof typeof MASTER_RESOLUTIONS;
export const MASTER_PPI = 1000;
export const masterPpi = (choice: MasterResolution, linesPerInch: number) => (choice === 'recipe' ? linesPerInch : MASTER_PPI);

/** How a studio takes orders: low-resolution photos, collection in person, and the files it gets. */
export const orderSettingsInputSchema = z
  .object({
    lowResolutionPolicy: z.enum(['confirm', 'refuse']),
    pickupEnabled: z.boolean(),
    /** Whether every item gets a proof for the buyer to approve before it is engraved. */
    proofsRequired: z.boolean(),
    masterResolution: z.enum(
      Object.keys(MASTER_RESOLUTIONS) as [MasterResolution, ...MasterResolution[]],
      'Choose the master’s resolution.',
    ),
    pickupNote: z.string().trim().max(300, 'Use at most 300 characters.'),
    /** The number the next order gets; orders count up from it. Never below one already used. */
    nextOrderNumber: z
      .number('Give a whole number.')
      .int('Give a whole number.')
      .min(1, 'Order numbers start at 1 or above.')
      .max(99_999_999, 'Use at most eight digits.')
      .optional(),
  })
  .refine((s) => !s.pickupEnabled || s.pickupNote.length > 0, { path: ['pickupNote'], message: 'Say where and when buyers collect.' });
export type OrderSettingsInput = z.infer<typeof orderSettingsInputSchema>;

/** A flat shipping rate; the price is in the studio's currency's minor unit. */
export const shippingRateInputSchema = z.object({
  name: z.string().trim().min(1, 'Name the method, such as “Tracked post, 3–5 days”.').max(80, 'Use at most 80 characters.'),
  priceMinor: z
    .number({ error: 'Enter a price.' })
    .int('Prices are whole minor units (cents).')
    .min(0, 'A price cannot be negative.')
    .max(10_000_000, 'That price is too high.'),
  sortOrder: z.number({ error: 'Enter a position.' }).int().min(0).max(1000).default(0),
});
export type ShippingRateInput = z.infer<typeof shippingRateInputSchema>;
export const shippingRateSchema = shippingRateInputSchema.extend({ id: z.uuid() });
export type ShippingRateView = z.infer<typeof shippingRateSchema>;
