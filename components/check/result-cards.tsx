import { VERDICT_BANDS_TEXT } from '@/lib/chem/verdict-bands';
import { StyleSheet, View } from 'react-native';
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
import { colors, spacing } from '@/components/ui/theme';
import { VerdictBadge } from '@/components/ui/verdict-badge';
import { LabilityScale } from './lability-scale';
import { OrbitalDiagram } from './orbital-diagram';

const CONFIDENCE_WORDS = { high: 'high confidence', medium: 'medium confidence', low: 'low confidence' } as const;

const DECIDED_WORDS = { library: 'decided by your group’s measurement', reference: 'decided by a published measurement' } as const;

export function VerdictCard({ result }: { result: Classification }) {
  const library = result.decidedBy === 'library' ? result.libraryMeasurement : undefined;
  return (
    <Card title="Verdict" testID="verdict-card">
      <View style={styles.verdictHead}>
        <VerdictBadge verdict={result.verdict} size="md" />
        <AppText tone="soft" testID="verdict-confidence">
          {result.decidedBy === 'model' ? `predicted · ${CONFIDENCE_WORDS[result.confidence]}` : DECIDED_WORDS[result.decidedBy]}
        </AppText>
      </View>
      {library ? (
        <View style={styles.measured} testID="verdict-headline">
          <AppText variant="label" tone="accent">Measured in your group’s library</AppText>
          <AppText style={styles.headlineEntry}>{library.entryName}</AppText>
          <AppText>
            k = {scientific(library.kPerSecond)} s⁻¹ at {formatCelsiusFromKelvin(library.temperatureK)} ({library.kind.replace('-', ' ')})
          </AppText>
          <AppText variant="caption" tone="muted" testID="verdict-headline-citation">{shortCitation(library.citation)}</AppText>
        </View>
      ) : null}
      <AppText variant="lead" testID="verdict-rate">
        k ≈ {powerOfTen(result.logKPerSecond)} s⁻¹ · t½ ≈ {duration(result.halfLifeSeconds)} at {formatCelsius(result.temperatureC)}
      </AppText>
      {result.measured && !library ? (
        <View style={styles.measured} testID="measured-value">
          <AppText variant="label" tone="accent">Measured</AppText>
          <AppText>
            k = {scientific(result.measured.kPerSecond)} s⁻¹ at {formatCelsiusFromKelvin(result.measured.temperatureK)}
            ({result.measured.kind.replace('-', ' ')})
          </AppText>
          <AppText variant="caption" tone="muted">{result.measured.source}</AppText>
          {result.measured.checked ? (
            <AppText variant="caption" tone="soft" testID="measured-checked">{CHECKED_MARKER[result.measured.checked]}</AppText>
          ) : null}
        </View>
      ) : null}
      <AppText variant="caption" tone="muted" testID="verdict-definition">
        {VERDICT_BANDS_TEXT}
      </AppText>
      <BulletList items={result.reasons} testID="verdict-reasons" />
      {library && result.modelVerdict && result.predictedLogKPerSecond !== undefined ? (
        <View style={styles.footnote} testID="verdict-model-footnote">
          <AppText variant="caption" tone="soft">
            Model’s prediction (footnote): {result.modelVerdict}, k ≈ {powerOfTen(result.predictedLogKPerSecond)} s⁻¹
            {result.modelVerdict !== result.verdict ? ' — the measurement overrules it' : ''}
          </AppText>
          {result.modelReasons ? <BulletList items={result.modelReasons} testID="verdict-model-reasons" /> : null}
        </View>
      ) : null}
    </Card>
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
          { label: 'Spin', value: result.spinState ? `${result.spinState}${result.nearSpinCrossover ? ' (near crossover)' : ''}` : '—' },
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
  if (result.lfseDq !== null) items.push({ label: 'LFSE', value: `${formatDecimal(result.lfseDq, Number.isInteger(result.lfseDq) ? 0 : 2)} Dq` });
  if (result.lfseKJPerMol !== null) items.push({ label: 'LFSE', value: `${formatDecimal(result.lfseKJPerMol, 0)} ${UNITS.kilojoulePerMole}` });
  if (result.activationEnergyDq) {
    items.push({ label: 'CFAE dissociative', value: `${formatDecimal(result.activationEnergyDq.dissociative, 2)} Dq` });
    items.push({ label: 'CFAE associative', value: `${formatDecimal(result.activationEnergyDq.associative, 2)} Dq` });
  }
  if (result.activationEnergyKJPerMol) {
    items.push({ label: 'CFAE dissoc.', value: `${formatDecimal(result.activationEnergyKJPerMol.dissociative, 0)} ${UNITS.kilojoulePerMole}` });
  }
  if (result.jahnTeller) items.push({ label: 'Jahn–Teller', value: result.jahnTeller });
  return (
    <Card title="Ligand field" testID="ligand-field-card">
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
        The same Δo is used in every line of this answer. Crystal-field activation energies (CFAE) for square-pyramidal
        (dissociative) and pentagonal-bipyramidal (associative) transition states, after Basolo & Pearson.
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

export function CautionsCard({ result }: { result: Classification }) {
  return <CautionBox cautions={result.cautions} testID="cautions" />;
}

const styles = StyleSheet.create({
  verdictHead: { flexDirection: 'row', alignItems: 'center', gap: spacing.md, flexWrap: 'wrap' },
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
