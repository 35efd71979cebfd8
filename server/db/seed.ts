import type { EntityManager } from '@mikro-orm/postgresql';
import { Studio } from '../features/studios/studio.entity.ts';
import { demoStudios } from './demo-scenario.ts';

/**
 * Puts the demo scenario in the database. Idempotent: what exists is left as it is (a studio
 * owner may have edited it), only what is missing is added. Returns how many rows it added.
 */
export async function seedDemo(em: EntityManager): Promise<number> {
  let added = 0;
  await em.transactional(async (tx) => {
    for (const demo of demoStudios) {
      const existing = await tx.findOne(Studio, { slug: demo.slug });
      if (existing) continue;
      tx.create(Studio, { ...demo });
      added++;
    }
  });
  return added;
}
