import { useQuery } from '@tanstack/react-query';

import { MOTION_RATE, type MotionResponse } from '@/shared/contracts/motion';
import { apiFetch } from './client';

/** Query keys of the 3D view's motion. */
export const motionKeys = {
  all: ['motion'] as const,
  version: (versionId: string, rate: number) => [...motionKeys.all, versionId, rate] as const,
};

/**
 * GET /api/motion/:versionId?rate= — samples, body, steps and cues of a version, fetched once per
 * version and rate and kept (samples are immutable; scrubbing never re-requests them).
 */
export function useMotionQuery(versionId: string | undefined, rate: number = MOTION_RATE.default) {
  return useQuery({
    queryKey: motionKeys.version(versionId ?? '', rate),
    queryFn: ({ signal }) => apiFetch<MotionResponse>(`/motion/${encodeURIComponent(versionId!)}`, { query: { rate }, signal }),
    enabled: !!versionId,
    staleTime: Infinity,
    gcTime: 10 * 60_000,
    refetchOnWindowFocus: false,
  });
}
