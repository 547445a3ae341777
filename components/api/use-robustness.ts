import { useMutation, useQuery, useQueryClient } from '@tanstack/react-query';

import type { RobustnessRun, StartRobustnessRequest } from '@/shared/contracts/robustness-run';

import { apiFetch, isApiStatus } from './client';
import { robustnessKeys } from './query-keys';

/** How often a queued or running run is polled, ms. */
export const ROBUSTNESS_POLL_MS = 1000;

/** GET /api/sequences/versions/:id/robustness — the newest run (null when none), polled until it ends. */
export function useVersionRobustnessQuery(versionId: string) {
  return useQuery({
    queryKey: robustnessKeys.version(versionId),
    queryFn: async (): Promise<RobustnessRun | null> => {
      try {
        return await apiFetch<RobustnessRun>(`/sequences/versions/${encodeURIComponent(versionId)}/robustness`);
      } catch (err) {
        if (isApiStatus(err, 404)) return null;
        throw err;
      }
    },
    refetchInterval: (query) => {
      const state = query.state.data?.state;
      return state === 'queued' || state === 'running' ? ROBUSTNESS_POLL_MS : false;
    },
  });
}

/** POST …/robustness (start) and POST …/robustness/cancel. */
export function useRobustnessActions(versionId: string) {
  const client = useQueryClient();
  const base = `/sequences/versions/${encodeURIComponent(versionId)}/robustness`;
  const refresh = (run: RobustnessRun) => client.setQueryData(robustnessKeys.version(versionId), run);
  return {
    start: useMutation({ mutationFn: (req: StartRobustnessRequest) => apiFetch<RobustnessRun>(base, { method: 'POST', body: req }), onSuccess: refresh }),
    cancel: useMutation({ mutationFn: () => apiFetch<RobustnessRun>(`${base}/cancel`, { method: 'POST', body: {} }), onSuccess: refresh }),
  };
}
