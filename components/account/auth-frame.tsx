import { Link, type Href } from 'expo-router';
import type { ReactNode } from 'react';
import { Linking, Platform, Pressable, StyleSheet, View } from 'react-native';
import { useDevOutboxQuery } from '@/lib/api/auth';
import { Screen } from '@/components/ui/screen';
import { AppText } from '@/components/ui/text';
import { colors, fonts, spacing } from '@/components/ui/theme';

/** Forms are centred and kept narrow (about 480 px) on every screen size. */
export const FORM_MAX_WIDTH = 480;

/** The page around a sign-in style form: a way home, a heading, a short line, then the form. */
export function AuthFrame({ title, intro, children, testID }: {
  title: string;
  intro?: string;
  children: ReactNode;
  testID?: string;
}) {
  return (
    <Screen maxWidth={FORM_MAX_WIDTH}>
      <View style={styles.frame} testID={testID}>
        <TextLink href="/" testID="auth-home-link">← Sphereline</TextLink>
        <View style={styles.head}>
          <AppText variant="display" accessibilityRole="header">{title}</AppText>
          {intro ? <AppText tone="soft">{intro}</AppText> : null}
        </View>
        {children}
      </View>
    </Screen>
  );
}

/** An in-app text link (an <a> on the web). */
export function TextLink({ href, children, testID }: { href: Href; children: ReactNode; testID?: string }) {
  return (
    <Link href={href} style={styles.link} testID={testID}>
      {children}
    </Link>
  );
}

/** A row of links under a form ("Create an account · Forgot your password?"). */
export function LinkRow({ children }: { children: ReactNode }) {
  return <View style={styles.linkRow}>{children}</View>;
}

const OUTBOX_PATH = '/api/dev/outbox';

/**
 * "Open the local outbox": development servers keep every outgoing e-mail in a local sink. Shown only
 * when that sink answers, so production never offers it.
 */
export function DevOutboxLink({ email }: { email?: string }) {
  const outbox = useDevOutboxQuery();
  if (outbox.data !== true) return null;
  const url = email ? `${OUTBOX_PATH}?to=${encodeURIComponent(email)}` : OUTBOX_PATH;
  return (
    <Pressable
      accessibilityRole="link"
      accessibilityHint="Development only: the messages this server would have e-mailed"
      onPress={() => {
        void Linking.openURL(url);
      }}
      testID="dev-outbox-link"
      style={styles.outbox}
    >
      <AppText variant="caption" tone="muted">Development server</AppText>
      <AppText style={styles.linkText}>Open the local outbox{Platform.OS === 'web' ? ' ↗' : ''}</AppText>
    </Pressable>
  );
}

const styles = StyleSheet.create({
  frame: { gap: spacing.xl, paddingVertical: spacing.md },
  head: { gap: spacing.sm },
  link: {
    fontFamily: fonts.strong,
    fontSize: 15,
    lineHeight: 22,
    color: colors.accent,
    textDecorationLine: 'underline',
    alignSelf: 'flex-start',
    // 22 px of text in a 44 px tall target.
    paddingVertical: 11,
  },
  linkText: { fontFamily: fonts.strong, color: colors.accent, textDecorationLine: 'underline' },
  linkRow: { flexDirection: 'row', flexWrap: 'wrap', columnGap: spacing.xl, rowGap: spacing.sm },
  outbox: {
    alignSelf: 'flex-start',
    borderWidth: 1,
    borderStyle: 'dashed',
    borderColor: colors.lineStrong,
    borderRadius: 10,
    paddingHorizontal: spacing.md,
    paddingVertical: spacing.sm,
    gap: 2,
  },
});
