import { StyleSheet, View } from 'react-native';
import { Button } from '@/components/ui/button';
import { FormulaText } from '@/components/ui/formula-text';
import { AppText } from '@/components/ui/text';
import { colors, radius, spacing } from '@/components/ui/theme';
import { StatusPill } from '@/components/ui/verdict-badge';
import type { ComplexDetail } from '@/lib/schemas/library';
import { dateTimeText } from './library-format';
import { MeasurementsTable } from './measurements-table';

/**
 * A save was refused because the entry changed after it was opened (409): show the entry as it is
 * now and let the person put their changes on top of it, or drop them. Nothing is overwritten.
 */
export function StaleConflict({ current, yourChanges, onReapply, onDiscard }: {
  current: ComplexDetail;
  /** One line per change the person tried to save. */
  yourChanges: readonly string[];
  onReapply: () => void;
  onDiscard: () => void;
}) {
  return (
    <View style={styles.box} testID="complex-conflict" accessibilityRole="alert">
      <AppText variant="lead" style={styles.title}>Someone else saved this entry since you opened it</AppText>
      <AppText>
        Nothing of yours was saved, and nothing of theirs was overwritten. This is the entry now (version {current.version}, changed{' '}
        {dateTimeText(current.updatedAt)}):
      </AppText>
      <View style={styles.current} testID="complex-conflict-current">
        <FormulaText formula={current.formula} variant="lead" testID="complex-conflict-formula" />
        <AppText testID="complex-conflict-name">{current.name}</AppText>
        <StatusPill status={current.status} />
        {current.notes ? <AppText tone="soft">{current.notes}</AppText> : null}
        <MeasurementsTable measurements={current.measurements} testID="complex-conflict-measurements" />
      </View>
      {yourChanges.length > 0 ? (
        <View style={styles.mine}>
          <AppText variant="label" tone="muted">Your changes (still in the form)</AppText>
          {yourChanges.map((line) => (
            <AppText key={line} variant="caption">• {line}</AppText>
          ))}
        </View>
      ) : null}
      <View style={styles.row}>
        <Button label="Re-apply my changes to this version" onPress={onReapply} testID="complex-conflict-reapply" />
        <Button label="Discard mine and load this version" kind="quiet" onPress={onDiscard} testID="complex-conflict-discard" />
      </View>
      <AppText variant="caption" tone="muted">
        Re-applying keeps what you typed and saves it on top of version {current.version} when you press Save again: measurements they added stay, and
        fields you both changed take your value — check them first.
      </AppText>
    </View>
  );
}

const styles = StyleSheet.create({
  box: {
    gap: spacing.md,
    padding: spacing.lg,
    borderRadius: radius.md,
    borderLeftWidth: 4,
    borderLeftColor: colors.notice,
    backgroundColor: colors.noticeSoft,
  },
  title: { color: colors.ink, fontWeight: '600' },
  current: { gap: spacing.xs, padding: spacing.md, backgroundColor: colors.card, borderRadius: radius.md },
  mine: { gap: 2 },
  row: { flexDirection: 'row', flexWrap: 'wrap', gap: spacing.sm },
});
