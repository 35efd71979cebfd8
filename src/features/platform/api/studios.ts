import { queryOptions, useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import { z } from 'zod';
import { apiFetch } from '#src/lib/api-client.ts';

const platformStudiosSchema = z.object({
  studios: z.array(
    z.object({
      slug: z.string(),
      name: z.string(),
      status: z.enum(['active', 'suspended']),
      createdAt: z.string(),
      owners: z.number(),
      staff: z.number(),
    }),
  ),
});

export const platformQueries = {
  studios: () =>
    queryOptions({
      queryKey: ['platform', 'studios'],
      queryFn: ({ signal }) => apiFetch('/api/platform/studios', { schema: platformStudiosSchema, signal }),
    }),
};
export const usePlatformStudios = () => useQuery(platformQueries.studios());

export function useSetStudioStatus() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: ({ slug, action }: { slug: string; action: 'suspend' | 'resume' }) =>
      apiFetch(`/api/platform/studios/${slug}/${action}`, { method: 'POST' }),
    onSettled: () => queryClient.invalidateQueries({ queryKey: platformQueries.studios().queryKey }),
  });
}
