import { deferred } from '@/components/deferred/deferred';

const ComplexFormScreen = deferred('ComplexFormScreen');

export default function NewLibraryEntry() {
  return <ComplexFormScreen mode="create" />;
}
