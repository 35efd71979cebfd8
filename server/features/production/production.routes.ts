import type { EntityManager } from '@mikro-orm/postgresql';
import { createBatchInputSchema, shipInputSchema } from '../../../shared/schemas/production.ts';
import type { Jobs } from '../../adapters/jobs.ts';
import type { Storage } from '../../adapters/storage.ts';
import type { Env } from '../../env.ts';
import type { Orm } from '../../db/orm.ts';
import type { WorkspaceRoute } from '../../middleware/workspace-routes.ts';
import { handOver } from '../orders/handover.service.ts';
import { batchView, createBatch, findBatch, markBurned, productionBoard, renderDownload, retryRender, takeOutOfBatch } from './production.service.ts';

/** Production: the board of approved items, batches and their renders, downloads, burned, handed over. */
export function productionRoutes({ orm, env, storage, jobs }: { orm: Orm; env: Env; storage: Storage; jobs: Jobs }): WorkspaceRoute[] {
  const em = () => orm.em as EntityManager;
  return [
    { method: 'get', path: '/production', permission: 'order:read', handler: async (req, res) => void res.json(await productionBoard(em(), req.studio!)) },
    {
      method: 'post', path: '/production/batches', permission: 'order:produce',
      sample: async (f) => ({ body: { itemIds: [(await f.orderItem({ stage: 'approved' })).itemId] } }),
      handler: async (req, res) => {
        const batch = await createBatch(em(), jobs, req.studio!, req.user!, createBatchInputSchema.parse(req.body).itemIds);
        res.status(201).json({ id: batch.id, number: batch.number });
      },
    },
    {
      method: 'get', path: '/production/batches/:batchId', permission: 'order:read',
      sample: async (f) => ({ params: { batchId: (await f.production('done')).batchId } }),
      handler: async (req, res) => void res.json(batchView(req.studio!, await findBatch(em(), req.studio!, String(req.params.batchId)), env.RENDER_TIMEOUT_SECONDS)),
    },
    {
      method: 'post', path: '/production/renders/:renderId/retry', permission: 'order:produce',
      sample: async (f) => ({ params: { renderId: (await f.production('failed')).renderId } }),
      handler: async (req, res) => void res.json({ status: (await retryRender(em(), jobs, req.studio!, String(req.params.renderId), env.RENDER_TIMEOUT_SECONDS)).status }),
    },
    {
      method: 'get', path: '/production/renders/:renderId/files/:kind', permission: 'order:produce',
      sample: async (f) => ({ params: { renderId: (await f.production('done')).renderId, kind: 'engrave' } }),
      handler: async (req, res) => void res.json(await renderDownload(em(), storage, req.studio!, String(req.params.renderId), String(req.params.kind), req.user!)),
    },
    {
      method: 'post', path: '/items/:itemId/burned', permission: 'order:produce',
      sample: async (f) => ({ params: { itemId: (await f.production('done')).itemId } }),
      handler: async (req, res) => void res.json({ stage: (await markBurned(em(), req.studio!, String(req.params.itemId), req.user!)).stage }),
    },
    {
      method: 'post', path: '/items/:itemId/out-of-batch', permission: 'order:produce',
      sample: async (f) => ({ params: { itemId: (await f.production('failed')).itemId } }),
      handler: async (req, res) => void res.json({ stage: (await takeOutOfBatch(em(), storage, req.studio!, String(req.params.itemId), req.user!)).stage }),
    },
    {
      method: 'post', path: '/orders/:orderId/handover', permission: 'order:produce',
      sample: async (f) => {
        const { orderId, itemId } = await f.orderItem({ stage: 'burned' });
        return { params: { orderId }, body: { method: 'ship', itemIds: [itemId], carrier: 'Parcelway', trackingNumber: 'PW 1234 5678' } };
      },
      handler: async (req, res) => {
        const order = await handOver(em(), req.studio!, String(req.params.orderId), req.user!, shipInputSchema.parse(req.body));
        res.json({ status: order.status });
      },
    },
  ];
}
