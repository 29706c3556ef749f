import { StyleSheet, View } from 'react-native';
import type { BridgingCandidate } from '@/lib/chem/route-types';
import { Card } from '@/components/ui/card';
import { AppText } from '@/components/ui/text';
import { colors, radius, spacing } from '@/components/ui/theme';

/** Ranked candidate bridges for this pair; those already on the complex come first among equals. */
export function BridgingCandidates({ candidates }: { candidates: BridgingCandidate[] }) {
  if (candidates.length === 0) return null;
  return (
    <Card title="Bridging candidates for this pair" testID="bridging-candidates">
      {candidates.map((candidate, index) => (
        <View key={`${candidate.ligand}-${candidate.donorAtom}`} style={styles.row} testID={`candidate-${index}`}>
          <View style={styles.head}>
            <AppText style={styles.name}>
              {candidate.name} <AppText tone="muted">via {candidate.donorAtom} · {candidate.attack} attack</AppText>
            </AppText>
            <AppText variant="caption" tone={candidate.present ? 'accent' : 'muted'}>
              {candidate.present ? 'on the complex' : 'could be installed'}
            </AppText>
          </View>
          <View style={styles.track} accessibilityLabel={`score ${candidate.score.toFixed(0)} of 100`}>
            <View style={[styles.bar, { width: `${Math.max(2, Math.min(100, candidate.score))}%` }, candidate.present ? styles.barPresent : null]} />
          </View>
          <AppText variant="caption" tone="soft">{candidate.reasons.slice(1).join('; ') || candidate.reasons[0]}</AppText>
        </View>
      ))}
      <AppText variant="caption" tone="muted">
        Scores rank bridges for this pair (polarisability of the bridging atom against the hardness of the attacking
        metal); they are not rate constants.
      </AppText>
    </Card>
  );
}

const styles = StyleSheet.create({
  row: { gap: 4, paddingVertical: spacing.xs },
  head: { flexDirection: 'row', justifyContent: 'space-between', flexWrap: 'wrap', gap: spacing.sm },
  name: { flexShrink: 1 },
  track: { height: 8, backgroundColor: colors.paper, borderRadius: radius.pill, overflow: 'hidden' },
  bar: { height: 8, backgroundColor: colors.lineStrong, borderRadius: radius.pill },
  barPresent: { backgroundColor: colors.accent },
});
