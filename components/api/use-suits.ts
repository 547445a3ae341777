import { useMutation, useQuery, useQueryClient } from '@tanstack/react-query';

import type { SuitView } from '@/shared/contracts/crew';
import type { SuitConfigInput } from '@/shared/contracts/suit';

import { ApiError, apiFetch } from './client';
import { suitKeys } from './query-keys';

/** GET /api/suits — the stored suit configurations, by name. */
export function useSuitsQuery() {
  return useQuery({
    queryKey: suitKeys.list(),
    queryFn: async ({ signal }) => (await apiFetch<{ suits: SuitView[] }>('/suits', { signal })).suits,
    staleTime: 60_000,
  });
}

/**
 * PUT /api/suits/:id — saves an edited configuration (planners, admins); later profile saves copy it.
 * `baseVersion` is the version the edit started from: the server answers 409 `stale_version` when
 * someone saved in between.
 */
export function useUpdateSuitMutation() {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: ({ id, config, baseVersion }: { id: string; config: SuitConfigInput; baseVersion: number }) =>
      apiFetch<{ suit: SuitView }>(`/suits/${encodeURIComponent(id)}`, { method: 'PUT', body: { ...config, baseVersion } }),
    onSuccess: () => void qc.invalidateQueries({ queryKey: suitKeys.all }),
    // A stale save means the list is behind: fetch the newer version so the editor can load it.
    onError: (e) => {
      if (e instanceof ApiError && e.code === 'stale_version') void qc.invalidateQueries({ queryKey: suitKeys.all });
    },
  });
}
