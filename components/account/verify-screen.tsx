import { useEffect, useRef } from 'react';
import { StyleSheet, View } from 'react-native';
import { ApiError } from '@/lib/api/api-client';
import { useVerifyEmailMutation } from '@/lib/api/auth';
import { Button } from '@/components/ui/button';
import { Card } from '@/components/ui/card';
import { FormError } from '@/components/ui/form-error';
import { AppText } from '@/components/ui/text';
import { spacing } from '@/components/ui/theme';
import { AuthFrame, LinkRow, TextLink } from './auth-frame';
import { describeError } from './form-errors';
import { LoadingBlock } from './query-states';

const LINK_SPENT =
  'This confirmation link no longer works: it may have been used already, have expired, or been replaced by a newer one. ' +
  'Sign in with your password and we will send a fresh link.';

function describeVerifyError(error: unknown): string {
  if (error instanceof ApiError && (error.code === 'VALIDATION_FAILED' || error.code === 'NOT_FOUND')) return LINK_SPENT;
  return describeError(error);
}

/** Opened from the e-mailed link: confirms the address once, then offers sign-in. */
export function VerifyScreen({ token }: { token: string }) {
  const verify = useVerifyEmailMutation();
  const { mutate } = verify;
  // One attempt per token, even when effects run twice in development.
  const sentFor = useRef<string | null>(null);
  useEffect(() => {
    if (!token || sentFor.current === token) return;
    sentFor.current = token;
    mutate({ token });
  }, [token, mutate]);

  return (
    <AuthFrame title="Confirm your e-mail" testID="verify-screen">
      {!token ? (
        <FormError
          message="This page needs the link from your confirmation e-mail. Open the link from the message, or copy it whole into the address bar."
          testID="verify-missing-token"
        />
      ) : verify.isSuccess ? (
        <View style={styles.block} testID="verify-success">
          <Card>
            <AppText variant="lead">Your e-mail address is confirmed.</AppText>
            <AppText tone="soft">You can sign in now and join your group.</AppText>
          </Card>
          <LinkRow>
            <TextLink href="/sign-in" testID="verify-sign-in">Sign in</TextLink>
          </LinkRow>
        </View>
      ) : verify.isError ? (
        <View style={styles.block} testID="verify-failed">
          <FormError message={describeVerifyError(verify.error)} />
          {verify.error instanceof ApiError && (verify.error.code === 'NETWORK' || verify.error.status >= 500) ? (
            <View style={styles.retry}>
              <Button label="Try again" kind="quiet" onPress={() => mutate({ token })} testID="verify-retry" />
            </View>
          ) : null}
          <LinkRow>
            <TextLink href="/sign-in" testID="verify-sign-in">Sign in</TextLink>
            <TextLink href="/sign-up" testID="verify-sign-up">Create an account</TextLink>
          </LinkRow>
        </View>
      ) : (
        <LoadingBlock label="Confirming your address…" testID="verify-pending" />
      )}
    </AuthFrame>
  );
}

const styles = StyleSheet.create({
  block: { gap: spacing.lg },
  retry: { alignSelf: 'flex-start' },
});
