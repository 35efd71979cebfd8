import { Router } from 'express';
import { acceptWithAccountInputSchema } from '#shared/schemas/team.ts';
import type { Orm } from '#server/db/orm.ts';
import type { Auth } from '#server/auth/auth.ts';
import type { RateLimits } from '#server/lib/rate-limits.ts';
import { requireUser, signedInUser } from '#server/middleware/auth-guards.ts';
import { acceptInvite, acceptInviteWithNewAccount, previewInvite } from './team.service.ts';

/** The invitee's side, by the token in the e-mailed link (`/api/invites/:token`). */
export function invitesRouter({ orm, auth, limits }: { orm: Orm; auth: Auth; limits: RateLimits }): Router {
  const router = Router();
  const em = () => orm.em;
  router.get('/:token', async (req, res) => void res.json(await previewInvite(em(), String(req.params.token))));
  router.post(
    '/:token/accept',
    requireUser(auth),
    async (req, res) => void res.json(await acceptInvite(em(), String(req.params.token), signedInUser(req))),
  );
  router.post('/:token/accept-with-account', async (req, res) => {
    const input = acceptWithAccountInputSchema.parse(req.body);
    await limits.consume('inviteAccount', req.ip ?? 'unknown');
    res.status(201).json(await acceptInviteWithNewAccount(em(), String(req.params.token), input));
  });
  return router;
}
