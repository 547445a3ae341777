import { type QueryKey, useMutation, useQueryClient } from '@tanstack/react-query';

import { apiErrorSchema } from '@/shared/contracts/api-error';
import type { UploadResult } from '@/shared/contracts/uploads';

import { ApiError, apiUrl } from './client';
import { crewKeys } from './query-keys';

/** What the server answered: the import, or a rejected upload with every row error (422). */
export type UploadOutcome = { ok: true; result: UploadResult } | { ok: false; message: string; result: UploadResult };

/** Sends one file as multipart; a 422 rejection is an outcome (with its row errors), other failures throw ApiError. */
export async function postFile(path: string, file: File, fields: Record<string, string> = {}): Promise<UploadOutcome> {
  const form = new FormData();
  for (const [k, v] of Object.entries(fields)) form.append(k, v);
  form.append('file', file, file.name);
  let res: Response;
  try {
    res = await fetch(apiUrl(path), { method: 'POST', body: form, credentials: 'same-origin', headers: { Accept: 'application/json' } });
  } catch {
    throw new ApiError(0, 'network', 'Holonaut could not reach its server. Check the connection and try again.');
  }
  const json: unknown = await res.json().catch(() => undefined);
  if (res.ok) return { ok: true, result: json as UploadResult };
  const err = apiErrorSchema.safeParse(json);
  if (res.status === 422 && err.success && (json as Partial<UploadResult>).upload) {
    return { ok: false, message: err.data.error.message, result: json as UploadResult };
  }
  if (err.success) throw new ApiError(res.status, err.data.error.code, err.data.error.message, err.data.error.field);
  throw new ApiError(res.status, 'http_error', `The server answered ${res.status}.`);
}

/** After an upload, a refetch of what it imported into, only when the file went in (a rejected file changed nothing). */
export function useRefreshOnImport(queryKey: QueryKey) {
  const qc = useQueryClient();
  return (out: { ok: boolean }) => {
    if (out.ok) void qc.invalidateQueries({ queryKey });
  };
}

/** POST /api/uploads/measurements — a measurements CSV for several crew members (all or nothing). */
export function useMeasurementsUploadMutation() {
  const refresh = useRefreshOnImport(crewKeys.all);
  return useMutation({
    mutationFn: (file: File) => postFile('/uploads/measurements', file),
    onSuccess: refresh,
  });
}

/** POST /api/uploads/segment-table — a measured segment table (CSV or contract JSON) for one member. */
export function useSegmentTableUploadMutation() {
  const refresh = useRefreshOnImport(crewKeys.all);
  return useMutation({
    mutationFn: ({ file, crewMemberId, baseVersion, note }: { file: File; crewMemberId: string; baseVersion: number; note?: string }) =>
      postFile('/uploads/segment-table', file, { crewMemberId, baseVersion: String(baseVersion), note: note ?? '' }),
    onSuccess: refresh,
  });
}
