import { Link, useParams } from 'react-router-dom';
import { formatBurnTime } from '#shared/imaging/burn-time.ts';
import { ITEM_STAGE_LABELS } from '#shared/orders/stages.ts';
import { can } from '#shared/permissions.ts';
import type { BatchView, RenderView } from '#shared/schemas/production.ts';
import { WithWorkspace } from '#src/app/layouts/workspace-layout.tsx';
import { Button } from '#src/components/ui/button.tsx';
import { Card } from '#src/components/ui/card.tsx';
import { Notice } from '#src/components/ui/notice.tsx';
import { useToast } from '#src/components/ui/toast.tsx';
import { LaserCautions } from '#src/features/catalog/components/laser-cautions.tsx';
import { downloadRenderFile, useBatch, useMarkBurned, useRetryRender, useTakeOutOfBatch } from '#src/features/production/api/production.ts';
import { cx } from '#src/lib/cx.ts';

export function BatchPage() {
  const { batchId = '' } = useParams();
  return (
    <WithWorkspace>
      {({ studio, role }) => <Batch slug={studio.slug} batchId={batchId} canProduce={can(role, 'order:produce')} />}
    </WithWorkspace>
  );
}

/** One batch: each item's render with live progress, its files, and the move to burned. */
function Batch({ slug, batchId, canProduce }: { slug: string; batchId: string; canProduce: boolean }) {
  const batch = useBatch(slug, batchId);
  if (batch.isPending) return <p className="text-graphite-500">Loading…</p>;
  if (batch.error) return <Notice tone="error">{batch.error.message}</Notice>;
  const b = batch.data;
  return (
    <div className="flex flex-col gap-6">
      <Link to={`/studio/${slug}/production`} className="text-sm font-semibold text-graphite-600 hover:underline">
        ← Production
      </Link>
      <div>
        <h1 className="text-3xl font-extrabold">Batch {b.number}</h1>
        <p className="mt-1 text-graphite-700">
          {b.materialName} on {b.machineName ?? 'no machine recipe'}
          {b.recipe && ` · ${b.recipe}`} · started {new Date(b.createdAt).toLocaleString()} by {b.createdBy}
        </p>
        <p className="mt-1 text-sm text-graphite-600">
          {b.rendered} of {b.itemCount} rendered · {b.burned} of {b.itemCount} burned
          {b.estimatedBurnSeconds !== null && ` · estimated machine time ${formatBurnTime(b.estimatedBurnSeconds)}`}
        </p>
      </div>
      <LaserCautions />
      {b.items.length === 0 && <Notice>Every item has been taken out of this batch.</Notice>}
      <ul className="flex flex-col gap-4">
        {b.items.map((item) => (
          <BatchItem key={item.itemId} slug={slug} item={item} canProduce={canProduce} />
        ))}
      </ul>
    </div>
  );
}

function BatchItem({ slug, item, canProduce }: { slug: string; item: BatchView['items'][number]; canProduce: boolean }) {
  const toast = useToast();
  const burned = useMarkBurned(slug);
  const retry = useRetryRender(slug);
  const takeOut = useTakeOutOfBatch(slug);
  const { render } = item;
  const report = (done: string) => ({
    onSuccess: () => toast.show(done, 'success'),
    onError: (e: Error) => toast.show(e.message, 'error'),
  });
  return (
    <li>
      <Card className="flex flex-wrap gap-5">
        <img src={item.thumbUrl} alt="" className="size-20 rounded object-cover" />
        <div className="flex min-w-64 flex-1 flex-col gap-2 text-sm">
          <p>
            <Link to={`/studio/${slug}/orders/${item.orderId}`} className="text-base font-bold hover:underline">
              Order {item.orderNumber}
            </Link>{' '}
            · {item.label}
            {item.quantity > 1 && ` × ${item.quantity}`} · {item.buyerName}
          </p>
          <p className="font-semibold">{ITEM_STAGE_LABELS[item.stage]}</p>
          <RenderProgress render={render} label={`Files for order ${item.orderNumber}, ${item.label}`} />
          {render.files.length > 0 && (
            <div className="flex flex-wrap gap-2">
              {render.files.map((file) => (
                <Button
                  key={file.kind}
                  size="sm"
                  variant="secondary"
                  disabled={!canProduce}
                  onClick={() => downloadRenderFile(slug, render.id, file.kind).catch((e: Error) => toast.show(e.message, 'error'))}
                >
                  Download {file.label.toLowerCase()} ({formatBytes(file.bytes)})
                </Button>
              ))}
            </div>
          )}
        </div>
        {canProduce && (
          <div className="flex flex-col items-stretch gap-2">
            {item.stage === 'in_production' && (
              <Button
                disabled={render.status !== 'done'}
                busy={burned.isPending}
                onClick={() => burned.mutate(item.itemId, report(`Order ${item.orderNumber}: marked burned.`))}
              >
                Mark burned
              </Button>
            )}
            {(render.status === 'failed' || render.stalled) && (
              <Button variant="secondary" busy={retry.isPending} onClick={() => retry.mutate(render.id, report('Render queued again.'))}>
                Render again
              </Button>
            )}
            {item.stage === 'in_production' && (
              <Button
                variant="quiet"
                busy={takeOut.isPending}
                onClick={() => takeOut.mutate(item.itemId, report('Taken out of the batch; it waits on the production page.'))}
              >
                Take out of batch
              </Button>
            )}
          </div>
        )}
      </Card>
    </li>
  );
}

const STATUS_TEXT: Record<RenderView['status'], string> = {
  queued: 'Waiting for a worker',
  running: 'Rendering',
  done: 'Files ready',
  failed: 'Render failed',
};

function RenderProgress({ render, label }: { render: RenderView; label: string }) {
  const failed = render.status === 'failed';
  return (
    <div className="flex flex-col gap-1">
      <div className="flex justify-between text-xs font-semibold text-graphite-600">
        <span>
          {STATUS_TEXT[render.status]}
          {render.status === 'running' && `: ${render.step}`}
          {render.attempts > 1 && ` (attempt ${render.attempts})`}
        </span>
        <span>{render.progress} %</span>
      </div>
      <div
        role="progressbar"
        aria-label={label}
        aria-valuemin={0}
        aria-valuemax={100}
        aria-valuenow={render.progress}
        className="h-2 overflow-hidden rounded-full bg-graphite-100"
      >
        <div
          className={cx(
            'h-full rounded-full transition-[width]',
            failed ? 'bg-rust-600' : render.status === 'done' ? 'bg-moss-600' : 'bg-accent',
          )}
          style={{ width: `${Math.max(render.progress, 3)}%` }}
        />
      </div>
      {render.error && (
        <p className={cx('text-xs', failed ? 'font-semibold text-rust-600' : 'text-graphite-600')}>
          {failed ? `Error: ${render.error}` : `Last attempt failed (${render.error}); trying again.`}
        </p>
      )}
      {render.stalled && (
        <p className="text-xs font-semibold text-rust-600">
          The worker has not reported for a while; it may have stopped. Render again to hand the job to another.
        </p>
      )}
    </div>
  );
}

const formatBytes = (bytes: number) =>
  bytes >= 1_000_000 ? `${(bytes / 1_000_000).toFixed(1)} MB` : `${Math.max(1, Math.round(bytes / 1000))} KB`;
