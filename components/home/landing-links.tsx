import { Link, type Href } from 'expo-router';
import type { ReactNode } from 'react';
import { Pressable, StyleSheet } from 'react-native';
import { AppText } from '@/components/ui/text';
import { colors, radius, spacing } from '@/components/ui/theme';

/**
 * A rounded link holding a typeset formula (or a pair). Its name is the text shown, so what a screen
 * reader says matches what a voice-control user reads on it (WCAG 2.5.3).
 */
export function PillLink({ href, children, testID }: { href: Href; children: ReactNode; testID?: string }) {
  return (
    <Link href={href} asChild>
      <Pressable accessibilityRole="link" style={styles.pill} testID={testID}>
        {children}
      </Pressable>
    </Link>
  );
}

/** A text link with a 44 px tall target. */
export function RowLink({ href, children, testID }: { href: Href; children: ReactNode; testID?: string }) {
  return (
    <Link href={href} asChild>
      <Pressable accessibilityRole="link" style={styles.rowLink} testID={testID}>
        <AppText tone="accent" style={styles.rowLinkText}>{children} →</AppText>
      </Pressable>
    </Link>
  );
}

const styles = StyleSheet.create({
  pill: {
    minHeight: 44,
    justifyContent: 'center',
    paddingHorizontal: spacing.md,
    paddingVertical: spacing.xs,
    borderRadius: radius.pill,
    borderWidth: 1,
    borderColor: colors.lineStrong,
    backgroundColor: colors.card,
  },
  rowLink: { minHeight: 44, justifyContent: 'center', alignSelf: 'flex-start' },
  rowLinkText: { textDecorationLine: 'underline' },
});
