import { infiniteQueryOptions, useInfiniteQuery } from '@tanstack/react-query';
import { auditPageSchema, type AuditGroup } from '#shared/schemas/audit.ts';
import { apiFetch } from '#src/lib/api-client.ts';

const PAGE_SIZE = 50;

export const auditQueries = {
  list: (slug: string, group: AuditGroup | undefined) =>
    infiniteQueryOptions({
      queryKey: ['audit', slug, group ?? 'all'],
      initialPageParam: undefined as string | undefined,
      queryFn: ({ pageParam, signal }) => {
        const params = new URLSearchParams({ limit: String(PAGE_SIZE) });
        if (group) params.set('group', group);
        if (pageParam) params.set('before', pageParam);
        return apiFetch(`/api/studios/${encodeURIComponent(slug)}/audit?${params}`, { schema: auditPageSchema, signal });
      },
      getNextPageParam: (page) => page.next ?? undefined,
    }),
};

/** The studio's audit log, newest first, one page of 50 at a time. */
export const useAuditLog = (slug: string, group: AuditGroup | undefined) => useInfiniteQuery(auditQueries.list(slug, group));
