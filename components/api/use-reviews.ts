import { useMutation, useQuery, useQueryClient } from '@tanstack/react-query';

import type { ReviewCommentRequest, ReviewDecisionRequest, ReviewQueueItem, VersionDetail } from '@/shared/contracts/maneuver';

import { apiFetch } from './client';
import { sequenceKeys } from './use-sequences';

/** Query keys of the Reviews area. */
export const reviewKeys = {
  all: ['reviews'] as const,
  queue: () => [...reviewKeys.all, 'queue'] as const,
};

/** GET /api/reviews/queue — versions waiting for a decision, oldest submission first. */
export function useReviewQueueQuery() {
  return useQuery({
    queryKey: reviewKeys.queue(),
    queryFn: async ({ signal }) => (await apiFetch<{ items: ReviewQueueItem[] }>('/reviews/queue', { signal })).items,
  });
}

/** After a review action: the version's new state, and every list that shows it. */
function useReviewSettled() {
  const qc = useQueryClient();
  return (version: VersionDetail) => {
    qc.setQueryData(sequenceKeys.version(version.id), version);
    void qc.invalidateQueries({ queryKey: reviewKeys.all });
    void qc.invalidateQueries({ queryKey: sequenceKeys.all });
    void qc.invalidateQueries({ queryKey: ['audit'] });
  };
}

/** POST /api/reviews/:versionId/decision — clear (approve) or send back, with a comment. */
export function useReviewDecisionMutation() {
  const settled = useReviewSettled();
  return useMutation({
    mutationFn: ({ versionId, request }: { versionId: string; request: ReviewDecisionRequest }) =>
      apiFetch<VersionDetail>(`/reviews/${encodeURIComponent(versionId)}/decision`, { method: 'POST', body: request }),
    onSuccess: settled,
  });
}

/** POST /api/reviews/:versionId/comments — a comment without a decision. */
export function useReviewCommentMutation() {
  const settled = useReviewSettled();
  return useMutation({
    mutationFn: ({ versionId, request }: { versionId: string; request: ReviewCommentRequest }) =>
      apiFetch<VersionDetail>(`/reviews/${encodeURIComponent(versionId)}/comments`, { method: 'POST', body: request }),
    onSuccess: settled,
  });
}
