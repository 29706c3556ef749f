import { ReviewQueueScreen } from '@/components/review/review-queue-screen';

export default function Review() {
  return <ReviewQueueScreen />;
}
