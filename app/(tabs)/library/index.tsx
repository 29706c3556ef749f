import { useLocalSearchParams, useRouter } from 'expo-router';
import { LibraryScreen } from '@/components/library/library-screen';
import { firstParam } from '@/components/account/form-errors';
import { useWideLayout } from '@/components/ui/use-wide-layout';

/** /library (?selected=<id> on a wide screen shows that entry beside the list without leaving it). */
export default function Library() {
  const { selected } = useLocalSearchParams<{ selected?: string }>();
  const router = useRouter();
  const wide = useWideLayout();
  const open = (id: string) => (wide ? router.setParams({ selected: id }) : router.push(`/library/${id}`));
  return <LibraryScreen selectedId={firstParam(selected) || null} onSelect={open} />;
}
