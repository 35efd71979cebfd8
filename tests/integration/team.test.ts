import { beforeAll, describe, expect, it } from 'vitest';
import request from 'supertest';
import { Invite } from '#server/features/team/invite.entity.ts';
import { Membership } from '#server/features/team/membership.entity.ts';
import { withoutTenantFilter } from '#server/db/tenant.ts';
import type { Studio } from '#server/features/studios/studio.entity.ts';
import type { User } from '#server/features/accounts/user.entity.ts';
import { useTestApp } from '../support/test-app.ts';
import { useMailFake } from '../support/mail.ts';
import { agentFor, createMember, createStudio, createUser, signIn } from '../support/factories.ts';

describe('team: invites, roles and the last owner', () => {
  const mail = useMailFake();
  let studio: Studio;
  let owner: User;
  let ownerAgent: ReturnType<typeof request.agent>;

  const t = useTestApp(async () => ({ SMTP_URL: (await mail.start()).smtpUrl, APP_URL: 'http://127.0.0.1:3000' }));

  beforeAll(async () => {
    const em = t.orm.em.fork();
    studio = await createStudio(em, { slug: 'team-studio', name: 'Team Studio' });
    owner = (await createMember(em, studio, 'owner')).user;
    ownerAgent = await agentFor(t.app, owner);
  });

  const base = '/api/studios/team-studio';
  const tokenFromMail = async (email: string) =>
    (await mail.latestTo(email)).links.map((l) => /\/invites\/([\w-]+)$/.exec(l)?.[1]).find(Boolean);
  const invite = async (email: string, role = 'staff') => {
    await ownerAgent.post(`${base}/team/invites`).send({ email, role }).expect(201);
    return tokenFromMail(email);
  };

  it('e-mails an invite that an existing account accepts, joining with the invite’s role', async () => {
    const colleague = await createUser(t.orm.em.fork(), { email: 'colleague@example.com' });
    const token = await invite('Colleague@Example.com');
    expect((await request(t.app).get(`/api/invites/${token}`).expect(200)).body).toMatchObject({
      studioName: 'Team Studio',
      email: 'colleague@example.com',
      role: 'staff',
      status: 'open',
      hasAccount: true,
    });
    const agent = await agentFor(t.app, colleague);
    expect((await agent.post(`/api/invites/${token}/accept`).expect(200)).body).toEqual({ studioSlug: 'team-studio' });
    expect((await agent.get(`${base}`).expect(200)).body.role).toBe('staff');
    // Single use: the link does not work a second time.
    const again = await agent.post(`/api/invites/${token}/accept`).expect(409);
    expect(again.body.message).toBe('This invitation has already been used.');
  });

  it('lets a new person create an account while accepting', async () => {
    const token = await invite('newcomer@example.com', 'owner');
    const res = await request(t.app)
      .post(`/api/invites/${token}/accept-with-account`)
      .send({ name: 'New Comer', password: 'a long new password' })
      .expect(201);
    expect(res.body).toEqual({ studioSlug: 'team-studio', email: 'newcomer@example.com' });
    const agent = request.agent(t.app);
    await signIn(agent, 'newcomer@example.com', 'a long new password');
    expect((await agent.get(base).expect(200)).body.role).toBe('owner');
  });

  it('refuses an invite accepted with another e-mail address, without revealing it whole', async () => {
    const token = await invite('intended@example.com');
    const stranger = await agentFor(t.app, await createUser(t.orm.em.fork(), { email: 'stranger@example.com' }));
    const res = await stranger.post(`/api/invites/${token}/accept`).expect(403);
    expect(res.body.message).toBe('This invitation was sent to i••@example.com. Sign in with that address to accept it.');
  });

  it('refuses an expired invite and a withdrawn one, and an unknown token', async () => {
    const token = await invite('slow@example.com');
    await t.orm.em
      .fork()
      .nativeUpdate(Invite, { email: 'slow@example.com' }, { expiresAt: new Date(Date.now() - 1000) }, withoutTenantFilter);
    const slow = await agentFor(t.app, await createUser(t.orm.em.fork(), { email: 'slow@example.com' }));
    expect((await slow.post(`/api/invites/${token}/accept`).expect(409)).body.message).toBe(
      'This invitation has expired. Ask the studio for a new one.',
    );

    const withdrawn = await invite('withdrawn@example.com');
    const { invites } = (await ownerAgent.get(`${base}/team`).expect(200)).body as { invites: Array<{ id: string; email: string }> };
    await ownerAgent.delete(`${base}/team/invites/${invites.find((i) => i.email === 'withdrawn@example.com')!.id}`).expect(204);
    expect((await request(t.app).get(`/api/invites/${withdrawn}`).expect(200)).body.status).toBe('revoked');

    expect((await request(t.app).get('/api/invites/not-a-real-token-at-all-0000').expect(404)).body.code).toBe('NOT_FOUND');
  });

  it('validates the invite form field by field', async () => {
    const res = await ownerAgent.post(`${base}/team/invites`).send({ email: 'nope', role: 'boss' }).expect(400);
    expect(res.body.issues.map((i: { path: string[] }) => i.path[0]).sort()).toEqual(['email', 'role']);
  });

  it('keeps at least one owner: the last owner cannot be demoted or removed', async () => {
    const em = t.orm.em.fork();
    const solo = await createStudio(em, { slug: 'solo-studio' });
    const soloOwner = await createMember(em, solo, 'owner');
    const agent = await agentFor(t.app, soloOwner.user);
    const demote = await agent
      .patch(`/api/studios/solo-studio/team/members/${soloOwner.membership.id}`)
      .send({ role: 'staff' })
      .expect(409);
    expect(demote.body.message).toBe('A studio needs at least one owner. Make another member an owner first.');
    await agent.delete(`/api/studios/solo-studio/team/members/${soloOwner.membership.id}`).expect(409);

    const second = await createMember(t.orm.em.fork(), solo, 'staff');
    await agent.patch(`/api/studios/solo-studio/team/members/${second.membership.id}`).send({ role: 'owner' }).expect(204);
    await agent.patch(`/api/studios/solo-studio/team/members/${soloOwner.membership.id}`).send({ role: 'staff' }).expect(204);
    const roles = await t.orm.em.fork().find(Membership, { studio: solo }, withoutTenantFilter);
    expect(roles.map((m) => m.role).sort()).toEqual(['owner', 'staff']);
  });

  it('answers 404 for a member id of another studio', async () => {
    const em = t.orm.em.fork();
    const elsewhere = await createStudio(em, { slug: 'elsewhere-studio' });
    const theirs = await createMember(em, elsewhere, 'staff');
    await ownerAgent.delete(`${base}/team/members/${theirs.membership.id}`).expect(404);
    await ownerAgent.patch(`${base}/team/members/not-a-uuid`).send({ role: 'staff' }).expect(404);
  });
});
