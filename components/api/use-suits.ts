import { useMutation, useQuery, useQueryClient } from '@tanstack/react-query';

import type { SuitView } from '@/shared/contracts/crew';
import type { SuitConfigInput } from '@/shared/contracts/suit';
import { apiFetch } from './client';

/** Query keys of the suit configurations. */
export const suitKeys = {
  all: ['suits'] as const,
  list: () => [...suitKeys.all, 'list'] as const,
};

/** GET /api/suits — the stored suit configurations, by name. */
export function useSuitsQuery() {
  return useQuery({
    queryKey: suitKeys.list(),
    queryFn: async ({ signal }) => (await apiFetch<{ suits: SuitView[] }>('/suits', { signal })).suits,
    staleTime: 60_000,
  });
}

/** PUT /api/suits/:id — saves an edited configuration (planners, admins); later profile saves copy it. */
export function useUpdateSuitMutation() {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: ({ id, config }: { id: string; config: SuitConfigInput }) => apiFetch<{ suit: SuitView }>(`/suits/${encodeURIComponent(id)}`, { method: 'PUT', body: config }),
    onSuccess: () => void qc.invalidateQueries({ queryKey: suitKeys.all }),
  });
}
