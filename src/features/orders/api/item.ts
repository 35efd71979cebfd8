import { useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import { regionPreviewSchema, type RegionPreviewInput } from '#shared/schemas/prep.ts';
import { staffItemSchema } from '#shared/schemas/workspace-orders.ts';
import { useToast } from '#src/components/ui/toast.tsx';
import { apiFetch } from '#src/lib/api-client.ts';

const itemUrl = (slug: string, itemId: string) => `/api/studios/${encodeURIComponent(slug)}/items/${encodeURIComponent(itemId)}`;

/** One item as staff prepare it: its order, placement, prep settings and their versions. */
export const useStaffItem = (slug: string, itemId: string) =>
  useQuery({
    queryKey: ['orders', slug, 'item', itemId],
    queryFn: ({ signal }) => apiFetch(itemUrl(slug, itemId), { schema: staffItemSchema, signal }),
  });

/** The 1:1 region: a piece of the burn at full resolution, drawn by the server's pipeline. */
export const useRegionPreview = (slug: string, itemId: string) =>
  useMutation({
    mutationFn: (body: RegionPreviewInput) =>
      apiFetch(`${itemUrl(slug, itemId)}/prep-preview`, { method: 'POST', body, schema: regionPreviewSchema }),
  });

/**
 * What staff do to an item in prep (save settings, send a proof, approve, reopen): the answer is
 * shown as a toast, and the studio's order queries refresh either way.
 */
export function useItemAction(slug: string, itemId: string) {
  const queryClient = useQueryClient();
  const toast = useToast();
  return useMutation({
    mutationFn: ({ path, method = 'POST', body }: { path: string; method?: 'POST' | 'PUT'; body?: unknown; done: string }) =>
      apiFetch(`${itemUrl(slug, itemId)}${path}`, { method, body }),
    onSuccess: (_r, { done }) => toast.show(done, 'success'),
    onError: (e) => toast.show((e as Error).message, 'error'),
    onSettled: () => queryClient.invalidateQueries({ queryKey: ['orders', slug] }),
  });
}
