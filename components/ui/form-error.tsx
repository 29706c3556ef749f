import type { ReactNode } from 'react';
import { StyleSheet, View } from 'react-native';
import { AppText } from './text';
import { colors, radius, spacing } from './theme';

/**
 * A message about the whole form (wrong sign-in, too many attempts, no connection), shown above the
 * submit button. `tone="done"` is the same box for good news (a confirmation that replaces nothing).
 */
export function FormError({ message, tone = 'problem', children, testID }: {
  message: string | null | undefined;
  tone?: 'problem' | 'done';
  children?: ReactNode;
  testID?: string;
}) {
  if (!message) return null;
  const done = tone === 'done';
  return (
    <View
      style={StyleSheet.flatten([styles.box, done ? styles.done : styles.problem])}
      accessibilityRole={done ? undefined : 'alert'}
      accessibilityLiveRegion="polite"
      testID={testID}
    >
      <AppText style={done ? styles.doneText : styles.problemText}>{message}</AppText>
      {children}
    </View>
  );
}

const styles = StyleSheet.create({
  box: { borderRadius: radius.md, borderLeftWidth: 4, padding: spacing.md, gap: spacing.sm },
  problem: { backgroundColor: colors.dangerSoft, borderLeftColor: colors.danger },
  done: { backgroundColor: colors.accentSoft, borderLeftColor: colors.accent },
  problemText: { color: colors.danger },
  doneText: { color: colors.ink },
});
