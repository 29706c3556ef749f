import { zodResolver } from '@hookform/resolvers/zod';
import { useEffect } from 'react';
import { Controller, useForm, useWatch } from 'react-hook-form';
import { StyleSheet, TextInput, View } from 'react-native';
import { marcusCrossRate, MarcusInputError, type MarcusResult } from '@/lib/chem/marcus';
import { marcusFormSchema, type MarcusForm } from '@/lib/schemas/chem';
import { Card } from '@/components/ui/card';
import { estimate } from '@/components/ui/format';
import { AppText } from '@/components/ui/text';
import { colors, fonts, radius, spacing } from '@/components/ui/theme';
import { MarcusChart } from './marcus-chart';

const FIELDS: { name: keyof MarcusForm; label: string; unit: string }[] = [
  { name: 'k11', label: 'k11 (oxidant couple)', unit: 'M⁻¹ s⁻¹' },
  { name: 'k22', label: 'k22 (reductant couple)', unit: 'M⁻¹ s⁻¹' },
  { name: 'dE', label: 'ΔE° = E°ox − E°red', unit: 'V' },
  { name: 'T', label: 'Temperature', unit: '°C' },
  { name: 'observed', label: 'Observed k12 (optional)', unit: 'M⁻¹ s⁻¹' },
];

function compute(values: MarcusForm): MarcusResult | string {
  try {
    return marcusCrossRate({
      k11: Number(values.k11),
      k22: Number(values.k22),
      deltaEV: Number(values.dE),
      temperatureC: values.T === '' ? 25 : Number(values.T),
      observedK12: values.observed === '' ? undefined : Number(values.observed),
    });
  } catch (error) {
    if (error instanceof MarcusInputError) return error.message;
    throw error;
  }
}

/**
 * The Marcus cross relation for the pair: prefilled from the couples table when both are known,
 * editable for any couple, with the predicted and observed k12 placed on one axis.
 */
/**
 * `sourceNotes` come from the route engine: where the couples table gave its own estimate, the
 * sources of k11 and E°; where it gave none, why. Once the fields hold an estimate, a "no estimate"
 * note would contradict it: the panel then says where this estimate comes from instead.
 */
export function MarcusPanel({ prefill, sourceNotes, tableEstimate = true }: { prefill: MarcusForm; sourceNotes: string[]; tableEstimate?: boolean }) {
  const { control, reset, formState } = useForm<MarcusForm>({
    resolver: zodResolver(marcusFormSchema),
    mode: 'onChange',
    defaultValues: prefill,
  });
  const prefillKey = JSON.stringify(prefill);
  useEffect(() => {
    reset(JSON.parse(prefillKey) as MarcusForm);
  }, [prefillKey, reset]);

  // The cross relation is a few arithmetic steps: recompute on every keystroke.
  const parsed = marcusFormSchema.safeParse(useWatch({ control }));
  const result = parsed.success ? compute(parsed.data) : null;
  const computed = result !== null && typeof result !== 'string';
  const notesShown = computed && !tableEstimate ? [] : sourceNotes;

  return (
    <Card title="Marcus cross relation" testID="marcus-panel">
      <AppText variant="caption" tone="muted">
        k12 = (k11·k22·K12·f12)½, log f12 = (log K12)² / 4 log(k11·k22/Z²), Z = 10¹¹ M⁻¹ s⁻¹; K12 from ΔE°. Work terms
        neglected.
      </AppText>
      <View style={styles.fields}>
        {FIELDS.map((field) => (
          <Controller
            key={field.name}
            control={control}
            name={field.name}
            render={({ field: { value, onChange, onBlur } }) => (
              <View style={styles.field}>
                <AppText variant="caption" tone="muted">
                  {field.label} / {field.unit}
                </AppText>
                <TextInput
                  value={value}
                  onChangeText={onChange}
                  onBlur={onBlur}
                  inputMode="decimal"
                  accessibilityLabel={field.label}
                  testID={`marcus-${field.name}`}
                  style={[styles.input, formState.errors[field.name] ? styles.inputInvalid : null]}
                />
                {formState.errors[field.name] ? (
                  <AppText variant="caption" tone="danger">{formState.errors[field.name]?.message}</AppText>
                ) : null}
              </View>
            )}
          />
        ))}
      </View>
      {typeof result === 'string' ? <AppText tone="danger">{result}</AppText> : null}
      {result && typeof result !== 'string' ? (
        <View style={styles.result} testID="marcus-result">
          <AppText variant="lead">
            k12 ≈ {estimate(result.k12)} M⁻¹ s⁻¹ · K12 = {estimate(result.K12)} · f12 = {estimate(result.f12, 3)}
          </AppText>
          <MarcusChart
            predictedLogK={Math.log10(result.k12)}
            observedLogK={result.comparison ? Math.log10(result.comparison.observedK12) : null}
          />
          {result.comparison ? (
            <AppText testID="marcus-comparison">{result.comparison.explanation}</AppText>
          ) : (
            <AppText tone="muted">Enter an observed k12 to compare it with the outer-sphere prediction.</AppText>
          )}
        </View>
      ) : null}
      {computed && !tableEstimate ? (
        <AppText variant="caption" tone="muted" testID="marcus-own-values">
          This estimate is the cross relation applied to the values in the fields above; the route above makes no estimate of its own for this pair.
        </AppText>
      ) : null}
      {notesShown.length > 0 ? (
        <View style={styles.notes} testID="marcus-notes">
          {notesShown.map((note) => (
            <AppText key={note} variant="caption" tone="muted">{note}</AppText>
          ))}
        </View>
      ) : null}
    </Card>
  );
}

const styles = StyleSheet.create({
  fields: { flexDirection: 'row', flexWrap: 'wrap', gap: spacing.md },
  field: { minWidth: 150, flexGrow: 1, flexBasis: 150, gap: 2 },
  input: {
    fontFamily: fonts.mono,
    fontSize: 15,
    borderWidth: 1,
    borderColor: colors.lineStrong,
    borderRadius: radius.sm,
    paddingHorizontal: spacing.sm,
    paddingVertical: 6,
    minHeight: 44,
    color: colors.ink,
    backgroundColor: colors.card,
  },
  inputInvalid: { borderColor: colors.danger },
  result: { gap: spacing.sm },
  notes: { gap: 2 },
});
