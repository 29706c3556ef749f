import { useEffect, useState } from 'react';
import { Platform, ScrollView, StyleSheet, View, type ViewStyle } from 'react-native';
import { BulletList } from '@/components/ui/bullet-list';
import { Button } from '@/components/ui/button';
import { Card } from '@/components/ui/card';
import { CautionBox } from '@/components/ui/caution-box';
import { Chip } from '@/components/ui/chip';
import { JumpBar, type JumpTarget } from '@/components/ui/jump-bar';
import { Screen } from '@/components/ui/screen';
import { AppText } from '@/components/ui/text';
import { spacing } from '@/components/ui/theme';
import { useDebouncedValue } from '@/components/ui/use-debounced-value';
import { useWideLayout } from '@/components/ui/use-wide-layout';
import { VerdictBadge } from '@/components/ui/verdict-badge';
import { FormulaInput } from '@/components/check/formula-input';
import { BridgingCandidates } from './bridging-candidates';
import { MarcusPanel } from './marcus-panel';
import { PairPicture } from './pair-picture';
import { RouteBadge } from './route-badge';
import { useRoute } from './use-route';

const EXAMPLE_PAIRS: [string, string][] = [
  ['[Co(NH3)5Cl]2+', '[Cr(H2O)6]2+'],
  ['[Co(NH3)6]3+', '[Cr(H2O)6]2+'],
  ['[Co(NH3)5(N3)]2+', '[Cr(H2O)6]2+'],
  ['[Ru(NH3)6]3+', '[V(H2O)6]2+'],
  ['[IrCl6]2-', '[Fe(CN)6]4-'],
];

export interface RouteScreenProps {
  initialOxidant: string;
  initialReductant: string;
  onPairSettled?: (oxidant: string, reductant: string) => void;
}

/** Route: a redox pair, inner- or outer-sphere, which bridge, what products, and the Marcus check. */
export function RouteScreen({ initialOxidant, initialReductant, onPairSettled }: RouteScreenProps) {
  const wide = useWideLayout();
  const [oxidant, setOxidant] = useState(initialOxidant);
  const [reductant, setReductant] = useState(initialReductant);
  const settled = useDebouncedValue(`${oxidant}\u0000${reductant}`, 200);
  const [settledOxidant = '', settledReductant = ''] = settled.split('\u0000');
  const state = useRoute(settledOxidant, settledReductant);

  useEffect(() => {
    onPairSettled?.(settledOxidant.trim(), settledReductant.trim());
  }, [settledOxidant, settledReductant, onPairSettled]);

  // A pair given the wrong way round is swapped once, in the fields too, and said once.
  const [swapNotice, setSwapNotice] = useState<string | null>(null);
  const swappedResult = state.kind === 'result' && state.result.roles.swapped ? state.result : null;
  const [handledSwap, setHandledSwap] = useState<typeof swappedResult>(null);
  if (swappedResult && swappedResult !== handledSwap) {
    // Adjusted while rendering (not in an effect): the fields take the swapped order at once, and
    // the answer for them comes in the right order, so this happens once per pair.
    setHandledSwap(swappedResult);
    setSwapNotice(swappedResult.roles.note);
    setOxidant(settledReductant);
    setReductant(settledOxidant);
  }
  const editOxidant = (text: string) => {
    setSwapNotice(null);
    setOxidant(text);
  };
  const editReductant = (text: string) => {
    setSwapNotice(null);
    setReductant(text);
  };

  const exampleChips = EXAMPLE_PAIRS.map(([ox, red]) => (
    <Chip
      key={ox + red}
      label={`${ox} + ${red}`}
      mono
      onPress={() => {
        setSwapNotice(null);
        setOxidant(ox);
        setReductant(red);
      }}
    />
  ));

  const inputs = (
    <View style={styles.inputs}>
      <View style={styles.intro}>
        <AppText variant="title" accessibilityRole="header">Electron-transfer route</AppText>
        <AppText tone="soft">Two complexes: the oxidant and the reductant. Sphereline swaps them if the potentials say so.</AppText>
      </View>
      <FormulaInput
        label="Oxidant"
        value={oxidant}
        onChangeText={editOxidant}
        problem={state.kind === 'problem' && state.field === 'oxidant' ? state.problem : null}
        placeholder="e.g. [Co(NH3)5Cl]2+"
        testID="oxidant-input"
      />
      <Button
        label="⇅ Swap"
        kind="quiet"
        onPress={() => {
          setSwapNotice(null);
          setOxidant(reductant);
          setReductant(oxidant);
        }}
        testID="swap-button"
        accessibilityLabel="Swap oxidant and reductant"
      />
      <FormulaInput
        label="Reductant"
        value={reductant}
        onChangeText={editReductant}
        problem={state.kind === 'problem' && state.field === 'reductant' ? state.problem : null}
        placeholder="e.g. [Cr(H2O)6]2+"
        testID="reductant-input"
      />
      <View style={styles.examples}>
        <AppText variant="label" tone="muted">Try</AppText>
        {/* One swipeable row on a phone, so the answer stays near the fields; wrapped when wide. */}
        {wide ? (
          <View style={styles.chips}>
            {exampleChips}
          </View>
        ) : (
          <ScrollView horizontal showsHorizontalScrollIndicator={false} contentContainerStyle={styles.chipRow}>
            {exampleChips}
          </ScrollView>
        )}
      </View>
    </View>
  );

  let results = null;
  if (state.kind === 'result') {
    const { result } = state;
    const bridge = result.transferredLigand
      ? { label: result.transferredLigand.name, atom: result.transferredLigand.bridgingAtom }
      : null;
    results = (
      <View style={styles.cards} testID="route-result">
        <JumpBar targets={ROUTE_SECTIONS} label="Sections of the answer" testID="route-jump-bar" />
        <Card title="Likely route" nativeID="route">
          <RouteBadge route={result.route} />
          <PairPicture route={result.route} oxidant={result.oxidant} reductant={result.reductant} bridge={bridge} />
          <View style={styles.partners}>
            <PartnerLine role="Oxidant" formula={result.oxidant.formula} verdict={result.oxidant.verdict} />
            <PartnerLine role="Reductant" formula={result.reductant.formula} verdict={result.reductant.verdict} />
          </View>
          {swapNotice ? (
            <AppText tone="accent" testID="roles-swapped">{swapNotice} The fields have been swapped to match.</AppText>
          ) : null}
          {!result.roles.swapped && result.roles.oxidant !== 'given' ? (
            <AppText tone="soft" testID="roles-note">{result.roles.note}</AppText>
          ) : null}
          {/* A swapped answer is replaced at once by the one for the swapped fields; its note is not repeated. */}
          <BulletList items={result.roles.swapped ? result.reasons.filter((r) => r !== result.roles.note) : result.reasons} testID="route-reasons" />
        </Card>
        <CautionBox cautions={result.cautions} testID="route-cautions" />
        <Card title="Expected products" testID="expected-products">
          <BulletList items={result.expectedProducts} />
        </Card>
        <View nativeID="bridges">
          <BridgingCandidates candidates={result.bridgingCandidates} />
        </View>
        <View nativeID="marcus">
          <MarcusPanel prefill={state.marcusPrefill} sourceNotes={result.marcusNotes} tableEstimate={result.marcus !== null} />
        </View>
      </View>
    );
  } else if (state.kind === 'incomplete') {
    results = (
      <AppText tone="muted" testID="route-empty">
        Give both partners to see the likely route, the bridging candidates, the expected products and the Marcus
        estimate. These are rules of thumb, not measurements.
      </AppText>
    );
  }

  return (
    <Screen>
      {wide ? (
        <View style={styles.wideRow}>
          <View style={[styles.wideInputs, Platform.OS === 'web' ? stickyColumn : null]}>{inputs}</View>
          <View style={styles.wideResults}>{results}</View>
        </View>
      ) : (
        <>
          {inputs}
          {results}
        </>
      )}
    </Screen>
  );
}

function PartnerLine({ role, formula, verdict }: { role: string; formula: string; verdict: 'labile' | 'intermediate' | 'inert' }) {
  return (
    <View style={styles.partnerLine}>
      <AppText tone="muted" style={styles.partnerRole}>{role}</AppText>
      <AppText variant="mono" style={styles.partnerFormula}>{formula}</AppText>
      <VerdictBadge verdict={verdict} />
    </View>
  );
}

const ROUTE_SECTIONS: JumpTarget[] = [
  { id: 'route', label: 'Route' },
  { id: 'bridges', label: 'Bridges' },
  { id: 'marcus', label: 'Marcus' },
];

// position: sticky (web): the pair stays in view while the answer scrolls past it.
const stickyColumn = { position: 'sticky', top: spacing.lg, alignSelf: 'flex-start' } as unknown as ViewStyle;

const styles = StyleSheet.create({
  inputs: { gap: spacing.md },
  intro: { gap: spacing.xs },
  examples: { gap: spacing.sm },
  chips: { flexDirection: 'row', flexWrap: 'wrap', gap: spacing.sm },
  chipRow: { gap: spacing.sm, paddingRight: spacing.lg },
  cards: { gap: spacing.lg },
  partners: { gap: spacing.sm },
  partnerLine: { flexDirection: 'row', alignItems: 'center', gap: spacing.sm, flexWrap: 'wrap' },
  partnerRole: { width: 80 },
  partnerFormula: { flexShrink: 1 },
  wideRow: { flexDirection: 'row', gap: spacing.xl, alignItems: 'flex-start' },
  wideInputs: { width: 400 },
  wideResults: { flex: 1, minWidth: 0 },
});
