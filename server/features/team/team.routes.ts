import type { EntityManager } from '@mikro-orm/postgresql';
import { changeRoleInputSchema, createInviteInputSchema } from '../../../shared/schemas/team.ts';
import type { Env } from '../../env.ts';
import type { Orm } from '../../db/orm.ts';
import type { RateLimits } from '../../lib/rate-limits.ts';
import type { WorkspaceRoute } from '../../middleware/workspace-routes.ts';
import { changeRole, createInvite, findTeam, removeMember, revokeInvite } from './team.service.ts';

/** The Team page's API: members, roles, invites. Owners only (team:manage). */
export function teamRoutes({ orm, env, limits }: { orm: Orm; env: Env; limits: RateLimits }): WorkspaceRoute[] {
  const em = () => orm.em as EntityManager;
  return [
    {
      method: 'get',
      path: '/team',
      permission: 'team:manage',
      handler: async (req, res) => void res.json(await findTeam(em(), req.studio!)),
    },
    {
      method: 'post',
      path: '/team/invites',
      permission: 'team:manage',
      sample: () => ({ body: { email: `new-${Math.random().toString(36).slice(2)}@example.com`, role: 'staff' } }),
      handler: async (req, res) => {
        const input = createInviteInputSchema.parse(req.body);
        await limits.consume('invite', req.studio!.id);
        const invite = await createInvite(em(), req.studio!, req.user!, input, env.APP_URL);
        res.status(201).json({ id: invite.id, email: invite.email, role: invite.role, expiresAt: invite.expiresAt.toISOString(), createdAt: invite.createdAt.toISOString() });
      },
    },
    {
      method: 'delete',
      path: '/team/invites/:inviteId',
      permission: 'team:manage',
      sample: async (f) => ({ params: { inviteId: await f.makeInvite() } }),
      handler: async (req, res) => {
        await revokeInvite(em(), req.studio!, String(req.params.inviteId), req.user!);
        res.status(204).end();
      },
    },
    {
      method: 'patch',
      path: '/team/members/:memberId',
      permission: 'team:manage',
      sample: async (f) => ({ params: { memberId: await f.makeMember() }, body: { role: 'owner' } }),
      handler: async (req, res) => {
        const { role } = changeRoleInputSchema.parse(req.body);
        await changeRole(em(), req.studio!, String(req.params.memberId), role, req.user!);
        res.status(204).end();
      },
    },
    {
      method: 'delete',
      path: '/team/members/:memberId',
      permission: 'team:manage',
      sample: async (f) => ({ params: { memberId: await f.makeMember() } }),
      handler: async (req, res) => {
        await removeMember(em(), req.studio!, String(req.params.memberId), req.user!);
        res.status(204).end();
      },
    },
  ];
}
