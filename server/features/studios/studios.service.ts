import type { EntityManager } from '@mikro-orm/postgresql';
import { AppError } from '../../../shared/errors.ts';
import { type PublicStudio, studioSlugSchema } from '../../../shared/studio.ts';
import { Studio } from './studio.entity.ts';

/** A studio by its public slug; NOT_FOUND for unknown and malformed slugs alike. */
export async function findStudioBySlug(em: EntityManager, slug: string): Promise<Studio> {
  const parsed = studioSlugSchema.safeParse(slug);
  const studio = parsed.success ? await em.findOne(Studio, { slug: parsed.data }) : null;
  if (!studio) throw new AppError('NOT_FOUND', 'There is no studio at this address.');
  return studio;
}

export function toPublicStudio(studio: Studio): PublicStudio {
  return { slug: studio.slug, name: studio.name, accentColour: studio.accentColour, status: studio.status, currency: studio.currency, units: studio.units };
}
