import type { OrderView } from '#shared/schemas/checkout.ts';

/** An order's events, oldest first, with when each happened: the buyer's and the studio's view. */
export function OrderTimeline({ events }: { events: OrderView['events'] }) {
  return (
    <ol className="flex flex-col gap-3 border-l-2 border-graphite-100 pl-4 text-sm">
      {events.map((e, i) => (
        <li key={i}>
          <time dateTime={e.at} className="block text-xs text-graphite-500">
            {new Date(e.at).toLocaleString()}
          </time>
          {e.text}
        </li>
      ))}
    </ol>
  );
}

/** The money of an order: items, delivery, total and what was refunded. */
export function OrderMoney({ order, deliveryLabel }: { order: OrderView; deliveryLabel: string }) {
  return (
    <dl className="grid grid-cols-[1fr_auto] gap-y-1 text-sm">
      <dt>Items</dt>
      <dd className="text-right">{order.subtotal}</dd>
      <dt>{deliveryLabel}</dt>
      <dd className="text-right">{order.shipping}</dd>
      <dt className="font-bold">Total</dt>
      <dd className="text-right font-bold">{order.total}</dd>
      {order.refunded && (
        <>
          <dt>Refunded</dt>
          <dd className="text-right">−{order.refunded}</dd>
        </>
      )}
    </dl>
  );
}
