import type { EntityManager } from '@mikro-orm/postgresql';
import { Studio } from '../features/studios/studio.entity.ts';
import { User } from '../features/accounts/user.entity.ts';
import { Membership } from '../features/team/membership.entity.ts';
import { hashPassword } from '../auth/password.ts';
import { withoutTenantFilter } from './tenant.ts';
import { DEMO_PASSWORD, demoCatalog, demoPeople, demoStudios } from './demo-scenario.ts';
import { Blank, BlankSize, Machine, Material, Recipe } from '../features/catalog/catalog.entity.ts';
import { addMaterialLibrary } from '../features/catalog/catalog.service.ts';
import { ShippingRate } from '../features/shipping/shipping-rate.entity.ts';
import { EXAMPLE_GLASS_RECIPE, MATERIAL_LIBRARY } from '../features/catalog/material-library.ts';
import { TENANT_FILTER } from './tenant.ts';

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
    for (const studio of studios.values()) added += (await seedDemoCatalog(tx, studio)) + (await seedDemoDelivery(tx, studio));
  });
  return added;
}

/** A demo studio's catalog, once: the library, a machine, a recipe, blanks with sizes. */
async function seedDemoCatalog(em: EntityManager, studio: Studio): Promise<number> {
  const scoped = { filters: { [TENANT_FILTER]: { studioId: studio.id } } };
  if (await em.count(Material, { studio }, scoped)) return 0;
  const plan = demoCatalog[studio.slug as keyof typeof demoCatalog];
  const materials = addMaterialLibrary(em, studio);
  let added = materials.length;
  if (!plan) return added;
  const byName = (name: string) => materials.find((m) => m.name === name)!;
  const machine = em.create(Machine, { ...plan.machine, studio });
  const recipeMaterial = byName(plan.recipeMaterial);
  const suggestion = MATERIAL_LIBRARY.find((m) => m.name === plan.recipeMaterial)!;
  const recipe =
    plan.recipeMaterial === 'Black-backed (painted) glass'
      ? {
          ...EXAMPLE_GLASS_RECIPE,
          notes: 'A starting point, not a setting to trust: check it with a test burn on a scrap of the same glass before the first order.',
        }
      : {
          linesPerInch: suggestion.suggestedLinesPerInch,
          halftoneMethod: suggestion.suggestedHalftone,
          tone: suggestion.defaultTone,
          speed: 300,
          powerMinPercent: 20,
          powerMaxPercent: 35,
          passes: 1,
          notes: '',
        };
  em.create(Recipe, { ...recipe, material: recipeMaterial, machine, studio });
  added += 2;
  plan.blanks.forEach((b, index) => {
    const blank = em.create(Blank, {
      name: b.name,
      description: b.description,
      material: byName(b.material),
      shape: b.shape,
      status: 'active',
      sortOrder: index,
      studio,
    });
    for (const size of b.sizes) em.create(BlankSize, { ...size, stock: size.stock, blank, studio });
    added += 1 + b.sizes.length;
  });
  return added;
}

/** A demo studio's shipping rates and pickup, once (also for demo data made before they existed). */
async function seedDemoDelivery(em: EntityManager, studio: Studio): Promise<number> {
  const plan = demoCatalog[studio.slug as keyof typeof demoCatalog];
  if (!plan || (await em.count(ShippingRate, { studio }, { filters: { [TENANT_FILTER]: { studioId: studio.id } } }))) return 0;
  plan.shipping.forEach((rate, index) => em.create(ShippingRate, { ...rate, sortOrder: index, studio }));
  if (plan.pickup) Object.assign(studio, { pickupEnabled: true, pickupNote: plan.pickup });
  return plan.shipping.length;
}
