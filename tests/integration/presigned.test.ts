import request from 'supertest';
import sharp from 'sharp';
import { beforeAll, describe, expect, it } from 'vitest';
import type { Studio } from '#server/features/studios/studio.entity.ts';
import { createStudio } from '../support/factories.ts';
import { useTestApp } from '../support/test-app.ts';

/**
 * Upload links: short-lived, good for the one key they were made for, and keys nobody can guess
 * or take from another studio. Presigned URLs are AWS Signature Version 4 query strings
 * (X-Amz-Expires is the lifetime in seconds; the key is part of what is signed).
 */
describe('presigned upload links', () => {
  const t = useTestApp();
  let studio: Studio;
  let other: Studio;
  let jpeg: Buffer;
  const ticket = async (slug: string) =>
    (
      await request(t.app)
        .post(`/api/storefront/${slug}/photo-uploads`)
        .send({ contentType: 'image/jpeg', contentLength: jpeg.length })
        .expect(201)
    ).body as { url: string; key: string; headers: Record<string, string> };

  beforeAll(async () => {
    studio = await createStudio(t.orm.em.fork(), { slug: 'link-shop' });
    other = await createStudio(t.orm.em.fork(), { slug: 'other-shop' });
    jpeg = await sharp({ create: { width: 640, height: 480, channels: 3, background: '#445566' } })
      .jpeg()
      .toBuffer();
  });

  it('lasts ten minutes and names a random key under the studio', async () => {
    const first = await ticket('link-shop');
    const second = await ticket('link-shop');
    const url = new URL(first.url);
    expect(url.searchParams.get('X-Amz-Expires')).toBe('600');
    expect(url.searchParams.get('X-Amz-Algorithm')).toBe('AWS4-HMAC-SHA256');
    // RFC 9562 version 4 UUIDs: 122 random bits each.
    expect(first.key).toMatch(
      new RegExp(`^uploads/${studio.id}/buyer-photos/[0-9a-f]{8}-[0-9a-f]{4}-4[0-9a-f]{3}-[89ab][0-9a-f]{3}-[0-9a-f]{12}$`),
    );
    expect(second.key).not.toBe(first.key);
  });

  it('is good for its own key only', async () => {
    const { url, key, headers } = await ticket('link-shop');
    const elsewhere = url.replace(encodeURI(key), `uploads/${studio.id}/buyer-photos/chosen-by-me`);
    expect(elsewhere).not.toBe(url);
    expect((await fetch(elsewhere, { method: 'PUT', headers, body: new Uint8Array(jpeg) })).status).toBe(403);
    expect((await fetch(url, { method: 'PUT', headers, body: new Uint8Array(jpeg) })).status).toBe(200);
  });

  it('cannot be claimed by another studio', async () => {
    const { url, key, headers } = await ticket('link-shop');
    await fetch(url, { method: 'PUT', headers, body: new Uint8Array(jpeg) });
    const stolen = await request(t.app).post(`/api/storefront/${other.slug}/buyer-photos`).send({ key }).expect(404);
    expect(stolen.body.message).toBe('That upload has not arrived. Please upload the file again.');
    await request(t.app).post('/api/storefront/link-shop/buyer-photos').send({ key }).expect(201);
  });
});
