import { handoverLine } from '#src/features/orders/handover-line.ts';
import { trackingUrl } from '#shared/orders/tracking.ts';
import { useEffect } from 'react';
import { Link, useParams, useSearchParams } from 'react-router-dom';
import { ITEM_STAGE_LABELS, ORDER_STATUS_LABELS } from '#shared/orders/stages.ts';
import { AppError } from '#shared/errors.ts';
import { WithStorefront } from '#src/app/layouts/storefront-layout.tsx';
import { Card, CardTitle } from '#src/components/ui/card.tsx';
import { Notice } from '#src/components/ui/notice.tsx';
import { clearCheckoutDetails, useCart } from '#src/features/cart/index.ts';
import { OrderMoney, OrderTimeline } from '#src/features/orders/components/order-timeline.tsx';
import { ItemMockup } from '#src/features/designer/components/item-mockup.tsx';
import { useOrder } from '#src/features/storefront/api/checkout.ts';
import { cx } from '#src/lib/cx.ts';

/** The buyer's order, opened by its private link: items as they will burn, stage and history. */
export function OrderPage() {
  const { studioSlug = '', orderId = '' } = useParams();
  const [search] = useSearchParams();
  const order = useOrder(studioSlug, orderId, search.get('key') ?? '');
  const cart = useCart(studioSlug);
  const justPaid = search.get('paid') === '1';
  const status = order.data?.status;
  const { clear: clearCart } = cart;
  const cartFilled = cart.lines.length > 0;
  useEffect(() => {
    // Back from the pay page: the cart has become this order.
    if (!justPaid || !status || status === 'awaiting_payment' || status === 'cancelled') return;
    // …and what was typed at checkout is no longer needed in this tab.
    clearCheckoutDetails(studioSlug);
    if (cartFilled) clearCart();
  }, [justPaid, status, cartFilled, clearCart, studioSlug]);

  return (
    <WithStorefront>
      {() => {
        if (order.isPending) return <p className="text-graphite-500">Opening your order…</p>;
        if (order.error)
          return (
            <Notice tone="error" title="This order could not be opened">
              {order.error instanceof AppError && order.error.code === 'NOT_FOUND'
                ? 'There is no order at this link. Check that you used the whole link from the e-mail.'
                : order.error.message}
            </Notice>
          );
        const o = order.data;
        return (
          <div className="flex flex-col gap-6">
            <div className="flex flex-wrap items-center gap-3">
              <h1 className="text-3xl font-extrabold">Order {o.number}</h1>
              <span
                className={cx(
                  'rounded-full px-3 py-1 text-sm font-bold',
                  o.status === 'paid' || o.status === 'fulfilled'
                    ? 'bg-moss-100 text-moss-800'
                    : o.status === 'awaiting_payment'
                      ? 'bg-ember-50 text-ember-800'
                      : 'bg-graphite-100 text-graphite-700',
                )}
              >
                {ORDER_STATUS_LABELS[o.status]}
              </span>
            </div>
            {o.status === 'awaiting_payment' && justPaid && <Notice>Your payment is being confirmed; this page updates by itself.</Notice>}
            {o.status === 'paid' && justPaid && (
              <Notice title="Thank you!">
                Your payment is in. We have sent a receipt to {o.buyer.email}; keep it, its link opens this page.
              </Notice>
            )}
            {o.note && <Notice tone="caution">{o.note}</Notice>}
            <div className="grid gap-6 lg:grid-cols-[minmax(0,2fr)_minmax(0,1fr)]">
              <Card>
                <CardTitle>Your items</CardTitle>
                <ul className="flex flex-col gap-6">
                  {o.items.map((item) => (
                    <li key={item.id} className="flex flex-wrap gap-5">
                      <ItemMockup item={item} />
                      <div className="flex flex-col gap-1">
                        <p className="text-lg font-bold">{item.blankName}</p>
                        <p className="text-sm text-graphite-600">
                          {item.sizeLabel}, {item.materialName}; {item.quantity} × {item.unitPrice}
                        </p>
                        {item.inscription && <p className="text-sm">“{item.inscription.lines.join(' / ')}”</p>}
                        <p className="mt-2 text-sm">
                          <span className="font-semibold">Now: </span>
                          {ITEM_STAGE_LABELS[item.stage]}
                        </p>
                        {item.handover && <p className="mt-1 text-sm">{handoverLine(item.handover)}</p>}
                        {item.handover && trackingUrl(item.handover.carrier, item.handover.trackingNumber) && (
                          <a
                            href={trackingUrl(item.handover.carrier, item.handover.trackingNumber)!}
                            target="_blank"
                            rel="noreferrer"
                            className="mt-1 inline-block self-start py-1 text-sm font-semibold underline"
                          >
                            Follow the parcel with {item.handover.carrier}
                          </a>
                        )}
                        {item.stage === 'needs_new_photo' && (
                          <p className="mt-1 max-w-sm text-sm font-semibold text-rust-600">
                            The studio needs a new photo for this piece: we sent you an e-mail with the reason and a link to send it.
                          </p>
                        )}
                        {item.stage === 'proof_sent' && (
                          <p className="mt-1 max-w-sm text-sm font-semibold text-ember-700">
                            Your proof is ready: the e-mail we sent has the link to approve it or ask for changes.
                          </p>
                        )}
                      </div>
                    </li>
                  ))}
                </ul>
              </Card>
              <div className="flex flex-col gap-6">
                <Card>
                  <CardTitle>Summary</CardTitle>
                  <OrderMoney order={o} deliveryLabel={o.delivery.label} />
                  {o.delivery.address && (
                    <p className="mt-3 text-sm text-graphite-700">
                      {o.buyer.name}
                      <br />
                      {o.delivery.address.line1}
                      {o.delivery.address.line2 && `, ${o.delivery.address.line2}`}
                      <br />
                      {o.delivery.address.postalCode} {o.delivery.address.city}, {o.delivery.address.country}
                    </p>
                  )}
                </Card>
                <Card>
                  <CardTitle>What has happened</CardTitle>
                  <OrderTimeline events={o.events} />
                </Card>
              </div>
            </div>
            <Link to={`/s/${studioSlug}`} className="inline-block self-start py-1 text-sm font-semibold text-graphite-600 hover:underline">
              ← Back to the storefront
            </Link>
          </div>
        );
      }}
    </WithStorefront>
  );
}
