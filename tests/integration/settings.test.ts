import { beforeAll, describe, expect, it } from 'vitest';
import request from 'supertest';
import sharp from 'sharp';
import type { Studio } from '#server/features/studios/studio.entity.ts';
import { useTestApp } from '../support/test-app.ts';
import { agentFor, createMember, createStudio } from '../support/factories.ts';

describe('studio settings', () => {
  const t = useTestApp();
  let studio: Studio;
  let owner: ReturnType<typeof request.agent>;
  const valid = { name: 'Willow & Flint', accentColour: '#2a7a50', currency: 'eur', units: 'mm', contactEmail: 'Hello@Willow.test' };

  beforeAll(async () => {
    const em = t.orm.em.fork();
    studio = await createStudio(em, { slug: 'willow-flint' });
    owner = await agentFor(t.app, (await createMember(em, studio, 'owner')).user);
  });

  it('saves branding, currency, units and contact; the storefront shows them', async () => {
    const res = await owner.put('/api/studios/willow-flint/settings').send(valid).expect(200);
    expect(res.body.studio).toMatchObject({
      name: 'Willow & Flint',
      accentColour: '#2a7a50',
      currency: 'EUR',
      units: 'mm',
      contactEmail: 'hello@willow.test',
    });
    expect((await request(t.app).get('/api/storefront/willow-flint').expect(200)).body).toMatchObject({
      name: 'Willow & Flint',
      accentColour: '#2a7a50',
      currency: 'EUR',
      units: 'mm',
    });
  });

  it.each([
    [{ name: '' }, 'name'],
    [{ accentColour: 'green' }, 'accentColour'],
    [{ currency: 'XYZW' }, 'currency'],
    [{ currency: 'QQQ' }, 'currency'],
    [{ units: 'cubits' }, 'units'],
    [{ contactEmail: 'not-an-address' }, 'contactEmail'],
  ])('refuses %j with a message on %s, changing nothing', async (change, field) => {
    const res = await owner
      .put('/api/studios/willow-flint/settings')
      .send({ ...valid, ...change })
      .expect(400);
    expect(res.body.issues.map((i: { path: string[] }) => i.path[0])).toEqual([field]);
    expect((await request(t.app).get('/api/storefront/willow-flint')).body.name).toBe('Willow & Flint');
  });

  it('saves how orders are taken; the storefront and checkout follow', async () => {
    await owner
      .put('/api/studios/willow-flint/settings/orders')
      .send({ lowResolutionPolicy: 'refuse', pickupEnabled: true, pickupNote: '', proofsRequired: true, masterResolution: '1000-ppi' })
      .expect(400);
    const res = await owner
      .put('/api/studios/willow-flint/settings/orders')
      .send({
        lowResolutionPolicy: 'refuse',
        pickupEnabled: true,
        pickupNote: 'The workshop, Fridays 2–6 pm.',
        proofsRequired: false,
        masterResolution: 'recipe',
      })
      .expect(200);
    expect(res.body.orders).toEqual({
      lowResolutionPolicy: 'refuse',
      pickupEnabled: true,
      pickupNote: 'The workshop, Fridays 2–6 pm.',
      proofsRequired: false,
      masterResolution: 'recipe',
      // A new studio numbers its orders from 1 (not from a number borrowed from elsewhere).
      nextOrderNumber: 1,
    });
    expect((await request(t.app).get('/api/storefront/willow-flint').expect(200)).body.lowResolutionPolicy).toBe('refuse');
    expect((await request(t.app).get('/api/storefront/willow-flint/delivery').expect(200)).body.pickup).toEqual({
      note: 'The workshop, Fridays 2–6 pm.',
    });
  });

  it('keeps shipping rates, each checked; checkout lists them formatted in the currency', async () => {
    for (const [change, field] of [
      [{ name: '' }, 'name'],
      [{ priceMinor: 8.5 }, 'priceMinor'],
      [{ priceMinor: -1 }, 'priceMinor'],
    ] as const) {
      const bad = await owner
        .post('/api/studios/willow-flint/shipping-rates')
        .send({ name: 'Post', priceMinor: 500, ...change })
        .expect(400);
      expect(bad.body.issues.map((i: { path: string[] }) => i.path[0])).toEqual([field]);
    }
    const rate = (await owner.post('/api/studios/willow-flint/shipping-rates').send({ name: 'Tracked post', priceMinor: 650 }).expect(201))
      .body;
    await owner
      .put(`/api/studios/willow-flint/shipping-rates/${rate.id}`)
      .send({ name: 'Tracked post, 2 days', priceMinor: 700 })
      .expect(200);
    const listed = (await request(t.app).get('/api/storefront/willow-flint/delivery').expect(200)).body.rates;
    expect(listed).toEqual([{ id: rate.id, name: 'Tracked post, 2 days', priceMinor: 700, price: '€7.00' }]);
    await owner.delete(`/api/studios/willow-flint/shipping-rates/${rate.id}`).expect(204);
    await owner.delete(`/api/studios/willow-flint/shipping-rates/${rate.id}`).expect(404);
  });

  it('takes a logo through a presigned upload, shows it on the storefront, and removes it', async () => {
    const png = await sharp({ create: { width: 600, height: 200, channels: 4, background: { r: 40, g: 90, b: 60, alpha: 0.5 } } })
      .png()
      .toBuffer();
    const ticket = (
      await owner
        .post('/api/studios/willow-flint/settings/logo-uploads')
        .send({ contentType: 'image/png', contentLength: png.length })
        .expect(201)
    ).body;
    expect((await fetch(ticket.url, { method: 'PUT', headers: ticket.headers, body: new Uint8Array(png) })).status).toBe(200);
    const saved = (await owner.put('/api/studios/willow-flint/settings/logo').send({ key: ticket.key }).expect(200)).body;
    const logoUrl = (await request(t.app).get('/api/storefront/willow-flint').expect(200)).body.logoUrl;
    expect(logoUrl).toBe(saved.studio.logoUrl);
    const image = await request(t.app).get(logoUrl).expect(200).expect('content-type', 'image/webp');
    // Scaled to fit 512 px, transparency kept.
    expect(await sharp(image.body).metadata()).toMatchObject({ format: 'webp', width: 512, height: 171, hasAlpha: true });
    await owner.delete('/api/studios/willow-flint/settings/logo').expect(200);
    expect((await request(t.app).get('/api/storefront/willow-flint').expect(200)).body.logoUrl).toBeNull();
    await request(t.app).get('/api/storefront/willow-flint/logo').expect(404);
  });
});
