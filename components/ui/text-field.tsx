import { forwardRef } from 'react';
import { StyleSheet, TextInput, View, type TextInputProps } from 'react-native';
import { AppText } from './text';
import { colors, fonts, radius, spacing } from './theme';

export interface TextFieldProps
  extends Pick<
    TextInputProps,
    | 'value'
    | 'onChangeText'
    | 'onBlur'
    | 'onSubmitEditing'
    | 'placeholder'
    | 'secureTextEntry'
    | 'autoComplete'
    | 'keyboardType'
    | 'autoCapitalize'
    | 'textContentType'
    | 'returnKeyType'
    | 'editable'
    | 'multiline'
    | 'numberOfLines'
  > {
  label: string;
  /** A line under the field that explains what is expected (shown until there is an error). */
  hint?: string;
  /** The problem with this field, from the form's own rules or from the server. */
  error?: string;
  testID?: string;
}

/**
 * A labelled text input with its problem written under it. Forwards the ref to the TextInput so
 * react-hook-form's Controller can focus the first field with an error.
 */
export const TextField = forwardRef<TextInput, TextFieldProps>(function TextField(
  { label, hint, error, testID, autoCapitalize = 'none', ...input },
  ref,
) {
  const labelId = testID ? `${testID}-label` : undefined;
  return (
    <View style={styles.wrap}>
      <AppText variant="label" tone="muted" nativeID={labelId}>{label}</AppText>
      <TextInput
        ref={ref}
        {...input}
        autoCapitalize={autoCapitalize}
        autoCorrect={false}
        spellCheck={false}
        placeholderTextColor={colors.muted}
        accessibilityLabel={label}
        aria-invalid={!!error}
        testID={testID}
        style={StyleSheet.flatten([styles.input, input.multiline ? styles.inputMultiline : null, error ? styles.inputInvalid : null, input.editable === false ? styles.inputLocked : null])}
      />
      {error ? (
        <AppText tone="danger" variant="caption" style={styles.line} testID={testID ? `${testID}-error` : undefined} accessibilityLiveRegion="polite">
          {error}
        </AppText>
      ) : hint ? (
        <AppText tone="muted" variant="caption" style={styles.line} testID={testID ? `${testID}-hint` : undefined}>
          {hint}
        </AppText>
      ) : null}
    </View>
  );
});

const styles = StyleSheet.create({
  wrap: { gap: spacing.xs },
  // Several lines of notes, top-aligned like a page.
  inputMultiline: { minHeight: 112, textAlignVertical: 'top', paddingTop: spacing.sm },
  input: {
    fontFamily: fonts.body,
    fontSize: 16,
    color: colors.ink,
    backgroundColor: colors.card,
    borderWidth: 1.5,
    borderColor: colors.lineStrong,
    borderRadius: radius.md,
    paddingHorizontal: spacing.md,
    paddingVertical: spacing.sm + 2,
    minHeight: 48,
  },
  inputInvalid: { borderColor: colors.danger },
  inputLocked: { backgroundColor: colors.paper, color: colors.inkSoft },
  line: { fontSize: 13, lineHeight: 18 },
});
