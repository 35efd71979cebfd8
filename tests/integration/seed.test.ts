import { describe, expect, it } from 'vitest';
import { seedDemo } from '#server/db/seed.ts';
import { demoPeople, demoStudios } from '#server/db/demo-scenario.ts';
import { Studio } from '#server/features/studios/studio.entity.ts';
import { useTestApp } from '../support/test-app.ts';

describe('demo scenario seed', () => {
  const t = useTestApp();

  it('adds the demo studios on an empty database', async () => {
    const memberships = demoPeople.reduce((n, p) => n + p.memberships.length, 0);
    // Studios, people, memberships, and each studio's catalog on top.
    expect(await seedDemo(t.orm.em.fork())).toBeGreaterThan(demoStudios.length + demoPeople.length + memberships);
    const slugs = (await t.orm.em.fork().find(Studio, {}, { orderBy: { slug: 'asc' } })).map((s) => s.slug);
    expect(slugs).toEqual(demoStudios.map((s) => s.slug).sort());
  });

  it('changes nothing when run again, and keeps what an owner edited', async () => {
    const em = t.orm.em.fork();
    const edited = await em.findOneOrFail(Studio, { slug: demoStudios[0].slug });
    edited.name = 'Renamed by its owner';
    await em.flush();
    const before = await t.orm.em.fork().find(Studio, {}, { orderBy: { slug: 'asc' } });

    expect(await seedDemo(t.orm.em.fork())).toBe(0);

    const after = await t.orm.em.fork().find(Studio, {}, { orderBy: { slug: 'asc' } });
    expect(after.map((s) => [s.id, s.name, s.updatedAt.getTime()])).toEqual(before.map((s) => [s.id, s.name, s.updatedAt.getTime()]));
  });
});
