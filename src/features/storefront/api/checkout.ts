import { queryOptions, useQuery } from '@tanstack/react-query';
import { z } from 'zod';
import { checkoutAnswerSchema, orderViewSchema, type CheckoutInput } from '#shared/schemas/checkout.ts';
import { apiFetch } from '#src/lib/api-client.ts';

const base = (slug: string) => `/api/storefront/${encodeURIComponent(slug)}`;

export const deliveryOptionsSchema = z.object({
  rates: z.array(z.object({ id: z.uuid(), name: z.string(), priceMinor: z.number().int(), price: z.string() })),
  pickup: z.object({ note: z.string() }).nullable(),
  lowResolutionPolicy: z.enum(['confirm', 'refuse']),
});

export const useDeliveryOptions = (slug: string) =>
  useQuery(
    queryOptions({
      queryKey: ['storefront', slug, 'delivery'],
      queryFn: ({ signal }) => apiFetch(`${base(slug)}/delivery`, { schema: deliveryOptionsSchema, signal }),
    }),
  );

export const placeOrder = (slug: string, input: CheckoutInput) =>
  apiFetch(`${base(slug)}/orders`, { method: 'POST', body: input, schema: checkoutAnswerSchema });

/** The buyer's order by its private link; refreshed while payment is on its way. */
export const useOrder = (slug: string, orderId: string, key: string) =>
  useQuery({
    queryKey: ['storefront', slug, 'orders', orderId, key],
    queryFn: ({ signal }) =>
      apiFetch(`${base(slug)}/orders/${orderId}?key=${encodeURIComponent(key)}`, { schema: orderViewSchema, signal }),
    refetchInterval: (query) => (query.state.data?.status === 'awaiting_payment' ? 1500 : false),
  });
