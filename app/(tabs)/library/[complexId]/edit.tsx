import { useLocalSearchParams } from 'expo-router';
import { deferred } from '@/components/deferred/deferred';
import { firstParam } from '@/components/ui/route-params';

const ComplexFormScreen = deferred('ComplexFormScreen');

export default function EditLibraryEntry() {
  const { complexId } = useLocalSearchParams<{ complexId: string }>();
  return <ComplexFormScreen mode="edit" complexId={firstParam(complexId)} />;
}
