import { Screen } from '@/components/ui/screen';
import { EmptyState } from '@/components/ui/empty-state';

export default function Route() {
  return (
    <Screen>
      <EmptyState testID="route-not-built" title="Route — coming next" body="Two complexes: inner-sphere or outer-sphere electron transfer, and the Marcus check." />
    </Screen>
  );
}
