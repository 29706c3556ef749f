import { useRouter } from 'expo-router';
import { StyleSheet, View } from 'react-native';
import { useMeQuery } from '@/lib/api/auth';
import type { MeResponse } from '@/lib/schemas/auth';
import { Button } from '@/components/ui/button';
import { Card } from '@/components/ui/card';
import { Screen } from '@/components/ui/screen';
import { AppText } from '@/components/ui/text';
import { spacing } from '@/components/ui/theme';
import { useWideLayout } from '@/components/ui/use-wide-layout';
import { LinkRow, TextLink } from './auth-frame';
import { MailPreferencesCard } from '@/components/exchange/mail-preferences-card';
import { GroupsCard } from './groups-card';
import { ProfileCard } from './profile-card';
import { PasswordCard } from './password-card';
import { ErrorBlock, LoadingBlock, StaleNotice } from './query-states';
import { SessionsCard } from './sessions-card';
import { SignOutCard } from './sign-out-card';

/** The Account tab: a sign-in invitation when signed out; profile, groups, devices, password and sign-out when in. */
export function AccountScreen() {
  const me = useMeQuery();
  const retry = () => void me.refetch();
  return (
    <Screen maxWidth={1040}>
      {me.data === undefined ? (
        me.isError ? (
          <ErrorBlock title="We could not tell whether you are signed in" error={me.error} onRetry={retry} testID="account-error" />
        ) : (
          <LoadingBlock label="Checking your sign-in…" testID="account-loading" />
        )
      ) : (
        <>
          {me.isError ? <StaleNotice error={me.error} onRetry={retry} testID="account-stale" /> : null}
          {me.data === null ? <SignedOut /> : <SignedIn me={me.data} />}
        </>
      )}
    </Screen>
  );
}

function SignedOut() {
  const router = useRouter();
  return (
    <View style={styles.signedOut} testID="account-signed-out">
      <View style={styles.head}>
        <AppText variant="display" accessibilityRole="header">Your account</AppText>
        <AppText variant="lead" tone="soft">
          Sign in to read your group’s library, contribute measurements and take part in reviews.
        </AppText>
      </View>
      <Card>
        <View style={styles.ctaButtons}>
          <Button label="Sign in" onPress={() => router.push('/sign-in')} testID="account-sign-in" />
          <Button label="Create an account" kind="quiet" onPress={() => router.push('/sign-up')} testID="account-sign-up" />
        </View>
        <AppText variant="caption" tone="muted">
          No account is needed to check a complex or plan an electron-transfer route.
        </AppText>
        <LinkRow>
          <TextLink href="/check" testID="account-to-check">Check a complex</TextLink>
          <TextLink href="/route" testID="account-to-route">Plan a route</TextLink>
        </LinkRow>
      </Card>
    </View>
  );
}

function SignedIn({ me }: { me: MeResponse }) {
  const wide = useWideLayout();
  return (
    <View style={styles.signedIn} testID="account-signed-in">
      <View style={styles.head}>
        <AppText variant="label" tone="muted">Signed in as</AppText>
        <AppText variant="display" accessibilityRole="header" testID="account-display-name">{me.user.displayName}</AppText>
        <AppText tone="soft" testID="account-email">{me.user.email}</AppText>
      </View>
      {wide ? (
        <View style={styles.columns}>
          <View style={styles.column}>
            <GroupsCard />
            <SessionsCard />
            <PasswordCard />
          </View>
          <View style={styles.column}>
            <ProfileCard user={me.user} />
            <MailPreferencesCard me={me} />
            <SignOutCard />
          </View>
        </View>
      ) : (
        <View style={styles.column}>
          <ProfileCard user={me.user} />
          <GroupsCard />
          <SessionsCard />
          <PasswordCard />
          <MailPreferencesCard me={me} />
          <SignOutCard />
        </View>
      )}
    </View>
  );
}

const styles = StyleSheet.create({
  signedOut: { gap: spacing.xl, width: '100%', maxWidth: 560, alignSelf: 'center' },
  signedIn: { gap: spacing.xl },
  head: { gap: spacing.xs },
  ctaButtons: { gap: spacing.sm },
  columns: { flexDirection: 'row', gap: spacing.xl, alignItems: 'flex-start' },
  column: { flex: 1, minWidth: 0, gap: spacing.lg },
});
