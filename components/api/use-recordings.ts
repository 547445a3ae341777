import { useMutation, useQuery, useQueryClient } from '@tanstack/react-query';

import type { BvhMapping, RecordingView } from '@/shared/contracts/recording';
import type { UploadResult } from '@/shared/contracts/uploads';

import { apiFetch } from './client';
import { recordingKeys } from './query-keys';
import { postFile, useRefreshOnImport } from './use-uploads';

/** A listed recording (frames left out; `frameCount` instead). */
export type RecordingSummary = RecordingView & { frameCount: number };

/** GET /api/recordings — imported recordings, newest first. */
export function useRecordingsQuery(enabled = true) {
  return useQuery({
    queryKey: recordingKeys.list(),
    enabled,
    queryFn: async ({ signal }) => (await apiFetch<{ recordings: RecordingSummary[] }>('/recordings', { signal })).recordings,
  });
}

/** GET /api/recordings/:id — one recording with its frames (and, for BVH, the file's joints). */
export function useRecordingQuery(id: string | null) {
  return useQuery({
    queryKey: recordingKeys.one(id ?? ''),
    enabled: !!id,
    queryFn: async ({ signal }) => (await apiFetch<{ recording: RecordingView }>(`/recordings/${id}`, { signal })).recording,
  });
}

/** POST /api/uploads/joint-angles or /bvh by the file's extension; a rejected file is an outcome with its row errors. */
export function useRecordingUploadMutation() {
  const refresh = useRefreshOnImport(recordingKeys.all);
  return useMutation({
    mutationFn: async (file: File): Promise<{ ok: true; recording: RecordingView } | { ok: false; message: string; result: UploadResult }> => {
      const bvh = file.name.toLowerCase().endsWith('.bvh');
      const out = await postFile(bvh ? '/uploads/bvh' : '/uploads/joint-angles', file);
      if (out.ok) return { ok: true, recording: (out.result as unknown as { recording: RecordingView }).recording };
      return out;
    },
    onSuccess: refresh,
  });
}

/** PUT /api/recordings/:id/mapping — a new BVH mapping (the track is rebuilt from the stored file). */
export function useRecordingMappingMutation(id: string) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (mapping: BvhMapping) => apiFetch<{ recording: RecordingView }>(`/recordings/${id}/mapping`, { method: 'PUT', body: { mapping } }),
    onSuccess: () => void qc.invalidateQueries({ queryKey: recordingKeys.all }),
  });
}
