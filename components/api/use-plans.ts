import { useMutation, useQuery, useQueryClient } from '@tanstack/react-query';

import type { CandidateMotionResponse } from '@/shared/contracts/motion';
import type { Plan, PlanCreated, PlanList, PlanRequest } from '@/shared/contracts/plan';

import { apiFetch } from './client';
import { planKeys } from './query-keys';

/** How often a queued or running plan is polled, ms. */
export const PLAN_POLL_MS = 1000;

/** POST /api/sequences/:id/plans — queues a planning run; answers { planId }. */
export function useStartPlanMutation(sequenceId: string) {
  const client = useQueryClient();
  return useMutation({
    mutationFn: (request: PlanRequest) =>
      apiFetch<PlanCreated>(`/sequences/${encodeURIComponent(sequenceId)}/plans`, { method: 'POST', body: request }),
    // The new plan is now the latest: a composer opened later must find it, not the cached older one.
    onSuccess: () => client.invalidateQueries({ queryKey: planKeys.latest(sequenceId) }),
  });
}

/**
 * GET /api/sequences/:id/plans?limit=1 — the sequence's latest plan (summary, or null when none),
 * so the composer shows a running or finished plan again after a reload. Always refetched on open.
 */
export function useLatestPlanQuery(sequenceId: string, enabled = true) {
  return useQuery({
    queryKey: planKeys.latest(sequenceId),
    queryFn: async () => (await apiFetch<PlanList>(`/sequences/${encodeURIComponent(sequenceId)}/plans?limit=1`)).plans[0] ?? null,
    enabled,
    staleTime: 0,
  });
}

/** Whether a plan has ended (nothing more to poll). */
export function planEnded(state: Plan['state'] | undefined): boolean {
  return state === 'done' || state === 'failed' || state === 'cancelled';
}

/** POST /api/sequences/:id/plans/:planId/cancel — stops a queued or running plan; answers the plan. */
export function useCancelPlanMutation(sequenceId: string) {
  const client = useQueryClient();
  return useMutation({
    mutationFn: (planId: string) =>
      apiFetch<Plan>(`/sequences/${encodeURIComponent(sequenceId)}/plans/${encodeURIComponent(planId)}/cancel`, { method: 'POST' }),
    onSuccess: (plan) => {
      client.setQueryData(planKeys.detail(sequenceId, plan.id), plan);
      return client.invalidateQueries({ queryKey: planKeys.latest(sequenceId) });
    },
  });
}

/** GET /api/sequences/:id/plans/:planId — polled every second until the plan has ended. */
export function usePlanQuery(sequenceId: string, planId: string | null) {
  return useQuery({
    queryKey: planKeys.detail(sequenceId, planId ?? ''),
    queryFn: () => apiFetch<Plan>(`/sequences/${encodeURIComponent(sequenceId)}/plans/${encodeURIComponent(planId ?? '')}`),
    enabled: !!planId,
    refetchInterval: (query) => (planEnded(query.state.data?.state) ? false : PLAN_POLL_MS),
  });
}

/**
 * GET /api/sequences/:id/plans/:planId/candidates/:rank/motion — a suggestion simulated for the 3D
 * preview before it is used; fetched once per candidate and kept (a finished plan never changes).
 */
export function useCandidateMotionQuery(sequenceId: string, planId: string, rank: number) {
  return useQuery({
    queryKey: planKeys.candidateMotion(sequenceId, planId, rank),
    queryFn: ({ signal }) =>
      apiFetch<CandidateMotionResponse>(`/sequences/${encodeURIComponent(sequenceId)}/plans/${encodeURIComponent(planId)}/candidates/${rank}/motion`, { signal }),
    staleTime: Infinity,
    gcTime: 10 * 60_000,
    refetchOnWindowFocus: false,
  });
}
