import type { EntityManager } from '@mikro-orm/postgresql';
import { absolute, platformPaths } from '#shared/routes.ts';
import { AppError } from '#shared/errors.ts';
import type { OpenStudioInput, SlugAvailability, Me } from '#shared/schemas/accounts.ts';
import { studioSlugSchema } from '#shared/studio.ts';
import { withoutTenantFilter } from '#server/db/tenant.ts';
import { hashPassword } from '#server/auth/password.ts';
import { VerificationToken } from '#server/auth/verification-token.entity.ts';
import { hashToken, newLinkToken } from '#server/lib/tokens.ts';
import { Studio } from '../studios/studio.entity.ts';
import { Membership } from '../team/membership.entity.ts';
import { User } from './user.entity.ts';
import { queueEmail } from '../outbox/outbox.service.ts';
import { verifyEmailMail } from './accounts-mail.ts';
import { addMaterialLibrary } from '../catalog/catalog.service.ts';

/** Addresses the app itself uses or might: never a studio's. */
const RESERVED_SLUGS = new Set([
  'admin',
  'api',
  'app',
  'auth',
  'etchwell',
  'help',
  'invites',
  'platform',
  'settings',
  'sign-in',
  'sign-up',
  'static',
  'studio',
  'studios',
  'support',
  'www',
]);

export async function checkSlug(em: EntityManager, slug: string): Promise<SlugAvailability> {
  const parsed = studioSlugSchema.safeParse(slug);
  if (!parsed.success) return { slug, available: false, reason: parsed.error.issues[0]!.message };
  if (RESERVED_SLUGS.has(parsed.data)) return { slug, available: false, reason: 'This address is reserved.' };
  const taken = await em.count(Studio, { slug: parsed.data });
  return taken ? { slug, available: false, reason: 'Another studio already uses this address.' } : { slug, available: true };
}

const VERIFY_DAYS = 7;

/**
 * Opens a studio: the studio, its first owner (a new account with a password), the owner's
 * membership and the studio's own copy of the materials library, in one transaction, with the e-mail that asks the owner to confirm the address.
 */
export async function openStudio(em: EntityManager, input: OpenStudioInput, appUrl: string): Promise<{ studio: Studio; user: User }> {
  const availability = await checkSlug(em, input.slug);
  if (!availability.available) {
    throw new AppError('CONFLICT', availability.reason!, { issues: [{ path: ['slug'], message: availability.reason! }] });
  }
  if (await em.count(User, { email: input.email })) {
    const message = 'An account with this e-mail address already exists. Sign in with it, or use another address.';
    throw new AppError('CONFLICT', message, { issues: [{ path: ['email'], message }] });
  }
  const passwordHash = await hashPassword(input.password);
  const { token, hash } = newLinkToken();
  const result = await em.transactional(async (tx) => {
    const user = tx.create(User, { email: input.email, name: input.ownerName, passwordHash });
    const studio = tx.create(Studio, { slug: input.slug, name: input.studioName, contactEmail: input.email });
    tx.create(Membership, { studio, user, role: 'owner' });
    addMaterialLibrary(tx, studio);
    tx.create(VerificationToken, {
      identifier: `verify:${user.email}`,
      token: hash,
      expires: new Date(Date.now() + VERIFY_DAYS * 86_400_000),
    });
    const url = absolute(appUrl, platformPaths.confirmEmail(token));
    queueEmail(tx, { to: user.email, ...verifyEmailMail({ name: input.ownerName, studioName: studio.name, url }) });
    return { studio, user };
  });
  return result;
}

/** Confirms an e-mail address from the link; single use. */
export async function confirmEmail(em: EntityManager, token: string): Promise<boolean> {
  const rows = await em
    .getConnection()
    .execute<Array<{ identifier: string; expires: Date }>>(
      "delete from verification_token where token = ? and identifier like 'verify:%' returning identifier, expires",
      [hashToken(token)],
    );
  const row = rows[0];
  if (!row || new Date(row.expires) < new Date()) return false;
  const user = await em.findOne(User, { email: row.identifier.slice('verify:'.length) });
  if (!user) return false;
  user.emailVerifiedAt ??= new Date();
  await em.flush();
  return true;
}

export async function describeMe(em: EntityManager, user: User | undefined): Promise<Me> {
  if (!user) return { user: null, memberships: [] };
  const memberships = await em.find(
    Membership,
    { user },
    { ...withoutTenantFilter, populate: ['studio'], orderBy: { studio: { name: 'asc' } } },
  );
  return {
    user: {
      id: user.id,
      email: user.email,
      name: user.name,
      emailVerified: Boolean(user.emailVerifiedAt),
      isPlatformAdmin: user.isPlatformAdmin,
    },
    memberships: memberships.map((m) => ({ studioSlug: m.studio.slug, studioName: m.studio.name, role: m.role })),
  };
}

export async function signOutEverywhere(em: EntityManager, user: User): Promise<void> {
  user.sessionVersion += 1;
  await em.flush();
}
