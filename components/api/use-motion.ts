import { useQuery } from '@tanstack/react-query';

import type { MotionResponse } from '@/shared/contracts/motion';

import { apiFetch } from './client';
import { motionKeys } from './query-keys';

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
