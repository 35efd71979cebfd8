import { askNewPhotoInputSchema } from '#shared/schemas/workspace-orders.ts';
import type { Env } from '#server/env.ts';
import type { WorkspaceRoute } from '#server/middleware/workspace-routes.ts';
import { approvePhoto, askNewPhoto, reviewQueue } from './review.service.ts';

/** The photo review queue and its two answers: the photo will do, or a new one is needed. */
export function reviewRoutes({ env }: { env: Env }): WorkspaceRoute[] {
  return [
    {
      method: 'get',
      path: '/review-queue',
      permission: 'order:review',
      handler: async (ctx, req, res) => void res.json({ items: await reviewQueue(ctx.em, ctx.studio) }),
    },
    {
      method: 'post',
      path: '/items/:itemId/approve-photo',
      permission: 'order:review',
      sample: async (f) => ({ params: { itemId: (await f.orderItem()).itemId } }),
      handler: async (ctx, req, res) => {
        const item = await approvePhoto(ctx.em, ctx.studio, String(req.params.itemId), ctx.user);
        res.json({ itemId: item.id, stage: item.stage });
      },
    },
    {
      method: 'post',
      path: '/items/:itemId/ask-new-photo',
      permission: 'order:review',
      sample: async (f) => ({
        params: { itemId: (await f.orderItem()).itemId },
        body: { reason: 'low_resolution', note: 'Please send the original.' },
      }),
      handler: async (ctx, req, res) => {
        const item = await askNewPhoto(
          ctx.em,
          ctx.studio,
          String(req.params.itemId),
          ctx.user,
          askNewPhotoInputSchema.parse(req.body),
          env.APP_URL,
        );
        res.json({ itemId: item.id, stage: item.stage });
      },
    },
  ];
}
