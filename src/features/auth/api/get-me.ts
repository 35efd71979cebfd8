import { queryOptions, useQuery } from '@tanstack/react-query';
import { meSchema } from '#shared/schemas/accounts.ts';
import { apiFetch } from '#src/lib/api-client.ts';

export const getMe = (signal?: AbortSignal) => apiFetch('/api/me', { schema: meSchema, signal });

export const meQueries = {
  all: ['me'] as const,
  current: () => queryOptions({ queryKey: [...meQueries.all, 'current'], queryFn: ({ signal }) => getMe(signal), staleTime: 60_000 }),
};

/** The signed-in person and their studios; `user` is null when signed out. */
export const useMe = () => useQuery(meQueries.current());
