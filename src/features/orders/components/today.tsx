import { Link } from 'react-router-dom';
import { useQuery } from '@tanstack/react-query';
import { Bar, BarChart, CartesianGrid, ResponsiveContainer, Tooltip, XAxis, YAxis } from 'recharts';
import { formatMoney, minorUnitDigits } from '#shared/money.ts';
import { ITEM_STAGE_LABELS } from '#shared/orders/stages.ts';
import { todaySchema } from '#shared/schemas/workspace-orders.ts';
import { Card, CardTitle } from '#src/components/ui/card.tsx';
import { Notice } from '#src/components/ui/notice.tsx';
import { apiFetch } from '#src/lib/api-client.ts';

/** Work waiting by stage, the items waiting longest, and orders and revenue per week (recharts). */
export function TodayPanel({ slug }: { slug: string }) {
  const today = useQuery({
    queryKey: ['orders', slug, 'today'],
    queryFn: ({ signal }) => apiFetch(`/api/studios/${encodeURIComponent(slug)}/today`, { schema: todaySchema, signal }),
  });
  if (today.error) return <Notice tone="error">{today.error.message}</Notice>;
  if (!today.data) return <p className="text-graphite-500">Loading today’s work…</p>;
  const { byStage, oldest, weeks, currency } = today.data;
  const digits = minorUnitDigits(currency);
  const chartWeeks = weeks.map((w) => ({ ...w, week: w.weekStart.slice(5), revenue: w.revenueMinor / 10 ** digits }));
  const weekLabel = (w: unknown) => `Week of ${String(w)}`;
  return (
    <div className="flex flex-col gap-4">
      <h2 className="text-xl font-bold">Today</h2>
      <ul className="grid grid-cols-2 gap-3 sm:grid-cols-5">
        {byStage
          .filter((s) => s.count > 0 || ['photo_review', 'prep', 'approved', 'in_production'].includes(s.stage))
          .map((s) => (
            <li key={s.stage} className="rounded-card border border-graphite-100 bg-white p-4">
              <p className="text-3xl font-extrabold">{s.count}</p>
              <p className="text-sm text-graphite-600">{ITEM_STAGE_LABELS[s.stage]}</p>
            </li>
          ))}
      </ul>
      <div className="grid gap-4 lg:grid-cols-3">
        <Card>
          <CardTitle>Waiting longest</CardTitle>
          {oldest.length === 0 ? (
            <p className="text-sm text-graphite-500">Nothing is waiting.</p>
          ) : (
            <ol className="flex flex-col gap-2 text-sm">
              {oldest.map((o) => (
                <li key={o.itemId}>
                  <Link to={`/studio/${slug}/orders/${o.orderId}`} className="font-semibold hover:underline">
                    Order {o.orderNumber}
                  </Link>{' '}
                  {o.label}
                  <span className="block text-xs text-graphite-500">
                    {ITEM_STAGE_LABELS[o.stage]} since {new Date(o.since).toLocaleDateString()}
                  </span>
                </li>
              ))}
            </ol>
          )}
        </Card>
        <Card>
          <CardTitle>Orders per week</CardTitle>
          <div
            className="h-48"
            role="img"
            aria-label={`Orders per week, last ${weeks.length} weeks: ${weeks.map((w) => w.orders).join(', ')}`}
          >
            <ResponsiveContainer width="100%" height="100%">
              <BarChart data={chartWeeks}>
                <CartesianGrid strokeDasharray="3 3" vertical={false} />
                <XAxis dataKey="week" tick={{ fontSize: 11 }} />
                <YAxis allowDecimals={false} width={28} tick={{ fontSize: 11 }} />
                <Tooltip labelFormatter={weekLabel} />
                <Bar dataKey="orders" name="Orders" fill="#c85a26" />
              </BarChart>
            </ResponsiveContainer>
          </div>
        </Card>
        <Card>
          <CardTitle>Revenue per week</CardTitle>
          <div
            className="h-48"
            role="img"
            aria-label={`Revenue per week after refunds, last ${weeks.length} weeks: ${weeks.map((w) => formatMoney(w.revenueMinor, currency)).join(', ')}`}
          >
            <ResponsiveContainer width="100%" height="100%">
              <BarChart data={chartWeeks}>
                <CartesianGrid strokeDasharray="3 3" vertical={false} />
                <XAxis dataKey="week" tick={{ fontSize: 11 }} />
                <YAxis width={44} tick={{ fontSize: 11 }} />
                <Tooltip
                  labelFormatter={weekLabel}
                  formatter={(value) => formatMoney(Math.round(Number(value) * 10 ** digits), currency)}
                />
                <Bar dataKey="revenue" name="Revenue" fill="#4c7a3a" />
              </BarChart>
            </ResponsiveContainer>
          </div>
        </Card>
      </div>
    </div>
  );
}
