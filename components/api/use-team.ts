import { useMutation, useQuery, useQueryClient } from '@tanstack/react-query';

import type { Invitation, InviteRequest, TeamMember, UpdateUserRequest } from '@/shared/contracts/team';

import { apiFetch } from './client';

/** Query keys of the Team area (admin). */
export const teamKeys = {
  all: ['team'] as const,
  users: () => [...teamKeys.all, 'users'] as const,
  invitations: () => [...teamKeys.all, 'invitations'] as const,
};

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

/** POST /api/team/invitations/:id/resend or /revoke; refreshes the Team lists and the audit log. */
export function useInvitationActionMutation() {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: ({ id, action }: { id: string; action: 'resend' | 'revoke' }) =>
      apiFetch<{ invitation: Invitation }>(`/team/invitations/${encodeURIComponent(id)}/${action}`, { method: 'POST', body: {} }),
    onSuccess: ({ invitation }) => {
      qc.setQueryData<Invitation[]>(teamKeys.invitations(), (old) => old?.map((i) => (i.id === invitation.id ? invitation : i)));
      void qc.invalidateQueries({ queryKey: teamKeys.all });
      void qc.invalidateQueries({ queryKey: ['audit'] });
    },
  });
}

/** POST /api/team/invitations — e-mails an invitation; refreshes the Team lists and the audit log. */
export function useInviteMutation() {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (input: InviteRequest) => apiFetch<{ invitation: Pick<Invitation, 'id' | 'email' | 'name' | 'role' | 'expiresAt'> }>('/team/invitations', { method: 'POST', body: input }),
    onSuccess: () => {
      void qc.invalidateQueries({ queryKey: teamKeys.all });
      void qc.invalidateQueries({ queryKey: ['audit'] });
    },
  });
}

/** PATCH /api/team/users/:id — change a role or disable/enable; refreshes the Team lists and the audit log. */
export function useUpdateUserMutation() {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: ({ id, change }: { id: string; change: UpdateUserRequest }) =>
      apiFetch<{ user: TeamMember }>(`/team/users/${encodeURIComponent(id)}`, { method: 'PATCH', body: change }),
    onSuccess: ({ user }) => {
      qc.setQueryData<TeamMember[]>(teamKeys.users(), (old) => old?.map((u) => (u.id === user.id ? user : u)));
      void qc.invalidateQueries({ queryKey: teamKeys.all });
      void qc.invalidateQueries({ queryKey: ['audit'] });
    },
  });
}
