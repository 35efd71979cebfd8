import { describe, expect, it } from 'vitest';
import request from 'supertest';
import { User } from '#server/features/accounts/user.entity.ts';
import { useTestApp } from '../support/test-app.ts';
import { useMailFake } from '../support/mail.ts';
import { agentFor, createMember, createStudio, createUser, signIn } from '../support/factories.ts';

describe('opening a studio, and platform admin', () => {
  const mail = useMailFake();
  const t = useTestApp(async () => ({ SMTP_URL: (await mail.start()).smtpUrl }));

  const valid = {
    studioName: 'Copper Finch Engraving',
    slug: 'copper-finch',
    ownerName: 'Rosa Vell',
    email: 'rosa@copper-finch.test',
    password: 'a very long password',
  };

  it('checks an address live: format, reserved words and studios already there', async () => {
    await createStudio(t.orm.em.fork(), { slug: 'taken-one' });
    const check = async (slug: string) =>
      (
        await request(t.app)
          .get(`/api/accounts/slug-availability?slug=${encodeURIComponent(slug)}`)
          .expect(200)
      ).body;
    expect(await check('fresh-name')).toEqual({ slug: 'fresh-name', available: true });
    expect(await check('taken-one')).toMatchObject({ available: false, reason: 'Another studio already uses this address.' });
    expect(await check('admin')).toMatchObject({ available: false, reason: 'This address is reserved.' });
    expect(await check('Bad Name!')).toMatchObject({ available: false, reason: 'Use lower-case letters, digits and single hyphens.' });
  });

  it.each([
    ['studioName', { studioName: '' }],
    ['slug', { slug: '-x-' }],
    ['ownerName', { ownerName: '' }],
    ['email', { email: 'rosa' }],
    ['password', { password: 'short' }],
  ])('refuses a bad %s with that field’s message, and writes nothing', async (field, change) => {
    const res = await request(t.app)
      .post('/api/accounts/studios')
      .send({ ...valid, ...change })
      .expect(400);
    expect(res.body.issues.map((i: { path: string[] }) => i.path[0])).toEqual([field]);
    expect(await t.orm.em.fork().count(User, { email: valid.email })).toBe(0);
  });

  it('opens the studio with its owner, sends the confirmation, and the owner signs in', async () => {
    expect((await request(t.app).post('/api/accounts/studios').send(valid).expect(201)).body).toEqual({ studioSlug: 'copper-finch' });
    const message = await mail.latestTo('rosa@copper-finch.test');
    expect(message.subject).toBe('Confirm your e-mail address for Copper Finch Engraving');
    const link = new URL(message.links.find((l) => l.includes('verify-email'))!);
    expect((await request(t.app).get(`${link.pathname}${link.search}`).expect(303)).headers.location).toBe('/sign-in?verified=1');
    expect((await t.orm.em.fork().findOneOrFail(User, { email: valid.email })).emailVerifiedAt).toBeInstanceOf(Date);
    // The link is single use.
    expect((await request(t.app).get(`${link.pathname}${link.search}`)).headers.location).toBe('/sign-in?verified=0');

    const agent = request.agent(t.app);
    await signIn(agent, valid.email, valid.password);
    const me = (await agent.get('/api/me').expect(200)).body;
    expect(me.memberships).toEqual([{ studioSlug: 'copper-finch', studioName: 'Copper Finch Engraving', role: 'owner' }]);
  });

  it('refuses a second studio at the same address or for an e-mail already in use', async () => {
    const sameSlug = await request(t.app)
      .post('/api/accounts/studios')
      .send({ ...valid, email: 'other@copper-finch.test' })
      .expect(409);
    expect(sameSlug.body.issues[0].path).toEqual(['slug']);
    const sameEmail = await request(t.app)
      .post('/api/accounts/studios')
      .send({ ...valid, slug: 'copper-finch-two' })
      .expect(409);
    expect(sameEmail.body.issues[0].path).toEqual(['email']);
  });

  it('lets a platform admin list, suspend and resume studios; a suspended storefront says it is closed', async () => {
    const em = t.orm.em.fork();
    const studio = await createStudio(em, { slug: 'to-suspend', name: 'To Suspend' });
    await createMember(em, studio, 'owner');
    const admin = await agentFor(t.app, await createUser(em, { isPlatformAdmin: true }));
    const list = (await admin.get('/api/platform/studios').expect(200)).body.studios;
    expect(list.find((s: { slug: string }) => s.slug === 'to-suspend')).toMatchObject({ status: 'active', owners: 1, staff: 0 });

    await admin.post('/api/platform/studios/to-suspend/suspend').expect(200);
    expect((await request(t.app).get('/api/storefront/to-suspend').expect(200)).body.status).toBe('suspended');
    await admin.post('/api/platform/studios/to-suspend/suspend').expect(409);
    await admin.post('/api/platform/studios/to-suspend/resume').expect(200);
    expect((await request(t.app).get('/api/storefront/to-suspend').expect(200)).body.status).toBe('active');
  });

  it('hides the platform pages from everyone else', async () => {
    const member = await agentFor(t.app, await createUser(t.orm.em.fork()));
    await member.get('/api/platform/studios').expect(404);
    await request(t.app).get('/api/platform/studios').expect(401);
  });
});
