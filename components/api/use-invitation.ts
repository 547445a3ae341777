import { useMutation, useQuery, useQueryClient } from '@tanstack/react-query';

import type { SignInResponse } from '@/shared/contracts/auth';
import type { AcceptInvitationRequest, InvitationPreview } from '@/shared/contracts/team';

import { apiFetch } from './client';
import { invitationKeys, sessionKeys } from './query-keys';

/** GET /api/invitations/:token — name, e-mail and role the invitation was made for (404 when not valid). */
export function useInvitationPreviewQuery(token: string) {
  return useQuery({
    queryKey: invitationKeys.preview(token),
    queryFn: ({ signal }) => apiFetch<InvitationPreview>(`/invitations/${encodeURIComponent(token)}`, { signal }),
    enabled: token.length > 0,
    staleTime: Infinity,
  });
}

/** POST /api/invitations/:token/accept — creates the account and signs the invitee in. */
export function useAcceptInvitationMutation(token: string) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (input: AcceptInvitationRequest) =>
      apiFetch<SignInResponse>(`/invitations/${encodeURIComponent(token)}/accept`, { method: 'POST', body: input }),
    onSuccess: ({ user }) => {
      qc.clear();
      qc.setQueryData(sessionKeys.me(), user);
    },
  });
}
