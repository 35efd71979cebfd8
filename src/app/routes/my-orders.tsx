import { Link } from 'react-router-dom';
import { ORDER_STATUS_LABELS } from '#shared/orders/stages.ts';
import { Card } from '#src/components/ui/card.tsx';
import { Notice } from '#src/components/ui/notice.tsx';
import { useMyOrders } from '#src/features/storefront/api/my-orders.ts';
import { RequireSignIn } from './workspace/require-sign-in.tsx';

/** Every order placed with the signed-in person's address, at any studio. */
export function MyOrdersPage() {
  return (
    <>
      <RequireSignIn>
        <MyOrders />
      </RequireSignIn>
    </>
  );
}

function MyOrders() {
  const orders = useMyOrders();
  return (
    <div className="mx-auto flex max-w-3xl flex-col gap-6 px-6 py-10">
      <h1 className="text-3xl font-extrabold">My orders</h1>
      {orders.isPending && <p className="text-graphite-500">Loading…</p>}
      {orders.error && <Notice tone="error">{orders.error.message}</Notice>}
      {orders.data && !orders.data.confirmed && (
        <Notice tone="caution">
          Confirm your e-mail address first: orders are found by it. Sign in with an e-mailed link to confirm it.
        </Notice>
      )}
      {orders.data?.confirmed && orders.data.orders.length === 0 && <p className="text-graphite-600">No orders with this address yet.</p>}
      <ul className="flex flex-col gap-3">
        {orders.data?.orders.map((o) => (
          <li key={o.id}>
            <Card className="flex flex-wrap items-center justify-between gap-3">
              <div>
                <Link to={`/s/${o.studio.slug}/orders/${o.id}`} className="text-lg font-bold hover:underline">
                  Order {o.number} at {o.studio.name}
                </Link>
                <p className="text-sm text-graphite-600">{o.items.join('; ')}</p>
                <p className="text-xs text-graphite-500">{new Date(o.createdAt).toLocaleDateString()}</p>
              </div>
              <div className="text-right">
                <p className="font-bold">{o.total}</p>
                <p className="text-sm">{ORDER_STATUS_LABELS[o.status]}</p>
              </div>
            </Card>
          </li>
        ))}
      </ul>
    </div>
  );
}
