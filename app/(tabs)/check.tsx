import { Screen } from '@/components/ui/screen';
import { EmptyState } from '@/components/ui/empty-state';

export default function Check() {
  return (
    <Screen>
      <EmptyState testID="check-not-built" title="Check — coming next" body="Type a complex and see whether it is labile or inert, and why." />
    </Screen>
  );
}
