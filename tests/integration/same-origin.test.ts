import request from 'supertest';
import { beforeAll, describe, expect, it } from 'vitest';
import { seedDemo } from '#server/db/seed.ts';
import { DEMO_PASSWORD } from '#server/db/demo-scenario.ts';
import { signIn } from '../support/factories.ts';
import { useTestApp } from '../support/test-app.ts';

/**
 * Cross-site request forgery: a signed-in member's browser, sent by another site to change
 * something, is refused; the same request from the app's own pages goes through. (The Fetch
 * Metadata and Origin headers, as browsers send them: W3C Fetch Metadata Request Headers; RFC 6454.)
 */
describe('requests from other sites', () => {
  const t = useTestApp();
  const url = '/api/studios/harbour-light/production/batches';
  let member: ReturnType<typeof request.agent>;

  beforeAll(async () => {
    await seedDemo(t.orm.em.fork());
    member = request.agent(t.app);
    await signIn(member, 'tobias@harbour-light.test', DEMO_PASSWORD);
  });

  const refused = {
    code: 'FORBIDDEN',
    message: 'This request came from another site and was refused. Open Etchwell itself and try again.',
  };

  it('refuses a cookie-carrying change sent from another site, by Sec-Fetch-Site or by Origin', async () => {
    expect((await member.post(url).set('sec-fetch-site', 'cross-site').send({}).expect(403)).body).toEqual(refused);
    expect((await member.post(url).set('sec-fetch-site', 'same-site').send({}).expect(403)).body).toEqual(refused);
    expect((await member.post(url).set('origin', 'https://elsewhere.example').send({}).expect(403)).body).toEqual(refused);
    expect((await member.post(url).set('origin', 'null').send({}).expect(403)).body).toEqual(refused);
  });

  it('lets the same change through from the app itself, and reads from anywhere', async () => {
    // Past the check, the request meets the usual validation: 400, not 403.
    await member.post(url).set('sec-fetch-site', 'same-origin').set('origin', new URL(t.env.APP_URL).origin).send({}).expect(400);
    await member.post(url).set('origin', new URL(t.env.APP_URL).origin).send({}).expect(400);
    await member.get('/api/studios/harbour-light/production').set('sec-fetch-site', 'cross-site').expect(200);
  });

  it('does not stand in the way of requests without cookies (webhooks, scripts)', async () => {
    await request(t.app)
      .post('/api/storefront/harbour-light/photo-uploads')
      .set('origin', 'https://elsewhere.example')
      .send({ contentType: 'image/jpeg', contentLength: 1000 })
      .expect(201);
  });
});
