import { ITEM_TRANSITIONS } from '#shared/orders/stages.ts';
import { orderListQuerySchema, type StaffItem } from '#shared/schemas/workspace-orders.ts';
import type { Storage } from '#server/adapters/storage.ts';
import { findBuyerPhoto } from '#server/features/photos/photos.service.ts';
import { currentPrep, defaultPrep } from '#server/features/prep/prep.service.ts';
import type { WorkspaceRoute } from '#server/middleware/workspace-routes.ts';
import { findItem } from './order-stages.service.ts';
import { orderView } from './order.views.ts';
import { recordPhotoDownload } from './photo-downloads.ts';
import { findOrder, listOrders } from './orders.service.ts';
import { today } from './today.service.ts';

/** The workspace's orders: the list, one order, one item, a buyer's original photo, and Today. */
export function workspaceOrderRoutes({ storage }: { storage: Storage }): WorkspaceRoute[] {
  return [
    {
      method: 'get',
      path: '/orders',
      permission: 'order:read',
      handler: async (ctx, req, res) => void res.json(await listOrders(ctx.em, ctx.studio, orderListQuerySchema.parse(req.query))),
    },
    {
      method: 'get',
      path: '/orders/:orderId',
      permission: 'order:read',
      sample: async (f) => ({ params: { orderId: (await f.orderItem()).orderId } }),
      handler: async (ctx, req, res) => {
        const order = await findOrder(ctx.em, ctx.studio, String(req.params.orderId));
        res.json({ ...orderView(order), paymentIntentId: order.paymentIntentId });
      },
    },
    {
      method: 'get',
      path: '/orders/photos/:photoId/original',
      permission: 'order:read',
      sample: async (f) => ({ params: { photoId: (await f.orderItem()).photoId } }),
      handler: async (ctx, req, res) => {
        const photo = await findBuyerPhoto(ctx.em, ctx.studio, String(req.params.photoId));
        const object = await storage.get(photo.originalKey);
        await recordPhotoDownload(ctx.em, ctx.studio, ctx.user, photo);
        res
          .set({ 'content-type': object.contentType ?? 'application/octet-stream', 'cache-control': 'private, max-age=3600' })
          .end(Buffer.from(object.body));
      },
    },
    {
      method: 'get',
      path: '/items/:itemId',
      permission: 'order:read',
      sample: async (f) => ({ params: { itemId: (await f.orderItem()).itemId } }),
      handler: async (ctx, req, res) => {
        const item = await findItem(ctx.em, ctx.studio, String(req.params.itemId));
        await ctx.em.populate(item.order, ['items', 'items.photo', 'events', 'studio']);
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
      method: 'get',
      path: '/today',
      permission: 'order:read',
      handler: async (ctx, req, res) => void res.json(await today(ctx.em, ctx.studio)),
    },
  ];
}
