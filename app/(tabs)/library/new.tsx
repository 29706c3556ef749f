import { ComplexFormScreen } from '@/components/library/complex-form';

export default function NewLibraryEntry() {
  return <ComplexFormScreen mode="create" />;
}
