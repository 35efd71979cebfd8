import type { EntityManager } from '@mikro-orm/postgresql';
import { Studio } from '../features/studios/studio.entity.ts';
import { User } from '../features/accounts/user.entity.ts';
import { Membership } from '../features/team/membership.entity.ts';
import { hashPassword } from '../auth/password.ts';
import { withoutTenantFilter } from './tenant.ts';
import { DEMO_PASSWORD, demoPeople, demoStudios } from './demo-scenario.ts';

/**
 * Puts the demo scenario in the database. Idempotent: what exists is left as it is (a studio
 * owner may have edited it), only what is missing is added. Returns how many rows it added.
 */
export async function seedDemo(em: EntityManager): Promise<number> {
  let added = 0;
  const passwordHash = await hashPassword(DEMO_PASSWORD);
  await em.transactional(async (tx) => {
    const studios = new Map<string, Studio>();
    for (const demo of demoStudios) {
      let studio = await tx.findOne(Studio, { slug: demo.slug });
      if (!studio) {
        studio = tx.create(Studio, { ...demo });
        added++;
      }
      studios.set(demo.slug, studio);
    }
    for (const person of demoPeople) {
      let user = await tx.findOne(User, { email: person.email });
      if (!user) {
        user = tx.create(User, {
          email: person.email,
          name: person.name,
          passwordHash: person.password ? passwordHash : null,
          emailVerifiedAt: new Date(),
          isPlatformAdmin: person.platformAdmin ?? false,
        });
        added++;
      }
      for (const { studio: slug, role } of person.memberships) {
        const studio = studios.get(slug)!;
        const existing = await tx.findOne(Membership, { studio, user }, withoutTenantFilter);
        if (existing) continue;
        tx.create(Membership, { studio, user, role });
        added++;
      }
    }
  });
  return added;
}
