import { z } from 'zod';
import { ROLES } from '../permissions.ts';
import { studioSlugSchema } from '../studio.ts';

export const emailSchema = z
  .string()
  .trim()
  .max(254, 'An e-mail address has at most 254 characters.')
  .pipe(z.email('Enter a valid e-mail address.'))
  .transform((email) => email.toLowerCase());

export const passwordSchema = z.string().min(10, 'Use at least 10 characters.').max(200, 'Use at most 200 characters.');

export const personNameSchema = z.string().trim().min(1, 'Enter a name.').max(120, 'Use at most 120 characters.');

/** Opening a studio: the studio and its first owner. */
export const openStudioInputSchema = z.object({
  studioName: z.string().trim().min(2, 'Enter the studio’s name.').max(120, 'Use at most 120 characters.'),
  slug: studioSlugSchema,
  ownerName: personNameSchema,
  email: emailSchema,
  password: passwordSchema,
});
export type OpenStudioInput = z.infer<typeof openStudioInputSchema>;

export const slugAvailabilitySchema = z.object({ slug: z.string(), available: z.boolean(), reason: z.string().optional() });
export type SlugAvailability = z.infer<typeof slugAvailabilitySchema>;

export const roleSchema = z.enum(ROLES);

/** The signed-in person, as the client sees them. */
export const meSchema = z.object({
  user: z
    .object({
      id: z.uuid(),
      email: z.string(),
      name: z.string().nullable(),
      emailVerified: z.boolean(),
      isPlatformAdmin: z.boolean(),
    })
    .nullable(),
  memberships: z.array(z.object({ studioSlug: z.string(), studioName: z.string(), role: roleSchema })),
});
export type Me = z.infer<typeof meSchema>;
