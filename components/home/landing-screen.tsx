import { useRouter } from 'expo-router';
import { useState } from 'react';
import { StyleSheet, View } from 'react-native';
import { deferred, usePreloadDeferredScreens } from '@/components/deferred/deferred';
import { Button } from '@/components/ui/button';
import { Card } from '@/components/ui/card';
import { FormulaText } from '@/components/ui/formula-text';
import { Screen } from '@/components/ui/screen';
import { TextField } from '@/components/ui/text-field';
import { AppText } from '@/components/ui/text';
import { spacing } from '@/components/ui/theme';
import { useWideLayout } from '@/components/ui/use-wide-layout';
import { useViewer } from '@/lib/api/viewer';
import { PillLink, RowLink } from './landing-links';

/** A few complexes worth a first look: one of each verdict, and a salt written as it comes from the bottle. */
const CHECK_EXAMPLES = ['[Co(NH3)5Cl]Cl2', '[Cu(H2O)6]2+', '[Cr(H2O)6]3+'];
/** One bridged and one outer-sphere pair. */
const ROUTE_EXAMPLES: [string, string][] = [
  ['[Co(NH3)5Cl]2+', '[Cr(H2O)6]2+'],
  ['[Ru(NH3)6]3+', '[V(H2O)6]2+'],
];

// The signed-in part (the person's drafts, the review queue, the library) needs the data layer: it
// comes with the deferred chunk once the page has painted, and shows nothing until then.
const LandingActivity = deferred('LandingActivity', { fallback: null, afterPaint: true });

/**
 * The start page: what to do next. The shell's navigation already lists the sections, so this page
 * does not repeat them: it starts a Check or a Route from here, and shows a signed-in person what
 * waits for them in the library (their drafts, entries to review, recent entries).
 */
export function LandingScreen() {
  const wide = useWideLayout();
  // Most next steps lead to the deferred screens: fetch them while the visitor reads.
  usePreloadDeferredScreens();
  const viewer = useViewer();
  return (
    <Screen maxWidth={1120}>
      <View style={styles.hero} testID="landing">
        <AppText variant="display" accessibilityRole="header">Sphereline</AppText>
        <AppText variant="lead" tone="soft" style={styles.lead}>
          Will a complex hold its ligands or swap them in seconds, and will two complexes trade an
          electron through a bridge or across their outer spheres? Answers from the ligand field,
          backed by your group’s reviewed, cited data.
        </AppText>
      </View>
      <View style={wide ? styles.columns : styles.stack}>
        <View style={wide ? styles.mainColumn : styles.stack} testID="landing-start">
          <CheckStart />
          <RouteStart />
        </View>
        <View style={wide ? styles.sideColumn : styles.stack} testID="landing-library">
          {viewer === undefined ? null : viewer.signedIn ? <LandingActivity /> : <VisitorLibrary />}
        </View>
      </View>
      <AppText variant="caption" tone="muted">
        Verdicts are rules of thumb from ligand-field theory, not measurements; where the library holds a
        measured value, it is shown beside the prediction and decides.
      </AppText>
    </Screen>
  );
}

function CheckStart() {
  const router = useRouter();
  const [formula, setFormula] = useState('');
  const open = () => {
    const typed = formula.trim();
    router.push(typed ? { pathname: '/check', params: { formula: typed } } : '/check');
  };
  return (
    <Card testID="landing-check">
      <AppText variant="title" accessibilityRole="header" aria-level={2}>Check a complex</AppText>
      <AppText tone="soft">Labile or inert, how fast its ligands exchange, and why: from the formula alone.</AppText>
      <View style={styles.formRow}>
        <View style={styles.grow}>
          <TextField
            label="Formula or name"
            value={formula}
            onChangeText={setFormula}
            onSubmitEditing={open}
            returnKeyType="go"
            hint="Brackets, charges and hydrates as you would write them"
            testID="landing-formula"
          />
        </View>
        <View style={styles.formButton}>
          <Button label="Check" onPress={open} testID="landing-check-submit" />
        </View>
      </View>
      <AppText variant="label" tone="muted">Or open one of these</AppText>
      <View style={styles.pills}>
        {CHECK_EXAMPLES.map((example) => (
          <PillLink key={example} href={`/check?formula=${encodeURIComponent(example)}`} testID={`landing-example-${example}`}>
            <FormulaText formula={example} variant="body" />
          </PillLink>
        ))}
      </View>
    </Card>
  );
}

function RouteStart() {
  return (
    <Card testID="landing-route">
      <AppText variant="title" accessibilityRole="header" aria-level={2}>Route a pair</AppText>
      <AppText tone="soft">
        An oxidant and a reductant: inner- or outer-sphere, which ligand could bridge, and a Marcus estimate of the rate.
      </AppText>
      <View style={styles.pills}>
        {ROUTE_EXAMPLES.map(([oxidant, reductant]) => (
          <PillLink
            key={oxidant}
            href={`/route?oxidant=${encodeURIComponent(oxidant)}&reductant=${encodeURIComponent(reductant)}`}
            testID={`landing-pair-${oxidant}`}
          >
            <View style={styles.pair}>
              <FormulaText formula={oxidant} variant="body" />
              <AppText tone="muted" aria-hidden>+</AppText>
              <FormulaText formula={reductant} variant="body" />
            </View>
          </PillLink>
        ))}
      </View>
      <RowLink href="/route" testID="landing-route-open">Choose your own pair</RowLink>
    </Card>
  );
}

/** For a visitor: what signing in adds, and the way in. */
function VisitorLibrary() {
  return (
    <Card testID="landing-visitor">
      <AppText variant="title" accessibilityRole="header" aria-level={2}>Your group’s library</AppText>
      <AppText tone="soft">
        Members keep measured rates with their citations. A curator reviews each entry before the group relies on it, and a
        measured value decides over the prediction on Check.
      </AppText>
      <View style={styles.links}>
        <RowLink href="/sign-in" testID="landing-sign-in">Sign in</RowLink>
        <RowLink href="/sign-up" testID="landing-sign-up">Create an account</RowLink>
      </View>
    </Card>
  );
}

const styles = StyleSheet.create({
  hero: { gap: spacing.sm, paddingTop: spacing.md },
  lead: { maxWidth: 720 },
  stack: { gap: spacing.lg },
  columns: { flexDirection: 'row', gap: spacing.xl, alignItems: 'flex-start' },
  mainColumn: { flex: 3, gap: spacing.lg },
  sideColumn: { flex: 2, gap: spacing.lg },
  formRow: { flexDirection: 'row', gap: spacing.sm, alignItems: 'flex-start', flexWrap: 'wrap' },
  grow: { flexGrow: 1, flexBasis: 220 },
  // Level with the input (the label above the field is about 20 px tall).
  formButton: { paddingTop: 22 },
  pills: { flexDirection: 'row', flexWrap: 'wrap', gap: spacing.sm },
  pair: { flexDirection: 'row', alignItems: 'center', gap: spacing.xs, flexWrap: 'wrap' },
  links: { gap: 0 },
});
