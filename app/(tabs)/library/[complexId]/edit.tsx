import { useLocalSearchParams } from 'expo-router';
import { firstParam } from '@/components/account/form-errors';
import { ComplexFormScreen } from '@/components/library/complex-form';

export default function EditLibraryEntry() {
  const { complexId } = useLocalSearchParams<{ complexId: string }>();
  return <ComplexFormScreen mode="edit" complexId={firstParam(complexId)} />;
}
