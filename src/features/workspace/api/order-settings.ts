import { queryOptions, useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import { z } from 'zod';
import { shippingRateSchema, type OrderSettingsInput, type ShippingRateInput, type ShippingRateView } from '#shared/studio.ts';
import { apiFetch } from '#src/lib/api-client.ts';
import { workspaceQueries, workspaceSchema } from './get-workspace.ts';

const base = (slug: string) => `/api/studios/${encodeURIComponent(slug)}`;
const ratesKey = (slug: string) => ['workspace', slug, 'shipping-rates'] as const;

export function useUpdateOrderSettings(slug: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (input: OrderSettingsInput) =>
      apiFetch(`${base(slug)}/settings/orders`, { method: 'PUT', body: input, schema: workspaceSchema }),
    onSuccess: (workspace) => queryClient.setQueryData(workspaceQueries.detail(slug).queryKey, workspace),
    onSettled: () => queryClient.invalidateQueries({ queryKey: ['storefront', slug] }),
  });
}

export const useShippingRates = (slug: string) =>
  useQuery(
    queryOptions({
      queryKey: ratesKey(slug),
      queryFn: ({ signal }) =>
        apiFetch(`${base(slug)}/shipping-rates`, { schema: z.object({ rates: z.array(shippingRateSchema) }), signal }),
    }),
  );

/** Rate changes show at once in the list and are put back if the server refuses them. */
function useRateMutation<T>(
  slug: string,
  run: (input: T) => Promise<unknown>,
  optimistic?: (rates: ShippingRateView[], input: T) => ShippingRateView[],
) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: run,
    onMutate: async (input: T) => {
      if (!optimistic) return undefined;
      await queryClient.cancelQueries({ queryKey: ratesKey(slug) });
      const previous = queryClient.getQueryData<{ rates: ShippingRateView[] }>(ratesKey(slug));
      if (previous) queryClient.setQueryData(ratesKey(slug), { rates: optimistic(previous.rates, input) });
      return { previous };
    },
    onError: (_e, _i, context) => context?.previous && queryClient.setQueryData(ratesKey(slug), context.previous),
    onSettled: () =>
      Promise.all([
        queryClient.invalidateQueries({ queryKey: ratesKey(slug) }),
        queryClient.invalidateQueries({ queryKey: ['storefront', slug] }),
      ]),
  });
}

export const useAddShippingRate = (slug: string) =>
  useRateMutation(slug, (input: ShippingRateInput) =>
    apiFetch(`${base(slug)}/shipping-rates`, { method: 'POST', body: input, schema: shippingRateSchema }),
  );
export const useUpdateShippingRate = (slug: string) =>
  useRateMutation(
    slug,
    ({ id, input }: { id: string; input: ShippingRateInput }) =>
      apiFetch(`${base(slug)}/shipping-rates/${id}`, { method: 'PUT', body: input, schema: shippingRateSchema }),
    (rates, { id, input }) => rates.map((r) => (r.id === id ? { ...r, ...input } : r)),
  );
export const useDeleteShippingRate = (slug: string) =>
  useRateMutation(
    slug,
    (id: string) => apiFetch(`${base(slug)}/shipping-rates/${id}`, { method: 'DELETE' }),
    (rates, id) => rates.filter((r) => r.id !== id),
  );
