import { useQuery } from '@tanstack/react-query';
import { myOrdersSchema } from '#shared/schemas/checkout.ts';
import { apiFetch } from '#src/lib/api-client.ts';

/** Every order placed with the signed-in person's confirmed address, at any studio. */
export const useMyOrders = () =>
  useQuery({ queryKey: ['me', 'orders'], queryFn: ({ signal }) => apiFetch('/api/me/orders', { schema: myOrdersSchema, signal }) });
