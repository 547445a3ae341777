import { useMutation, useQuery, useQueryClient } from '@tanstack/react-query';

import type { LogRehearsalRequest, RehearsableVersion, Rehearsal } from '@/shared/contracts/rehearsal';

import { apiFetch } from './client';
import { rehearsalKeys } from './query-keys';

/** GET /api/rehearsals/available — cleared versions the signed-in trainee may rehearse (and rehearsed ones now in re-check). */
export function useRehearsableVersionsQuery() {
  return useQuery({
    queryKey: rehearsalKeys.available(),
    queryFn: async ({ signal }) => (await apiFetch<{ versions: RehearsableVersion[] }>('/rehearsals/available', { signal })).versions,
  });
}

/** GET /api/rehearsals[?versionId=] — logged rehearsals, newest first (a trainee's own). */
export function useRehearsalHistoryQuery(versionId?: string) {
  return useQuery({
    queryKey: rehearsalKeys.history(versionId),
    queryFn: async ({ signal }) => (await apiFetch<{ rehearsals: Rehearsal[] }>('/rehearsals', { query: { versionId }, signal })).rehearsals,
  });
}

/** POST /api/rehearsals — logs a run; refreshes the history and the list's "last rehearsal". */
export function useLogRehearsalMutation() {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (input: LogRehearsalRequest) => apiFetch<{ rehearsal: Rehearsal }>('/rehearsals', { method: 'POST', body: input }),
    onSuccess: () => {
      void qc.invalidateQueries({ queryKey: rehearsalKeys.all });
    },
  });
}
