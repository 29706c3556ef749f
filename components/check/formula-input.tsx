import { StyleSheet, TextInput, View } from 'react-native';
import { formulaProblemText } from '@/lib/chem/types';
import { AppText } from '@/components/ui/text';
import { colors, fonts, radius, spacing } from '@/components/ui/theme';

export interface FormulaProblem {
  message: string;
  /** 0-based character index in the formula. */
  position: number;
}

/** One formula field with the problem shown under the exact character it concerns. */
export function FormulaInput({ label, value, onChangeText, problem, placeholder, testID }: {
  label: string;
  value: string;
  onChangeText: (text: string) => void;
  problem: FormulaProblem | null;
  placeholder?: string;
  testID?: string;
}) {
  const caretAt = problem ? Math.min(problem.position, value.length) : 0;
  return (
    <View style={styles.wrap}>
      <AppText variant="label" tone="muted" nativeID={`${testID}-label`}>{label}</AppText>
      <TextInput
        value={value}
        onChangeText={onChangeText}
        placeholder={placeholder}
        placeholderTextColor={colors.muted}
        autoCapitalize="none"
        autoCorrect={false}
        spellCheck={false}
        accessibilityLabel={label}
        aria-invalid={!!problem}
        testID={testID}
        style={[styles.input, problem ? styles.inputInvalid : null]}
      />
      {problem ? (
        <View style={styles.problem} testID={`${testID}-problem`} accessibilityLiveRegion="polite">
          <AppText style={styles.echo} numberOfLines={1}>
            {value.slice(0, caretAt)}
            <AppText style={styles.culprit}>{value.slice(caretAt, caretAt + 1) || ' '}</AppText>
            {value.slice(caretAt + 1)}
          </AppText>
          <AppText tone="danger">
            {formulaProblemText(problem.message, problem.position)}
          </AppText>
        </View>
      ) : null}
    </View>
  );
}

const styles = StyleSheet.create({
  wrap: { gap: spacing.xs },
  input: {
    fontFamily: fonts.mono,
    fontSize: 20,
    color: colors.ink,
    backgroundColor: colors.card,
    borderWidth: 1.5,
    borderColor: colors.lineStrong,
    borderRadius: radius.md,
    paddingHorizontal: spacing.md,
    paddingVertical: spacing.md,
  },
  inputInvalid: { borderColor: colors.danger },
  problem: { gap: 2 },
  echo: { fontFamily: fonts.mono, color: colors.inkSoft },
  culprit: {
    fontFamily: fonts.mono,
    backgroundColor: colors.dangerSoft,
    color: colors.danger,
    textDecorationLine: 'underline',
  },
});
