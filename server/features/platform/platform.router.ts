import { Router } from 'express';
import { AppError } from '#shared/errors.ts';
import type { Orm } from '#server/db/orm.ts';
import type { Auth } from '#server/auth/auth.ts';
import { requirePlatformAdmin, requireUser, signedInUser } from '#server/middleware/auth-guards.ts';
import { findStudioBySlug } from '../studios/studios.service.ts';

/** Platform admin pages' API (`/api/platform`): studios with counts; suspend and resume. */
export function platformRouter({ orm, auth }: { orm: Orm; auth: Auth }): Router {
  const router = Router();
  const em = () => orm.em;
  router.use(requireUser(auth), requirePlatformAdmin);

  router.get('/studios', async (_req, res) => {
    // Counts only: the platform page never reads a studio's buyers or photos.
    const rows = await em()
      .getConnection()
      .execute<Array<{ slug: string; name: string; status: string; created_at: Date; owners: string; staff: string }>>(
        `select s.slug, s.name, s.status, s.created_at,
              count(m.id) filter (where m.role = 'owner') as owners,
              count(m.id) filter (where m.role = 'staff') as staff
         from studio s left join membership m on m.studio_id = s.id
        group by s.id order by s.name`,
      );
    res.json({
      studios: rows.map((r) => ({
        slug: r.slug,
        name: r.name,
        status: r.status,
        createdAt: new Date(r.created_at).toISOString(),
        owners: Number(r.owners),
        staff: Number(r.staff),
      })),
    });
  });

  for (const action of ['suspend', 'resume'] as const) {
    router.post(`/studios/:studioSlug/${action}`, async (req, res) => {
      const studio = await findStudioBySlug(em(), req.params.studioSlug as string);
      const status = action === 'suspend' ? 'suspended' : 'active';
      if (studio.status === status) throw new AppError('CONFLICT', `The studio is already ${status}.`);
      studio.status = status;
      await em().flush();
      req.log.info({ studio: studio.slug, by: signedInUser(req).id, action }, 'platform: studio status changed');
      res.json({ slug: studio.slug, status });
    });
  }
  return router;
}
