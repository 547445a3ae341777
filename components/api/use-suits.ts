import { useQuery } from '@tanstack/react-query';

import type { SuitView } from '@/shared/contracts/crew';
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
