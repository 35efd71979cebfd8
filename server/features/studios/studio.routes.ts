import type { Request } from 'express';
import type { EntityManager } from '@mikro-orm/postgresql';
import { ROLE_PERMISSIONS } from '../../../shared/permissions.ts';
import { orderSettingsInputSchema, studioSettingsInputSchema } from '../../../shared/studio.ts';
import type { Orm } from '../../db/orm.ts';
import type { WorkspaceRoute } from '../../middleware/workspace-routes.ts';

const describe = (req: Request) => {
  const s = req.studio!;
  return {
    studio: { slug: s.slug, name: s.name, accentColour: s.accentColour, currency: s.currency, units: s.units, contactEmail: s.contactEmail, status: s.status },
    orders: { lowResolutionPolicy: s.lowResolutionPolicy, pickupEnabled: s.pickupEnabled, pickupNote: s.pickupNote },
    role: req.role,
    permissions: ROLE_PERMISSIONS[req.role!],
  };
};

/** The workspace's view of its own studio, what the member may do there, and its settings. */
export function studioRoutes({ orm }: { orm: Orm }): WorkspaceRoute[] {
  return [
    {
      method: 'get',
      path: '/',
      permission: 'studio:read',
      handler: (req, res) => void res.json(describe(req)),
    },
    {
      method: 'put',
      path: '/settings',
      permission: 'studio:settings',
      sample: () => ({ body: { name: 'Matrix Studio', accentColour: '#224466', currency: 'EUR', units: 'mm', contactEmail: '' } }),
      handler: async (req, res) => {
        const input = studioSettingsInputSchema.parse(req.body);
        (orm.em as EntityManager).assign(req.studio!, input);
        await orm.em.flush();
        res.json(describe(req));
      },
    },
    {
      method: 'put',
      path: '/settings/orders',
      permission: 'studio:settings',
      sample: () => ({ body: { lowResolutionPolicy: 'refuse', pickupEnabled: true, pickupNote: 'At the workshop, weekdays.' } }),
      handler: async (req, res) => {
        (orm.em as EntityManager).assign(req.studio!, orderSettingsInputSchema.parse(req.body));
        await orm.em.flush();
        res.json(describe(req));
      },
    },
  ];
}
