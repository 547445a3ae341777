import { useMutation, useQuery, useQueryClient } from '@tanstack/react-query';

import type { ReverificationProgress } from '@/shared/contracts/maneuver';

import { apiFetch } from './client';
import { crewKeys, sequenceKeys } from './query-keys';

/** How often open re-verifications are polled, ms. */
const POLL_MS = 1500;

/** GET /api/crew/:id/reverifications — polled while any version is still queued or running. */
export function useReverificationProgressQuery(crewMemberId: string) {
  return useQuery({
    queryKey: crewKeys.reverifications(crewMemberId),
    queryFn: ({ signal }) => apiFetch<ReverificationProgress>(`/crew/${encodeURIComponent(crewMemberId)}/reverifications`, { signal }),
    refetchInterval: (query) => {
      const p = query.state.data;
      return p && p.queued + p.running > 0 ? POLL_MS : false;
    },
  });
}

/** POST /api/crew/:id/reverifications/cancel — stops every open re-verification; answers the progress. */
export function useCancelReverificationsMutation(crewMemberId: string) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: () => apiFetch<ReverificationProgress>(`/crew/${encodeURIComponent(crewMemberId)}/reverifications/cancel`, { method: 'POST' }),
    onSuccess: (p) => {
      qc.setQueryData(crewKeys.reverifications(crewMemberId), p);
      // Maneuver lists show each version's re-verification state.
      return qc.invalidateQueries({ queryKey: sequenceKeys.all });
    },
  });
}
