import { Link } from 'expo-router';
import { Screen } from '@/components/ui/screen';
import { EmptyState } from '@/components/ui/empty-state';
import { PageTitle } from '@/components/ui/page-title';
import { AppText } from '@/components/ui/text';

export default function NotFound() {
  return (
    <Screen>
      <PageTitle parts={['Page not found']} />
      <EmptyState title="No such page" body="This address is not part of Sphereline." />
      <Link href="/check"><AppText tone="accent">Go to Check</AppText></Link>
    </Screen>
  );
}
