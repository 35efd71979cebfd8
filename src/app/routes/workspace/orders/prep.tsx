import { Link } from 'react-router-dom';
import { ITEM_STAGE_LABELS } from '#shared/orders/stages.ts';
import { WithWorkspace } from '#src/app/layouts/workspace-layout.tsx';
import { Notice } from '#src/components/ui/notice.tsx';
import { usePrepQueue } from '#src/features/orders/api/orders.ts';

/** The prep queue: approved photos and proofs sent back, the longest waiting first. */
export function PrepQueuePage() {
  return <WithWorkspace>{({ studio }) => <PrepQueue slug={studio.slug} />}</WithWorkspace>;
}

const since = (iso: string) => new Intl.DateTimeFormat(undefined, { dateStyle: 'medium', timeStyle: 'short' }).format(new Date(iso));

function PrepQueue({ slug }: { slug: string }) {
  const queue = usePrepQueue(slug);
  const items = queue.data?.items ?? [];
  return (
    <div className="flex flex-col gap-6">
      <div>
        <h1 className="text-3xl font-extrabold">Prep</h1>
        <p className="mt-1 text-graphite-600">Photos approved in review wait here to be prepared, the longest waiting first.</p>
      </div>
      {queue.error && <Notice tone="error">{queue.error.message}</Notice>}
      {queue.data && items.length === 0 && (
        <Notice>
          Nothing waits for prep. Approve photos in{' '}
          <Link to={`/studio/${slug}/review`} className="font-semibold underline">
            Photo review
          </Link>{' '}
          and they come here.
        </Notice>
      )}
      {items.length > 0 && (
        <ol aria-label="Waiting for prep" className="flex flex-col gap-2">
          {items.map((item) => (
            <li key={item.itemId}>
              <Link
                to={`/studio/${slug}/items/${item.itemId}`}
                className="flex items-center gap-4 rounded-card border border-graphite-100 bg-white p-3 hover:border-ember-300"
              >
                <img src={item.thumbUrl} alt="" className="size-14 shrink-0 rounded object-cover" />
                <span className="min-w-0 flex-1">
                  <span className="block font-bold">
                    Order {item.orderNumber} · {item.buyerName}
                  </span>
                  <span className="block text-sm text-graphite-700">{item.label}</span>
                </span>
                <span className="shrink-0 text-right text-sm">
                  <span className="block font-semibold">{ITEM_STAGE_LABELS[item.stage]}</span>
                  <span className="block text-graphite-500">since {since(item.since)}</span>
                </span>
              </Link>
            </li>
          ))}
        </ol>
      )}
    </div>
  );
}
