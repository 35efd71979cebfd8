import { queryOptions, useQuery } from '@tanstack/react-query';
import { storefrontCatalogSchema } from '#shared/schemas/catalog.ts';
import { apiFetch } from '#src/lib/api-client.ts';

export const storefrontCatalogQueries = {
  blanks: (slug: string) =>
    queryOptions({
      queryKey: ['storefront', slug, 'blanks'],
      queryFn: ({ signal }) => apiFetch(`/api/storefront/${encodeURIComponent(slug)}/blanks`, { schema: storefrontCatalogSchema, signal }),
    }),
};

export const useStorefrontCatalog = (slug: string) => useQuery(storefrontCatalogQueries.blanks(slug));
