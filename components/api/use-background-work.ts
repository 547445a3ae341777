import { useMutation, useQuery, useQueryClient } from '@tanstack/react-query';

import type { BackgroundWork, WorkFilter, WorkKind } from '@/shared/contracts/background-work';

import { apiFetch } from './client';
import { backgroundWorkKeys } from './query-keys';

/** How often the list refreshes while it is open, ms. */
export const BACKGROUND_WORK_POLL_MS = 2000;

/** GET /api/jobs?filter=… — refreshed every two seconds while shown. */
export function useBackgroundWorkQuery(filter: WorkFilter) {
  return useQuery({
    queryKey: backgroundWorkKeys.list(filter),
    queryFn: () => apiFetch<BackgroundWork>(`/jobs?filter=${filter}`),
    refetchInterval: BACKGROUND_WORK_POLL_MS,
  });
}

/** POST /api/jobs/:kind/:id/retry|cancel. */
export function useBackgroundWorkAction() {
  const client = useQueryClient();
  return useMutation({
    mutationFn: ({ kind, id, action }: { kind: WorkKind; id: string; action: 'retry' | 'cancel' }) =>
      apiFetch<{ ok: true }>(`/jobs/${kind}/${encodeURIComponent(id)}/${action}`, { method: 'POST', body: {} }),
    onSettled: () => client.invalidateQueries({ queryKey: backgroundWorkKeys.all }),
  });
}
