import { beforeAll, describe, expect, it } from 'vitest';
import request from 'supertest';
import { publicStudioSchema } from '#shared/studio.ts';
import { Studio } from '#server/features/studios/studio.entity.ts';
import { useTestApp } from '../support/test-app.ts';

describe('GET /api/storefront/:studioSlug', () => {
  const t = useTestApp();

  beforeAll(async () => {
    const em = t.orm.em.fork();
    em.create(Studio, { slug: 'north-pier', name: 'North Pier Etching', accentColour: '#336699' });
    em.create(Studio, { slug: 'quiet-lane', name: 'Quiet Lane Glass', status: 'suspended' });
    await em.flush();
  });

  it('answers the public face of a studio and nothing more', async () => {
    const res = await request(t.app).get('/api/storefront/north-pier').expect(200);
    expect(publicStudioSchema.strict().parse(res.body)).toEqual({
      slug: 'north-pier',
      name: 'North Pier Etching',
      accentColour: '#336699',
      status: 'active',
      currency: 'USD',
      units: 'in',
      lowResolutionPolicy: 'confirm',
      logoUrl: null,
    });
  });

  it('tells a suspended studio apart', async () => {
    const res = await request(t.app).get('/api/storefront/quiet-lane').expect(200);
    expect(res.body.status).toBe('suspended');
  });

  it.each(['no-such-studio', 'UPPER', '..%2Fetc', 'a'])('answers 404 for %s', async (slug) => {
    const res = await request(t.app).get(`/api/storefront/${slug}`).expect(404);
    expect(res.body).toEqual({ code: 'NOT_FOUND', message: 'There is no studio at this address.' });
  });
});
