import { changeRoleInputSchema, createInviteInputSchema } from '#shared/schemas/team.ts';
import type { Env } from '#server/env.ts';
import type { RateLimits } from '#server/lib/rate-limits.ts';
import type { WorkspaceRoute } from '#server/middleware/workspace-routes.ts';
import { changeRole, createInvite, findTeam, removeMember, revokeInvite } from './team.service.ts';

/** The Team page's API: members, roles, invites. Owners only (team:manage). */
export function teamRoutes({ env, limits }: { env: Env; limits: RateLimits }): WorkspaceRoute[] {
  return [
    {
      method: 'get',
      path: '/team',
      permission: 'team:manage',
      handler: async (ctx, req, res) => void res.json(await findTeam(ctx.em, ctx.studio)),
    },
    {
      method: 'post',
      path: '/team/invites',
      permission: 'team:manage',
      sample: () => ({ body: { email: `new-${Math.random().toString(36).slice(2)}@example.com`, role: 'staff' } }),
      handler: async (ctx, req, res) => {
        const input = createInviteInputSchema.parse(req.body);
        await limits.consume('invite', ctx.studio.id);
        const invite = await createInvite(ctx.em, ctx.studio, ctx.user, input, env.APP_URL);
        res.status(201).json({
          id: invite.id,
          email: invite.email,
          role: invite.role,
          expiresAt: invite.expiresAt.toISOString(),
          createdAt: invite.createdAt.toISOString(),
        });
      },
    },
    {
      method: 'delete',
      path: '/team/invites/:inviteId',
      permission: 'team:manage',
      sample: async (f) => ({ params: { inviteId: await f.makeInvite() } }),
      handler: async (ctx, req, res) => {
        await revokeInvite(ctx.em, ctx.studio, String(req.params.inviteId), ctx.user);
        res.status(204).end();
      },
    },
    {
      method: 'patch',
      path: '/team/members/:memberId',
      permission: 'team:manage',
      sample: async (f) => ({ params: { memberId: await f.makeMember() }, body: { role: 'owner' } }),
      handler: async (ctx, req, res) => {
        const { role } = changeRoleInputSchema.parse(req.body);
        await changeRole(ctx.em, ctx.studio, String(req.params.memberId), role, ctx.user);
        res.status(204).end();
      },
    },
    {
      method: 'delete',
      path: '/team/members/:memberId',
      permission: 'team:manage',
      sample: async (f) => ({ params: { memberId: await f.makeMember() } }),
      handler: async (ctx, req, res) => {
        await removeMember(ctx.em, ctx.studio, String(req.params.memberId), ctx.user);
        res.status(204).end();
      },
    },
  ];
}
