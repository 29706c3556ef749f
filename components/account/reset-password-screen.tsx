import { zodResolver } from '@hookform/resolvers/zod';
import { useState } from 'react';
import { useForm } from 'react-hook-form';
import { StyleSheet, View } from 'react-native';
import { ApiError } from '@/lib/api/api-client';
import { usePasswordResetConfirmMutation } from '@/lib/api/auth';
import { resetPasswordFormSchema } from '@/lib/schemas/auth-forms';
import { Button } from '@/components/ui/button';
import { Card } from '@/components/ui/card';
import { FormError } from '@/components/ui/form-error';
import { AppText } from '@/components/ui/text';
import { spacing } from '@/components/ui/theme';
import { AuthFrame, LinkRow, TextLink } from './auth-frame';
import { applyServerErrors } from './form-errors';
import { NewPasswordFields } from './new-password-fields';
import { PASSWORD_RULES } from './sign-up-screen';

const LINK_SPENT =
  'This reset link no longer works: it may have been used already, have expired, or been replaced by a newer one. Ask for a new link.';

/** Choose a new password from an e-mailed link (?token=); every session ends afterwards. */
export function ResetPasswordScreen({ token }: { token: string }) {
  const confirm = usePasswordResetConfirmMutation();
  const [done, setDone] = useState(false);
  const [formError, setFormError] = useState<{ message: string; linkSpent: boolean } | null>(null);
  const { control, handleSubmit, setError } = useForm({
    resolver: zodResolver(resetPasswordFormSchema),
    defaultValues: { password: '', confirmPassword: '' },
  });

  const submit = handleSubmit(async ({ password }) => {
    setFormError(null);
    try {
      await confirm.mutateAsync({ token, password });
      setDone(true);
    } catch (error) {
      const linkSpent = error instanceof ApiError && 'token' in error.fields;
      const message = linkSpent ? LINK_SPENT : applyServerErrors(error, setError, ['password']);
      if (message) setFormError({ message, linkSpent });
    }
  });

  if (!token) {
    return (
      <AuthFrame title="Choose a new password" testID="reset-screen">
        <FormError
          message="This page needs the link from your reset e-mail. Open the link from the message, or ask for a new one."
          testID="reset-missing-token"
        />
        <LinkRow>
          <TextLink href="/forgot-password" testID="reset-request-new">Ask for a reset link</TextLink>
        </LinkRow>
      </AuthFrame>
    );
  }

  if (done) {
    return (
      <AuthFrame title="Password changed" testID="reset-done">
        <Card>
          <AppText variant="lead">Your new password is set.</AppText>
          <AppText tone="soft">
            For safety every device that was signed in has been signed out. Sign in again with the new password.
          </AppText>
        </Card>
        <LinkRow>
          <TextLink href="/sign-in" testID="reset-done-sign-in">Sign in</TextLink>
        </LinkRow>
      </AuthFrame>
    );
  }

  return (
    <AuthFrame title="Choose a new password" intro={PASSWORD_RULES} testID="reset-screen">
      <View style={styles.form}>
        <NewPasswordFields control={control} name="password" confirmName="confirmPassword" onSubmitEditing={() => void submit()} testID="reset-password" />
        <FormError message={formError?.message} testID="reset-form-error">
          {formError?.linkSpent ? <TextLink href="/forgot-password" testID="reset-request-new">Ask for a new link</TextLink> : null}
        </FormError>
        <Button
          label={confirm.isPending ? 'Saving…' : 'Set the new password'}
          accessibilityLabel="Set the new password"
          onPress={() => void submit()}
          disabled={confirm.isPending}
          testID="reset-submit"
        />
      </View>
    </AuthFrame>
  );
}

const styles = StyleSheet.create({ form: { gap: spacing.lg } });
