import { useState } from 'react';
import { StyleSheet, View } from 'react-native';
import { useSignOutEverywhereMutation, useSignOutMutation } from '@/lib/api/auth';
import { Button } from '@/components/ui/button';
import { Card } from '@/components/ui/card';
import { FormError } from '@/components/ui/form-error';
import { AppText } from '@/components/ui/text';
import { spacing } from '@/components/ui/theme';
import { describeError } from './form-errors';

/** Sign out here, or everywhere (asks once more: it ends every session, this one included). */
export function SignOutCard() {
  const signOut = useSignOutMutation();
  const everywhere = useSignOutEverywhereMutation();
  const [confirming, setConfirming] = useState(false);
  const busy = signOut.isPending || everywhere.isPending;
  const failure = signOut.error ?? everywhere.error;
  return (
    <Card title="Sign out" testID="sign-out-card">
      <View style={styles.buttons}>
        <Button
          label={signOut.isPending ? 'Signing out…' : 'Sign out'}
          accessibilityLabel="Sign out"
          onPress={() => signOut.mutate()}
          disabled={busy}
          testID="account-sign-out"
        />
        {confirming ? null : (
          <Button
            label="Sign out everywhere…"
            kind="quiet"
            onPress={() => setConfirming(true)}
            disabled={busy}
            testID="account-sign-out-everywhere"
          />
        )}
      </View>
      {confirming ? (
        <View style={styles.confirm} testID="sign-out-everywhere-confirm">
          <AppText tone="soft">
            Every device signed in to your account, this one included, will be signed out. Use it if you signed in on a
            shared computer or suspect someone else has your password (then change it too).
          </AppText>
          <View style={styles.buttons}>
            <Button
              label={everywhere.isPending ? 'Signing out everywhere…' : 'Yes, sign out everywhere'}
              onPress={() => everywhere.mutate()}
              disabled={busy}
              testID="account-sign-out-everywhere-confirm"
            />
            <Button label="Keep my sessions" kind="quiet" onPress={() => setConfirming(false)} disabled={busy} testID="account-sign-out-everywhere-cancel" />
          </View>
        </View>
      ) : null}
      <FormError message={failure ? describeError(failure) : null} testID="sign-out-error" />
    </Card>
  );
}

const styles = StyleSheet.create({
  buttons: { flexDirection: 'row', flexWrap: 'wrap', gap: spacing.sm },
  confirm: { gap: spacing.sm, marginTop: spacing.xs },
});
