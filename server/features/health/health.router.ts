import { Router } from 'express';
import type { Health } from '#shared/health.ts';
import type { Orm } from '#server/db/orm.ts';

/** `GET /api/health`: asks the database a real question; 503 when it cannot answer. */
export function healthRouter({ orm, version }: { orm: Orm; version: string }): Router {
  const router = Router();
  router.get('/', async (req, res) => {
    let db: Health['db'] = 'up';
    try {
      await orm.em.getConnection().execute('select 1');
    } catch (error) {
      req.log.warn({ err: error }, 'health: database unreachable');
      db = 'down';
    }
    const body: Health = { status: db === 'up' ? 'ok' : 'degraded', db, version };
    res.status(db === 'up' ? 200 : 503).json(body);
  });
  return router;
}
