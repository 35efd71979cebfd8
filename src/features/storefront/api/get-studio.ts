import { queryOptions, useQuery } from '@tanstack/react-query';
import { publicStudioSchema } from '#shared/studio.ts';
import { apiFetch } from '#src/lib/api-client.ts';

export const getPublicStudio = (slug: string, signal?: AbortSignal) =>
  apiFetch(`/api/storefront/${encodeURIComponent(slug)}`, { schema: publicStudioSchema, signal });

export const studioQueries = {
  all: ['studios'] as const,
  publicDetail: (slug: string) =>
    queryOptions({ queryKey: [...studioQueries.all, 'public', slug], queryFn: ({ signal }) => getPublicStudio(slug, signal) }),
};

export const usePublicStudio = (slug: string) => useQuery(studioQueries.publicDetail(slug));
