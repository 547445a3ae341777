import { useMutation, useQuery, useQueryClient } from '@tanstack/react-query';

import type { CaptureTrendPoint, RehearsalCapture } from '@/shared/contracts/recording';
import type { UploadResult } from '@/shared/contracts/uploads';

import { apiFetch, isApiStatus } from './client';
import { captureKeys } from './query-keys';
import { postFile, useRefreshOnImport } from './use-uploads';

/** GET /api/rehearsals/:id/recording — the capture, or null when none is attached yet (404). */
export function useRehearsalCaptureQuery(rehearsalId: string, enabled: boolean) {
  return useQuery({
    queryKey: captureKeys.one(rehearsalId),
    enabled,
    queryFn: async ({ signal }) => {
      try {
        return (await apiFetch<{ capture: RehearsalCapture }>(`/rehearsals/${rehearsalId}/recording`, { signal })).capture;
      } catch (err) {
        if (isApiStatus(err, 404)) return null;
        throw err;
      }
    },
  });
}

/** GET /api/rehearsals/captures/trend — the signed-in trainee's recorded figures across rehearsals. */
export function useCaptureTrendQuery() {
  return useQuery({
    queryKey: captureKeys.trend(),
    queryFn: async ({ signal }) => (await apiFetch<{ points: CaptureTrendPoint[] }>('/rehearsals/captures/trend', { signal })).points,
  });
}

/** POST /api/rehearsals/:id/recording — attaches a joint-angle CSV or BVH; a rejected file is an outcome with its row errors. */
export function useAttachRecordingMutation(rehearsalId: string) {
  const refresh = useRefreshOnImport(captureKeys.all);
  return useMutation({
    mutationFn: async (file: File): Promise<{ ok: true } | { ok: false; message: string; result: UploadResult }> => {
      const out = await postFile(`/rehearsals/${rehearsalId}/recording`, file);
      if (out.ok) return { ok: true };
      return out;
    },
    onSuccess: refresh,
  });
}

/** POST /api/rehearsals/:id/recording/sign-off — a reviewer's sign-off. */
export function useSignOffCaptureMutation(rehearsalId: string) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (note: string) => apiFetch<{ capture: RehearsalCapture }>(`/rehearsals/${rehearsalId}/recording/sign-off`, { method: 'POST', body: { note } }),
    onSuccess: () => void qc.invalidateQueries({ queryKey: captureKeys.all }),
  });
}
