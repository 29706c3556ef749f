import { VERDICT_BANDS_TEXT, VERDICT_DEFINITIONS } from '@/lib/chem/verdict-bands';
import { useState } from 'react';
import { Pressable, StyleSheet, View } from 'react-native';
import { toDisplayFormula } from '@/lib/chem/display-formula';
import { nearestReferenceRates } from '@/lib/chem/reference-rates';
import { shortCitation } from '@/lib/chem/library-decision';
import { CHECKED_MARKER, type Classification } from '@/lib/chem/types';
import { BulletList } from '@/components/ui/bullet-list';
import { Card } from '@/components/ui/card';
import { CautionBox } from '@/components/ui/caution-box';
import { duration, powerOfTen, roman, scientific } from '@/components/ui/format';
import { formatCelsius, formatCelsiusFromKelvin, formatDecimal, formatInteger, UNITS } from '@/lib/chem/number-format';
import { FormulaText } from '@/components/ui/formula-text';
import { KeyValueGrid } from '@/components/ui/key-value';
import { AppText } from '@/components/ui/text';
import { TypesetText } from '@/components/ui/typeset-text';
import { jumpTo } from '@/components/ui/jump-bar';
import { colors, fonts, radius, spacing, verdictColors } from '@/components/ui/theme';
import { VerdictGlyph } from '@/components/ui/verdict-badge';
import { capitalise, keyReason, totalSpin } from './key-reason';
import { LabilityScale } from './lability-scale';
import { OrbitalDiagram } from './orbital-diagram';

const CONFIDENCE_WORDS = { high: 'high confidence', medium: 'medium confidence', low: 'low confidence' } as const;

const DECIDED_WORDS = { library: 'decided by your group’s measurement', reference: 'decided by a published measurement' } as const;

const kindWords = (kind: string) => kind.replace(/-/g, ' ');

/**
 * The verdict as the hero of the page: the word, the half-life as the number that matters, one reason
 * and what decided it; the derivation follows under "Why" (open on a wide screen, one tap on a phone).
 */
export function VerdictCard({ result, whyOpenInitially = true }: { result: Classification; whyOpenInitially?: boolean }) {
  return (
    <>
      <VerdictHero result={result} />
      <WhyCard result={result} openInitially={whyOpenInitially} />
    </>
  );
}

function VerdictHero({ result }: { result: Classification }) {
  const library = result.decidedBy === 'library' ? result.libraryMeasurement : undefined;
  const palette = verdictColors[result.verdict];
  const reason = library || result.measured ? null : keyReason(result);
  return (
    <View nativeID="verdict" style={[styles.hero, { borderTopColor: palette.fg }]} testID="verdict-card">
      <AppText variant="label" tone="muted">Verdict</AppText>
      <View
        style={styles.heroHead}
        accessible
        accessibilityRole="header"
        accessibilityLabel={`Verdict: ${result.verdict}`}
        accessibilityHint={VERDICT_DEFINITIONS[result.verdict]}
        testID="verdict-badge"
      >
        <VerdictGlyph verdict={result.verdict} color={palette.fg} size={40} />
        <AppText style={[styles.heroWord, { color: palette.fg }]}>{result.verdict}</AppText>
      </View>
      {result.halfLifeRangeSeconds ? (
        // Where the model is weak only the order of magnitude is given, never a precise half-life.
        <AppText style={styles.heroNumbers} testID="verdict-rate">
          <AppText style={styles.heroNumber}>
            t½ {duration(result.halfLifeRangeSeconds.shortest)} to {duration(result.halfLifeRangeSeconds.longest)}
          </AppText>{' '}
          <AppText tone="soft" style={styles.heroNumberAside} testID="verdict-rate-range-note">
            at {formatCelsius(result.temperatureC)} · order of magnitude only: the model is weak for this kind of complex
          </AppText>
        </AppText>
      ) : (
        <AppText style={styles.heroNumbers} testID="verdict-rate">
          <AppText style={styles.heroNumber}>t½ ≈ {duration(result.halfLifeSeconds)}</AppText>{' '}
          <AppText tone="soft" style={styles.heroNumberAside}>
            at {formatCelsius(result.temperatureC)} · k ≈ {powerOfTen(result.logKPerSecond)} s⁻¹
          </AppText>
        </AppText>
      )}
      {reason ? (
        <TypesetText variant="lead" testID="verdict-key-reason">{reason}</TypesetText>
      ) : null}
      {library ? (
        <View style={styles.measured} testID="verdict-headline">
          <AppText variant="label" tone="accent">Measured in your group’s library</AppText>
          <AppText style={styles.headlineEntry}>{library.entryName}</AppText>
          <AppText>
            k = {scientific(library.kPerSecond)} s⁻¹ at {formatCelsiusFromKelvin(library.temperatureK)} ({kindWords(library.kind)})
          </AppText>
          <AppText variant="caption" tone="muted" testID="verdict-headline-citation">{shortCitation(library.citation)}</AppText>
        </View>
      ) : null}
      {result.measured && !library ? (
        <View style={styles.measured} testID="measured-value">
          <AppText variant="label" tone="accent">Measured</AppText>
          <AppText>
            k = {scientific(result.measured.kPerSecond)} s⁻¹ at {formatCelsiusFromKelvin(result.measured.temperatureK)}
            ({kindWords(result.measured.kind)})
          </AppText>
          <AppText variant="caption" tone="muted" testID="measured-source">{result.measured.source}</AppText>
          {result.measured.checked ? (
            <AppText variant="caption" tone="soft" testID="measured-checked">{CHECKED_MARKER[result.measured.checked]}</AppText>
          ) : null}
        </View>
      ) : null}
      <AppText tone="soft">
        Verdict{' '}
        <AppText tone="soft" testID="verdict-confidence">
          {result.decidedBy === 'model'
            ? `decided by the model: predicted · ${CONFIDENCE_WORDS[result.confidence]} — a rule of thumb, not a measurement`
            : DECIDED_WORDS[result.decidedBy]}
        </AppText>
      </AppText>
      {result.cautions.length > 0 ? (
        <Pressable accessibilityRole="link" onPress={() => jumpTo('safety')} style={styles.hazardLink} testID="verdict-safety-link">
          <AppText style={styles.hazardText}>
            Handle with care: {result.cautions.length === 1 ? 'one safety note' : `${result.cautions.length} safety notes`} under Safety
          </AppText>
        </Pressable>
      ) : null}
    </View>
  );
}

/** The derivation: every reason the engine gave (a published measurement's citation only once, above). */
function WhyCard({ result, openInitially }: { result: Classification; openInitially: boolean }) {
  const [open, setOpen] = useState(openInitially);
  const library = result.decidedBy === 'library' ? result.libraryMeasurement : undefined;
  const citation = result.measured && !library ? result.measured.source : null;
  // The citation is printed once, with the measurement in the verdict: the reason repeating it is left out here.
  const reasons = citation ? result.reasons.filter((reason) => !reason.includes(citation)) : result.reasons;
  return (
    <View nativeID="why" style={styles.why} testID="verdict-why">
      <Pressable
        accessibilityRole="button"
        accessibilityState={{ expanded: open }}
        onPress={() => setOpen((value) => !value)}
        style={styles.whyHead}
        testID="verdict-why-toggle"
      >
        <AppText variant="label" tone="muted">Why</AppText>
        <AppText tone="accent" style={styles.whyCount}>
          {open ? 'Hide' : `Show ${reasons.length} reasons`}
        </AppText>
      </Pressable>
      {open ? (
        <View style={styles.whyBody}>
          <BulletList items={reasons.map(capitalise)} testID="verdict-reasons" />
          <AppText variant="caption" tone="muted" testID="verdict-definition">
            {VERDICT_BANDS_TEXT}
          </AppText>
          {library && result.modelVerdict && result.predictedLogKPerSecond !== undefined ? (
            <View style={styles.footnote} testID="verdict-model-footnote">
              <AppText variant="caption" tone="soft">
                Model’s prediction (footnote): {result.modelVerdict}, k ≈ {powerOfTen(result.predictedLogKPerSecond)} s⁻¹
                {result.modelVerdict !== result.verdict ? ' — the measurement overrules it' : ''}
              </AppText>
              {result.modelReasons ? <BulletList items={result.modelReasons.map(capitalise)} testID="verdict-model-reasons" /> : null}
            </View>
          ) : null}
        </View>
      ) : null}
    </View>
  );
}

export function IdentityCard({ result }: { result: Classification }) {
  const shell = result.electronShell === 'f' ? 'f' : 'd';
  return (
    <Card title="Identity" testID="identity-card">
      <FormulaText formula={result.formula} variant="title" />
      {result.readings?.map((reading) => (
        <View key={`${reading.kind}:${reading.species}`} style={styles.readAs} testID="read-as">
          <AppText variant="label" tone="soft">{reading.kind === 'name' ? 'Stands for' : reading.kind === 'solid' ? 'Read as the solid’s complex' : 'Read as the species in water'}</AppText>
          <FormulaText formula={reading.species} />
        </View>
      ))}
      {result.centres ? (
        <View testID="dinuclear-centres">
          {result.centres.map((centre, index) => (
            <View key={`${index}:${centre.species}`} style={styles.readAs}>
              <AppText variant="label" tone="soft">{`Centre ${index + 1} · ${centre.metal}(${roman(centre.oxidationState)}) · ${centre.verdict}`}</AppText>
              <FormulaText formula={centre.species} />
            </View>
          ))}
        </View>
      ) : null}
      {result.warnings?.map((warning) => (
        <AppText key={warning} tone="danger" testID="formula-warning">{warning}</AppText>
      ))}
      <KeyValueGrid
        items={[
          { label: 'Metal', value: `${result.metal}(${roman(result.oxidationState)})` },
          { label: `${shell} electrons`, value: `${shell}${result.dElectrons}` },
          { label: 'Spin', value: spinText(result) },
          { label: 'Coordination no.', value: String(result.coordinationNumber) },
          { label: 'Geometry', value: `${result.geometry}${result.geometrySource === 'given' ? ' (chosen)' : ''}` },
          { label: 'Molar mass', value: `${formatDecimal(result.molarMassGPerMol, 2)} ${UNITS.gramPerMole}` },
        ]}
      />
      <AppText variant="caption" tone="muted">
        Ligands: {result.ligands.map((l) => `${l.count} × ${l.name} (${l.donorAtoms.join(', ')})`).join(' · ')}
      </AppText>
      {result.nearSpinCrossover ? (
        <AppText tone="danger" testID="spin-crossover-flag">
          Near spin crossover — check the spin state experimentally (magnetic moment, Mössbauer, low-temperature spectra).
        </AppText>
      ) : null}
    </Card>
  );
}

const DELTA_O_LABELS = { measured: 'Δo (measured)', estimated: 'Δo (estimate)', rough: 'Δo (rough)' } as const;

export function LigandFieldCard({ result }: { result: Classification }) {
  const items: { label: string; value: string }[] = [];
  if (result.deltaOcm !== null) items.push({ label: DELTA_O_LABELS[result.deltaOBasis ?? 'estimated'], value: `${formatInteger(result.deltaOcm)} ${UNITS.perCentimetre}` });
  // One LFSE: in Dq, and in kJ mol⁻¹ beside it when Δo is known.
  const lfse = [
    result.lfseDq !== null ? `${formatDecimal(result.lfseDq, Number.isInteger(result.lfseDq) ? 0 : 2)} Dq` : null,
    result.lfseKJPerMol !== null ? `${formatDecimal(result.lfseKJPerMol, 0)} ${UNITS.kilojoulePerMole}` : null,
  ].filter((part): part is string => part !== null);
  if (lfse.length > 0) items.push({ label: 'LFSE', value: lfse.join(' ≈ ') });
  if (result.lfseLossToTransitionStateDq) {
    const kj = result.lfseLossToTransitionStateKJPerMol;
    items.push({
      label: 'LFSE lost, dissociative',
      value: `${formatDecimal(result.lfseLossToTransitionStateDq.dissociative, 2)} Dq${kj ? ` ≈ ${formatDecimal(kj.dissociative, 0)} ${UNITS.kilojoulePerMole}` : ''}`,
    });
    items.push({
      label: 'LFSE lost, associative',
      value: `${formatDecimal(result.lfseLossToTransitionStateDq.associative, 2)} Dq${kj ? ` ≈ ${formatDecimal(kj.associative, 0)} ${UNITS.kilojoulePerMole}` : ''}`,
    });
  }
  if (result.jahnTeller) items.push({ label: 'Jahn–Teller', value: result.jahnTeller });
  return (
    <Card title="Ligand field" testID="ligand-field-card" nativeID="ligand-field">
      {result.electronShell === 'd' ? (
        <OrbitalDiagram
          dElectrons={result.dElectrons}
          geometry={result.geometry}
          spinState={result.spinState}
          deltaOcm={result.deltaOcm}
        />
      ) : (
        <AppText tone="soft">
          {result.electronShell === 'f'
            ? 'f-block ion: the 4f/5f electrons are shielded, the ligand field is tiny and does not govern exchange.'
            : 'Main-group ion: no partly filled d shell, so no ligand-field term.'}
        </AppText>
      )}
      {items.length > 0 ? <KeyValueGrid items={items} /> : null}
      <AppText variant="caption" tone="muted">
        {result.deltaOBasis === 'measured' && result.deltaOSource
          ? `Δo measured for this complex (${result.deltaOSource.source}). `
          : result.deltaOBasis === 'rough'
            ? 'Δo a rough value: no published g for this ion or no f for a ligand. '
            : 'Δo estimated from Jørgensen’s f·g, with π-acceptor ligands weighted up for back-bonding. '}
        The same Δo is used in every line of this answer. “LFSE lost” is the ligand-field stabilisation given up on the way
        to a square-pyramidal (dissociative) or pentagonal-bipyramidal (associative) transition state, the crystal-field
        activation energy of Basolo & Pearson: one term of the barrier, not the activation energy; a negative value
        lowers the barrier.
      </AppText>
    </Card>
  );
}

export function ScaleCard({ result }: { result: Classification }) {
  const neighbours = nearestReferenceRates(result.logKPerSecond, 4, result.formula).map((rate) => ({
    label: toDisplayFormula(rate.species),
    logK: rate.logKPerSecond,
    measured: true,
  }));
  return (
    <Card title="Lability scale" testID="scale-card">
      <LabilityScale logK={result.logKPerSecond} verdict={result.verdict} label={toDisplayFormula(result.formula)} neighbours={neighbours} />
      <AppText variant="caption" tone="muted">
        First-order exchange constant per bound ligand at {formatCelsius(result.temperatureC)}, among published water-exchange
        constants (Helm & Merbach, Chem. Rev. 2005). The line marks a one-minute half-life (Taube’s criterion).
      </AppText>
    </Card>
  );
}

export function HintsCard({ result }: { result: Classification }) {
  if (result.hints.length === 0) return null;
  return (
    <Card title="Getting it to react" testID="hints-card">
      <BulletList items={result.hints} />
    </Card>
  );
}

/** Safety: the cautions in full, or a plain statement that none is flagged (never a clearance). */
export function CautionsCard({ result }: { result: Classification }) {
  return (
    <View nativeID="safety">
      {result.cautions.length > 0 ? (
        <CautionBox cautions={result.cautions} testID="cautions" />
      ) : (
        <Card title="Safety" testID="no-cautions">
          <AppText tone="soft">
            No caution is flagged for this formula. That is not a clearance: follow the supplier’s safety data sheet, your
            institution’s safety office and local regulations.
          </AppText>
        </Card>
      )}
    </View>
  );
}

/** Spin as chemists state it: high or low where there is a choice, else the one arrangement and its S. */
function spinText(result: Classification): string {
  if (result.spinState) return `${result.spinState}${result.nearSpinCrossover ? ' (near crossover)' : ''}`;
  const unpaired = result.unpairedElectrons;
  if (unpaired === null || unpaired === undefined) return 'no high/low choice';
  const shell = result.electronShell === 'f' ? 'f' : 'd';
  return `one arrangement (${shell}${result.dElectrons}): ${unpaired} unpaired, S = ${totalSpin(unpaired)}`;
}

const styles = StyleSheet.create({
  hero: {
    backgroundColor: colors.card,
    borderRadius: radius.lg,
    borderWidth: 1,
    borderColor: colors.line,
    borderTopWidth: 6,
    padding: spacing.lg,
    gap: spacing.sm,
  },
  heroHead: { flexDirection: 'row', alignItems: 'center', gap: spacing.md },
  heroWord: { fontFamily: fonts.strong, fontSize: 44, lineHeight: 52, letterSpacing: -0.5 },
  heroNumbers: { lineHeight: 36 },
  heroNumber: { fontFamily: fonts.strong, fontSize: 28, lineHeight: 36 },
  heroNumberAside: { fontSize: 16 },
  hazardLink: { minHeight: 44, justifyContent: 'center', alignSelf: 'flex-start' },
  hazardText: { color: colors.hazard, fontFamily: fonts.strong, textDecorationLine: 'underline' },
  why: {
    backgroundColor: colors.card,
    borderRadius: radius.lg,
    borderWidth: 1,
    borderColor: colors.line,
    paddingHorizontal: spacing.lg,
    paddingBottom: spacing.sm,
  },
  whyHead: { minHeight: 48, flexDirection: 'row', alignItems: 'center', justifyContent: 'space-between', gap: spacing.md },
  whyCount: { fontWeight: '600' },
  whyBody: { gap: spacing.sm, paddingBottom: spacing.sm },
  readAs: { flexDirection: 'row', alignItems: 'baseline', gap: spacing.sm, flexWrap: 'wrap' },
  measured: {
    borderLeftWidth: 3,
    borderLeftColor: colors.accent,
    paddingLeft: spacing.md,
    gap: 2,
  },
  headlineEntry: { fontWeight: '600' },
  footnote: { borderTopWidth: 1, borderTopColor: colors.line, paddingTop: spacing.sm, gap: spacing.xs },
});
