import { queryOptions, useQuery } from '@tanstack/react-query';
import { z } from 'zod';
import { apiFetch } from '../../../lib/api-client.ts';

/** The signed-in user, or null. Served by the sign-in service at /api/auth/session. */
const sessionSchema = z
  .object({ user: z.object({ email: z.string(), name: z.string().nullish() }).optional() })
  .nullable()
  .transform((session) => session?.user ?? null);

export type SessionUser = NonNullable<z.infer<typeof sessionSchema>>;

export const getSession = (signal?: AbortSignal) => apiFetch('/api/auth/session', { schema: sessionSchema, signal });

export const sessionQueries = {
  current: () => queryOptions({ queryKey: ['session', 'current'], queryFn: ({ signal }) => getSession(signal), staleTime: 60_000, retry: false }),
};

export const useSession = () => useQuery(sessionQueries.current());
