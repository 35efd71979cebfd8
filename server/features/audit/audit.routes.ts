import type { EntityManager } from '@mikro-orm/postgresql';
import { auditListQuerySchema } from '../../../shared/schemas/audit.ts';
import type { Orm } from '../../db/orm.ts';
import type { WorkspaceRoute } from '../../middleware/workspace-routes.ts';
import { listAudit } from './audit.service.ts';

/** The audit log's API: owners read it (audit:read); nobody writes it but the features themselves. */
export function auditRoutes({ orm }: { orm: Orm }): WorkspaceRoute[] {
  const em = () => orm.em as EntityManager;
  return [
    {
      method: 'get', path: '/audit', permission: 'audit:read',
      handler: async (req, res) => void res.json(await listAudit(em(), req.studio!, auditListQuerySchema.parse(req.query))),
    },
  ];
}
