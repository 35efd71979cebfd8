import { Link, useNavigate } from 'react-router-dom';
import { formatBurnTime } from '#shared/imaging/burn-time.ts';
import { can } from '#shared/permissions.ts';
import type { ProductionBoard } from '#shared/schemas/production.ts';
import { WithWorkspace } from '#src/app/layouts/workspace-layout.tsx';
import { Button } from '#src/components/ui/button.tsx';
import { Card, CardTitle } from '#src/components/ui/card.tsx';
import { Notice } from '#src/components/ui/notice.tsx';
import { Table, TBody, TD, TH, THead, TR } from '#src/components/ui/table.tsx';
import { useToast } from '#src/components/ui/toast.tsx';
import { LaserCautions } from '#src/features/catalog/components/laser-cautions.tsx';
import { useCreateBatch, useProductionBoard } from '#src/features/production/api/production.ts';
import { useChosen } from '#src/lib/use-chosen.ts';

export function ProductionPage() {
  return <WithWorkspace>{({ studio, role }) => <Production slug={studio.slug} canProduce={can(role, 'order:produce')} />}</WithWorkspace>;
}

/** Approved items waiting, grouped as they burn together, and the batches started so far. */
function Production({ slug, canProduce }: { slug: string; canProduce: boolean }) {
  const board = useProductionBoard(slug);
  return (
    <div className="flex flex-col gap-6">
      <h1 className="text-3xl font-extrabold">Production</h1>
      <p className="max-w-3xl text-graphite-700">
        Approved items wait here, grouped by material and machine recipe: items in one group burn with the same settings. Start a batch to
        make their engrave files, grayscale masters and job sheets.
      </p>
      {board.error && <Notice tone="error">{board.error.message}</Notice>}
      {board.isPending && <p className="text-graphite-500">Loading…</p>}
      {board.data && board.data.groups.length === 0 && (
        <Notice>No approved items are waiting. Items arrive here once their proof is approved (or they are approved without one).</Notice>
      )}
      {board.data?.groups.map((group) => (
        <WaitingGroup key={group.key} slug={slug} group={group} canProduce={canProduce} />
      ))}
      {board.data && <Batches slug={slug} batches={board.data.batches} />}
      <LaserCautions />
    </div>
  );
}

function WaitingGroup({ slug, group, canProduce }: { slug: string; group: ProductionBoard['groups'][number]; canProduce: boolean }) {
  const { chosen, toggle } = useChosen(group.items.map((i) => i.itemId));
  const create = useCreateBatch(slug);
  const toast = useToast();
  const navigate = useNavigate();
  const ids = group.items.filter((i) => chosen.has(i.itemId)).map((i) => i.itemId);
  const total = group.items
    .filter((i) => chosen.has(i.itemId))
    .reduce<number | null>(
      (sum, i) => (sum === null || i.estimatedBurnSeconds === null ? null : sum + i.estimatedBurnSeconds * i.quantity),
      0,
    );
  const title = `${group.materialName} · ${group.machineName ?? 'no machine recipe'}`;
  return (
    <Card>
      <CardTitle aside={group.recipe && <span className="text-sm text-graphite-600">{group.recipe}</span>}>{title}</CardTitle>
      {!group.machineName && (
        <Notice tone="caution">
          This material has no recipe on any machine: the job sheets will say to set speed and power by hand. Add a recipe in Catalog →
          Recipes to have them filled in.
        </Notice>
      )}
      <ul className="mt-3 flex flex-col divide-y divide-graphite-100" aria-label={`Waiting: ${title}`}>
        {group.items.map((item) => (
          <li key={item.itemId} className="flex items-center gap-3 py-2 text-sm">
            {canProduce && (
              <input
                type="checkbox"
                aria-label={`Include order ${item.orderNumber}, ${item.label}`}
                checked={chosen.has(item.itemId)}
                onChange={() => toggle(item.itemId)}
                className="size-4"
              />
            )}
            <img src={item.thumbUrl} alt="" className="size-10 rounded object-cover" />
            <span className="flex-1">
              <Link to={`/studio/${slug}/orders/${item.orderId}`} className="font-bold hover:underline">
                Order {item.orderNumber}
              </Link>{' '}
              · {item.label}
              {item.quantity > 1 && ` × ${item.quantity}`} · {item.buyerName}
            </span>
            <span className="text-graphite-600">
              {item.estimatedBurnSeconds === null ? 'burn time not estimated' : `about ${formatBurnTime(item.estimatedBurnSeconds)} each`}
            </span>
          </li>
        ))}
      </ul>
      {canProduce && (
        <div className="mt-4 flex flex-wrap items-center gap-3">
          <Button
            disabled={!ids.length}
            busy={create.isPending}
            onClick={() =>
              create.mutate(ids, {
                onSuccess: (batch) => {
                  toast.show(`Batch ${batch.number} started; its files are being made.`, 'success');
                  navigate(`/studio/${slug}/production/batches/${batch.id}`);
                },
                onError: (e) => toast.show(e.message, 'error'),
              })
            }
          >
            Start a batch of {ids.length} {ids.length === 1 ? 'item' : 'items'}
          </Button>
          {total !== null && ids.length > 0 && (
            <span className="text-sm text-graphite-600">Estimated machine time: {formatBurnTime(total)}</span>
          )}
        </div>
      )}
    </Card>
  );
}

function Batches({ slug, batches }: { slug: string; batches: ProductionBoard['batches'] }) {
  if (!batches.length) return null;
  return (
    <Card>
      <CardTitle>Batches</CardTitle>
      <Table>
        <THead>
          <tr>
            <TH>Batch</TH>
            <TH>Material and machine</TH>
            <TH>Items</TH>
            <TH>Files ready</TH>
            <TH>Burned</TH>
            <TH>Started</TH>
          </tr>
        </THead>
        <TBody>
          {batches.map((b) => (
            <TR key={b.id}>
              <TD>
                <Link to={`/studio/${slug}/production/batches/${b.id}`} className="font-bold text-ember-700 underline">
                  Batch {b.number}
                </Link>
              </TD>
              <TD>
                {b.materialName} · {b.machineName ?? 'no machine recipe'}
              </TD>
              <TD>{b.itemCount}</TD>
              <TD>
                {b.rendered} of {b.itemCount}
                {b.failed > 0 && <span className="ml-2 font-semibold text-rust-600">{b.failed} failed</span>}
              </TD>
              <TD>
                {b.burned} of {b.itemCount}
              </TD>
              <TD>
                {new Date(b.createdAt).toLocaleString()} by {b.createdBy}
              </TD>
            </TR>
          ))}
        </TBody>
      </Table>
    </Card>
  );
}
