import { cancelInputSchema, refundInputSchema } from '#shared/schemas/workspace-orders.ts';
import type { Payments } from '#server/adapters/payments.ts';
import type { WorkspaceRoute } from '#server/middleware/workspace-routes.ts';
import { cancelOrder, refundOrder } from './refunds.service.ts';

/** Money back: a refund of part or all of an order, and cancelling an order with its refund. */
export function refundRoutes({ payments }: { payments: Payments }): WorkspaceRoute[] {
  return [
    {
      method: 'post',
      path: '/orders/:orderId/refunds',
      permission: 'order:refund',
      sample: async (f) => ({
        params: { orderId: (await f.orderItem({ paid: true })).orderId },
        body: { amountMinor: 100, reason: 'A scratch on the frame.' },
      }),
      handler: async (ctx, req, res) => {
        const order = await refundOrder(
          ctx.em,
          payments,
          ctx.studio,
          String(req.params.orderId),
          ctx.user,
          refundInputSchema.parse(req.body),
        );
        res.json({ status: order.status, refundedMinor: order.refundedMinor });
      },
    },
    {
      method: 'post',
      path: '/orders/:orderId/cancel',
      permission: 'order:refund',
      sample: async (f) => ({
        params: { orderId: (await f.orderItem({ paid: true })).orderId },
        body: { reason: 'The buyer changed their mind.' },
      }),
      handler: async (ctx, req, res) => {
        const order = await cancelOrder(
          ctx.em,
          payments,
          ctx.studio,
          String(req.params.orderId),
          ctx.user,
          cancelInputSchema.parse(req.body).reason,
        );
        res.json({ status: order.status, refundedMinor: order.refundedMinor });
      },
    },
  ];
}
