import { useMutation, useQuery } from '@tanstack/react-query';

import type { Plan, PlanCreated, PlanRequest } from '@/shared/contracts/plan';
import { apiFetch } from './client';

/** Query keys of maneuver plans ("Suggest steps"). */
export const planKeys = {
  all: ['plans'] as const,
  detail: (sequenceId: string, planId: string) => [...planKeys.all, sequenceId, planId] as const,
};

/** How often a queued or running plan is polled, ms. */
export const PLAN_POLL_MS = 1000;

/** POST /api/sequences/:id/plans — queues a planning run; answers { planId }. */
export function useStartPlanMutation(sequenceId: string) {
  return useMutation({
    mutationFn: (request: PlanRequest) =>
      apiFetch<PlanCreated>(`/sequences/${encodeURIComponent(sequenceId)}/plans`, { method: 'POST', body: request }),
  });
}

/** GET /api/sequences/:id/plans/:planId — polled every second until the plan is done or failed. */
export function usePlanQuery(sequenceId: string, planId: string | null) {
  return useQuery({
    queryKey: planKeys.detail(sequenceId, planId ?? ''),
    queryFn: () => apiFetch<Plan>(`/sequences/${encodeURIComponent(sequenceId)}/plans/${encodeURIComponent(planId ?? '')}`),
    enabled: !!planId,
    refetchInterval: (query) => {
      const state = query.state.data?.state;
      return state === 'done' || state === 'failed' ? false : PLAN_POLL_MS;
    },
  });
}
