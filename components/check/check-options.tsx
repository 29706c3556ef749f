import { useState } from 'react';
import { ScrollView, StyleSheet, TextInput, View } from 'react-native';
import { geometriesFor } from '@/lib/chem/geometry-fit';
import type { Geometry } from '@/lib/chem/types';
import { Chip } from '@/components/ui/chip';
import { AppText } from '@/components/ui/text';
import { colors, fonts, radius, spacing } from '@/components/ui/theme';

export const EXAMPLE_FORMULAS = [
  '[Co(NH3)5Cl]Cl2',
  '[Cr(H2O)6]3+',
  '[Cu(H2O)6]2+',
  '[V(H2O)6]2+',
  'K3[Fe(CN)6]',
  '[Ni(CN)4]2-',
  '[Pt(NH3)2Cl2]',
  '[Ru(bpy)3]Cl2·6H2O',
  'K3[Cr(ox)3]·3H2O',
  '[Gd(H2O)8]3+',
];

const GEOMETRY_CHOICES: Geometry[] = ['octahedral', 'tetrahedral', 'square-planar', 'square-pyramidal', 'trigonal-bipyramidal'];
const TEMPERATURE_CHOICES_C = [0, 25, 37, 60, 80, 100];

/** Examples to tap: one swipeable row on a phone (so the verdict stays near the input), wrapped when wide. */
export function ExampleChips({ onPick, oneRow }: { onPick: (formula: string) => void; oneRow?: boolean }) {
  const chips = EXAMPLE_FORMULAS.map((formula) => (
    <Chip key={formula} label={formula} mono onPress={() => onPick(formula)} testID={`example-${formula}`} />
  ));
  return (
    <View style={styles.section}>
      <AppText variant="label" tone="muted">Try</AppText>
      {oneRow ? (
        <ScrollView horizontal showsHorizontalScrollIndicator={false} contentContainerStyle={styles.oneRow}>
          {chips}
        </ScrollView>
      ) : (
        <View style={styles.row}>{chips}</View>
      )}
    </View>
  );
}

export function GeometryChoice({ value, predicted, coordinationNumber, onChange }: {
  value: Geometry | null;
  predicted: Geometry | null;
  /** Only geometries with room for this many donor atoms are offered. */
  coordinationNumber: number;
  onChange: (geometry: Geometry | null) => void;
}) {
  const fitting = geometriesFor(coordinationNumber);
  return (
    <View style={styles.section}>
      <AppText variant="label" tone="muted">Geometry</AppText>
      <View style={styles.row}>
        <Chip
          label={predicted ? `predicted (${predicted})` : 'predicted'}
          selected={value === null}
          onPress={() => onChange(null)}
          testID="geometry-predicted"
        />
        {GEOMETRY_CHOICES.filter((g) => g !== predicted && fitting.includes(g)).map((geometry) => (
          <Chip key={geometry} label={geometry} selected={value === geometry} onPress={() => onChange(geometry)} />
        ))}
      </View>
    </View>
  );
}

export const TEMPERATURE_RANGE_C = { min: -80, max: 250 } as const;

/** Null when the text is a usable temperature, else what is wrong with it (shown in the field). */
export function temperatureProblem(text: string): string | null {
  const trimmed = text.trim();
  if (trimmed === '') return null;
  const value = Number(trimmed.replace(',', '.').replace('−', '-'));
  if (!Number.isFinite(value)) return `“${trimmed}” is not a number: write degrees Celsius, e.g. 45.`;
  if (value < TEMPERATURE_RANGE_C.min || value > TEMPERATURE_RANGE_C.max) {
    return `Choose a temperature from ${TEMPERATURE_RANGE_C.min} to ${TEMPERATURE_RANGE_C.max} °C (aqueous and common solvent work).`;
  }
  return null;
}

/**
 * Preset chips and a field for any other temperature. The field is controlled: a chip clears it, a
 * valid entry is applied at once, and an invalid one is reported in place and `onProblem` tells the
 * screen, which then shows no result rather than one for another temperature.
 */
export function TemperatureChoice({ valueC, onChange, onProblem }: {
  valueC: number;
  onChange: (celsius: number) => void;
  onProblem?: (problem: string | null) => void;
}) {
  const [text, setText] = useState(TEMPERATURE_CHOICES_C.includes(valueC) ? '' : String(valueC));
  const problem = temperatureProblem(text);
  const pickChip = (celsius: number) => {
    setText('');
    onProblem?.(null);
    onChange(celsius);
  };
  const edit = (next: string) => {
    setText(next);
    const nextProblem = temperatureProblem(next);
    onProblem?.(nextProblem);
    if (nextProblem === null && next.trim() !== '') onChange(Number(next.trim().replace(',', '.').replace('−', '-')));
    if (next.trim() === '') onChange(25);
  };
  return (
    <View style={styles.section}>
      <AppText variant="label" tone="muted">Temperature</AppText>
      <View style={styles.row}>
        {TEMPERATURE_CHOICES_C.map((celsius) => (
          <Chip key={celsius} label={`${celsius} °C`} selected={text.trim() === '' && valueC === celsius} onPress={() => pickChip(celsius)} />
        ))}
        <TextInput
          accessibilityLabel="Temperature in degrees Celsius"
          aria-invalid={problem !== null}
          testID="temperature-input"
          inputMode="decimal"
          value={text}
          onChangeText={edit}
          placeholder="other °C"
          placeholderTextColor={colors.muted}
          style={[styles.temperatureInput, problem ? styles.temperatureInputProblem : null]}
        />
      </View>
      {problem ? (
        <AppText variant="caption" tone="danger" accessibilityLiveRegion="polite" testID="temperature-problem">
          {problem}
        </AppText>
      ) : null}
    </View>
  );
}

const styles = StyleSheet.create({
  section: { gap: spacing.sm },
  row: { flexDirection: 'row', flexWrap: 'wrap', gap: spacing.sm, alignItems: 'center' },
  oneRow: { gap: spacing.sm, paddingRight: spacing.lg },
  temperatureInput: {
    width: 92,
    minHeight: 44,
    fontFamily: fonts.mono,
    fontSize: 13,
    borderWidth: 1,
    borderColor: colors.lineStrong,
    borderRadius: radius.pill,
    paddingVertical: spacing.xs,
    paddingHorizontal: spacing.md,
    color: colors.ink,
    backgroundColor: colors.card,
  },
  temperatureInputProblem: { borderColor: colors.danger },
});
