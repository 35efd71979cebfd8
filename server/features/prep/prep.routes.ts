import { prepSettingsSchema, regionPreviewInputSchema, type PrepSettings } from '#shared/schemas/prep.ts';
import type { Storage } from '#server/adapters/storage.ts';
import type { Env } from '#server/env.ts';
import { findItem } from '#server/features/orders/order-stages.service.ts';
import type { WorkspaceRoute } from '#server/middleware/workspace-routes.ts';
import { approveWithoutProof, prepQueue, reopenPrep, savePrep, sendProof } from './prep.service.ts';
import { regionPreview } from './region-preview.ts';

const SAMPLE_PREP: PrepSettings = {
  brightness: 5,
  contrast: 10,
  gamma: 1.1,
  autoLevels: true,
  sharpenAmount: 200,
  sharpenRadius: 2,
  sharpenThreshold: 2,
  halftoneMethod: 'stucki',
  linesPerInch: 300,
  negative: true,
  featherRadius: 3,
  cutout: {
    start: 'plain-background',
    tolerance: 30,
    strokes: [
      {
        mode: 'remove',
        size: 0.05,
        points: [
          [0.1, 0.1],
          [0.2, 0.15],
        ],
      },
    ],
  },
};

/** Preparing an item: its settings, the 1:1 region, the proof and approval without one. */
export function prepRoutes({ env, storage }: { env: Env; storage: Storage }): WorkspaceRoute[] {
  return [
    {
      method: 'get',
      path: '/prep-queue',
      permission: 'order:read',
      handler: async (ctx, _req, res) => void res.json({ items: await prepQueue(ctx.em, ctx.studio) }),
    },
    {
      method: 'put',
      path: '/items/:itemId/prep',
      permission: 'order:produce',
      sample: async (f) => ({ params: { itemId: (await f.orderItem({ stage: 'prep' })).itemId }, body: SAMPLE_PREP }),
      handler: async (ctx, req, res) => {
        const item = await savePrep(ctx.em, ctx.studio, String(req.params.itemId), ctx.user, prepSettingsSchema.parse(req.body));
        res.json({ version: item.prepVersions.at(-1)!.version });
      },
    },
    {
      method: 'post',
      path: '/items/:itemId/prep-preview',
      permission: 'order:produce',
      sample: async (f) => ({
        params: { itemId: (await f.orderItem({ stage: 'prep' })).itemId },
        body: { settings: SAMPLE_PREP, centre: { x: 0.3, y: 0.6 } },
      }),
      handler: async (ctx, req, res) => {
        const item = await findItem(ctx.em, ctx.studio, String(req.params.itemId));
        const input = regionPreviewInputSchema.parse(req.body);
        res.json(await regionPreview(storage, item, input.settings, input.centre));
      },
    },
    {
      method: 'post',
      path: '/items/:itemId/send-proof',
      permission: 'order:produce',
      sample: async (f) => ({ params: { itemId: (await f.orderItem({ stage: 'prep' })).itemId } }),
      handler: async (ctx, req, res) =>
        void res.json({ stage: (await sendProof(ctx.em, storage, ctx.studio, String(req.params.itemId), ctx.user, env.APP_URL)).stage }),
    },
    {
      method: 'post',
      path: '/items/:itemId/approve-without-proof',
      permission: 'order:produce',
      sample: async (f) => ({ params: { itemId: (await f.orderItem({ stage: 'prep' })).itemId } }),
      handler: async (ctx, req, res) =>
        void res.json({ stage: (await approveWithoutProof(ctx.em, ctx.studio, String(req.params.itemId), ctx.user)).stage }),
    },
    {
      method: 'post',
      path: '/items/:itemId/reopen-prep',
      permission: 'order:produce',
      sample: async (f) => ({ params: { itemId: (await f.orderItem({ stage: 'changes_requested' })).itemId } }),
      handler: async (ctx, req, res) =>
        void res.json({ stage: (await reopenPrep(ctx.em, ctx.studio, String(req.params.itemId), ctx.user)).stage }),
    },
  ];
}
