import type { EntityManager } from '@mikro-orm/postgresql';
import { askNewPhotoInputSchema, cancelInputSchema, orderListQuerySchema, refundInputSchema } from '../../../shared/schemas/workspace-orders.ts';
import type { Payments } from '../../adapters/payments.ts';
import { cancelOrder, refundOrder } from './refunds.service.ts';
import { today } from './today.service.ts';
import { approveWithoutProof, currentPrep, defaultPrep, reopenPrep, savePrep, sendProof } from './prep.service.ts';
import { findItem } from './item-moves.ts';
import { prepSettingsSchema, regionPreviewInputSchema, type PrepSettings } from '../../../shared/schemas/prep.ts';
import { regionPreview } from './region-preview.ts';
import { ITEM_TRANSITIONS } from '../../../shared/orders/stages.ts';
import type { StaffItem } from '../../../shared/schemas/workspace-orders.ts';

const SAMPLE_PREP: PrepSettings = { brightness: 5, contrast: 10, gamma: 1.1, autoLevels: true, sharpenAmount: 200, sharpenRadius: 2, sharpenThreshold: 2, halftoneMethod: 'stucki', linesPerInch: 300, negative: true, featherRadius: 3, cutout: { start: 'plain-background', tolerance: 30, strokes: [{ mode: 'remove', size: 0.05, points: [[0.1, 0.1], [0.2, 0.15]] }] } };
import type { Storage } from '../../adapters/storage.ts';
import type { Env } from '../../env.ts';
import type { Orm } from '../../db/orm.ts';
import type { WorkspaceRoute } from '../../middleware/workspace-routes.ts';
import { findBuyerPhoto } from '../photos/photos.service.ts';
import { recordPhotoDownload } from './photo-downloads.ts';
import { orderView } from './order.views.ts';
import { approvePhoto, askNewPhoto, findOrder, listOrders, reviewQueue } from './review.service.ts';

/** The workspace's orders: the list, one order, the photo review queue and its two answers. */
export function workspaceOrderRoutes({ orm, env, storage, payments }: { orm: Orm; env: Env; storage: Storage; payments: Payments }): WorkspaceRoute[] {
  const em = () => orm.em as EntityManager;
  return [
    {
      method: 'get', path: '/orders', permission: 'order:read',
      handler: async (req, res) => void res.json(await listOrders(em(), req.studio!, orderListQuerySchema.parse(req.query))),
    },
    {
      method: 'get', path: '/orders/:orderId', permission: 'order:read',
      sample: async (f) => ({ params: { orderId: (await f.orderItem()).orderId } }),
      handler: async (req, res) => {
        const order = await findOrder(em(), req.studio!, String(req.params.orderId));
        res.json({ ...orderView(order), paymentIntentId: order.paymentIntentId });
      },
    },
    {
      method: 'get', path: '/orders/photos/:photoId/original', permission: 'order:read',
      sample: async (f) => ({ params: { photoId: (await f.orderItem()).photoId } }),
      handler: async (req, res) => {
        const photo = await findBuyerPhoto(em(), req.studio!, String(req.params.photoId));
        const object = await storage.get(photo.originalKey);
        await recordPhotoDownload(em(), req.studio!, req.user!, photo);
        res.set({ 'content-type': object.contentType ?? 'application/octet-stream', 'cache-control': 'private, max-age=3600' }).end(Buffer.from(object.body));
      },
    },
    {
      method: 'get', path: '/items/:itemId', permission: 'order:read',
      sample: async (f) => ({ params: { itemId: (await f.orderItem()).itemId } }),
      handler: async (req, res) => {
        const item = await findItem(em(), req.studio!, String(req.params.itemId));
        await em().populate(item.order, ['items', 'items.photo', 'events', 'studio']);
        res.json({
          orderId: item.order.id,
          orderNumber: item.order.number,
          item: orderView(item.order).items.find((i) => i.id === item.id)!,
          allowedMoves: [...ITEM_TRANSITIONS[item.stage]],
          prep: currentPrep(item),
          defaults: defaultPrep(item),
          versions: item.prepVersions,
        } satisfies StaffItem);
      },
    },
    {
      method: 'put', path: '/items/:itemId/prep', permission: 'order:produce',
      sample: async (f) => ({ params: { itemId: (await f.orderItem({ stage: 'prep' })).itemId }, body: SAMPLE_PREP }),
      handler: async (req, res) => {
        const item = await savePrep(em(), req.studio!, String(req.params.itemId), req.user!, prepSettingsSchema.parse(req.body));
        res.json({ version: item.prepVersions.at(-1)!.version });
      },
    },
    {
      method: 'post', path: '/items/:itemId/prep-preview', permission: 'order:produce',
      sample: async (f) => ({ params: { itemId: (await f.orderItem({ stage: 'prep' })).itemId }, body: { settings: SAMPLE_PREP, centre: { x: 0.3, y: 0.6 } } }),
      handler: async (req, res) => {
        const item = await findItem(em(), req.studio!, String(req.params.itemId));
        const input = regionPreviewInputSchema.parse(req.body);
        res.json(await regionPreview(storage, item, input.settings, input.centre));
      },
    },
    {
      method: 'post', path: '/items/:itemId/send-proof', permission: 'order:produce',
      sample: async (f) => ({ params: { itemId: (await f.orderItem({ stage: 'prep' })).itemId } }),
      handler: async (req, res) => void res.json({ stage: (await sendProof(em(), storage, req.studio!, String(req.params.itemId), req.user!, env.APP_URL)).stage }),
    },
    {
      method: 'post', path: '/items/:itemId/approve-without-proof', permission: 'order:produce',
      sample: async (f) => ({ params: { itemId: (await f.orderItem({ stage: 'prep' })).itemId } }),
      handler: async (req, res) => void res.json({ stage: (await approveWithoutProof(em(), req.studio!, String(req.params.itemId), req.user!)).stage }),
    },
    {
      method: 'post', path: '/items/:itemId/reopen-prep', permission: 'order:produce',
      sample: async (f) => ({ params: { itemId: (await f.orderItem({ stage: 'changes_requested' })).itemId } }),
      handler: async (req, res) => void res.json({ stage: (await reopenPrep(em(), req.studio!, String(req.params.itemId), req.user!)).stage }),
    },
    { method: 'get', path: '/today', permission: 'order:read', handler: async (req, res) => void res.json(await today(em(), req.studio!)) },
    { method: 'get', path: '/review-queue', permission: 'order:review', handler: async (req, res) => void res.json({ items: await reviewQueue(em(), req.studio!) }) },
    {
      method: 'post', path: '/items/:itemId/approve-photo', permission: 'order:review',
      sample: async (f) => ({ params: { itemId: (await f.orderItem()).itemId } }),
      handler: async (req, res) => {
        const item = await approvePhoto(em(), req.studio!, String(req.params.itemId), req.user!);
        res.json({ itemId: item.id, stage: item.stage });
      },
    },
    {
      method: 'post', path: '/items/:itemId/ask-new-photo', permission: 'order:review',
      sample: async (f) => ({ params: { itemId: (await f.orderItem()).itemId }, body: { reason: 'low_resolution', note: 'Please send the original.' } }),
      handler: async (req, res) => {
        const item = await askNewPhoto(em(), req.studio!, String(req.params.itemId), req.user!, askNewPhotoInputSchema.parse(req.body), env.APP_URL);
        res.json({ itemId: item.id, stage: item.stage });
      },
    },
    {
      method: 'post', path: '/orders/:orderId/refunds', permission: 'order:refund',
      sample: async (f) => ({ params: { orderId: (await f.orderItem({ paid: true })).orderId }, body: { amountMinor: 100, reason: 'A scratch on the frame.' } }),
      handler: async (req, res) => {
        const order = await refundOrder(em(), payments, req.studio!, String(req.params.orderId), req.user!, refundInputSchema.parse(req.body));
        res.json({ status: order.status, refundedMinor: order.refundedMinor });
      },
    },
    {
      method: 'post', path: '/orders/:orderId/cancel', permission: 'order:refund',
      sample: async (f) => ({ params: { orderId: (await f.orderItem({ paid: true })).orderId }, body: { reason: 'The buyer changed their mind.' } }),
      handler: async (req, res) => {
        const order = await cancelOrder(em(), payments, req.studio!, String(req.params.orderId), req.user!, cancelInputSchema.parse(req.body).reason);
        res.json({ status: order.status, refundedMinor: order.refundedMinor });
      },
    },
  ];
}
