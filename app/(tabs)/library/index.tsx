import { useLocalSearchParams, useRouter } from 'expo-router';
import { useCallback } from 'react';
import { deferred } from '@/components/deferred/deferred';

const LibraryScreen = deferred('LibraryScreen');

/**
 * /library?q=&metal=&…&sort=&dir=&pages= — the list's search, filters, order and loaded pages live
 * in the address (written with setParams, which replaces the history entry), so Back and a shared
 * link restore them. An entry opens on its own page.
 */
export default function Library() {
  const params = useLocalSearchParams<Record<string, string | string[]>>();
  const router = useRouter();
  const onUrlChange = useCallback((next: Record<string, string | undefined>) => router.setParams(next), [router]);
  return <LibraryScreen urlParams={params} onUrlChange={onUrlChange} onSelect={(id: string) => router.push(`/library/${id}`)} />;
}
