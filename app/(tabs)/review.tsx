import { Screen } from '@/components/ui/screen';
import { EmptyState } from '@/components/ui/empty-state';

export default function Review() {
  return (
    <Screen>
      <EmptyState
        testID="review-not-built"
        title="Review queue — not built yet"
        body="Curators will approve, request changes to or reject the group's submissions here, oldest first. It arrives with the curated library."
      />
    </Screen>
  );
}
