import { Router } from 'express';
import { openStudioInputSchema } from '#shared/schemas/accounts.ts';
import type { Env } from '#server/env.ts';
import type { Orm } from '#server/db/orm.ts';
import type { Auth } from '#server/auth/auth.ts';
import type { RateLimits } from '#server/lib/rate-limits.ts';
import { optionalUser, requireUser, signedInUser } from '#server/middleware/auth-guards.ts';
import { checkSlug, confirmEmail, describeMe, openStudio, signOutEverywhere } from './accounts.service.ts';

/** Opening a studio, e-mail confirmation, and the signed-in person (`/api/accounts`, `/api/me`). */
export function accountsRouter({ orm, env, auth, limits }: { orm: Orm; env: Env; auth: Auth; limits: RateLimits }): Router {
  const router = Router();
  const em = () => orm.em;

  router.get('/accounts/slug-availability', async (req, res) => {
    res.json(await checkSlug(em(), String(req.query.slug ?? '')));
  });

  router.post('/accounts/studios', async (req, res) => {
    const input = openStudioInputSchema.parse(req.body);
    await limits.consume('signUp', req.ip ?? 'unknown');
    const { studio } = await openStudio(em(), input, env.APP_URL);
    res.status(201).json({ studioSlug: studio.slug });
  });

  router.get('/accounts/verify-email', async (req, res) => {
    const ok = await confirmEmail(em(), String(req.query.token ?? ''));
    res.redirect(303, ok ? '/sign-in?verified=1' : '/sign-in?verified=0');
  });

  router.get('/me', optionalUser(auth), async (req, res) => {
    res.json(await describeMe(em(), req.user));
  });

  router.post('/me/sign-out-everywhere', requireUser(auth), async (req, res) => {
    await signOutEverywhere(em(), signedInUser(req));
    res.status(204).end();
  });

  return router;
}
