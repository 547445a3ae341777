import { keepPreviousData, useInfiniteQuery, useMutation, useQuery, useQueryClient } from '@tanstack/react-query';

import type {
  CompareResponse,
  CompileRequest,
  CompileResponse,
  CreateSequenceRequest,
  SaveVersionRequest,
  SequenceDetail,
  SequenceListResponse,
  SequenceSummary,
  SubmitRequest,
  UpdateSequenceRequest,
  VersionDetail,
} from '@/shared/contracts/maneuver';
import type { VersionStatus } from '@/shared/contracts/version-status';

import { apiFetch } from './client';
import { reviewKeys, sequenceKeys } from './query-keys';

/** What the maneuver list asks the server for (the shelf, a crew member, a search text, the newest version's status). */
export interface SequenceListFilters {
  crewMemberId?: string;
  archived?: boolean;
  q?: string;
  status?: VersionStatus;
}

/** Maneuvers per page of the list (by name; "Show more" asks for the next). */
export const SEQUENCE_PAGE_SIZE = 50;

/**
 * GET /api/sequences — the active (or archived) maneuvers the caller may see that match the
 * filters, a page at a time by name; `fetchNextPage()` adds the next page.
 */
export function useSequencesQuery(filters: SequenceListFilters) {
  return useInfiniteQuery({
    queryKey: sequenceKeys.list(filters),
    queryFn: ({ signal, pageParam }) =>
      apiFetch<SequenceListResponse>('/sequences', {
        query: { crewMemberId: filters.crewMemberId, archived: filters.archived ? 'true' : undefined, q: filters.q, status: filters.status, limit: SEQUENCE_PAGE_SIZE, after: pageParam },
        signal,
      }),
    initialPageParam: undefined as string | undefined,
    getNextPageParam: (last) => last.next ?? undefined,
    placeholderData: keepPreviousData,
  });
}

/** POST /api/sequences/:id/archive or /restore, or DELETE /api/sequences/:id (never submitted); refreshes everything about maneuvers. */
export function useSequenceLifecycleMutation(sequenceId: string) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (action: 'archive' | 'restore' | 'delete') =>
      action === 'delete'
        ? apiFetch<void>(`/sequences/${encodeURIComponent(sequenceId)}`, { method: 'DELETE' })
        : apiFetch<void>(`/sequences/${encodeURIComponent(sequenceId)}/${action}`, { method: 'POST' }),
    onSuccess: (_data, action) => {
      // A deleted sequence's detail would refetch into a 404: drop it instead.
      if (action === 'delete') qc.removeQueries({ queryKey: sequenceKeys.detail(sequenceId) });
      void qc.invalidateQueries({ queryKey: sequenceKeys.all });
    },
  });
}

/** GET /api/sequences/:id — the sequence with its versions, newest first. */
export function useSequenceQuery(sequenceId: string | undefined) {
  return useQuery({
    queryKey: sequenceKeys.detail(sequenceId ?? ''),
    queryFn: ({ signal }) => apiFetch<SequenceDetail>(`/sequences/${encodeURIComponent(sequenceId!)}`, { signal }),
    enabled: !!sequenceId,
  });
}

/** GET /api/sequences/versions/:id — a version with its primitives, compiled steps, report and reviews. */
export function useVersionQuery(versionId: string | undefined) {
  return useQuery({
    queryKey: sequenceKeys.version(versionId ?? ''),
    queryFn: ({ signal }) => apiFetch<VersionDetail>(`/sequences/versions/${encodeURIComponent(versionId!)}`, { signal }),
    enabled: !!versionId,
  });
}

/** GET /api/sequences/versions/:a/compare/:b — steps and results side by side. */
export function useCompareQuery(a: string | undefined, b: string | undefined) {
  return useQuery({
    queryKey: sequenceKeys.compare(a ?? '', b ?? ''),
    queryFn: ({ signal }) =>
      apiFetch<CompareResponse>(`/sequences/versions/${encodeURIComponent(a!)}/compare/${encodeURIComponent(b!)}`, { signal }),
    enabled: !!a && !!b && a !== b,
  });
}

/** POST /api/sequences/compile — the joint-space steps of unsaved primitives (no save, no simulation). */
export function useCompileQuery(request: CompileRequest | null) {
  return useQuery({
    queryKey: sequenceKeys.compile(request ?? { primitives: [] }),
    queryFn: ({ signal }) => apiFetch<CompileResponse>('/sequences/compile', { method: 'POST', body: request, signal }),
    enabled: !!request && request.primitives.length > 0,
    placeholderData: keepPreviousData,
  });
}

/** POST /api/sequences — a new sequence (no versions yet); refreshes the lists. */
export function useCreateSequenceMutation() {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (input: CreateSequenceRequest) => apiFetch<SequenceSummary>('/sequences', { method: 'POST', body: input }),
    onSuccess: () => void qc.invalidateQueries({ queryKey: sequenceKeys.lists() }),
  });
}

/** PATCH /api/sequences/:id — rename or change the target. */
export function useUpdateSequenceMutation(sequenceId: string) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (change: UpdateSequenceRequest) =>
      apiFetch<SequenceSummary>(`/sequences/${encodeURIComponent(sequenceId)}`, { method: 'PATCH', body: change }),
    onSuccess: () => void qc.invalidateQueries({ queryKey: sequenceKeys.all }),
  });
}

/**
 * POST /api/sequences/:id/versions — saves the composed primitives as a new version, which the
 * server compiles and verifies. A 409 `stale_version` means someone saved in between.
 */
export function useSaveVersionMutation(sequenceId: string) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (input: SaveVersionRequest) =>
      apiFetch<VersionDetail>(`/sequences/${encodeURIComponent(sequenceId)}/versions`, { method: 'POST', body: input }),
    onSuccess: (version) => {
      qc.setQueryData(sequenceKeys.version(version.id), version);
      void qc.invalidateQueries({ queryKey: sequenceKeys.detail(sequenceId) });
      void qc.invalidateQueries({ queryKey: sequenceKeys.lists() });
    },
  });
}

/** POST /api/sequences/versions/:id/submit — sends a version to the reviewers. */
export function useSubmitVersionMutation() {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: ({ versionId, request }: { versionId: string; request?: SubmitRequest }) =>
      apiFetch<VersionDetail>(`/sequences/versions/${encodeURIComponent(versionId)}/submit`, { method: 'POST', body: request ?? {} }),
    onSuccess: (version) => {
      qc.setQueryData(sequenceKeys.version(version.id), version);
      void qc.invalidateQueries({ queryKey: sequenceKeys.all });
      void qc.invalidateQueries({ queryKey: reviewKeys.all });
    },
  });
}
