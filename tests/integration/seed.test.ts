import { describe, expect, it } from 'vitest';
import { seedDemo } from '#server/db/seed.ts';
import { HISTORY_WEEKS, seedDemoHistory } from '#server/db/demo-history.ts';
import { today } from '#server/features/orders/today.service.ts';
import { Order } from '#server/features/orders/order.entity.ts';
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

  it('gives the demo studios twelve weeks of orders, every week, from fictional buyers; a second run adds none', async () => {
    await seedDemo(t.orm.em.fork());
    const now = new Date();
    expect(await seedDemoHistory(t.orm.em.fork(), t.storage, now)).toBeGreaterThan(2 * HISTORY_WEEKS * 2);
    for (const demo of demoStudios) {
      const em = t.orm.em.fork();
      const studio = await em.findOneOrFail(Studio, { slug: demo.slug });
      const orders = await em.find(Order, { studio }, { filters: false, populate: ['items', 'items.photo'], orderBy: { number: 'asc' } });
      // Numbered from 1 without gaps, and the next order follows on.
      expect(orders.map((o) => o.number)).toEqual(orders.map((_, i) => i + 1));
      expect(studio.nextOrderNumber).toBe(orders.length + 1);
      expect(orders.every((o) => o.buyerEmail.endsWith('.test'))).toBe(true);
      // Today's twelve weeks each have orders, and the photos are in storage.
      em.setFilterParams('tenant', { studioId: studio.id });
      const weeks = (await today(em, studio)).weeks;
      expect(weeks).toHaveLength(HISTORY_WEEKS);
      expect(weeks.filter((w) => w.orders === 0)).toEqual([]);
      const photo = orders[0]!.items[0]!.photo;
      expect((await t.storage.get(photo.previewKey)).body.length).toBeGreaterThan(1000);
      // Old orders have left the studio; this week's are still being worked on.
      expect(orders.at(0)!.status).toBe('fulfilled');
      expect(orders.at(-1)!.status).toBe('paid');
    }
    expect(await seedDemoHistory(t.orm.em.fork(), t.storage, now)).toBe(0);
  });
});
