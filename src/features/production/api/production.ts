import { queryOptions, useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import {
  batchViewSchema,
  createdBatchSchema,
  downloadLinkSchema,
  productionBoardSchema,
  type BatchView,
  type RenderFileKind,
  type ShipInput,
} from '#shared/schemas/production.ts';
import { apiFetch } from '#src/lib/api-client.ts';

const base = (slug: string) => `/api/studios/${encodeURIComponent(slug)}`;
/** While a render is on its way, its batch is asked again every second for the progress. */
const POLL_MS = 1000;
const rendering = (batch: BatchView | undefined) =>
  Boolean(batch?.items.some((i) => i.render.status === 'queued' || i.render.status === 'running'));

export const productionQueries = {
  all: (slug: string) => ['production', slug] as const,
  board: (slug: string) =>
    queryOptions({
      queryKey: ['production', slug, 'board'],
      queryFn: ({ signal }) => apiFetch(`${base(slug)}/production`, { schema: productionBoardSchema, signal }),
    }),
  batch: (slug: string, batchId: string) =>
    queryOptions({
      queryKey: ['production', slug, 'batch', batchId],
      queryFn: ({ signal }) => apiFetch(`${base(slug)}/production/batches/${batchId}`, { schema: batchViewSchema, signal }),
      refetchInterval: (query) => (rendering(query.state.data) ? POLL_MS : false),
    }),
};

export const useProductionBoard = (slug: string) => useQuery(productionQueries.board(slug));
export const useBatch = (slug: string, batchId: string) => useQuery(productionQueries.batch(slug, batchId));

/** Production moves refresh production and the orders (stages show on both). */
function useProductionMove<T, R = unknown>(slug: string, run: (input: T) => Promise<R>) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: run,
    onSettled: () =>
      Promise.all([
        queryClient.invalidateQueries({ queryKey: productionQueries.all(slug) }),
        queryClient.invalidateQueries({ queryKey: ['orders', slug] }),
      ]),
  });
}

export const useCreateBatch = (slug: string) =>
  useProductionMove(slug, (itemIds: string[]) =>
    apiFetch(`${base(slug)}/production/batches`, { method: 'POST', body: { itemIds }, schema: createdBatchSchema }),
  );
export const useRetryRender = (slug: string) =>
  useProductionMove(slug, (renderId: string) => apiFetch(`${base(slug)}/production/renders/${renderId}/retry`, { method: 'POST' }));
export const useMarkBurned = (slug: string) =>
  useProductionMove(slug, (itemId: string) => apiFetch(`${base(slug)}/items/${itemId}/burned`, { method: 'POST' }));
export const useTakeOutOfBatch = (slug: string) =>
  useProductionMove(slug, (itemId: string) => apiFetch(`${base(slug)}/items/${itemId}/out-of-batch`, { method: 'POST' }));
export const useHandOver = (slug: string, orderId: string) =>
  useProductionMove(slug, (input: ShipInput) => apiFetch(`${base(slug)}/orders/${orderId}/handover`, { method: 'POST', body: input }));

/** Asks for a short-lived link to a render's file and lets the browser download it. */
export async function downloadRenderFile(slug: string, renderId: string, kind: RenderFileKind): Promise<void> {
  const link = await apiFetch(`${base(slug)}/production/renders/${renderId}/files/${kind}`, { schema: downloadLinkSchema });
  window.location.assign(link.url);
}
