import { Controller, useWatch, type Control, type UseFormSetValue } from 'react-hook-form';
import { StyleSheet, View } from 'react-native';
import { Button } from '@/components/ui/button';
import { Chip } from '@/components/ui/chip';
import { AppText } from '@/components/ui/text';
import { colors, radius, spacing } from '@/components/ui/theme';
import type { ComplexFormValues } from '@/lib/schemas/library-forms';
import { measurementKindRules, measurementKinds, type MeasurementKind } from '@/lib/schemas/library';
import { DoiFillButton } from '@/components/exchange/doi-fill-button';
import { FormTextField } from '@/components/ui/form-text-field';
import { unitDisplay } from './library-format';

/** Hints per kind: what the number means and a typical magnitude (common practice). */
const VALUE_HINTS: Record<MeasurementKind, string> = {
  'water-exchange': 'First-order rate constant per water molecule, e.g. 2.4e-6.',
  'ligand-exchange': 'First order in s⁻¹, or second order in M⁻¹ s⁻¹ — choose the unit.',
  substitution: 'First order in s⁻¹, or second order in M⁻¹ s⁻¹ — choose the unit.',
  'self-exchange': 'Second-order self-exchange constant k11.',
  'cross-reaction': 'Second-order cross-reaction constant k12; give the partner below.',
  'reduction-potential': 'Standard (or formal) reduction potential; say the reference electrode in the method.',
  'ligand-field-splitting': 'Δo from the spectrum, in wavenumbers.',
  'activation-enthalpy': 'ΔH‡ from an Eyring plot.',
  'activation-entropy': 'ΔS‡ from an Eyring plot.',
  'activation-volume': 'ΔV‡ from variable-pressure kinetics.',
  'half-life': 't½ in seconds (e.g. 3600 for one hour).',
};

/** Kinds of source; the kind sets the BibTeX and RIS entry type of an export. */
const CITATION_KINDS = [
  ['article', 'Article'],
  ['book', 'Book'],
  ['chapter', 'Chapter'],
  ['web-page', 'Web page'],
] as const;
// A book has no journal: its title is the work.
const JOURNAL_LABELS: Record<string, string> = { article: 'Journal', chapter: 'Book', 'web-page': 'Site' };

/** One measurement of the entry form: kind, value with its unit, conditions and citation. */
export function MeasurementFields({ index, control, setValue, onRemove }: {
  index: number;
  control: Control<ComplexFormValues>;
  setValue: UseFormSetValue<ComplexFormValues>;
  onRemove: () => void;
}) {
  const prefix = `measurements.${index}` as const;
  const kind = useWatch({ control, name: `${prefix}.kind` });
  const unit = useWatch({ control, name: `${prefix}.unit` });
  const rule = measurementKindRules[kind];
  const citationKind = useWatch({ control, name: `${prefix}.citation.kind` });
  const id = `complex-form-m-${index}`;

  const chooseKind = (next: MeasurementKind) => {
    setValue(`${prefix}.kind`, next, { shouldDirty: true });
    const units = measurementKindRules[next].units as readonly string[];
    if (!units.includes(unit)) setValue(`${prefix}.unit`, units[0] ?? '', { shouldDirty: true });
  };

  return (
    <View style={styles.box} testID={id}>
      <View style={styles.headRow}>
        <AppText variant="label" tone="muted" style={styles.grow}>Measurement {index + 1}</AppText>
        <Button label="Remove" kind="quiet" onPress={onRemove} testID={`${id}-remove`} />
      </View>
      <View style={styles.chips}>
        {measurementKinds.map((k) => (
          <Chip key={k} label={measurementKindRules[k].label} selected={kind === k} onPress={() => chooseKind(k)} testID={`${id}-kind-${k}`} />
        ))}
      </View>
      <View style={styles.valueRow}>
        <View style={styles.grow}>
          <FormTextField
            control={control}
            name={`${prefix}.value`}
            // Labels are set in capitals: the unit goes in the hint, where "s⁻¹" cannot turn into "S⁻¹".
            label="Value"
            hint={`${rule.symbol} in ${unitDisplay(unit)}. ${VALUE_HINTS[kind]}`}
            keyboardType="numbers-and-punctuation"
            testID={`${id}-value`}
          />
        </View>
        <Controller
          control={control}
          name={`${prefix}.unit`}
          render={({ fieldState }) => (
            <View style={styles.units}>
              <AppText variant="label" tone="muted">Unit</AppText>
              <View style={styles.chips}>
                {rule.units.map((u) => (
                  <Chip key={u} label={unitDisplay(u)} selected={unit === u} onPress={() => setValue(`${prefix}.unit`, u, { shouldDirty: true })} testID={`${id}-unit-${u}`} />
                ))}
              </View>
              {fieldState.error ? <AppText tone="danger" variant="caption" testID={`${id}-unit-error`}>{fieldState.error.message}</AppText> : null}
            </View>
          )}
        />
      </View>
      {kind === 'cross-reaction' ? (
        <FormTextField control={control} name={`${prefix}.partnerFormula`} label="Partner formula" hint="Example: [Fe(H2O)6]2+" testID={`${id}-partner`} />
      ) : null}
      <AppText variant="label" tone="muted">Conditions</AppText>
      <View style={styles.grid}>
        <View style={styles.cell}>
          <FormTextField control={control} name={`${prefix}.temperatureK`} label="Temperature (K)" hint="298.15 K = 25 °C" keyboardType="decimal-pad" testID={`${id}-temperature`} />
        </View>
        <View style={styles.cell}>
          <FormTextField control={control} name={`${prefix}.ionicStrengthM`} label="Ionic strength (M)" keyboardType="decimal-pad" hint="Example: 1.0" testID={`${id}-ionic-strength`} />
        </View>
        <View style={styles.cell}>
          <FormTextField control={control} name={`${prefix}.medium`} label="Medium" autoCapitalize="none" hint="Example: 1 M HClO4" testID={`${id}-medium`} />
        </View>
        <View style={styles.cell}>
          <FormTextField control={control} name={`${prefix}.method`} label="Method" autoCapitalize="none" hint="Example: 17O NMR line broadening" testID={`${id}-method`} />
        </View>
      </View>
      <AppText variant="label" tone="muted">Citation</AppText>
      <View style={styles.chips}>
        {CITATION_KINDS.map(([value, label]) => (
          <Chip
            key={value}
            label={label}
            selected={(citationKind || 'article') === value}
            onPress={() => setValue(`${prefix}.citation.kind`, value, { shouldDirty: true })}
            testID={`${id}-source-${value}`}
          />
        ))}
      </View>
      <View style={styles.grid}>
        <View style={styles.cell}>
          <FormTextField control={control} name={`${prefix}.citation.doi`} label="DOI" hint="Example: 10.1021/cr030726o" testID={`${id}-doi`} />
          <DoiFillButton index={index} control={control} setValue={setValue} />
        </View>
        <View style={styles.cellWide}>
          <FormTextField control={control} name={`${prefix}.citation.authors`} label="Authors" autoCapitalize="words" hint="Example: L. Helm, A. E. Merbach" testID={`${id}-authors`} />
        </View>
        <View style={styles.cellWide}>
          <FormTextField control={control} name={`${prefix}.citation.title`} label="Title" autoCapitalize="sentences" testID={`${id}-title`} />
        </View>
        {citationKind === 'book' ? null : (
          <View style={styles.cell}>
            <FormTextField control={control} name={`${prefix}.citation.journal`} label={JOURNAL_LABELS[citationKind || 'article'] ?? 'Journal'} autoCapitalize="words" hint="Example: Chem. Rev." testID={`${id}-journal`} />
          </View>
        )}
        {citationKind === 'book' || citationKind === 'chapter' ? (
          <>
            <View style={styles.cell}>
              <FormTextField control={control} name={`${prefix}.citation.publisher`} label="Publisher" autoCapitalize="words" testID={`${id}-publisher`} />
            </View>
            <View style={styles.cell}>
              <FormTextField control={control} name={`${prefix}.citation.place`} label="Place" autoCapitalize="words" testID={`${id}-place`} />
            </View>
          </>
        ) : null}
        {citationKind === 'web-page' ? (
          <View style={styles.cellWide}>
            <FormTextField control={control} name={`${prefix}.citation.url`} label="Address" autoCapitalize="none" hint="The full address, starting with https://" testID={`${id}-url`} />
          </View>
        ) : null}
        <View style={styles.cellSmall}>
          <FormTextField control={control} name={`${prefix}.citation.year`} label="Year" keyboardType="number-pad" testID={`${id}-year`} />
        </View>
        <View style={styles.cellSmall}>
          <FormTextField control={control} name={`${prefix}.citation.volume`} label="Volume" testID={`${id}-volume`} />
        </View>
        <View style={styles.cellSmall}>
          <FormTextField control={control} name={`${prefix}.citation.pages`} label="Pages" hint="Example: 1923-1960" testID={`${id}-pages`} />
        </View>
      </View>
      <AppText variant="caption" tone="muted">Leave every citation field empty to add the source later (the entry shows “No citation yet”).</AppText>
      <FormTextField control={control} name={`${prefix}.notes`} label="Notes on this measurement" autoCapitalize="sentences" multiline numberOfLines={3} testID={`${id}-notes`} />
    </View>
  );
}

const styles = StyleSheet.create({
  box: { gap: spacing.md, padding: spacing.lg, borderWidth: 1, borderColor: colors.line, borderRadius: radius.md, backgroundColor: colors.card },
  headRow: { flexDirection: 'row', alignItems: 'center', gap: spacing.md },
  grow: { flex: 1 },
  chips: { flexDirection: 'row', flexWrap: 'wrap', gap: spacing.xs },
  valueRow: { flexDirection: 'row', flexWrap: 'wrap', gap: spacing.md, alignItems: 'flex-start' },
  units: { gap: spacing.xs, minWidth: 140 },
  grid: { flexDirection: 'row', flexWrap: 'wrap', gap: spacing.md },
  cell: { flexGrow: 1, flexBasis: 200 },
  cellWide: { flexGrow: 2, flexBasis: 300 },
  cellSmall: { flexGrow: 1, flexBasis: 90 },
});
