import { ImportScreen } from '@/components/exchange/import-screen';

/** /library/import: CSV import into the group's library (entries arrive submitted for review). */
export default function LibraryImport() {
  return <ImportScreen />;
}
