import { useState } from 'react';
import { Link } from 'react-router-dom';
import { ITEM_STAGES, ITEM_STAGE_LABELS, ORDER_STATUSES, ORDER_STATUS_LABELS } from '#shared/orders/stages.ts';
import type { OrderListQuery } from '#shared/schemas/workspace-orders.ts';
import { WithWorkspace } from '#src/app/layouts/workspace-layout.tsx';
import { Button } from '#src/components/ui/button.tsx';
import { SelectField } from '#src/components/ui/field.tsx';
import { Notice } from '#src/components/ui/notice.tsx';
import { Table, TBody, TD, TH, THead, TR } from '#src/components/ui/table.tsx';
import { TextField } from '#src/components/ui/text-field.tsx';
import { useOrderList } from '#src/features/orders/api/orders.ts';
import { useMaterials } from '#src/features/catalog/api/catalog.ts';
import { useDebounced } from '#src/lib/use-debounced.ts';

export function OrdersPage() {
  return <WithWorkspace>{({ studio }) => <Orders slug={studio.slug} />}</WithWorkspace>;
}

/** Every order of the studio; search, filters, sorting and paging run on the server. */
function Orders({ slug }: { slug: string }) {
  const [search, setSearch] = useState('');
  const [filters, setFilters] = useState<Omit<OrderListQuery, 'search'>>({ sort: 'newest', page: 1, pageSize: 25 });
  const query = { ...filters, search: useDebounced(search, 250) };
  const orders = useOrderList(slug, query);
  const materials = useMaterials(slug);
  const set = (change: Partial<OrderListQuery>) => setFilters((f) => ({ ...f, page: 1, ...change }));
  const pages = orders.data ? Math.max(1, Math.ceil(orders.data.total / orders.data.pageSize)) : 1;
  const page = Number(filters.page ?? 1);

  return (
    <div className="flex flex-col gap-6">
      <h1 className="text-3xl font-extrabold">Orders</h1>
      <div className="grid gap-3 sm:grid-cols-2 lg:grid-cols-7">
        <TextField
          label="Search"
          type="search"
          placeholder="Number, e-mail or name"
          value={search}
          onChange={(e) => {
            setSearch(e.target.value);
            set({});
          }}
          className="lg:col-span-2"
        />
        <SelectField
          label="Material"
          placeholder="Any material"
          options={(materials.data?.materials ?? []).map((m) => ({ value: m.name, label: m.name }))}
          value={filters.material ?? ''}
          onChange={(e) => set({ material: e.target.value || undefined })}
        />
        <SelectField
          label="Stage"
          placeholder="Any stage"
          options={ITEM_STAGES.map((s) => ({ value: s, label: ITEM_STAGE_LABELS[s] }))}
          value={filters.stage ?? ''}
          onChange={(e) => set({ stage: (e.target.value || undefined) as OrderListQuery['stage'] })}
        />
        <SelectField
          label="Status"
          placeholder="Any"
          options={ORDER_STATUSES.map((s) => ({ value: s, label: ORDER_STATUS_LABELS[s] }))}
          value={filters.status ?? ''}
          onChange={(e) => set({ status: (e.target.value || undefined) as OrderListQuery['status'] })}
        />
        <TextField label="From" type="date" value={filters.from ?? ''} onChange={(e) => set({ from: e.target.value || undefined })} />
        <TextField label="To" type="date" value={filters.to ?? ''} onChange={(e) => set({ to: e.target.value || undefined })} />
      </div>
      <div className="flex items-center justify-between gap-3">
        <SelectField
          label="Sort by"
          options={[
            { value: 'newest', label: 'Newest first' },
            { value: 'oldest', label: 'Oldest first' },
            { value: 'total-high', label: 'Highest total' },
            { value: 'total-low', label: 'Lowest total' },
          ]}
          value={filters.sort}
          onChange={(e) => set({ sort: e.target.value as OrderListQuery['sort'] })}
          className="w-48"
        />
        <p className="text-sm text-graphite-500" aria-live="polite">
          {orders.data ? `${orders.data.total} order${orders.data.total === 1 ? '' : 's'}` : ''}
        </p>
      </div>
      {orders.error && <Notice tone="error">{orders.error.message}</Notice>}
      {orders.data && (
        <Table>
          <THead>
            <tr>
              <TH>Order</TH>
              <TH>Placed</TH>
              <TH>Buyer</TH>
              <TH>Items</TH>
              <TH>Status</TH>
              <TH className="text-right">Total</TH>
            </tr>
          </THead>
          <TBody>
            {orders.data.orders.map((o) => (
              <TR key={o.id}>
                <TD>
                  <Link to={`/studio/${slug}/orders/${o.id}`} className="font-bold hover:underline">
                    {o.number}
                  </Link>
                </TD>
                <TD>{new Date(o.createdAt).toLocaleDateString()}</TD>
                <TD>
                  {o.buyerName}
                  <span className="block text-xs text-graphite-500">{o.buyerEmail}</span>
                </TD>
                <TD>
                  {o.items.map((i) => (
                    <span key={i.id} className="block text-sm">
                      {i.label} · <span className="text-graphite-600">{ITEM_STAGE_LABELS[i.stage]}</span>
                    </span>
                  ))}
                </TD>
                <TD>{ORDER_STATUS_LABELS[o.status]}</TD>
                <TD className="text-right font-semibold">{o.total}</TD>
              </TR>
            ))}
          </TBody>
        </Table>
      )}
      {orders.data?.orders.length === 0 && <p className="text-center text-graphite-500">No orders match.</p>}
      <nav aria-label="Pages" className="flex items-center justify-end gap-2">
        <Button size="sm" variant="secondary" disabled={page <= 1} onClick={() => setFilters((f) => ({ ...f, page: page - 1 }))}>
          Previous
        </Button>
        <span className="text-sm">
          Page {page} of {pages}
        </span>
        <Button size="sm" variant="secondary" disabled={page >= pages} onClick={() => setFilters((f) => ({ ...f, page: page + 1 }))}>
          Next
        </Button>
      </nav>
    </div>
  );
}
