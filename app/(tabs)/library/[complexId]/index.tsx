import { useLocalSearchParams, useRouter } from 'expo-router';
import { firstParam } from '@/components/account/form-errors';
import { ComplexDetailView } from '@/components/library/complex-detail';
import { LibraryScreen } from '@/components/library/library-screen';
import { useWideLayout } from '@/components/ui/use-wide-layout';

/** /library/<id>: the entry; on a wide screen with the list beside it. */
export default function LibraryEntry() {
  const { complexId } = useLocalSearchParams<{ complexId: string }>();
  const router = useRouter();
  const wide = useWideLayout();
  const id = firstParam(complexId);
  if (wide) return <LibraryScreen selectedId={id} onSelect={(next) => router.replace(`/library/${next}`)} />;
  return <ComplexDetailView id={id} showBackLink />;
}
