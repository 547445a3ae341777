import { useMutation, useQuery, useQueryClient } from '@tanstack/react-query';

import type { CreateCrewMemberInput, CrewMemberView, SaveProfileInput } from '@/shared/contracts/crew';
import type { ProfileComparison, ProfileVersionHeader, ProfileVersionView, SaveProfileResponse } from '@/shared/contracts/profile-version';

import { apiFetch, apiUrl } from './client';
import { crewKeys, sequenceKeys } from './query-keys';

/** GET /api/crew?q=&archived= — active (or archived) crew members the signed-in user may see (a trainee: only their own). */
export function useCrewListQuery(q: string, archived = false) {
  return useQuery({
    queryKey: crewKeys.list(q, archived),
    queryFn: async ({ signal }) => (await apiFetch<{ members: CrewMemberView[] }>('/crew', { signal, query: { q, archived: archived ? 'true' : undefined } })).members,
    placeholderData: (prev) => prev,
  });
}

/** GET /api/crew/:id — the member and their current version (null before the first save). */
export function useCrewMemberQuery(id: string | null) {
  return useQuery({
    queryKey: crewKeys.member(id ?? ''),
    enabled: !!id,
    queryFn: ({ signal }) => apiFetch<{ member: CrewMemberView; current: ProfileVersionView | null }>(`/crew/${encodeURIComponent(id!)}`, { signal }),
  });
}

/** GET /api/crew/:id/versions — the history, newest first. */
export function useProfileVersionsQuery(id: string) {
  return useQuery({
    queryKey: crewKeys.versions(id),
    queryFn: async ({ signal }) => (await apiFetch<{ versions: ProfileVersionHeader[] }>(`/crew/${encodeURIComponent(id)}/versions`, { signal })).versions,
  });
}

/** GET /api/crew/:id/versions/:version — one full version (old versions stay viewable). */
export function useProfileVersionQuery(id: string, version: number | null) {
  return useQuery({
    queryKey: crewKeys.version(id, version ?? 0),
    enabled: version !== null,
    queryFn: async ({ signal }) => (await apiFetch<{ version: ProfileVersionView }>(`/crew/${encodeURIComponent(id)}/versions/${version}`, { signal })).version,
  });
}

/** GET /api/crew/:id/compare?a=&b= — two versions side by side. */
export function useProfileComparisonQuery(id: string, a: number | null, b: number | null) {
  return useQuery({
    queryKey: crewKeys.compare(id, a ?? 0, b ?? 0),
    enabled: a !== null && b !== null && a !== b,
    queryFn: async ({ signal }) => (await apiFetch<{ comparison: ProfileComparison }>(`/crew/${encodeURIComponent(id)}/compare`, { signal, query: { a, b } })).comparison,
  });
}

/**
 * After a member's profile save, archive or restore: the crew lists, and their maneuvers, whose lists
 * and versions change with them (a save can make versions stale; an archived member's maneuvers move).
 */
function useMemberSettled() {
  const qc = useQueryClient();
  return () => {
    void qc.invalidateQueries({ queryKey: crewKeys.all });
    void qc.invalidateQueries({ queryKey: sequenceKeys.all });
  };
}

/** POST /api/crew — a new crew member; refreshes the lists. */
export function useCreateCrewMemberMutation() {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (input: CreateCrewMemberInput) => apiFetch<{ member: CrewMemberView }>('/crew', { method: 'POST', body: input }),
    onSuccess: () => void qc.invalidateQueries({ queryKey: crewKeys.all }),
  });
}

/** POST /api/crew/:id/versions — saves version N+1 on top of `baseVersion`; 409 `stale_version` when someone saved first. */
export function useSaveProfileMutation(id: string) {
  const settled = useMemberSettled();
  return useMutation({
    mutationFn: (input: SaveProfileInput) => apiFetch<SaveProfileResponse>(`/crew/${encodeURIComponent(id)}/versions`, { method: 'POST', body: input }),
    onSuccess: settled,
  });
}

/** URL of a version's derived body as a contract JSON download (the session cookie authorises it). */
export function bodyExportUrl(id: string, version: number): string {
  return apiUrl(`/crew/${encodeURIComponent(id)}/versions/${version}/body.json`);
}

/** POST /api/crew/:id/archive or /restore; refreshes the crew and the maneuver lists (an archived member's maneuvers move with them). */
export function useMemberArchiveMutation(id: string) {
  const settled = useMemberSettled();
  return useMutation({
    mutationFn: (action: 'archive' | 'restore') => apiFetch<void>(`/crew/${encodeURIComponent(id)}/${action}`, { method: 'POST' }),
    onSuccess: settled,
  });
}
