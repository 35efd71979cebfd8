import type { Request, RequestHandler } from 'express';
import { AppError } from '#shared/errors.ts';
import { can, type Permission } from '#shared/permissions.ts';
import { studioSlugSchema } from '#shared/studio.ts';
import type { Auth } from '../auth/auth.ts';
import type { Orm } from '../db/orm.ts';
import { TENANT_FILTER } from '../db/tenant.ts';
import { Membership } from '../features/team/membership.entity.ts';
import { Studio } from '../features/studios/studio.entity.ts';
import type { User } from '../features/accounts/user.entity.ts';

/** 401 unless someone is signed in; sets req.user. */
export function requireUser(auth: Auth): RequestHandler {
  return async (req, _res, next) => {
    const user = await auth.currentUser(req);
    if (!user) throw new AppError('UNAUTHENTICATED', 'Please sign in first.');
    req.user = user;
    next();
  };
}

/** The user `requireUser` put on the request: the typed way for a handler behind it to read it. */
export function signedInUser(req: Request): User {
  if (!req.user) throw new AppError('INTERNAL', 'A route for signed-in people ran without requireUser.');
  return req.user;
}

/** Sets req.user when someone is signed in; never refuses. */
export function optionalUser(auth: Auth): RequestHandler {
  return async (req, _res, next) => {
    req.user = (await auth.currentUser(req)) ?? undefined;
    next();
  };
}

/**
 * Resolves `:studioSlug`, finds the signed-in user's membership and turns the tenant filter on
 * for the rest of the request. Not a member → 404, exactly as for a studio that does not
 * exist: a workspace never confirms that another studio's records exist.
 */
export function studioContext(orm: Orm): RequestHandler {
  return async (req, _res, next) => {
    const slug = studioSlugSchema.safeParse(req.params.studioSlug);
    const user = req.user;
    if (!user) throw new AppError('UNAUTHENTICATED', 'Please sign in first.');
    const studio = slug.success ? await orm.em.findOne(Studio, { slug: slug.data }) : null;
    const membership = studio
      ? await orm.em.findOne(Membership, { studio, user }, { filters: { [TENANT_FILTER]: { studioId: studio.id } } })
      : null;
    if (!studio || !membership) throw new AppError('NOT_FOUND', 'There is no studio at this address, or you are not a member of it.');
    req.studio = studio;
    req.role = membership.role;
    orm.em.setFilterParams(TENANT_FILTER, { studioId: studio.id });
    next();
  };
}

/** 403 unless the member's role has the permission (see shared/permissions.ts). */
export function requirePermission(permission: Permission): RequestHandler {
  return (req, _res, next) => {
    if (!can(req.role, permission)) throw new AppError('FORBIDDEN', 'Your role in this studio does not allow this. Ask an owner.');
    next();
  };
}

/** Platform pages: platform admins only; 404 for everyone else, so the pages stay unlisted. */
export const requirePlatformAdmin: RequestHandler = (req, _res, next) => {
  if (!req.user?.isPlatformAdmin) throw new AppError('NOT_FOUND', 'Not found.');
  next();
};
