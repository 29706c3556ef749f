import { useCallback, useEffect, useState } from 'react';
import { StyleSheet, View } from 'react-native';
import { decideByLibrary } from '@/lib/chem/library-decision';
import type { Geometry, LibraryMeasurementRef } from '@/lib/chem/types';
import { deferred } from '@/components/deferred/deferred';
import { Screen } from '@/components/ui/screen';
import { AppText } from '@/components/ui/text';
import { spacing } from '@/components/ui/theme';
import { useDebouncedValue } from '@/components/ui/use-debounced-value';
import { useWideLayout } from '@/components/ui/use-wide-layout';
import { ExampleChips, GeometryChoice, TemperatureChoice } from './check-options';
import { FormulaInput } from './formula-input';
import { IncomingLigandCard } from './incoming-ligand-card';
import { MechanismCard } from './mechanism-card';
import { PlannerLinkCard } from './planner-link-card';
import {
  CautionsCard,
  HintsCard,
  IdentityCard,
  LigandFieldCard,
  ScaleCard,
  VerdictCard,
} from './result-cards';
import { useClassification } from './use-classification';

// The measured card needs the signed-in person and the library (the data layer): it arrives after the
// first verdict instead of holding it back, and shows nothing until it has values anyway.
const LibraryMeasuredCard = deferred('LibraryMeasuredCard', { fallback: null, afterPaint: true });

export interface CheckScreenProps {
  initialFormula: string;
  /** Called with the settled formula so the route can keep the address shareable. */
  onFormulaSettled?: (formula: string) => void;
}

/** Check: one complex, labile or inert, and why. Input left and cards right on a wide screen. */
export function CheckScreen({ initialFormula, onFormulaSettled }: CheckScreenProps) {
  const wide = useWideLayout();
  const [formula, setFormula] = useState(initialFormula);
  const [temperatureC, setTemperatureC] = useState(25);
  // An unusable temperature in the field: no result is shown rather than one for another temperature.
  const [temperatureProblem, setTemperatureProblem] = useState<string | null>(null);
  const [geometry, setGeometry] = useState<Geometry | null>(null);
  const settled = useDebouncedValue(formula, 180);
  const state = useClassification(settled, temperatureC, geometry);
  // Measured decides: the group's accepted measurement for this species, handed up by the deferred card.
  const [library, setLibrary] = useState<{ formula: string; measurement: LibraryMeasurementRef | null } | null>(null);
  const onDecision = useCallback((decision: { formula: string; measurement: LibraryMeasurementRef | null }) => setLibrary(decision), []);
  const shown =
    state.kind === 'result' && library?.measurement && library.formula === state.result.formula
      ? decideByLibrary(state.result, library.measurement)
      : state.kind === 'result'
        ? state.result
        : null;

  const updateFormula = (text: string) => {
    setFormula(text);
    setGeometry(null);
  };
  useEffect(() => {
    onFormulaSettled?.(settled.trim());
  }, [settled, onFormulaSettled]);

  const inputColumn = (
    <View style={styles.inputColumn}>
      <View style={styles.intro}>
        <AppText variant="title" accessibilityRole="header">Check a complex</AppText>
        <AppText tone="soft">
          Type a formula as you would write it: brackets, charges, counter-ions, hydrates, ligand abbreviations.
        </AppText>
      </View>
      <FormulaInput
        label="Formula"
        value={formula}
        onChangeText={updateFormula}
        problem={state.kind === 'problem' ? state.problem : null}
        placeholder="e.g. [Co(NH3)5Cl]Cl2"
        testID="formula-input"
      />
      <ExampleChips onPick={updateFormula} oneRow={!wide} />
    </View>
  );

  // Geometry override and temperature: beside the input on a wide screen, under the verdict on a phone.
  const options =
    state.kind === 'result' ? (
      <View style={styles.inputColumn}>
        <GeometryChoice
          value={geometry}
          predicted={geometry === null ? state.result.geometry : null}
          coordinationNumber={state.result.coordinationNumber}
          onChange={setGeometry}
        />
        <TemperatureChoice valueC={temperatureC} onChange={setTemperatureC} onProblem={setTemperatureProblem} />
      </View>
    ) : null;

  const results =
    state.kind === 'result' && temperatureProblem ? (
      <View style={styles.cards}>
        <View style={styles.placeholder} testID="check-temperature-problem">
          <AppText tone="danger">No result: {temperatureProblem}</AppText>
        </View>
        {wide ? null : options}
      </View>
    ) : state.kind === 'result' ? (
      <View style={styles.cards} testID="check-result">
        <VerdictCard result={shown ?? state.result} />
        <LibraryMeasuredCard formula={state.result.formula} temperatureC={temperatureC} onDecision={onDecision} />
        <CautionsCard result={state.result} />
        {wide ? null : options}
        <IdentityCard result={state.result} />
        <MechanismCard result={state.result} />
        {state.result.geometry === 'square-planar' && state.result.dElectrons === 8 && state.result.electronShell === 'd' ? (
          <PlannerLinkCard formula={state.result.formula} />
        ) : null}
        <IncomingLigandCard result={state.result} />
        <ScaleCard result={state.result} />
        <LigandFieldCard result={state.result} />
        <HintsCard result={state.result} />
      </View>
    ) : state.kind === 'empty' ? (
      <View style={styles.placeholder} testID="check-empty">
        <AppText tone="muted">
          The verdict, the reasons, a d-orbital diagram and the place of the complex on the lability scale appear here
          as you type. Predictions are rules of thumb; published measurements win where known.
        </AppText>
      </View>
    ) : null;

  return (
    <Screen>
      {wide ? (
        <View style={styles.wideRow}>
          <View style={styles.wideInput}>
            {inputColumn}
            {options}
          </View>
          <View style={styles.wideResults}>{results}</View>
        </View>
      ) : (
        <>
          {inputColumn}
          {results}
        </>
      )}
    </Screen>
  );
}

const styles = StyleSheet.create({
  inputColumn: { gap: spacing.lg },
  intro: { gap: spacing.xs },
  cards: { gap: spacing.lg },
  placeholder: { paddingVertical: spacing.lg },
  wideRow: { flexDirection: 'row', gap: spacing.xl, alignItems: 'flex-start' },
  wideInput: { width: 400, gap: spacing.lg },
  wideResults: { flex: 1, minWidth: 0 },
});
