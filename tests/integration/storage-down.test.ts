import sharp from 'sharp';
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { seedDemo } from '#server/db/seed.ts';
import { BuyerPhoto } from '#server/features/photos/buyer-photo.entity.ts';
import { startTcpProxy } from '../support/tcp-proxy.ts';
import { buildTestApp } from '../support/test-app.ts';

/**
 * The object store goes away between a buyer's upload and its acceptance: the app answers 503
 * with words the buyer can act on, writes no photo row and keeps the upload, and accepts it
 * once the store is back.
 */
describe('object storage down', () => {
  let proxy: Awaited<ReturnType<typeof startTcpProxy>>;
  let t: Awaited<ReturnType<typeof buildTestApp>>;
  const store = '/api/storefront/harbour-light';

  beforeAll(async () => {
    const storage = new URL(process.env.S3_ENDPOINT!);
    proxy = await startTcpProxy({ host: storage.hostname, port: Number(storage.port) });
    t = await buildTestApp({ S3_ENDPOINT: `http://127.0.0.1:${proxy.port}` });
    await seedDemo(t.orm.em.fork());
  });
  afterAll(async () => {
    await proxy?.restore();
    await t?.close();
    proxy?.close();
  });

  const photoRows = () => t.orm.em.fork().count(BuyerPhoto, {}, { filters: false });

  it('answers the accept call with 503 and a clear message, stores nothing, and accepts the same upload later', async () => {
    const bytes = await sharp({ create: { width: 1200, height: 1500, channels: 3, background: '#6b7c8d' } })
      .jpeg()
      .toBuffer();
    const ticket = (
      await request(t.app).post(`${store}/photo-uploads`).send({ contentType: 'image/jpeg', contentLength: bytes.length }).expect(201)
    ).body;
    expect((await fetch(ticket.url, { method: 'PUT', headers: ticket.headers, body: new Uint8Array(bytes) })).status).toBe(200);

    await proxy.cut();
    const refused = await request(t.app).post(`${store}/buyer-photos`).send({ key: ticket.key }).expect(503);
    expect(refused.body).toEqual({
      code: 'SERVICE_UNAVAILABLE',
      message: 'File storage is not answering just now. Nothing was saved; please try again in a minute.',
    });
    expect(await photoRows()).toBe(0);

    await proxy.restore();
    const accepted = await request(t.app).post(`${store}/buyer-photos`).send({ key: ticket.key }).expect(201);
    expect(accepted.body).toMatchObject({ width: 1200, height: 1500 });
    expect(await photoRows()).toBe(1);
    // The upload is let go once it has been copied into place.
    await request(t.app).post(`${store}/buyer-photos`).send({ key: ticket.key }).expect(404);
  });
});
