import request from 'supertest';
import { beforeAll, describe, expect, it } from 'vitest';
import { seedDemo } from '#server/db/seed.ts';
import { DEMO_PASSWORD } from '#server/db/demo-scenario.ts';
import { TENANT_FILTER } from '#server/db/tenant.ts';
import { AuditEntry } from '#server/features/audit/audit-entry.entity.ts';
import { Blank } from '#server/features/catalog/catalog.entity.ts';
import { Studio } from '#server/features/studios/studio.entity.ts';
import type { AuditEntryView, AuditPage } from '#shared/schemas/audit.ts';
import type { RecipeView } from '#shared/schemas/catalog.ts';
import { createMember, createStudio, agentFor, signIn } from '../support/factories.ts';
import { placePaidOrder, uploadBuyerPhoto } from '../support/orders.ts';
import { useTestApp } from '../support/test-app.ts';

/**
 * The audit log: refunds, role changes, prices, recipes and downloads of buyers' photos are
 * written with the change itself (a refused change leaves no line), owners read them newest
 * first by group and page, staff and other studios cannot.
 */
describe('audit log', () => {
  const t = useTestApp();
  const work = '/api/studios/harbour-light';
  let owner: ReturnType<typeof request.agent>;
  let staff: ReturnType<typeof request.agent>;
  let glass: Blank;
  let studioId: string;

  beforeAll(async () => {
    await seedDemo(t.orm.em.fork());
    const em = t.orm.em.fork();
    const studio = await em.findOneOrFail(Studio, { slug: 'harbour-light' });
    studioId = studio.id;
    glass = await em.findOneOrFail(
      Blank,
      { name: 'Black-backed glass portrait' },
      { populate: ['sizes'], filters: { [TENANT_FILTER]: { studioId } } },
    );
    owner = request.agent(t.app);
    await signIn(owner, 'maren@harbour-light.test', DEMO_PASSWORD);
    staff = request.agent(t.app);
    await signIn(staff, 'tobias@harbour-light.test', DEMO_PASSWORD);
  });

  const lines = () => t.orm.em.fork().count(AuditEntry, { studio: studioId }, { filters: false });
  const newest = async (query = ''): Promise<AuditEntryView[]> =>
    ((await owner.get(`${work}/audit${query}`).expect(200)).body as AuditPage).entries;

  it('records a refund with its amount, and nothing for a refund refused', async () => {
    const photo = await uploadBuyerPhoto(t, 'harbour-light', 1500, 2100);
    const orderId = await placePaidOrder(t, 'harbour-light', [{ blankId: glass.id, sizeId: glass.sizes[0]!.id, photo }], {
      email: 'ines@buyers.test',
      name: 'Ines Marr',
    });
    const before = await lines();
    await owner.post(`${work}/orders/${orderId}/refunds`).send({ amountMinor: 10_000_000, reason: 'Too much' }).expect(400);
    expect(await lines()).toBe(before);
    await owner.post(`${work}/orders/${orderId}/refunds`).send({ amountMinor: 500, reason: 'Scratch on the edge' }).expect(200);
    const [entry] = await newest();
    expect(entry).toMatchObject({
      action: 'order.refunded',
      group: 'money',
      actor: 'Maren Quist',
      link: `/studio/harbour-light/orders/${orderId}`,
    });
    expect(entry!.subject).toMatch(/^Order \d+$/);
    expect(entry!.summary).toMatch(/^Refunded \$5\.00 in part; \$5\.00 of \$[\d,.]+ refunded so far\. Reason: Scratch on the edge$/);
  });

  it('records role changes, invitations and removals, not the change refused for the last owner', async () => {
    const team = (await owner.get(`${work}/team`).expect(200)).body as { members: Array<{ id: string; email: string; role: string }> };
    const tobias = team.members.find((m) => m.email === 'tobias@harbour-light.test')!;
    const maren = team.members.find((m) => m.email === 'maren@harbour-light.test')!;
    const before = await lines();
    await owner.patch(`${work}/team/members/${maren.id}`).send({ role: 'staff' }).expect(409);
    await owner.patch(`${work}/team/members/${tobias.id}`).send({ role: 'staff' }).expect(204); // no change, no line
    expect(await lines()).toBe(before);
    await owner.patch(`${work}/team/members/${tobias.id}`).send({ role: 'owner' }).expect(204);
    await owner.patch(`${work}/team/members/${tobias.id}`).send({ role: 'staff' }).expect(204);
    const [back, up] = await newest('?group=team');
    expect(up).toMatchObject({
      action: 'member.role_changed',
      summary: expect.stringMatching(/^Changed the role of .*tobias@harbour-light\.test.* from staff to owner\.$/),
    });
    expect(back!.summary).toMatch(/from owner to staff\.$/);
    const invite = (await owner.post(`${work}/team/invites`).send({ email: 'wren@harbour-light.test', role: 'staff' }).expect(201))
      .body as { id: string };
    await owner.delete(`${work}/team/invites/${invite.id}`).expect(204);
    const [revoked, sent] = await newest('?group=team');
    expect(sent).toMatchObject({
      action: 'invite.sent',
      subject: 'wren@harbour-light.test',
      summary: 'Invited wren@harbour-light.test to join as staff.',
    });
    expect(revoked).toMatchObject({ action: 'invite.revoked', summary: 'Withdrew the invitation to wren@harbour-light.test (staff).' });
    const studio = await t.orm.em.fork().findOneOrFail(Studio, { id: studioId });
    const leaving = await createMember(t.orm.em.fork(), studio, 'staff');
    await owner.delete(`${work}/team/members/${leaving.membership.id}`).expect(204);
    const [removed] = await newest('?group=team');
    expect(removed).toMatchObject({
      action: 'member.removed',
      summary: `Removed ${leaving.user.name ? `${leaving.user.name} (${leaving.user.email})` : leaving.user.email} (staff) from the studio.`,
    });
  });

  it('records price changes with the old and new price, and not saves that keep the price', async () => {
    const blank = (await owner.get(`${work}/catalog/blanks/${glass.id}`).expect(200)).body as {
      sizes: Array<Record<string, unknown> & { id: string; label: string; priceMinor: number }>;
    };
    const { id, ...size } = blank.sizes[0]!;
    const before = await lines();
    await owner
      .put(`${work}/catalog/sizes/${id}`)
      .send({ ...size, stock: 99 })
      .expect(200);
    expect(await lines()).toBe(before);
    await owner
      .put(`${work}/catalog/sizes/${id}`)
      .send({ ...size, priceMinor: size.priceMinor + 250 })
      .expect(200);
    const [entry] = await newest('?group=prices');
    const dollars = (minor: number) => `$${(minor / 100).toFixed(2)}`;
    expect(entry).toMatchObject({
      action: 'price.changed',
      subject: `${glass.name}, ${size.label}`,
      summary: `Price: ${dollars(size.priceMinor)} → ${dollars(size.priceMinor + 250)}.`,
    });
    // Staff may not change prices, and a refused change writes nothing.
    await staff
      .put(`${work}/catalog/sizes/${id}`)
      .send({ ...size, priceMinor: 1 })
      .expect(403);
    expect(await lines()).toBe(before + 1);
  });

  it('records what changed in a recipe', async () => {
    const [recipe] = ((await owner.get(`${work}/catalog/recipes`).expect(200)).body as { recipes: RecipeView[] }).recipes;
    const { id, material, machine, ...fields } = recipe!;
    await owner
      .put(`${work}/catalog/recipes/${id}`)
      .send({ ...fields, materialId: material.id, machineId: machine.id, speed: fields.speed + 10, passes: fields.passes + 1 })
      .expect(200);
    const [entry] = await newest('?group=recipes');
    expect(entry).toMatchObject({ action: 'recipe.changed', subject: `${material.name} on ${machine.name}` });
    expect(entry!.summary).toContain(`Speed: ${fields.speed} `);
    expect(entry!.summary).toContain(`Passes: ${fields.passes} → ${fields.passes + 1}`);
    expect(entry!.summary).not.toContain('Line density');
  });

  it('records a blank added and put on sale, and nothing for a save that keeps its status', async () => {
    const { materials } = (await owner.get(`${work}/catalog/materials`).expect(200)).body as {
      materials: Array<{ id: string; name: string }>;
    };
    const slate = materials.find((m) => m.name.includes('slate')) ?? materials[0]!;
    const input = { name: 'Slate heart', description: '', materialId: slate.id, shape: 'oval', status: 'draft', sortOrder: 9 };
    const created = (await owner.post(`${work}/catalog/blanks`).send(input).expect(201)).body as { id: string };
    await owner
      .put(`${work}/catalog/blanks/${created.id}`)
      .send({ ...input, status: 'active' })
      .expect(200);
    const before = await lines();
    await owner
      .put(`${work}/catalog/blanks/${created.id}`)
      .send({ ...input, status: 'active', description: 'New words' })
      .expect(200);
    expect(await lines()).toBe(before);
    const [onSale, added] = await newest('?group=blanks');
    expect(added).toMatchObject({
      action: 'blank.created',
      subject: 'Blank: Slate heart',
      summary: `New blank of ${slate.name}, a draft.`,
    });
    expect(onSale).toMatchObject({ action: 'blank.status_changed', summary: 'From a draft to on sale.' });
  });

  it('records a member opening a buyer’s original photo, once per hour per member and photo', async () => {
    const photo = await uploadBuyerPhoto(t, 'harbour-light', 1200, 1600);
    const orderId = await placePaidOrder(t, 'harbour-light', [{ blankId: glass.id, sizeId: glass.sizes[0]!.id, photo }], {
      email: 'ola@buyers.test',
      name: 'Ola Brant',
    });
    await staff.get(`${work}/orders/photos/${photo.id}/original`).expect(200);
    await staff.get(`${work}/orders/photos/${photo.id}/original`).expect(200);
    const photos = await newest('?group=photos');
    expect(photos.filter((e) => e.link === `/studio/harbour-light/orders/${orderId}`)).toEqual([
      expect.objectContaining({
        action: 'photo.downloaded',
        actor: 'Tobias Renn',
        summary: `Opened the original photo (1200 × 1600 px) for ${glass.name}, ${glass.sizes[0]!.label}.`,
      }),
    ]);
  });

  it('pages newest first; owners only; each studio its own', async () => {
    const all = await newest('?limit=100');
    expect(all.length).toBeGreaterThanOrEqual(8);
    expect([...all].sort((a, b) => b.at.localeCompare(a.at))).toEqual(all);
    const first = (await owner.get(`${work}/audit?limit=3`).expect(200)).body as AuditPage;
    const second = (await owner.get(`${work}/audit?limit=3&before=${encodeURIComponent(first.next!)}`).expect(200)).body as AuditPage;
    expect([...first.entries, ...second.entries].map((e) => e.id)).toEqual(all.slice(0, 6).map((e) => e.id));
    const bad = await owner.get(`${work}/audit?before=yesterday`).expect(400);
    expect(bad.body.issues[0]).toMatchObject({ path: ['before'], message: 'Not a page marker from this list.' });
    await owner.get(`${work}/audit?group=everything`).expect(400);
    await staff.get(`${work}/audit`).expect(403);
    const other = await createStudio(t.orm.em.fork(), { slug: 'quiet-kiln' });
    const otherOwner = await agentFor(t.app, (await createMember(t.orm.em.fork(), other, 'owner')).user);
    expect((await otherOwner.get('/api/studios/quiet-kiln/audit').expect(200)).body).toEqual({ entries: [], next: null });
    await otherOwner.get(`${work}/audit`).expect(404);
  });
});
