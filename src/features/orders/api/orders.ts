import { keepPreviousData, queryOptions, useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import {
  orderListSchema,
  prepQueueSchema,
  reviewQueueSchema,
  staffOrderSchema,
  type AskNewPhotoInput,
  type OrderListQuery,
  type ReviewItem,
} from '#shared/schemas/workspace-orders.ts';
import { apiFetch } from '#src/lib/api-client.ts';

const base = (slug: string) => `/api/studios/${encodeURIComponent(slug)}`;

export const orderQueries = {
  all: (slug: string) => ['orders', slug] as const,
  list: (slug: string, query: OrderListQuery) => {
    const params = new URLSearchParams(Object.entries(query).flatMap(([k, v]) => (v === undefined || v === '' ? [] : [[k, String(v)]])));
    return queryOptions({
      queryKey: ['orders', slug, 'list', query],
      queryFn: ({ signal }) => apiFetch(`${base(slug)}/orders?${params}`, { schema: orderListSchema, signal }),
      placeholderData: keepPreviousData,
    });
  },
  detail: (slug: string, orderId: string) =>
    queryOptions({
      queryKey: ['orders', slug, 'detail', orderId],
      queryFn: ({ signal }) => apiFetch(`${base(slug)}/orders/${orderId}`, { schema: staffOrderSchema, signal }),
    }),
  review: (slug: string) =>
    queryOptions({
      queryKey: ['orders', slug, 'review'],
      queryFn: ({ signal }) => apiFetch(`${base(slug)}/review-queue`, { schema: reviewQueueSchema, signal }),
    }),
  prep: (slug: string) =>
    queryOptions({
      queryKey: ['orders', slug, 'prep'],
      queryFn: ({ signal }) => apiFetch(`${base(slug)}/prep-queue`, { schema: prepQueueSchema, signal }),
    }),
};

export const useOrderList = (slug: string, query: OrderListQuery) => useQuery(orderQueries.list(slug, query));
export const useStaffOrder = (slug: string, orderId: string) => useQuery(orderQueries.detail(slug, orderId));
export const useReviewQueue = (slug: string) => useQuery(orderQueries.review(slug));
export const usePrepQueue = (slug: string) => useQuery(orderQueries.prep(slug));

/** A review answer leaves the queue at once; it comes back if the server refuses the move. */
function useReviewMove<T extends { itemId: string }>(slug: string, run: (input: T) => Promise<unknown>) {
  const queryClient = useQueryClient();
  const key = orderQueries.review(slug).queryKey;
  return useMutation({
    mutationFn: run,
    onMutate: async (input: T) => {
      await queryClient.cancelQueries({ queryKey: key });
      const previous = queryClient.getQueryData<{ items: ReviewItem[] }>(key);
      if (previous) queryClient.setQueryData(key, { items: previous.items.filter((i) => i.itemId !== input.itemId) });
      return { previous };
    },
    onError: (_e, _i, context) => context?.previous && queryClient.setQueryData(key, context.previous),
    onSettled: () => queryClient.invalidateQueries({ queryKey: orderQueries.all(slug) }),
  });
}

export const useApprovePhoto = (slug: string) =>
  useReviewMove(slug, ({ itemId }: { itemId: string }) => apiFetch(`${base(slug)}/items/${itemId}/approve-photo`, { method: 'POST' }));
export const useAskNewPhoto = (slug: string) =>
  useReviewMove(slug, ({ itemId, ...input }: { itemId: string } & AskNewPhotoInput) =>
    apiFetch(`${base(slug)}/items/${itemId}/ask-new-photo`, { method: 'POST', body: input }),
  );

/** Refunds and cancellations refresh the order and the lists. */
function useOrderMoney<T>(slug: string, run: (input: T) => Promise<unknown>) {
  const queryClient = useQueryClient();
  return useMutation({ mutationFn: run, onSettled: () => queryClient.invalidateQueries({ queryKey: orderQueries.all(slug) }) });
}
export const useRefund = (slug: string, orderId: string) =>
  useOrderMoney(slug, (input: { amountMinor?: number; reason: string }) =>
    apiFetch(`${base(slug)}/orders/${orderId}/refunds`, { method: 'POST', body: input }),
  );
export const useCancelOrder = (slug: string, orderId: string) =>
  useOrderMoney(slug, (input: { reason: string }) => apiFetch(`${base(slug)}/orders/${orderId}/cancel`, { method: 'POST', body: input }));
