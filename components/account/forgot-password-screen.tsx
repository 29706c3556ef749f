import { zodResolver } from '@hookform/resolvers/zod';
import { useState } from 'react';
import { useForm } from 'react-hook-form';
import { StyleSheet, View } from 'react-native';
import { usePasswordResetRequestMutation } from '@/lib/api/auth';
import { passwordResetRequestInputSchema } from '@/lib/schemas/auth';
import { Button } from '@/components/ui/button';
import { Card } from '@/components/ui/card';
import { FormError } from '@/components/ui/form-error';
import { AppText } from '@/components/ui/text';
import { FormTextField } from '@/components/ui/form-text-field';
import { spacing } from '@/components/ui/theme';
import { AuthFrame, DevOutboxLink, LinkRow, TextLink } from './auth-frame';
import { applyServerErrors } from './form-errors';

/**
 * Asks for a reset link. The confirmation reads the same whether or not the address has an account, so
 * the page tells nobody who is registered.
 */
export function ForgotPasswordScreen() {
  const request = usePasswordResetRequestMutation();
  const [sentTo, setSentTo] = useState<string | null>(null);
  const [formError, setFormError] = useState<string | null>(null);
  const { control, handleSubmit, setError } = useForm({
    resolver: zodResolver(passwordResetRequestInputSchema),
    defaultValues: { email: '' },
  });

  const submit = handleSubmit(async (values) => {
    setFormError(null);
    try {
      await request.mutateAsync(values);
      setSentTo(values.email);
    } catch (error) {
      setFormError(applyServerErrors(error, setError, ['email']));
    }
  });

  if (sentTo) {
    return (
      <AuthFrame title="Look in your inbox" testID="forgot-done">
        <Card>
          <AppText variant="lead">
            If <AppText variant="lead" style={styles.strong}>{sentTo}</AppText> belongs to a Sphereline account, a link
            to choose a new password is on its way.
          </AppText>
          <AppText tone="soft">
            The link works once and only for a short while. Nothing after a few minutes? Check the spam folder, or the
            spelling of the address, and ask again.
          </AppText>
        </Card>
        <DevOutboxLink email={sentTo} />
        <LinkRow>
          <TextLink href="/sign-in" testID="forgot-done-sign-in">Back to sign in</TextLink>
        </LinkRow>
      </AuthFrame>
    );
  }

  return (
    <AuthFrame
      title="Forgot your password?"
      intro="Give the address you sign in with and we will e-mail a link to choose a new password."
      testID="forgot-screen"
    >
      <View style={styles.form}>
        <FormTextField
          control={control}
          name="email"
          label="E-mail address"
          onSubmitEditing={() => void submit()}
          keyboardType="email-address"
          autoComplete="email"
          testID="forgot-email"
        />
        <FormError message={formError} testID="forgot-form-error" />
        <Button
          label={request.isPending ? 'Sending…' : 'Send the link'}
          accessibilityLabel="Send the link"
          onPress={() => void submit()}
          disabled={request.isPending}
          testID="forgot-submit"
        />
        <LinkRow>
          <TextLink href="/sign-in" testID="forgot-to-sign-in">Remembered it? Sign in</TextLink>
        </LinkRow>
      </View>
    </AuthFrame>
  );
}

const styles = StyleSheet.create({
  form: { gap: spacing.lg },
  strong: { fontWeight: '600' },
});
