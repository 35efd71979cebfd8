import { createBatchInputSchema, shipInputSchema } from '#shared/schemas/production.ts';
import type { Jobs } from '#server/adapters/jobs.ts';
import type { Storage } from '#server/adapters/storage.ts';
import type { Env } from '#server/env.ts';
import type { WorkspaceRoute } from '#server/middleware/workspace-routes.ts';
import { handOver } from '#server/features/fulfilment/handover.service.ts';
import {
  batchView,
  createBatch,
  findBatch,
  markBurned,
  productionBoard,
  renderDownload,
  retryRender,
  takeOutOfBatch,
} from './production.service.ts';

/** Production: the board of approved items, batches and their renders, downloads, burned, handed over. */
export function productionRoutes({ env, storage, jobs }: { env: Env; storage: Storage; jobs: Jobs }): WorkspaceRoute[] {
  return [
    {
      method: 'get',
      path: '/production',
      permission: 'order:read',
      handler: async (ctx, req, res) => void res.json(await productionBoard(ctx.em, ctx.studio)),
    },
    {
      method: 'post',
      path: '/production/batches',
      permission: 'order:produce',
      sample: async (f) => ({ body: { itemIds: [(await f.orderItem({ stage: 'approved' })).itemId] } }),
      handler: async (ctx, req, res) => {
        const batch = await createBatch(ctx.em, jobs, ctx.studio, ctx.user, createBatchInputSchema.parse(req.body).itemIds);
        res.status(201).json({ id: batch.id, number: batch.number });
      },
    },
    {
      method: 'get',
      path: '/production/batches/:batchId',
      permission: 'order:read',
      sample: async (f) => ({ params: { batchId: (await f.production('done')).batchId } }),
      handler: async (ctx, req, res) =>
        void res.json(batchView(ctx.studio, await findBatch(ctx.em, ctx.studio, String(req.params.batchId)), env.RENDER_TIMEOUT_SECONDS)),
    },
    {
      method: 'post',
      path: '/production/renders/:renderId/retry',
      permission: 'order:produce',
      sample: async (f) => ({ params: { renderId: (await f.production('failed')).renderId } }),
      handler: async (ctx, req, res) =>
        void res.json({
          status: (await retryRender(ctx.em, jobs, ctx.studio, String(req.params.renderId), env.RENDER_TIMEOUT_SECONDS)).status,
        }),
    },
    {
      method: 'get',
      path: '/production/renders/:renderId/files/:kind',
      permission: 'order:produce',
      sample: async (f) => ({ params: { renderId: (await f.production('done')).renderId, kind: 'engrave' } }),
      handler: async (ctx, req, res) =>
        void res.json(await renderDownload(ctx.em, storage, ctx.studio, String(req.params.renderId), String(req.params.kind), ctx.user)),
    },
    {
      method: 'post',
      path: '/items/:itemId/burned',
      permission: 'order:produce',
      sample: async (f) => ({ params: { itemId: (await f.production('done')).itemId } }),
      handler: async (ctx, req, res) =>
        void res.json({ stage: (await markBurned(ctx.em, ctx.studio, String(req.params.itemId), ctx.user)).stage }),
    },
    {
      method: 'post',
      path: '/items/:itemId/out-of-batch',
      permission: 'order:produce',
      sample: async (f) => ({ params: { itemId: (await f.production('failed')).itemId } }),
      handler: async (ctx, req, res) =>
        void res.json({ stage: (await takeOutOfBatch(ctx.em, storage, ctx.studio, String(req.params.itemId), ctx.user)).stage }),
    },
    {
      method: 'post',
      path: '/orders/:orderId/handover',
      permission: 'order:produce',
      sample: async (f) => {
        const { orderId, itemId } = await f.orderItem({ stage: 'burned' });
        return { params: { orderId }, body: { method: 'ship', itemIds: [itemId], carrier: 'Parcelway', trackingNumber: 'PW 1234 5678' } };
      },
      handler: async (ctx, req, res) => {
        const order = await handOver(ctx.em, ctx.studio, String(req.params.orderId), ctx.user, shipInputSchema.parse(req.body));
        res.json({ status: order.status });
      },
    },
  ];
}
