import { ReviewQueueScreen } from '@/components/reviews/ReviewQueueScreen';

/** `/reviews`: the reviewer's queue. */
export default function ReviewsIndex() {
  return <ReviewQueueScreen />;
}
