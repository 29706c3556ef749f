import { StyleSheet, View } from 'react-native';
import type { BridgingCandidate } from '@/lib/chem/route-types';
import { Card } from '@/components/ui/card';
import { AppText } from '@/components/ui/text';
import { colors, radius, spacing } from '@/components/ui/theme';

/**
 * Candidate bridges for this pair: the ones already on the complex first (the reaction can only use
 * those), then, apart and marked, bridges a chemist could install instead.
 */
export function BridgingCandidates({ candidates }: { candidates: BridgingCandidate[] }) {
  if (candidates.length === 0) return null;
  const present = candidates.filter((c) => c.present);
  const installable = candidates.filter((c) => !c.present);
  return (
    <Card title="Bridging candidates for this pair" testID="bridging-candidates">
      <AppText variant="label" tone="accent">On the complex</AppText>
      {present.length === 0 ? (
        <AppText tone="soft" testID="candidates-none-present">No ligand on the complex can bridge.</AppText>
      ) : (
        <View testID="candidates-present">{present.map((candidate, index) => <CandidateRow key={`${candidate.ligand}-${candidate.donorAtom}`} candidate={candidate} testID={`candidate-${index}`} />)}</View>
      )}
      {installable.length > 0 ? (
        <View style={styles.installable} testID="candidates-installable">
          <AppText variant="label" tone="muted">Could be installed instead (not on the complex)</AppText>
          {installable.map((candidate, index) => (
            <CandidateRow key={`${candidate.ligand}-${candidate.donorAtom}`} candidate={candidate} testID={`candidate-installable-${index}`} />
          ))}
        </View>
      ) : null}
      <AppText variant="caption" tone="muted">
        Scores rank bridges for this pair (polarisability of the bridging atom against the hardness of the attacking
        metal); they are not rate constants.
      </AppText>
    </Card>
  );
}

function CandidateRow({ candidate, testID }: { candidate: BridgingCandidate; testID: string }) {
  return (
    <View style={styles.row} testID={testID}>
      <View style={styles.head}>
        <AppText style={styles.name}>
          {candidate.name} <AppText tone="muted">via {candidate.donorAtom} · {candidate.attack} attack</AppText>
        </AppText>
        <AppText variant="caption" tone={candidate.present ? 'accent' : 'muted'}>
          {candidate.present ? 'on the complex' : 'could be installed'}
        </AppText>
      </View>
      <View style={styles.track} accessibilityRole="image" accessibilityLabel={`score ${candidate.score.toFixed(0)} of 100`}>
        <View style={[styles.bar, { width: `${Math.max(2, Math.min(100, candidate.score))}%` }, candidate.present ? styles.barPresent : null]} />
      </View>
      <AppText variant="caption" tone="soft">{candidate.reasons.slice(1).join('; ') || candidate.reasons[0]}</AppText>
    </View>
  );
}

const styles = StyleSheet.create({
  row: { gap: 4, paddingVertical: spacing.xs },
  head: { flexDirection: 'row', justifyContent: 'space-between', flexWrap: 'wrap', gap: spacing.sm },
  name: { flexShrink: 1 },
  track: { height: 8, backgroundColor: colors.paper, borderRadius: radius.pill, overflow: 'hidden' },
  bar: { height: 8, backgroundColor: colors.lineStrong, borderRadius: radius.pill },
  barPresent: { backgroundColor: colors.accent },
  installable: { gap: 4, borderTopWidth: 1, borderTopColor: colors.line, paddingTop: spacing.sm, opacity: 0.85 },
});
