import { keepPreviousData, useQuery } from '@tanstack/react-query';

import type { AuditEvent } from '@/shared/contracts/team';

import { apiFetch } from './client';
import { auditKeys } from './query-keys';

/** Filters of the audit log view; times are ISO 8601 date-times, empty strings mean "any". */
export interface AuditFilters {
  action?: string;
  objectType?: string;
  actorId?: string;
  since?: string;
  until?: string;
  /** Newest N events, 1–500; the server's default is 100. */
  limit?: number;
}

/** GET /api/audit — newest first, filtered; keeps the previous page visible while new filters load. */
export function useAuditQuery(filters: AuditFilters) {
  return useQuery({
    queryKey: auditKeys.list(filters),
    queryFn: async ({ signal }) =>
      (await apiFetch<{ events: AuditEvent[] }>('/audit', { signal, query: { ...filters } })).events,
    placeholderData: keepPreviousData,
  });
}
