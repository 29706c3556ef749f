import { Link } from 'expo-router';
import { StyleSheet, View } from 'react-native';
import { useMeQuery } from '@/lib/api/auth';
import { useLibraryMeasuredQuery } from '@/lib/api/library';
import { Card } from '@/components/ui/card';
import { AppText } from '@/components/ui/text';
import { colors, spacing } from '@/components/ui/theme';
import { citationText, conditionsText, kindLabel, measurementValueText } from '@/components/library/library-format';

/**
 * Measured meets predicted: when the signed-in person's group library holds approved measurements
 * of this complex (same metal, oxidation state and ligand set), they sit beside the prediction.
 */
export function LibraryMeasuredCard({ formula }: { formula: string }) {
  const me = useMeQuery();
  const groupId = me.data?.memberships[0]?.groupId ?? null;
  const groupName = me.data?.memberships[0]?.groupName ?? '';
  const measured = useLibraryMeasuredQuery(groupId, formula);
  const items = measured.data?.libraryMeasurements ?? [];
  if (!groupId || items.length === 0) return null;
  return (
    <Card title={`Measured in ${groupName}`} testID="library-measured">
      {items.map((item) => (
        <View key={item.id} style={styles.row}>
          <AppText>
            {kindLabel(item.kind)}: <AppText style={styles.value}>{measurementValueText(item)}</AppText>
            {conditionsText(item) ? <AppText tone="muted"> · {conditionsText(item)}</AppText> : null}
          </AppText>
          {item.citation ? <AppText variant="caption" tone="muted">{citationText(item.citation)}</AppText> : null}
          <Link href={`/library/${item.complexId}`}>
            <AppText variant="caption" tone="accent">Open the library entry ({item.complexName})</AppText>
          </Link>
        </View>
      ))}
      <AppText variant="caption" tone="muted">
        Approved values from your group’s library; where they disagree with the prediction, trust the measurement.
      </AppText>
    </Card>
  );
}

const styles = StyleSheet.create({
  row: { gap: 2, paddingVertical: spacing.xs, borderBottomWidth: 1, borderBottomColor: colors.line },
  value: { fontWeight: '600' },
});
