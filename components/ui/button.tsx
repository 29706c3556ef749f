import { Pressable, StyleSheet } from 'react-native';
import { AppText } from './text';
import { colors, radius, spacing } from './theme';

export function Button({ label, onPress, kind = 'primary', disabled, testID, accessibilityLabel }: {
  label: string;
  onPress: () => void;
  kind?: 'primary' | 'quiet';
  disabled?: boolean;
  testID?: string;
  accessibilityLabel?: string;
}) {
  return (
    <Pressable
      accessibilityRole="button"
      accessibilityLabel={accessibilityLabel ?? label}
      accessibilityState={{ disabled: !!disabled }}
      disabled={disabled}
      onPress={onPress}
      testID={testID}
      style={({ pressed }) => [
        styles.base,
        kind === 'primary' ? styles.primary : styles.quiet,
        pressed && styles.pressed,
        disabled && styles.disabled,
      ]}
    >
      <AppText variant="body" numberOfLines={1} style={kind === 'primary' ? styles.primaryText : styles.quietText}>
        {label}
      </AppText>
    </Pressable>
  );
}

const styles = StyleSheet.create({
  // At least 44 px tall, and the label on one line: a button that wraps reads as two.
  base: { minHeight: 44, minWidth: 44, flexShrink: 0, justifyContent: 'center', paddingVertical: spacing.sm, paddingHorizontal: spacing.lg, borderRadius: radius.pill, alignItems: 'center' },
  primary: { backgroundColor: colors.accent },
  quiet: { backgroundColor: 'transparent', borderWidth: 1, borderColor: colors.lineStrong },
  pressed: { opacity: 0.8 },
  disabled: { opacity: 0.45 },
  primaryText: { color: colors.accentInk },
  quietText: { color: colors.ink },
});
