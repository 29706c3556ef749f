import { ScrollView, StyleSheet, TextInput, View } from 'react-native';
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

export function GeometryChoice({ value, predicted, onChange }: {
  value: Geometry | null;
  predicted: Geometry | null;
  onChange: (geometry: Geometry | null) => void;
}) {
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
        {GEOMETRY_CHOICES.filter((g) => g !== predicted).map((geometry) => (
          <Chip key={geometry} label={geometry} selected={value === geometry} onPress={() => onChange(geometry)} />
        ))}
      </View>
    </View>
  );
}

export function TemperatureChoice({ valueC, onChange }: { valueC: number; onChange: (celsius: number) => void }) {
  return (
    <View style={styles.section}>
      <AppText variant="label" tone="muted">Temperature</AppText>
      <View style={styles.row}>
        {TEMPERATURE_CHOICES_C.map((celsius) => (
          <Chip key={celsius} label={`${celsius} °C`} selected={valueC === celsius} onPress={() => onChange(celsius)} />
        ))}
        <TextInput
          accessibilityLabel="Temperature in degrees Celsius"
          testID="temperature-input"
          inputMode="decimal"
          defaultValue={TEMPERATURE_CHOICES_C.includes(valueC) ? '' : String(valueC)}
          placeholder="other °C"
          placeholderTextColor={colors.muted}
          onChangeText={(text) => {
            const value = Number(text.replace(',', '.'));
            if (text.trim() !== '' && Number.isFinite(value) && value >= -80 && value <= 250) onChange(value);
          }}
          style={styles.temperatureInput}
        />
      </View>
    </View>
  );
}

const styles = StyleSheet.create({
  section: { gap: spacing.sm },
  row: { flexDirection: 'row', flexWrap: 'wrap', gap: spacing.sm, alignItems: 'center' },
  oneRow: { gap: spacing.sm, paddingRight: spacing.lg },
  temperatureInput: {
    width: 92,
    fontFamily: fonts.mono,
    fontSize: 13,
    borderWidth: 1,
    borderColor: colors.lineStrong,
    borderRadius: radius.pill,
    paddingVertical: 5,
    paddingHorizontal: spacing.md,
    color: colors.ink,
    backgroundColor: colors.card,
  },
});
