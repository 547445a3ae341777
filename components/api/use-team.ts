import { type QueryKey, useMutation, useQuery, useQueryClient } from '@tanstack/react-query';

import type { Invitation, InviteRequest, TeamMember, UpdateUserRequest } from '@/shared/contracts/team';

import { apiFetch } from './client';
import { auditKeys, teamKeys } from './query-keys';

/** GET /api/team/users — every user, by name. */
export function useTeamUsersQuery() {
  return useQuery({
    queryKey: teamKeys.users(),
    queryFn: async ({ signal }) => (await apiFetch<{ users: TeamMember[] }>('/team/users', { signal })).users,
  });
}

/** GET /api/team/invitations — open, used, revoked and expired invitations, newest first. */
export function useTeamInvitationsQuery() {
  return useQuery({
    queryKey: teamKeys.invitations(),
    queryFn: async ({ signal }) => (await apiFetch<{ invitations: Invitation[] }>('/team/invitations', { signal })).invitations,
    // While an e-mail is being sent (or retried), follow it until it is sent or fails.
    refetchInterval: (query) => (query.state.data?.some((i) => i.mailState === 'sending' && !i.acceptedAt && !i.revokedAt) ? 3000 : false),
  });
}

/**
 * After a Team change: the changed row (when the server answered one) replaces its copy in the cached
 * list at once, then the Team lists and the audit log that records the change refetch.
 */
function useTeamSettled() {
  const qc = useQueryClient();
  return <Row extends { id: string }>(changed?: { list: QueryKey; row: Row }) => {
    if (changed) qc.setQueryData<Row[]>(changed.list, (old) => old?.map((r) => (r.id === changed.row.id ? changed.row : r)));
    void qc.invalidateQueries({ queryKey: teamKeys.all });
    void qc.invalidateQueries({ queryKey: auditKeys.all });
  };
}

/** POST /api/team/invitations/:id/resend or /revoke; refreshes the Team lists and the audit log. */
export function useInvitationActionMutation() {
  const settled = useTeamSettled();
  return useMutation({
    mutationFn: ({ id, action }: { id: string; action: 'resend' | 'revoke' }) =>
      apiFetch<{ invitation: Invitation }>(`/team/invitations/${encodeURIComponent(id)}/${action}`, { method: 'POST', body: {} }),
    onSuccess: ({ invitation }) => settled({ list: teamKeys.invitations(), row: invitation }),
  });
}

/** POST /api/team/invitations — e-mails an invitation; refreshes the Team lists and the audit log. */
export function useInviteMutation() {
  const settled = useTeamSettled();
  return useMutation({
    mutationFn: (input: InviteRequest) => apiFetch<{ invitation: Pick<Invitation, 'id' | 'email' | 'name' | 'role' | 'expiresAt'> }>('/team/invitations', { method: 'POST', body: input }),
    onSuccess: () => settled(),
  });
}

/** PATCH /api/team/users/:id — change a role or disable/enable; refreshes the Team lists and the audit log. */
export function useUpdateUserMutation() {
  const settled = useTeamSettled();
  return useMutation({
    mutationFn: ({ id, change }: { id: string; change: UpdateUserRequest }) =>
      apiFetch<{ user: TeamMember }>(`/team/users/${encodeURIComponent(id)}`, { method: 'PATCH', body: change }),
    onSuccess: ({ user }) => settled({ list: teamKeys.users(), row: user }),
  });
}
