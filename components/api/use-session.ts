import { useMutation, useQuery, useQueryClient } from '@tanstack/react-query';

import type { ChangePasswordRequest, SessionUser, SignInRequest, SignInResponse } from '@/shared/contracts/auth';

import { apiFetch, isApiStatus } from './client';
import { sessionKeys } from './query-keys';

/** The signed-in user, `null` when signed out (401), or an error when the server cannot be reached. */
export function useSessionQuery() {
  return useQuery({
    queryKey: sessionKeys.me(),
    queryFn: async ({ signal }): Promise<SessionUser | null> => {
      try {
        const { user } = await apiFetch<{ user: SessionUser }>('/me', { signal });
        return user;
      } catch (err) {
        if (isApiStatus(err, 401)) return null;
        throw err;
      }
    },
    staleTime: 60_000,
  });
}

/** POST /api/auth/sign-in; on success the session cache holds the user (cookie set by the server). */
export function useSignInMutation() {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (input: SignInRequest) => apiFetch<SignInResponse>('/auth/sign-in', { method: 'POST', body: input }),
    onSuccess: ({ user }) => {
      // Another user's cached data must never show: start from a clean cache.
      qc.clear();
      qc.setQueryData(sessionKeys.me(), user);
    },
  });
}

/** POST /api/me/sign-out; clears every cached query. */
export function useSignOutMutation() {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: () => apiFetch<void>('/me/sign-out', { method: 'POST' }),
    onSettled: () => {
      qc.clear();
      qc.setQueryData(sessionKeys.me(), null);
    },
  });
}

/** POST /api/me/password; the server signs the user out everywhere on success. */
export function useChangePasswordMutation() {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (input: ChangePasswordRequest) => apiFetch<void>('/me/password', { method: 'POST', body: input }),
    onSuccess: () => {
      qc.clear();
      qc.setQueryData(sessionKeys.me(), null);
    },
  });
}
