import { useMutation, useQuery, useQueryClient } from '@tanstack/react-query';

import type { ReviewCommentRequest, ReviewDecisionRequest, ReviewQueueItem, VersionDetail } from '@/shared/contracts/maneuver';

import { apiFetch } from './client';
import { auditKeys, reviewKeys, sequenceKeys } from './query-keys';

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
    void qc.invalidateQueries({ queryKey: auditKeys.all });
  };
}

/** POST /api/reviews/:versionId/<action>: the server answers the version as it now stands. */
function useReviewAction<Request>(action: 'decision' | 'comments') {
  const settled = useReviewSettled();
  return useMutation({
    mutationFn: ({ versionId, request }: { versionId: string; request: Request }) =>
      apiFetch<VersionDetail>(`/reviews/${encodeURIComponent(versionId)}/${action}`, { method: 'POST', body: request }),
    onSuccess: settled,
  });
}

/** POST /api/reviews/:versionId/decision — clear (approve) or send back, with a comment. */
export const useReviewDecisionMutation = () => useReviewAction<ReviewDecisionRequest>('decision');

/** POST /api/reviews/:versionId/comments — a comment without a decision. */
export const useReviewCommentMutation = () => useReviewAction<ReviewCommentRequest>('comments');
