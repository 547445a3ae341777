import { useLocalSearchParams } from 'expo-router';

import { ReviewScreen } from '@/components/reviews/ReviewScreen';

/** `/reviews/<versionId>`: one version to review (the link reviewers get by e-mail). */
export default function ReviewRoute() {
  const { versionId } = useLocalSearchParams<{ versionId: string }>();
  return <ReviewScreen versionId={versionId} />;
}
