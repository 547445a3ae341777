import { useLocalSearchParams } from 'expo-router';

import { lazyScreen } from '@/components/shell/lazy-screen';

const ReviewScreen = lazyScreen(() => import('@/components/shell/signed-in-screens').then((m) => m.ReviewScreen), 'Loading the review…');

/** `/reviews/<versionId>`: one version to review (the link reviewers get by e-mail). */
export default function ReviewRoute() {
  const { versionId } = useLocalSearchParams<{ versionId: string }>();
  return <ReviewScreen versionId={versionId} />;
}
