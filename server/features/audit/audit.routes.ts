import { auditListQuerySchema } from '#shared/schemas/audit.ts';
import type { WorkspaceRoute } from '#server/middleware/workspace-routes.ts';
import { listAudit } from './audit.service.ts';

/** The audit log's API: owners read it (audit:read); nobody writes it but the features themselves. */
export function auditRoutes(): WorkspaceRoute[] {
  return [
    {
      method: 'get',
      path: '/audit',
      permission: 'audit:read',
      handler: async (ctx, req, res) => void res.json(await listAudit(ctx.em, ctx.studio, auditListQuerySchema.parse(req.query))),
    },
  ];
}
