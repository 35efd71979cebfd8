import type { EntityManager } from '@mikro-orm/postgresql';
import { Router, type Request, type Response } from 'express';
import { AppError } from '#shared/errors.ts';
import type { Permission, Role } from '#shared/permissions.ts';
import type { User } from '../features/accounts/user.entity.ts';
import type { Studio } from '../features/studios/studio.entity.ts';
import type { Auth } from '../auth/auth.ts';
import type { Orm } from '../db/orm.ts';
import { requirePermission, requireUser, studioContext } from './auth-guards.ts';

/**
 * A workspace route: everything under /api/studios/:studioSlug. Declared as data so that the
 * router is built from the list, and the isolation tests walk the same list — a new route is
 * covered by them without anyone remembering to add it.
 */
export type WorkspaceRoute = {
  method: 'get' | 'post' | 'patch' | 'put' | 'delete';
  /** Below /api/studios/:studioSlug, e.g. '/team/members/:memberId'. */
  path: string;
  permission: Permission;
  handler: (context: WorkspaceContext, req: Request, res: Response) => Promise<void> | void;
  /** A valid call for the tests: path params and body, given fixtures of the studio. */
  sample?: (
    fixtures: WorkspaceFixtures,
  ) => Promise<{ params?: Record<string, string>; body?: unknown }> | { params?: Record<string, string>; body?: unknown };
};

/**
 * What every workspace handler works with, set by the guards before it runs: the studio of the
 * address, the signed-in member and their role, and the request's entity manager (its tenant
 * filter already on).
 */
export type WorkspaceContext = { studio: Studio; user: User; role: Role; em: EntityManager };

/** The handler's context from what the guards put on the request; a missing guard is our bug, a 500. */
function workspaceContext(req: Request, orm: Orm): WorkspaceContext {
  const { studio, user, role } = req;
  if (!studio || !user || !role) throw new AppError('INTERNAL', 'A workspace route ran without its guards.');
  return { studio, user, role, em: orm.em };
}

/** What the isolation tests give a route's sample: ids of records in the studio under test. */
export type WorkspaceFixtures = {
  studioId: string;
  ownerId: string;
  staffId: string;
  makeMember(): Promise<string>;
  makeInvite(): Promise<string>;
  /** A fresh catalog record of the studio under test; returns its id. */
  catalog(kind: 'material' | 'machine' | 'recipe' | 'blank' | 'size' | 'photo'): Promise<string>;
  /** The key of a small photo uploaded to storage as a browser would, under this purpose. */
  upload(purpose: 'blank-photos' | 'logo'): Promise<string>;
  shippingRate(): Promise<string>;
  /** A paid order with one item waiting for photo review, its photo stored. */
  orderItem(options?: {
    paid?: boolean;
    stage?: 'photo_review' | 'prep' | 'changes_requested' | 'approved' | 'burned';
  }): Promise<{ orderId: string; itemId: string; photoId: string }>;
  /** An item in production in a batch of its own, its render done (files stored) or failed. */
  production(render: 'done' | 'failed'): Promise<{ orderId: string; itemId: string; batchId: string; renderId: string }>;
};

export function workspaceRouter({ auth, orm, routes }: { auth: Auth; orm: Orm; routes: WorkspaceRoute[] }): Router {
  const router = Router({ mergeParams: true });
  router.use(requireUser(auth), studioContext(orm));
  for (const route of routes)
    router[route.method](route.path, requirePermission(route.permission), (req, res) =>
      route.handler(workspaceContext(req, orm), req, res),
    );
  return router;
}
