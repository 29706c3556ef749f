import { useLocalSearchParams, useRouter } from 'expo-router';
import { deferred } from '@/components/deferred/deferred';
import { firstParam } from '@/components/ui/route-params';
import { useWideLayout } from '@/components/ui/use-wide-layout';

const LibraryScreen = deferred('LibraryScreen');

/** /library (?selected=<id> on a wide screen shows that entry beside the list without leaving it). */
export default function Library() {
  const { selected } = useLocalSearchParams<{ selected?: string }>();
  const router = useRouter();
  const wide = useWideLayout();
  const open = (id: string) => (wide ? router.setParams({ selected: id }) : router.push(`/library/${id}`));
  return <LibraryScreen selectedId={firstParam(selected) || null} onSelect={open} />;
}
