import type { EntityManager } from '@mikro-orm/postgresql';
import { assetPaths } from '#shared/routes.ts';
import { AppError } from '#shared/errors.ts';
import { type PublicStudio, studioSlugSchema } from '#shared/studio.ts';
import { Studio } from './studio.entity.ts';
import { TENANT_FILTER } from '#server/db/tenant.ts';

/** A studio by its public slug; NOT_FOUND for unknown and malformed slugs alike. */
export async function findStudioBySlug(em: EntityManager, slug: string): Promise<Studio> {
  const parsed = studioSlugSchema.safeParse(slug);
  const studio = parsed.success ? await em.findOne(Studio, { slug: parsed.data }) : null;
  if (!studio) throw new AppError('NOT_FOUND', 'There is no studio at this address.');
  return studio;
}

/** Where a studio's logo loads from; the key's own name changes with each new logo, so it caches well. */
export const logoUrl = (studio: Studio) =>
  studio.logoKey ? assetPaths.logo(studio.slug, studio.logoKey.split('/').pop()!.replace('.webp', '')) : null;

export function toPublicStudio(studio: Studio): PublicStudio {
  return {
    slug: studio.slug,
    name: studio.name,
    accentColour: studio.accentColour,
    status: studio.status,
    currency: studio.currency,
    units: studio.units,
    lowResolutionPolicy: studio.lowResolutionPolicy,
    logoUrl: logoUrl(studio),
  };
}

/**
 * The studio behind a storefront request, with the tenant filter set to it. `open` refuses a
 * suspended studio: it shows its page but takes no photos and no orders.
 */
export async function storefrontStudio(em: EntityManager, slug: string, { open = false } = {}): Promise<Studio> {
  const studio = await findStudioBySlug(em, slug);
  em.setFilterParams(TENANT_FILTER, { studioId: studio.id });
  if (open && studio.status !== 'active') throw new AppError('CONFLICT', `${studio.name} is closed for now and is not taking orders.`);
  return studio;
}

/**
 * Refuses a next order number at or below one the studio has used: numbers must stay unique and
 * keep counting up. (Plain SQL: the order entity imports this feature's, not the other way.)
 */
export async function assertOrderNumberFree(em: EntityManager, studio: Studio, next: number): Promise<void> {
  const [row] = await em.execute<Array<{ highest: number | null }>>(
    'select max("number") as "highest" from "order" where "studio_id" = ?',
    [studio.id],
  );
  const highest = row?.highest ?? 0;
  if (next <= highest)
    throw new AppError('VALIDATION_FAILED', `Order ${highest} has been placed already: the next number must be ${highest + 1} or more.`, {
      issues: [{ path: ['nextOrderNumber'], message: `Use ${highest + 1} or more: order ${highest} exists.` }],
    });
}
