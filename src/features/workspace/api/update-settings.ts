import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { StudioSettingsInput } from '#shared/studio.ts';
import { apiFetch } from '#src/lib/api-client.ts';
import { workspaceQueries, workspaceSchema } from './get-workspace.ts';
import { studioQueries } from '#src/features/storefront/index.ts';

/** Saves the studio's settings; the workspace and its storefront pick up the change. */
export function useUpdateSettings(slug: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (input: StudioSettingsInput) =>
      apiFetch(`/api/studios/${encodeURIComponent(slug)}/settings`, { method: 'PUT', body: input, schema: workspaceSchema }),
    onSuccess: (workspace) => queryClient.setQueryData(workspaceQueries.detail(slug).queryKey, workspace),
    onSettled: () => queryClient.invalidateQueries({ queryKey: studioQueries.publicDetail(slug).queryKey }),
  });
}
