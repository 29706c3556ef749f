import { useLocalSearchParams } from 'expo-router';
import { PlannerScreen } from '@/components/planner/planner-screen';
import { PageTitle } from '@/components/ui/page-title';

/** /planner?start=<formula>&ligands=<space-separated ids>: the order-of-addition planner, reached from Check. */
export default function Planner() {
  const { start, ligands } = useLocalSearchParams<{ start?: string; ligands?: string }>();
  const initialStart = typeof start === 'string' ? start : '';
  return (
    <>
      <PageTitle parts={[initialStart, 'Order of addition']} />
      <PlannerScreen initialStart={initialStart} initialLigands={typeof ligands === 'string' ? ligands : ''} />
    </>
  );
}
