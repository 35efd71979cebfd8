import { queryOptions, useQuery } from '@tanstack/react-query';
import { z } from 'zod';
import { slugAvailabilitySchema, type OpenStudioInput } from '#shared/schemas/accounts.ts';
import { apiFetch } from '#src/lib/api-client.ts';

export const slugQueries = {
  availability: (slug: string) =>
    queryOptions({
      queryKey: ['accounts', 'slug', slug],
      queryFn: ({ signal }) =>
        apiFetch(`/api/accounts/slug-availability?slug=${encodeURIComponent(slug)}`, { schema: slugAvailabilitySchema, signal }),
      enabled: slug.length > 0,
      staleTime: 10_000,
    }),
};
export const useSlugAvailability = (slug: string) => useQuery(slugQueries.availability(slug));

export const openStudio = (input: OpenStudioInput) =>
  apiFetch('/api/accounts/studios', { method: 'POST', body: input, schema: z.object({ studioSlug: z.string() }) });
