import { useLocalSearchParams, useRouter } from 'expo-router';
import { deferred } from '@/components/deferred/deferred';
import { firstParam } from '@/components/ui/route-params';
import { useWideLayout } from '@/components/ui/use-wide-layout';

const ComplexDetailView = deferred('ComplexDetailView');
const LibraryScreen = deferred('LibraryScreen');

/** /library/<id>: the entry; on a wide screen with the list beside it. */
export default function LibraryEntry() {
  const { complexId } = useLocalSearchParams<{ complexId: string }>();
  const router = useRouter();
  const wide = useWideLayout();
  const id = firstParam(complexId);
  if (wide) return <LibraryScreen selectedId={id} onSelect={(next) => router.replace(`/library/${next}`)} />;
  return <ComplexDetailView id={id} showBackLink />;
}
