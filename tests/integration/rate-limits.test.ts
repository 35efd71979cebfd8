import request from 'supertest';
import { beforeAll, describe, expect, it } from 'vitest';
import { Studio } from '#server/features/studios/studio.entity.ts';
import { Invite } from '#server/features/team/invite.entity.ts';
import { agentFor, createMember, createStudio } from '../support/factories.ts';
import { useTestApp } from '../support/test-app.ts';

/**
 * Rate limits outside sign-in (which auth.test covers): opening studios, sending invitations,
 * making accounts from invitation links, and taking in buyers' photos. Each answers 429 with
 * a clear message and a Retry-After header (RFC 9110 §10.2.3) once spent, counts well-formed
 * attempts only, and keeps one caller's count apart from another's.
 */
describe('rate limits', () => {
  const t = useTestApp();
  // The app trusts its loopback proxy, so each test caller can stand for a different address.
  const from = (ip: string) => ({ 'x-forwarded-for': ip });
  let studio: Studio;

  beforeAll(async () => {
    studio = await createStudio(t.orm.em.fork(), { slug: 'busy-bench' });
  });

  async function spend(allowed: number, call: (i: number) => Promise<request.Response>, okStatus: number[]) {
    for (let i = 0; i < allowed; i++) expect(okStatus).toContain((await call(i)).status);
    return call(allowed);
  }

  function expectLimited(res: request.Response, message: RegExp) {
    expect(res.status).toBe(429);
    expect(res.body.code).toBe('RATE_LIMITED');
    expect(res.body.message).toMatch(message);
    expect(Number(res.headers['retry-after'])).toBeGreaterThan(0);
  }

  it('limits studios opened from one address, not counting refused forms', async () => {
    const { points } = t.limits.allowance('signUp');
    const open = (i: number, ip = '198.51.100.7') =>
      request(t.app)
        .post('/api/accounts/studios')
        .set(from(ip))
        .send({
          studioName: `Bench ${i}`,
          slug: `bench-${i}`,
          ownerName: 'Noor Hale',
          email: `noor${i}@bench.test`,
          password: 'a long enough password',
        });
    // Forms the schema refuses cost nothing.
    for (let i = 0; i < points + 2; i++)
      await request(t.app).post('/api/accounts/studios').set(from('198.51.100.7')).send({ slug: 'x' }).expect(400);
    const over = await spend(points, (i) => open(i), [201]);
    expectLimited(over, /^Too many studios have been opened from this address\. Try again in \d+ minutes?\.$/);
    expect(await t.orm.em.fork().count(Studio, { slug: `bench-${points}` })).toBe(0);
    // Someone else is not held up.
    await open(points, '198.51.100.8').expect(201);
  });

  it('limits invitations per studio, whoever sends them', async () => {
    const { points } = t.limits.allowance('invite');
    const owner = await agentFor(t.app, (await createMember(t.orm.em.fork(), studio, 'owner')).user);
    const invite = (i: number) => owner.post('/api/studios/busy-bench/team/invites').send({ email: `guest${i}@bench.test`, role: 'staff' });
    const over = await spend(points, invite, [201]);
    expectLimited(over, /^This studio has sent too many invitations today\. Try again in \d+ (hours|minutes)\.$/);
    expect(await t.orm.em.fork().count(Invite, { email: `guest${points}@bench.test` }, { filters: false })).toBe(0);
  });

  it('limits accounts made from invitation links, so tokens cannot be tried at will', async () => {
    const { points } = t.limits.allowance('inviteAccount');
    const make = (i: number) =>
      request(t.app)
        .post(`/api/invites/${'t'.repeat(30)}${i}/accept-with-account`)
        .set(from('203.0.113.9'))
        .send({ name: 'Pim Ray', password: 'a long enough password' });
    const over = await spend(points, make, [404]);
    expectLimited(over, /^Too many accounts have been made from this address\./);
  });

  it('limits photos taken in from one address', async () => {
    const { points } = t.limits.allowance('photoAccept');
    const accept = (ip: string) =>
      request(t.app).post('/api/storefront/busy-bench/buyer-photos').set(from(ip)).send({ key: 'uploads/none/buyer-photos/missing' });
    const over = await spend(points, () => accept('192.0.2.44'), [404]);
    expectLimited(over, /^Too many photos have been uploaded from this address\. Try again in \d+ minutes?\.$/);
    expect((await accept('192.0.2.45')).status).toBe(404);
  });
});
