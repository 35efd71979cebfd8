import { queryOptions, useQuery } from '@tanstack/react-query';
import { z } from 'zod';
import { invitePreviewSchema } from '#shared/schemas/team.ts';
import { apiFetch } from '#src/lib/api-client.ts';

export const inviteQueries = {
  preview: (token: string) =>
    queryOptions({
      queryKey: ['invites', token],
      queryFn: ({ signal }) => apiFetch(`/api/invites/${encodeURIComponent(token)}`, { schema: invitePreviewSchema, signal }),
    }),
};
export const useInvitePreview = (token: string) => useQuery(inviteQueries.preview(token));

const joinedSchema = z.object({ studioSlug: z.string() });
export const acceptInvite = (token: string) =>
  apiFetch(`/api/invites/${encodeURIComponent(token)}/accept`, { method: 'POST', schema: joinedSchema });
export const acceptInviteWithAccount = (token: string, body: { name: string; password: string }) =>
  apiFetch(`/api/invites/${encodeURIComponent(token)}/accept-with-account`, {
    method: 'POST',
    body,
    schema: joinedSchema.extend({ email: z.string() }),
  });
