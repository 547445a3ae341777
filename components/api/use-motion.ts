import { useQuery } from '@tanstack/react-query';

import type { MotionResponse } from '@/shared/contracts/motion';

import { apiFetch } from './client';

/** Query keys of the 3D view's motion. */
export const motionKeys = {
  all: ['motion'] as const,
  version: (versionId: string, rate: number | undefined) => [...motionKeys.all, versionId, rate ?? 'verified'] as const,
};

/**
 * GET /api/motion/:versionId?rate= — samples, body, steps and cues of a version, fetched once per
 * version and rate and kept (samples are immutable; scrubbing never re-requests them). Without a
 * rate: the verified samples exactly as stored with the version.
 */
export function useMotionQuery(versionId: string | undefined, rate?: number) {
  return useQuery({
    queryKey: motionKeys.version(versionId ?? '', rate),
    queryFn: ({ signal }) => apiFetch<MotionResponse>(`/motion/${encodeURIComponent(versionId!)}`, { query: { rate }, signal }),
    enabled: !!versionId,
    staleTime: Infinity,
    gcTime: 10 * 60_000,
    refetchOnWindowFocus: false,
  });
}
