import { Writable } from 'node:stream';
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { seedDemo } from '#server/db/seed.ts';
import { DEMO_PASSWORD } from '#server/db/demo-scenario.ts';
import { TENANT_FILTER } from '#server/db/tenant.ts';
import { LOCAL_SECRETS } from '#server/env.ts';
import { loggableUrl } from '#server/logger.ts';
import { Blank } from '#server/features/catalog/catalog.entity.ts';
import { OutboxEmail } from '#server/features/outbox/outbox-email.entity.ts';
import { OrderItem } from '#server/features/orders/order.entity.ts';
import { Studio } from '#server/features/studios/studio.entity.ts';
import { signIn } from '../support/factories.ts';
import { placePaidOrder, uploadBuyerPhoto } from '../support/orders.ts';
import { buildTestApp } from '../support/test-app.ts';

/**
 * Secrets never reach the log: with every line written (level trace) through sign-in, a paid
 * order and its webhook, the private order link, a proof link and a presigned upload, none of
 * the passwords, keys, cookies, signatures or link tokens appears in what was logged.
 */
describe('what the log keeps', () => {
  const lines: string[] = [];
  const sink = new Writable({ write: (chunk, _enc, done) => (lines.push(String(chunk)), done()) });
  let t: Awaited<ReturnType<typeof buildTestApp>>;
  const secrets: Record<string, string> = { ...LOCAL_SECRETS };

  beforeAll(async () => {
    t = await buildTestApp({ LOG_LEVEL: 'trace' }, { logDestination: sink });
    await seedDemo(t.orm.em.fork());
  });
  afterAll(() => t?.close());

  it('logs requests without a password, key, cookie, signature or link token', async () => {
    const staff = request.agent(t.app);
    const signedIn = await signIn(staff, 'tobias@harbour-light.test', DEMO_PASSWORD);
    secrets.password = DEMO_PASSWORD;
    secrets.sessionCookie = String(signedIn.headers['set-cookie']).match(/session-token=([^;]+)/)![1]!;
    await signIn(request.agent(t.app), 'tobias@harbour-light.test', 'a-wrong-password-9931');
    secrets.wrongPassword = 'a-wrong-password-9931';

    const em = t.orm.em.fork();
    const studio = await em.findOneOrFail(Studio, { slug: 'harbour-light' });
    const glass = await em.findOneOrFail(
      Blank,
      { name: 'Black-backed glass portrait' },
      { populate: ['sizes'], filters: { [TENANT_FILTER]: { studioId: studio.id } } },
    );
    const photo = await uploadBuyerPhoto(t, 'harbour-light', 1500, 2100);
    const orderId = await placePaidOrder(t, 'harbour-light', [{ blankId: glass.id, sizeId: glass.sizes[0]!.id, photo }], {
      email: 'gale@buyers.test',
      name: 'Gale Orr',
    });
    const received = await t.orm.em.fork().findOneOrFail(OutboxEmail, { to: 'gale@buyers.test', subject: { $like: 'Your order%' } });
    secrets.orderKey = /[?&]key=([\w-]+)/.exec(received.text)![1]!;
    await request(t.app).get(`/api/storefront/harbour-light/orders/${orderId}?key=${secrets.orderKey}`).expect(200);

    const itemId = (await t.orm.em.fork().findOneOrFail(OrderItem, { order: orderId }, { filters: false })).id;
    await staff.post(`/api/studios/harbour-light/items/${itemId}/approve-photo`).expect(200);
    await staff.post(`/api/studios/harbour-light/items/${itemId}/send-proof`).expect(200);
    const proofMail = await t.orm.em.fork().findOneOrFail(OutboxEmail, { to: 'gale@buyers.test', subject: { $like: '%your proof%' } });
    secrets.proofToken = /\/proofs\/([\w-]+)/.exec(proofMail.text)![1]!;
    await request(t.app).get(`/api/storefront/harbour-light/proofs/${secrets.proofToken}`).expect(200);

    const ticket = (
      await request(t.app)
        .post('/api/storefront/harbour-light/photo-uploads')
        .send({ contentType: 'image/jpeg', contentLength: 1000 })
        .expect(201)
    ).body;
    secrets.uploadSignature = new URL(ticket.url).searchParams.get('X-Amz-Signature')!;
    await request(t.app)
      .get(`/api/storefront/harbour-light/orders/${orderId}?key=${secrets.orderKey}&X-Amz-Signature=${secrets.uploadSignature}`)
      .set('authorization', `Bearer ${LOCAL_SECRETS.STRIPE_SECRET_KEY}`)
      .expect(200);

    const log = lines.join('');
    expect(log.split('\n').length).toBeGreaterThan(12);
    expect(log).toContain('/proofs/[redacted]');
    expect(log).toContain('?key=[redacted]');
    for (const [name, value] of Object.entries(secrets)) expect(log.includes(value), `${name} is in the log`).toBe(false);
  });

  it('redacts link tokens and signatures in URLs but keeps ids readable', () => {
    expect(loggableUrl('/api/storefront/s/orders/6f1c2d3e-0000-4000-8000-00000000abcd?key=abc&x=1')).toBe(
      '/api/storefront/s/orders/6f1c2d3e-0000-4000-8000-00000000abcd?key=[redacted]&x=1',
    );
    expect(loggableUrl('/api/storefront/s/replacements/LcFOSemtGOinuxfsxp5RqEIUfEeK5qO0blYIkI8Qf5c/photo')).toBe(
      '/api/storefront/s/replacements/[redacted]/photo',
    );
  });
});
