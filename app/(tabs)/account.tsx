import { Screen } from '@/components/ui/screen';
import { EmptyState } from '@/components/ui/empty-state';

export default function Account() {
  return (
    <Screen>
      <EmptyState
        testID="account-not-built"
        title="Accounts — not built yet"
        body="Sign-in, your groups and roles will live here. Check and Route need no account."
      />
    </Screen>
  );
}
