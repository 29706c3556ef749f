import { useCallback, useEffect, useState } from 'react';
import { Platform, Pressable, StyleSheet, View, type ViewStyle } from 'react-native';
import { decideByLibrary } from '@/lib/chem/library-decision';
import type { Geometry, LibraryMeasurementRef } from '@/lib/chem/types';
import { deferred } from '@/components/deferred/deferred';
import { JumpBar, type JumpTarget } from '@/components/ui/jump-bar';
import { Screen } from '@/components/ui/screen';
import { AppText } from '@/components/ui/text';
import { colors, radius, spacing } from '@/components/ui/theme';
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

const CHECK_SECTIONS: JumpTarget[] = [
  { id: 'verdict', label: 'Verdict' },
  { id: 'why', label: 'Why' },
  { id: 'ligand-field', label: 'Ligand field' },
  { id: 'safety', label: 'Safety' },
];

/**
 * Check: one complex, labile or inert, and why. The controls (examples, geometry, temperature) sit with
 * the input: in a column that stays in view on a wide screen, in one folded line under the field on a
 * phone. The verdict leads the results; a jump bar reaches the sections below it.
 */
export function CheckScreen({ initialFormula, onFormulaSettled }: CheckScreenProps) {
  const wide = useWideLayout();
  const [formula, setFormula] = useState(initialFormula);
  const [temperatureC, setTemperatureC] = useState(25);
  // An unusable temperature in the field: no result is shown rather than one for another temperature.
  const [temperatureProblem, setTemperatureProblem] = useState<string | null>(null);
  const [geometry, setGeometry] = useState<Geometry | null>(null);
  const [conditionsOpen, setConditionsOpen] = useState(false);
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

  // Geometry override and temperature, with the input: always open on a wide screen; on a phone one line
  // that opens (and stays open while the temperature field holds an unusable value).
  const showOptions = wide || conditionsOpen || temperatureProblem !== null;
  const conditionsLine =
    state.kind === 'result' && !wide ? (
      <Pressable
        accessibilityRole="button"
        accessibilityState={{ expanded: showOptions }}
        onPress={() => setConditionsOpen((open) => !open || temperatureProblem !== null)}
        style={styles.conditions}
        testID="check-conditions"
      >
        <AppText variant="label" tone="muted">Conditions</AppText>
        <AppText style={styles.conditionsValue} numberOfLines={1}>
          {geometry ?? state.result.geometry} · {temperatureC} °C
        </AppText>
        <AppText tone="accent" style={styles.conditionsAction}>{showOptions ? 'Hide' : 'Change'}</AppText>
      </Pressable>
    ) : null;
  const options =
    state.kind === 'result' && showOptions ? (
      <View style={styles.inputColumn} testID="check-options">
        <GeometryChoice
          value={geometry}
          predicted={geometry === null ? state.result.geometry : null}
          coordinationNumber={state.result.coordinationNumber}
          onChange={setGeometry}
        />
        <TemperatureChoice valueC={temperatureC} onChange={setTemperatureC} onProblem={setTemperatureProblem} />
      </View>
    ) : null;

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
      {conditionsLine}
      {wide ? null : options}
    </View>
  );

  const results =
    state.kind === 'result' && temperatureProblem ? (
      <View style={styles.cards}>
        <View style={styles.placeholder} testID="check-temperature-problem">
          <AppText tone="danger">No result: {temperatureProblem}</AppText>
        </View>
      </View>
    ) : state.kind === 'result' ? (
      <View style={styles.cards} testID="check-result">
        <JumpBar targets={CHECK_SECTIONS} label="Sections of the answer" testID="check-jump-bar" />
        <VerdictCard result={shown ?? state.result} whyOpenInitially={wide} />
        <LibraryMeasuredCard formula={state.result.formula} temperatureC={temperatureC} onDecision={onDecision} />
        <LigandFieldCard result={state.result} />
        <MechanismCard result={state.result} />
        {state.result.geometry === 'square-planar' && state.result.dElectrons === 8 && state.result.electronShell === 'd' ? (
          <PlannerLinkCard formula={state.result.formula} />
        ) : null}
        <IncomingLigandCard result={state.result} />
        <ScaleCard result={state.result} />
        <IdentityCard result={state.result} />
        <HintsCard result={state.result} />
        <CautionsCard result={state.result} />
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
          <View style={[styles.wideInput, Platform.OS === 'web' ? stickyColumn : null]} testID="check-input-column">
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

// position: sticky (web): the input column stays in view while the answer scrolls past it.
const stickyColumn = { position: 'sticky', top: spacing.lg, alignSelf: 'flex-start' } as unknown as ViewStyle;

const styles = StyleSheet.create({
  conditions: {
    minHeight: 44,
    flexDirection: 'row',
    alignItems: 'center',
    gap: spacing.sm,
    borderWidth: 1,
    borderColor: colors.line,
    borderRadius: radius.md,
    backgroundColor: colors.card,
    paddingHorizontal: spacing.md,
  },
  conditionsValue: { flex: 1 },
  conditionsAction: { fontWeight: '600' },
  inputColumn: { gap: spacing.lg },
  intro: { gap: spacing.xs },
  cards: { gap: spacing.lg },
  placeholder: { paddingVertical: spacing.lg },
  wideRow: { flexDirection: 'row', gap: spacing.xl, alignItems: 'flex-start' },
  wideInput: { width: 400, gap: spacing.lg },
  wideResults: { flex: 1, minWidth: 0 },
});
