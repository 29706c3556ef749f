import { useLocalSearchParams } from 'expo-router';
import { deferred } from '@/components/deferred/deferred';
import { firstParam } from '@/components/ui/route-params';

const ComplexDetailView = deferred('ComplexDetailView');

/** /library/<id>: the entry, with the way back to the list as it was left. */
export default function LibraryEntry() {
  const { complexId } = useLocalSearchParams<{ complexId: string }>();
  return <ComplexDetailView id={firstParam(complexId)} showBackLink />;
}
