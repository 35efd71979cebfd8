import { Link, useParams } from 'react-router-dom';
import { ITEM_STAGE_LABELS, ORDER_STATUS_LABELS } from '#shared/orders/stages.ts';
import { WithWorkspace } from '#src/app/layouts/workspace-layout.tsx';
import { Card, CardTitle } from '#src/components/ui/card.tsx';
import { Notice } from '#src/components/ui/notice.tsx';
import { OrderMoney, OrderTimeline } from '#src/features/orders/components/order-timeline.tsx';
import { ItemMockup } from '#src/features/designer/components/item-mockup.tsx';
import { useStaffOrder } from '#src/features/orders/api/orders.ts';
import { methodLabel } from '#src/features/catalog/labels.ts';
import { MoneyActions } from '#src/features/orders/components/money-actions.tsx';
import { can } from '#shared/permissions.ts';
import { HandoverForm } from '#src/features/production/components/handover-form.tsx';
import { handoverLine } from '#src/features/orders/handover-line.ts';

export function StaffOrderPage() {
  const { orderId = '' } = useParams();
  return (
    <WithWorkspace>
      {({ studio, role }) => (
        <StaffOrder slug={studio.slug} orderId={orderId} canRefund={can(role, 'order:refund')} canProduce={can(role, 'order:produce')} />
      )}
    </WithWorkspace>
  );
}

/** One order as the studio sees it: items as they will burn, buyer, payment and every event. */
function StaffOrder({ slug, orderId, canRefund, canProduce }: { slug: string; orderId: string; canRefund: boolean; canProduce: boolean }) {
  const order = useStaffOrder(slug, orderId);
  if (order.isPending) return <p className="text-graphite-500">Loading…</p>;
  if (order.error) return <Notice tone="error">{order.error.message}</Notice>;
  const o = order.data;
  return (
    <div className="flex flex-col gap-6">
      <Link to={`/studio/${slug}/orders`} className="text-sm font-semibold text-graphite-600 hover:underline">
        ← All orders
      </Link>
      <div className="flex flex-wrap items-center gap-3">
        <h1 className="text-3xl font-extrabold">Order {o.number}</h1>
        <span className="rounded-full bg-birch-100 px-3 py-1 text-sm font-bold">{ORDER_STATUS_LABELS[o.status]}</span>
        <div className="ml-auto">{canRefund && <MoneyActions slug={slug} order={o} />}</div>
      </div>
      {o.note && <Notice tone="caution">{o.note}</Notice>}
      <div className="grid gap-6 lg:grid-cols-[minmax(0,2fr)_minmax(0,1fr)]">
        <Card>
          <CardTitle>Items</CardTitle>
          <ul className="flex flex-col gap-6">
            {o.items.map((item) => (
              <li key={item.id} className="flex flex-wrap gap-5">
                <ItemMockup item={item} />
                <div className="flex flex-col gap-1 text-sm">
                  <p className="text-lg font-bold">{item.blankName}</p>
                  <p>
                    {item.sizeLabel}, {item.orientation}; {item.materialName}
                  </p>
                  <p>
                    {item.quantity} × {item.unitPrice}
                  </p>
                  <p>
                    Recipe: {item.look.linesPerInch} lines per inch, {methodLabel(item.look.halftoneMethod)}, {item.look.tone}
                  </p>
                  {item.inscription && <p>Words: “{item.inscription.lines.join(' / ')}”</p>}
                  <p className="mt-2 font-semibold">{ITEM_STAGE_LABELS[item.stage]}</p>
                  {item.handover && <p>{handoverLine(item.handover)}</p>}
                  {['prep', 'proof_sent', 'changes_requested', 'approved'].includes(item.stage) && (
                    <Link to={`/studio/${slug}/items/${item.id}`} className="font-semibold text-ember-700 underline">
                      Prepare this item
                    </Link>
                  )}
                  {['in_production', 'burned'].includes(item.stage) && (
                    <Link to={`/studio/${slug}/production`} className="font-semibold text-ember-700 underline">
                      Production
                    </Link>
                  )}
                </div>
              </li>
            ))}
          </ul>
        </Card>
        <div className="flex flex-col gap-6">
          {canProduce && <HandoverForm key={o.items.map((i) => i.stage).join()} slug={slug} order={o} />}
          <Card>
            <CardTitle>Buyer and delivery</CardTitle>
            <p className="text-sm">
              {o.buyer.name}
              <br />
              <a href={`mailto:${o.buyer.email}`} className="underline">
                {o.buyer.email}
              </a>
            </p>
            <p className="mt-3 text-sm font-semibold">{o.delivery.label}</p>
            {o.delivery.address && (
              <p className="text-sm text-graphite-700">
                {o.delivery.address.line1}
                {o.delivery.address.line2 && `, ${o.delivery.address.line2}`}, {o.delivery.address.postalCode} {o.delivery.address.city},{' '}
                {o.delivery.address.country}
              </p>
            )}
            <div className="mt-3">
              <OrderMoney order={o} deliveryLabel="Delivery" />
            </div>
          </Card>
          <Card>
            <CardTitle>Timeline</CardTitle>
            <OrderTimeline events={o.events} />
          </Card>
        </div>
      </div>
    </div>
  );
}
