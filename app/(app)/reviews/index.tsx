import { lazyScreen } from '@/components/shell/lazy-screen';

const ReviewQueueScreen = lazyScreen(() => import('@/components/shell/signed-in-screens').then((m) => m.ReviewQueueScreen), 'Loading the review queue…');

/** `/reviews`: the reviewer's queue. */
export default function ReviewsIndex() {
  return <ReviewQueueScreen />;
}
