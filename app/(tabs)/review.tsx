import { deferred } from '@/components/deferred/deferred';

const ReviewQueueScreen = deferred('ReviewQueueScreen');

export default function Review() {
  return <ReviewQueueScreen />;
}
