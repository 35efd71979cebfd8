import { queryOptions, useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import { inviteSchema, teamSchema, type CreateInviteInput } from '#shared/schemas/team.ts';
import type { Role } from '#shared/permissions.ts';
import { apiFetch } from '#src/lib/api-client.ts';

const base = (slug: string) => `/api/studios/${encodeURIComponent(slug)}/team`;

export const teamQueries = {
  all: ['team'] as const,
  detail: (slug: string) =>
    queryOptions({ queryKey: [...teamQueries.all, slug], queryFn: ({ signal }) => apiFetch(base(slug), { schema: teamSchema, signal }) }),
};

export const useTeam = (slug: string) => useQuery(teamQueries.detail(slug));

/** Every team change refreshes the team list. */
function useTeamMutation<T>(slug: string, run: (input: T) => Promise<unknown>) {
  const queryClient = useQueryClient();
  return useMutation({ mutationFn: run, onSettled: () => queryClient.invalidateQueries({ queryKey: teamQueries.detail(slug).queryKey }) });
}

export const useInvite = (slug: string) =>
  useTeamMutation(slug, (input: CreateInviteInput) =>
    apiFetch(`${base(slug)}/invites`, { method: 'POST', body: input, schema: inviteSchema }),
  );
export const useWithdrawInvite = (slug: string) =>
  useTeamMutation(slug, (inviteId: string) => apiFetch(`${base(slug)}/invites/${inviteId}`, { method: 'DELETE' }));
export const useChangeRole = (slug: string) =>
  useTeamMutation(slug, ({ memberId, role }: { memberId: string; role: Role }) =>
    apiFetch(`${base(slug)}/members/${memberId}`, { method: 'PATCH', body: { role } }),
  );
export const useRemoveMember = (slug: string) =>
  useTeamMutation(slug, (memberId: string) => apiFetch(`${base(slug)}/members/${memberId}`, { method: 'DELETE' }));
