import type { EntityManager } from '@mikro-orm/postgresql';
import { absolute, platformPaths, workspacePaths } from '#shared/routes.ts';
import { AppError } from '#shared/errors.ts';
import type { Role } from '#shared/permissions.ts';
import type { CreateInviteInput, InvitePreview, Team } from '#shared/schemas/team.ts';
import { withoutTenantFilter } from '#server/db/tenant.ts';
import { hashPassword } from '#server/auth/password.ts';
import { hashToken, isUuid, maskEmail, newLinkToken } from '#server/lib/tokens.ts';
import { displayName, User } from '../accounts/user.entity.ts';
import type { Studio } from '../studios/studio.entity.ts';
import { Invite } from './invite.entity.ts';
import { Membership } from './membership.entity.ts';
import { queueEmail } from '../outbox/outbox.service.ts';
import { inviteMail } from './team-mail.ts';
import { recordAudit } from '../audit/audit.service.ts';

const teamLink = (studio: Studio) => workspacePaths.team(studio.slug);
const memberName = (user: User) => (user.name ? `${user.name} (${user.email})` : user.email);

export const INVITE_VALID_DAYS = 7;

/** Members and open invites of the studio in context (the tenant filter scopes both). */
export async function findTeam(em: EntityManager, studio: Studio): Promise<Team> {
  const members = await em.find(Membership, { studio }, { populate: ['user'], orderBy: { role: 'asc', createdAt: 'asc' } });
  const invites = await em.find(
    Invite,
    { studio, usedAt: null, revokedAt: null, expiresAt: { $gt: new Date() } },
    { orderBy: { createdAt: 'desc' } },
  );
  return {
    members: members.map((m) => ({
      id: m.id,
      userId: m.user.id,
      email: m.user.email,
      name: m.user.name,
      role: m.role,
      joinedAt: m.createdAt.toISOString(),
    })),
    invites: invites.map((i) => ({
      id: i.id,
      email: i.email,
      role: i.role,
      expiresAt: i.expiresAt.toISOString(),
      createdAt: i.createdAt.toISOString(),
    })),
  };
}

/** Creates the invite and queues its e-mail, in one transaction. */
export async function createInvite(
  em: EntityManager,
  studio: Studio,
  invitedBy: User,
  input: CreateInviteInput,
  appUrl: string,
): Promise<Invite> {
  const existing = await em.findOne(Membership, { studio, user: { email: input.email } });
  if (existing) {
    const message = 'This person is already a member of the studio.';
    throw new AppError('CONFLICT', message, { issues: [{ path: ['email'], message }] });
  }
  const { token, hash } = newLinkToken();
  return em.transactional(async (tx) => {
    // A new invite to the same address replaces the open one, so only the newest link works.
    await tx.nativeUpdate(Invite, { studio, email: input.email, usedAt: null, revokedAt: null }, { revokedAt: new Date() });
    const invite = tx.create(Invite, {
      studio,
      email: input.email,
      role: input.role,
      tokenHash: hash,
      expiresAt: new Date(Date.now() + INVITE_VALID_DAYS * 86_400_000),
      invitedBy,
    });
    const url = absolute(appUrl, platformPaths.invite(token));
    queueEmail(tx, {
      to: input.email,
      ...inviteMail({ studioName: studio.name, inviterName: displayName(invitedBy), role: input.role, url, validDays: INVITE_VALID_DAYS }),
    });
    recordAudit(tx, studio, invitedBy, {
      action: 'invite.sent',
      subject: input.email,
      summary: `Invited ${input.email} to join as ${input.role}.`,
      link: teamLink(studio),
      details: { inviteId: invite.id, role: input.role },
    });
    return invite;
  });
}

export async function revokeInvite(em: EntityManager, studio: Studio, inviteId: string, actor: User): Promise<void> {
  const invite = isUuid(inviteId) ? await em.findOne(Invite, { id: inviteId, studio }) : null;
  if (!invite) throw new AppError('NOT_FOUND', 'There is no such invite.');
  if (!invite.revokedAt) {
    invite.revokedAt = new Date();
    recordAudit(em, studio, actor, {
      action: 'invite.revoked',
      subject: invite.email,
      summary: `Withdrew the invitation to ${invite.email} (${invite.role}).`,
      link: teamLink(studio),
      details: { inviteId: invite.id },
    });
  }
  await em.flush();
}

async function findMember(em: EntityManager, studio: Studio, memberId: string): Promise<Membership> {
  const member = isUuid(memberId) ? await em.findOne(Membership, { id: memberId, studio }, { populate: ['user'] }) : null;
  if (!member) throw new AppError('NOT_FOUND', 'There is no such member.');
  return member;
}

/** A studio always keeps at least one owner. Checked under a row lock on the studio's owners. */
async function ensureAnotherOwner(em: EntityManager, studio: Studio, leaving: Membership): Promise<void> {
  if (leaving.role !== 'owner') return;
  const owners = await em
    .getConnection()
    .execute<Array<{ id: string }>>("select id from membership where studio_id = ? and role = 'owner' for update", [studio.id]);
  if (owners.length <= 1) throw new AppError('CONFLICT', 'A studio needs at least one owner. Make another member an owner first.');
}

export async function changeRole(em: EntityManager, studio: Studio, memberId: string, role: Role, actor: User): Promise<void> {
  await em.transactional(async (tx) => {
    const member = await findMember(tx, studio, memberId);
    if (member.role === role) return;
    await ensureAnotherOwner(tx, studio, member);
    recordAudit(tx, studio, actor, {
      action: 'member.role_changed',
      subject: memberName(member.user),
      summary: `Changed the role of ${memberName(member.user)} from ${member.role} to ${role}.`,
      link: teamLink(studio),
      details: { userId: member.user.id, from: member.role, to: role },
    });
    member.role = role;
  });
}

export async function removeMember(em: EntityManager, studio: Studio, memberId: string, actor: User): Promise<void> {
  await em.transactional(async (tx) => {
    const member = await findMember(tx, studio, memberId);
    await ensureAnotherOwner(tx, studio, member);
    recordAudit(tx, studio, actor, {
      action: 'member.removed',
      subject: memberName(member.user),
      summary: `Removed ${memberName(member.user)} (${member.role}) from the studio.`,
      link: teamLink(studio),
      details: { userId: member.user.id, role: member.role },
    });
    tx.remove(member);
  });
}

// ---- the invitee's side: by token, before any studio context exists ---------------------------

async function findInviteByToken(em: EntityManager, token: string): Promise<Invite> {
  const invite = /^[\w-]{20,100}$/.test(token)
    ? await em.findOne(Invite, { tokenHash: hashToken(token) }, { ...withoutTenantFilter, populate: ['studio'] })
    : null;
  if (!invite) throw new AppError('NOT_FOUND', 'This invitation link is not valid. Ask the studio for a new one.');
  return invite;
}

function inviteStatus(invite: Invite): InvitePreview['status'] {
  if (invite.usedAt) return 'used';
  if (invite.revokedAt) return 'revoked';
  if (invite.expiresAt <= new Date()) return 'expired';
  return 'open';
}

export async function previewInvite(em: EntityManager, token: string): Promise<InvitePreview> {
  const invite = await findInviteByToken(em, token);
  return {
    studioName: invite.studio.name,
    studioSlug: invite.studio.slug,
    email: invite.email,
    role: invite.role,
    status: inviteStatus(invite),
    hasAccount: (await em.count(User, { email: invite.email })) > 0,
  };
}

const unusable: Record<Exclude<InvitePreview['status'], 'open'>, string> = {
  used: 'This invitation has already been used.',
  revoked: 'This invitation was withdrawn. Ask the studio for a new one.',
  expired: 'This invitation has expired. Ask the studio for a new one.',
};

/**
 * Joins the studio with the invite's role. The invite is marked used by a conditional update, so
 * two clicks at once cannot both succeed.
 */
export async function acceptInvite(em: EntityManager, token: string, user: User): Promise<{ studioSlug: string }> {
  const invite = await findInviteByToken(em, token);
  const status = inviteStatus(invite);
  if (status !== 'open') throw new AppError('CONFLICT', unusable[status]);
  if (invite.email !== user.email) {
    throw new AppError('FORBIDDEN', `This invitation was sent to ${maskEmail(invite.email)}. Sign in with that address to accept it.`);
  }
  await em.transactional(async (tx) => {
    const taken = await tx.nativeUpdate(
      Invite,
      { id: invite.id, usedAt: null, revokedAt: null },
      { usedAt: new Date() },
      withoutTenantFilter,
    );
    if (taken !== 1) throw new AppError('CONFLICT', unusable.used);
    const member = await tx.findOne(Membership, { studio: invite.studio, user }, withoutTenantFilter);
    // Following the link proves the address.
    const fresh = await tx.findOneOrFail(User, { id: user.id });
    if (!member) {
      tx.create(Membership, { studio: invite.studio, user: fresh, role: invite.role });
      recordAudit(tx, invite.studio, fresh, {
        action: 'member.joined',
        subject: memberName(fresh),
        summary: `Joined as ${invite.role} through the invitation sent to ${invite.email}.`,
        link: teamLink(invite.studio),
        details: { inviteId: invite.id, role: invite.role },
      });
    }
    fresh.emailVerifiedAt ??= new Date();
  });
  return { studioSlug: invite.studio.slug };
}

/** For an invitee without an account: creates it (with a password) and accepts. */
export async function acceptInviteWithNewAccount(
  em: EntityManager,
  token: string,
  input: { name: string; password: string },
): Promise<{ studioSlug: string; email: string }> {
  const invite = await findInviteByToken(em, token);
  const status = inviteStatus(invite);
  if (status !== 'open') throw new AppError('CONFLICT', unusable[status]);
  if (await em.count(User, { email: invite.email })) {
    throw new AppError('CONFLICT', 'An account with this e-mail address already exists. Sign in to accept the invitation.');
  }
  const user = em.create(User, { email: invite.email, name: input.name, passwordHash: await hashPassword(input.password) });
  await em.flush();
  const { studioSlug } = await acceptInvite(em, token, user);
  return { studioSlug, email: user.email };
}
