import { ROLE_PERMISSIONS } from '../../../shared/permissions.ts';
import type { WorkspaceRoute } from '../../middleware/workspace-routes.ts';

/** The workspace's view of its own studio, and what the member may do there. */
export function studioRoutes(): WorkspaceRoute[] {
  return [
    {
      method: 'get',
      path: '/',
      permission: 'studio:read',
      handler: (req, res) => {
        const s = req.studio!;
        res.json({
          studio: { slug: s.slug, name: s.name, accentColour: s.accentColour, currency: s.currency, units: s.units, contactEmail: s.contactEmail, status: s.status },
          role: req.role,
          permissions: ROLE_PERMISSIONS[req.role!],
        });
      },
    },
  ];
}
