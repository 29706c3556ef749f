import { Link } from 'expo-router';
import { useEffect } from 'react';
import { StyleSheet, View } from 'react-native';
import { useMeQuery } from '@/lib/api/auth';
import { useLibraryMeasuredQuery } from '@/lib/api/library';
import { candidatesFromRows, pickDecidingMeasurement } from '@/lib/chem/library-decision';
import type { LibraryMeasurementRef } from '@/lib/chem/types';
import { Card } from '@/components/ui/card';
import { Chip } from '@/components/ui/chip';
import { AppText } from '@/components/ui/text';
import { colors, spacing } from '@/components/ui/theme';
import { citationText, conditionsText, kindLabel, measurementValueText } from '@/components/library/library-format';
import { useChosenGroup } from './chosen-group';

export interface LibraryDecision {
  /** The formula the decision belongs to (a decision never outlives its formula). */
  formula: string;
  measurement: LibraryMeasurementRef | null;
}

/**
 * Measured decides: when the signed-in person's group library holds accepted measurements of this
 * complex (same metal, oxidation state and ligand set), they are listed here, and the one that
 * decides (lib/chem/library-decision.ts) is handed up so the verdict card shows it as the headline.
 * A person in several groups chooses which group's library decides (the last choice is kept).
 */
export function LibraryMeasuredCard({
  formula,
  temperatureC = 25,
  onDecision,
}: {
  formula: string;
  temperatureC?: number;
  onDecision?: (decision: LibraryDecision) => void;
}) {
  const me = useMeQuery();
  const memberships = me.data?.memberships ?? [];
  const { group, choose } = useChosenGroup(me.data?.user.id ?? null, memberships);
  const groupId = group?.groupId ?? null;
  const groupName = group?.groupName ?? '';
  const measured = useLibraryMeasuredQuery(groupId, formula);
  const items = measured.data?.libraryMeasurements ?? [];
  const deciding = items.length > 0 ? pickDecidingMeasurement(candidatesFromRows(items), temperatureC + 273.15) : null;
  const decidingKey = deciding ? `${deciding.entryId}|${deciding.kind}|${deciding.kPerSecond}|${deciding.temperatureK}` : '';
  useEffect(() => {
    onDecision?.({ formula, measurement: deciding });
    // The key stands for the decision's content; a new object with the same content changes nothing.
    // eslint-disable-next-line react-hooks/exhaustive-deps
  }, [formula, decidingKey, onDecision]);
  if (!groupId) return null;
  const picker =
    memberships.length > 1 ? (
      <View style={styles.picker} accessibilityRole="radiogroup" accessibilityLabel="Group whose measurements decide" testID="library-group-picker">
        <AppText variant="caption" tone="soft">Measurements from</AppText>
        {memberships.map((m) => (
          <Chip key={m.groupId} label={m.groupName} selected={m.groupId === groupId} onPress={() => choose(m.groupId)} testID={`library-group-${m.groupId}`} />
        ))}
      </View>
    ) : null;
  if (items.length === 0) {
    // One group and nothing measured: nothing to show. Several groups: the choice stays within reach.
    if (!picker) return null;
    return (
      <Card title="Measured in your groups" testID="library-measured">
        {picker}
        <AppText variant="caption" tone="muted" testID="library-measured-none">
          {measured.isPending ? `Looking in ${groupName}…` : `No accepted measurement of this complex in ${groupName}.`}
        </AppText>
      </Card>
    );
  }
  return (
    <Card title={`Measured in ${groupName}`} testID="library-measured">
      {picker}
      {items.map((item) => (
        <View key={item.id} style={styles.row}>
          <AppText>
            {kindLabel(item.kind)}: <AppText style={styles.value}>{measurementValueText(item)}</AppText>
            {conditionsText(item) ? <AppText tone="muted"> · {conditionsText(item)}</AppText> : null}
          </AppText>
          {item.citation ? <AppText variant="caption" tone="muted">{citationText(item.citation)}</AppText> : null}
          <Link href={`/library/${item.complexId}`} style={styles.entryLink}>
            <AppText variant="caption" tone="accent">Open the library entry ({item.complexName})</AppText>
          </Link>
        </View>
      ))}
      <AppText variant="caption" tone="muted">
        {deciding
          ? 'Accepted values from your group’s library; the first-order rate above decides the verdict, and the model’s prediction is the footnote.'
          : 'Accepted values from your group’s library; none of them is a first-order rate, so the verdict stays with the engine.'}
      </AppText>
    </Card>
  );
}

const styles = StyleSheet.create({
  picker: { flexDirection: 'row', flexWrap: 'wrap', alignItems: 'center', gap: spacing.sm },
  row: { gap: 2, paddingVertical: spacing.xs, borderBottomWidth: 1, borderBottomColor: colors.line },
  value: { fontWeight: '600' },
  // A 44 px tall tap target around a 16 px caption line.
  entryLink: { paddingVertical: 14, alignSelf: 'flex-start' },
});
