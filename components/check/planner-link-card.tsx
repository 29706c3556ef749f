import { useRouter } from 'expo-router';
import { Button } from '@/components/ui/button';
import { Card } from '@/components/ui/card';
import { AppText } from '@/components/ui/text';

/** Square-planar d8 only: open the order-of-addition planner with this complex as the start. */
export function PlannerLinkCard({ formula }: { formula: string }) {
  const router = useRouter();
  return (
    <Card title="Order of addition" testID="planner-link-card">
      <AppText tone="soft">
        Square-planar: which ligand leaves depends on what sits opposite it. Add ligands one at a time and see which isomer
        forms.
      </AppText>
      <Button
        label="Plan a sequence from this complex"
        kind="quiet"
        onPress={() => router.push({ pathname: '/planner', params: { start: formula } })}
        testID="planner-link"
      />
    </Card>
  );
}
