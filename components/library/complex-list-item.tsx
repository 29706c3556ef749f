import { Pressable, StyleSheet, View } from 'react-native';
import { FormulaText } from '@/components/ui/formula-text';
import { AppText } from '@/components/ui/text';
import { colors, radius, spacing } from '@/components/ui/theme';
import { StatusPill, VerdictBadge } from '@/components/ui/verdict-badge';
import type { ComplexListItem } from '@/lib/schemas/library';
import { metalLabel } from './library-format';

/** One row of the library: formula, name, verdict and status, then metal, d count and what is measured. */
export function ComplexListRow({ item, index, selected, onPress }: {
  item: ComplexListItem;
  index: number;
  selected: boolean;
  onPress: (item: ComplexListItem) => void;
}) {
  const measured = item.measurementCount === 1 ? '1 measurement' : `${item.measurementCount} measurements`;
  return (
    <Pressable
      onPress={() => onPress(item)}
      accessibilityRole="button"
      accessibilityState={{ selected }}
      testID={`library-item-${index}`}
      style={({ pressed }) => StyleSheet.flatten([styles.row, selected ? styles.selected : null, pressed ? styles.pressed : null])}
    >
      <View style={styles.head}>
        <View style={styles.names}>
          <FormulaText formula={item.formula} variant="lead" testID={`library-item-${index}-formula`} />
          <AppText tone="soft" numberOfLines={1}>{item.name}</AppText>
        </View>
        <VerdictBadge verdict={item.verdict} size="sm" />
      </View>
      <View style={styles.meta}>
        <StatusPill status={item.status} />
        <AppText variant="caption" tone="muted">
          {metalLabel(item.metal, item.oxidationState)} · d{item.dElectrons}
          {item.spinState ? ` ${item.spinState}-spin` : ''} · {measured}
          {item.hasCitation ? ' · cited' : ''}
        </AppText>
      </View>
      {item.hasPendingRevision ? (
        <AppText variant="caption" style={styles.pending} testID={`library-item-${index}-pending`}>
          A newer revision awaits review
        </AppText>
      ) : null}
    </Pressable>
  );
}

const styles = StyleSheet.create({
  row: {
    backgroundColor: colors.card,
    borderWidth: 1,
    borderColor: colors.line,
    borderRadius: radius.md,
    padding: spacing.md,
    gap: spacing.xs,
    marginBottom: spacing.sm,
  },
  selected: { borderColor: colors.accent, borderWidth: 2, backgroundColor: colors.accentSoft },
  pressed: { opacity: 0.85 },
  head: { flexDirection: 'row', alignItems: 'flex-start', gap: spacing.sm },
  names: { flex: 1, gap: 2 },
  meta: { flexDirection: 'row', flexWrap: 'wrap', alignItems: 'center', gap: spacing.sm },
  pending: { color: colors.notice },
});
