import { useMemo, useState } from 'react';
import { StyleSheet, View } from 'react-native';
import { formationRate, FormationInputError, type FormationResult } from '@/lib/chem/formation';
import { CHECKED_MARKER, type Classification } from '@/lib/chem/types';
import { BulletList } from '@/components/ui/bullet-list';
import { Card } from '@/components/ui/card';
import { Chip } from '@/components/ui/chip';
import { KeyValueGrid } from '@/components/ui/key-value';
import { scientific } from '@/components/ui/format';
import { AppText } from '@/components/ui/text';
import { TextField } from '@/components/ui/text-field';
import { spacing } from '@/components/ui/theme';

const SUGGESTED = ['NH3', 'py', 'bpy', 'phen', 'Cl', 'F', 'NCS', 'gly'];

type Answer = { kind: 'none' } | { kind: 'result'; result: FormationResult } | { kind: 'problem'; problem: string };

/** Pick a ligand that comes in: how fast it enters this complex (the Eigen–Wilkins estimate). */
export function IncomingLigandCard({ result }: { result: Classification }) {
  const [ligand, setLigand] = useState('');
  const answer: Answer = useMemo(() => {
    const token = ligand.trim();
    if (token === '') return { kind: 'none' };
    try {
      return { kind: 'result', result: formationRate(result.formula, token, { temperatureC: result.temperatureC }) };
    } catch (error) {
      if (error instanceof FormationInputError) return { kind: 'problem', problem: error.message };
      throw error;
    }
  }, [ligand, result.formula, result.temperatureC]);

  return (
    <Card title="Incoming ligand" testID="incoming-ligand-card">
      <AppText tone="soft">How fast does a ligand come on? Pick or type one from the ligand table.</AppText>
      <View style={styles.chips}>
        {SUGGESTED.map((id) => (
          <Chip key={id} label={id} mono selected={ligand.trim() === id} onPress={() => setLigand(id)} testID={`incoming-ligand-${id}`} />
        ))}
      </View>
      <TextField label="Entering ligand" value={ligand} onChangeText={setLigand} placeholder="e.g. NH3" testID="incoming-ligand-input" error={answer.kind === 'problem' ? answer.problem : undefined} />
      {answer.kind === 'result' ? (
        <View style={styles.result} testID="incoming-ligand-result">
          <AppText variant="lead" testID="incoming-ligand-kf">
            k_f ≈ {scientific(answer.result.kf)} M⁻¹ s⁻¹
          </AppText>
          <KeyValueGrid
            items={[
              { label: 'K_os (outer-sphere)', value: `${scientific(answer.result.Kos)} M⁻¹` },
              { label: 'k_ex (leaving ligand)', value: `${scientific(answer.result.kex)} s⁻¹ (${answer.result.kexBasis})` },
              { label: 'factor s', value: String(Number(answer.result.factor.toPrecision(3))) },
              { label: 'conditions', value: `I = ${answer.result.ionicStrengthM} M, ${answer.result.temperatureC} °C, a = ${answer.result.contactDistanceAngstrom} Å` },
              ...(answer.result.limitingStep ? [{ label: 'rate-limiting step', value: answer.result.limitingStep === 'first-bond' ? 'first bond' : 'ring closure' }] : []),
              { label: 'confidence', value: answer.result.confidence },
            ]}
          />
          {answer.result.published ? (
            <View testID="incoming-ligand-published">
              <AppText variant="label" tone="accent">Published</AppText>
              <AppText>
                k_f = {scientific(answer.result.published.kf)} M⁻¹ s⁻¹ at {answer.result.published.temperatureC} °C — the estimate is{' '}
                {answer.result.published.ratio >= 1 ? `${answer.result.published.ratio.toPrecision(2)} times higher` : `${(1 / answer.result.published.ratio).toPrecision(2)} times lower`}
              </AppText>
              <AppText variant="caption" tone="muted">{answer.result.published.source}</AppText>
              <AppText variant="caption" tone="soft">{CHECKED_MARKER[answer.result.published.checked]}</AppText>
            </View>
          ) : null}
          <BulletList items={answer.result.reasons} testID="incoming-ligand-reasons" />
        </View>
      ) : null}
    </Card>
  );
}

const styles = StyleSheet.create({
  chips: { flexDirection: 'row', flexWrap: 'wrap', gap: spacing.sm },
  result: { gap: spacing.sm },
});
