import { deferred } from '@/components/deferred/deferred';

const ImportScreen = deferred('ImportScreen');

/** /library/import: CSV import into the group's library (entries arrive submitted for review). */
export default function LibraryImport() {
  return <ImportScreen />;
}
