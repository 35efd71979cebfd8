import request from 'supertest';
import type { Express } from 'express';
import type { EntityManager } from '@mikro-orm/postgresql';
import type { Role } from '#shared/permissions.ts';
import { Studio } from '#server/features/studios/studio.entity.ts';
import { User } from '#server/features/accounts/user.entity.ts';
import { Membership } from '#server/features/team/membership.entity.ts';
import { hashPassword } from '#server/auth/password.ts';

export const TEST_PASSWORD = 'correct horse battery';
let passwordHash: Promise<string> | undefined;
let counter = 0;
const unique = () => `${Date.now().toString(36)}${(counter++).toString(36)}`;

export async function createUser(
  em: EntityManager,
  overrides: Partial<Pick<User, 'email' | 'name' | 'isPlatformAdmin'>> & { password?: boolean } = {},
): Promise<User> {
  const user = em.create(User, {
    email: overrides.email ?? `person-${unique()}@example.com`,
    name: overrides.name ?? 'Test Person',
    passwordHash: overrides.password === false ? null : await (passwordHash ??= hashPassword(TEST_PASSWORD)),
    emailVerifiedAt: new Date(),
    isPlatformAdmin: overrides.isPlatformAdmin ?? false,
  });
  await em.flush();
  return user;
}

export async function createStudio(em: EntityManager, overrides: Partial<Pick<Studio, 'slug' | 'name' | 'status'>> = {}): Promise<Studio> {
  const studio = em.create(Studio, {
    slug: overrides.slug ?? `studio-${unique()}`,
    name: overrides.name ?? 'Test Studio',
    status: overrides.status,
  });
  await em.flush();
  return studio;
}

export async function createMember(
  em: EntityManager,
  studio: Studio,
  role: Role,
  user?: User,
): Promise<{ user: User; membership: Membership }> {
  const member = user ?? (await createUser(em));
  const membership = em.create(Membership, { studio, user: member, role });
  await em.flush();
  return { user: member, membership };
}

/** Signs an agent in with a password through the sign-in service's form flow; returns the redirect URL. */
export async function signIn(agent: ReturnType<typeof request.agent>, email: string, password = TEST_PASSWORD) {
  const csrf = await agent.get('/api/auth/csrf').expect(200);
  const res = await agent
    .post('/api/auth/callback/credentials')
    .set('x-auth-return-redirect', '1')
    .type('form')
    .send({ csrfToken: csrf.body.csrfToken, email, password });
  return res;
}

/** A new agent signed in as this user. */
export async function agentFor(app: Express, user: User) {
  const agent = request.agent(app);
  const res = await signIn(agent, user.email);
  if (res.status !== 200 || String(res.body.url).includes('error='))
    throw new Error(`sign-in failed for ${user.email}: ${res.status} ${JSON.stringify(res.body)}`);
  return agent;
}
