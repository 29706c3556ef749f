import { Screen } from '@/components/ui/screen';
import { EmptyState } from '@/components/ui/empty-state';

export default function Library() {
  return (
    <Screen>
      <EmptyState
        testID="library-not-built"
        title="Library — not built yet"
        body="The group's curated complexes, measured rate constants and their citations will be searchable here. Until then, Check and Route work without signing in."
      />
    </Screen>
  );
}
