import { useMemo, useState } from 'react';
import { StyleSheet, View } from 'react-native';
import { toDisplayFormula } from '@/lib/chem/display-formula';
import { capitaliseSentence } from '@/lib/chem/number-format';
import { planSequence, SequenceInputError, type SequenceResult } from '@/lib/chem/sequence-planner';
import { BulletList } from '@/components/ui/bullet-list';
import { Card } from '@/components/ui/card';
import { Chip } from '@/components/ui/chip';
import { FormulaText } from '@/components/ui/formula-text';
import { Screen } from '@/components/ui/screen';
import { AppText } from '@/components/ui/text';
import { TextField } from '@/components/ui/text-field';
import { colors, spacing } from '@/components/ui/theme';
import { useDebouncedValue } from '@/components/ui/use-debounced-value';
import { useWideLayout } from '@/components/ui/use-wide-layout';
import { SquareComplex } from './square-complex';

const LIGAND_CHIPS = ['NH3', 'Cl', 'py', 'NO2', 'Br', 'I', 'tu', 'PPh3', 'C2H4', 'H2O'];

type PlanState = { kind: 'empty' } | { kind: 'plan'; plan: SequenceResult } | { kind: 'problem'; field: string; problem: string };

/** Splits "NH3, NH3 py" into tokens. */
function ligandTokens(text: string): string[] {
  return text.split(/[\s,;]+/).filter((token) => token !== '');
}

export interface PlannerScreenProps {
  initialStart: string;
  initialLigands: string;
}

/** Order of addition: a square-planar complex, ligands added one at a time, each intermediate drawn. */
export function PlannerScreen({ initialStart, initialLigands }: PlannerScreenProps) {
  const wide = useWideLayout();
  const [start, setStart] = useState(initialStart);
  const [ligands, setLigands] = useState(initialLigands);
  const settledStart = useDebouncedValue(start, 180);
  const settledLigands = useDebouncedValue(ligands, 180);
  const state: PlanState = useMemo(() => {
    const tokens = ligandTokens(settledLigands);
    if (settledStart.trim() === '' || tokens.length === 0) return { kind: 'empty' };
    try {
      return { kind: 'plan', plan: planSequence(settledStart, tokens) };
    } catch (error) {
      if (error instanceof SequenceInputError) return { kind: 'problem', field: error.field, problem: error.message };
      throw error;
    }
  }, [settledStart, settledLigands]);
  const metal = state.kind === 'plan' ? (/^\[([A-Z][a-z]?)/.exec(state.plan.start.formula)?.[1] ?? 'M') : 'M';

  return (
    <Screen>
      <View style={styles.intro}>
        <AppText variant="title" accessibilityRole="header">Order of addition</AppText>
        <AppText tone="soft">
          Start from a square-planar complex and add ligands one at a time: at each step the ligand opposite the strongest
          trans director leaves, and the square shows where everything sits.
        </AppText>
      </View>
      <View style={[styles.inputs, wide && styles.inputsWide]}>
        <View style={[styles.field, wide && styles.fieldWide]}>
          <TextField
            label="Start complex"
            value={start}
            onChangeText={setStart}
            hint="A square-planar complex, for example [PtCl4]2- or cis-[PtCl2(NH3)2]"
            testID="planner-start"
            error={state.kind === 'problem' && state.field === 'start' ? state.problem : undefined}
          />
        </View>
        <View style={[styles.field, wide && styles.fieldWide]}>
          <TextField
            label="Entering ligands, in order"
            value={ligands}
            onChangeText={setLigands}
            hint="Formulas or abbreviations separated by spaces, for example NH3 NH3"
            testID="planner-ligands"
            error={state.kind === 'problem' && state.field !== 'start' ? state.problem : undefined}
          />
          <View style={styles.chips}>
            {LIGAND_CHIPS.map((id) => (
              <Chip key={id} label={`+ ${toDisplayFormula(id)}`} mono onPress={() => setLigands((text) => `${text.trim()} ${id}`.trim())} testID={`planner-add-${id}`} />
            ))}
            <Chip label="Clear" onPress={() => setLigands('')} testID="planner-clear" />
          </View>
        </View>
      </View>
      {state.kind === 'plan' ? (
        <View style={styles.result} testID="planner-result">
          <Card title="Product" testID="planner-product">
            <FormulaText formula={state.plan.productLabel} variant="title" />
            <AppText tone="soft" testID="planner-isomer">{state.plan.isomer ? `${state.plan.isomer} isomer` : 'no cis/trans label applies'}</AppText>
          </Card>
          <View style={[styles.chain, wide && styles.chainWide]} testID="planner-chain">
            <View style={styles.stage}>
              <SquareComplex metal={metal} sites={state.plan.start.sites} label={state.plan.start.productLabel} testID="planner-square-0" />
              <FormulaText formula={state.plan.start.productLabel} />
            </View>
            {state.plan.steps.map((step, index) => (
              <View key={index} style={[styles.stepPair, wide && styles.stepPairWide]}>
                <View style={styles.arrow} testID={`planner-arrow-${index + 1}`}>
                  <AppText variant="mono" tone="accent">+ {toDisplayFormula(step.entering)}</AppText>
                  <AppText style={styles.arrowGlyph}>{wide ? '⟶' : '↓'}</AppText>
                  <AppText variant="mono" tone="muted">− {toDisplayFormula(step.leaving)}</AppText>
                </View>
                <View style={styles.stage}>
                  <SquareComplex metal={metal} sites={step.sites} enteredSite={step.site} directorSite={step.transDirectorSite} label={step.productLabel} testID={`planner-square-${index + 1}`} />
                  <FormulaText formula={step.productLabel} />
                </View>
              </View>
            ))}
          </View>
          {state.plan.steps.map((step, index) => (
            <Card key={index} title={`Step ${index + 1}: + ${toDisplayFormula(step.entering)}`} testID={`planner-step-${index + 1}`}>
              <BulletList items={step.reasons.map(capitaliseSentence)} />
            </Card>
          ))}
          <Card title="Notes">
            <BulletList items={state.plan.notes.map(capitaliseSentence)} testID="planner-notes" />
          </Card>
        </View>
      ) : state.kind === 'empty' ? (
        <AppText tone="muted" testID="planner-empty">Give a start complex and at least one entering ligand.</AppText>
      ) : null}
    </Screen>
  );
}

const styles = StyleSheet.create({
  intro: { gap: spacing.xs },
  inputs: { gap: spacing.lg },
  inputsWide: { flexDirection: 'row', alignItems: 'flex-start' },
  field: { gap: spacing.sm },
  fieldWide: { flex: 1 },
  chips: { flexDirection: 'row', flexWrap: 'wrap', gap: spacing.sm },
  result: { gap: spacing.lg },
  chain: { alignItems: 'center', gap: spacing.sm },
  chainWide: { flexDirection: 'row', flexWrap: 'wrap', alignItems: 'center', justifyContent: 'flex-start' },
  stepPair: { alignItems: 'center', gap: spacing.sm },
  stepPairWide: { flexDirection: 'row' },
  stage: { alignItems: 'center', gap: spacing.xs },
  arrow: { alignItems: 'center', paddingHorizontal: spacing.sm },
  arrowGlyph: { fontSize: 22, color: colors.muted },
});
