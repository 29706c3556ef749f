import { Link } from 'expo-router';
import { StyleSheet, View } from 'react-native';
import { FormulaText } from '@/components/ui/formula-text';
import { AppText } from '@/components/ui/text';
import { colors, radius, spacing } from '@/components/ui/theme';
import type { Measurement } from '@/lib/schemas/library';
import { citationText, conditionsText, kindLabel, measurementValueText } from './library-format';

/** Measured values with their conditions and citations, one row each (reads on a phone as on a desk). */
export function MeasurementsTable({ measurements, testID = 'complex-measurements' }: { measurements: readonly Measurement[]; testID?: string }) {
  if (measurements.length === 0) {
    return (
      <AppText tone="soft" testID={`${testID}-none`}>
        No measurements recorded yet. The verdict above is a prediction only.
      </AppText>
    );
  }
  return (
    <View style={styles.table} testID={testID} accessibilityRole="list">
      {measurements.map((m, index) => (
        <View key={m.id} role="listitem" style={StyleSheet.flatten([styles.row, index > 0 ? styles.rowRule : null])} testID={`${testID}-row-${index}`}>
          <View style={styles.valueLine}>
            <AppText variant="caption" tone="soft" style={styles.kind}>{kindLabel(m.kind)}</AppText>
            <AppText variant="lead" testID={`${testID}-row-${index}-value`}>{measurementValueText(m)}</AppText>
          </View>
          {m.partnerFormula ? (
            <View style={styles.partner}>
              <AppText tone="soft">with </AppText>
              <FormulaText formula={m.partnerFormula} variant="body" />
            </View>
          ) : null}
          <AppText tone="soft" variant="caption">{conditionsText(m)}</AppText>
          {m.citation ? (
            <View style={styles.citation}>
              <AppText variant="caption">
                {citationText(m.citation)}
                {m.citation.title ? ` — “${m.citation.title}”` : ''}
              </AppText>
              {m.citation.doi ? (
                <Link
                  href={`https://doi.org/${m.citation.doi}`}
                  target="_blank"
                  rel="noopener noreferrer"
                  style={styles.doi}
                  testID={`${testID}-row-${index}-doi`}
                >
                  doi:{m.citation.doi}
                </Link>
              ) : null}
            </View>
          ) : (
            <AppText variant="caption" tone="danger">No citation yet</AppText>
          )}
          {m.notes ? <AppText variant="caption" tone="muted">{m.notes}</AppText> : null}
        </View>
      ))}
    </View>
  );
}

const styles = StyleSheet.create({
  table: { borderWidth: 1, borderColor: colors.line, borderRadius: radius.md, backgroundColor: colors.card },
  row: { padding: spacing.md, gap: 2 },
  rowRule: { borderTopWidth: 1, borderTopColor: colors.line },
  valueLine: { flexDirection: 'row', flexWrap: 'wrap', alignItems: 'baseline', columnGap: spacing.md },
  kind: { minWidth: 180 },
  partner: { flexDirection: 'row', alignItems: 'baseline' },
  citation: { borderLeftWidth: 2, borderLeftColor: colors.accentSoft, paddingLeft: spacing.sm, marginTop: 2, gap: 2 },
  doi: { color: colors.accent, textDecorationLine: 'underline', fontSize: 12, lineHeight: 16 },
});
