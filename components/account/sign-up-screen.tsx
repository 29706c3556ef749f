import { zodResolver } from '@hookform/resolvers/zod';
import { useState } from 'react';
import { useForm } from 'react-hook-form';
import { StyleSheet, View } from 'react-native';
import { useSignUpMutation } from '@/lib/api/auth';
import { PASSWORD_MIN_LENGTH, signUpInputSchema } from '@/lib/schemas/auth';
import { Button } from '@/components/ui/button';
import { Card } from '@/components/ui/card';
import { FormError } from '@/components/ui/form-error';
import { AppText } from '@/components/ui/text';
import { FormTextField } from '@/components/ui/form-text-field';
import { spacing } from '@/components/ui/theme';
import { AuthFrame, DevOutboxLink, LinkRow, TextLink } from './auth-frame';
import { applyServerErrors, safeNextPath } from './form-errors';

const fieldNames = ['displayName', 'email', 'password'] as const;

export const PASSWORD_RULES =
  `At least ${PASSWORD_MIN_LENGTH} characters. Not a commonly used password, not your e-mail address, ` +
  'not the name of this site. A few unrelated words make a strong one.';

/** Create an account; the address must be confirmed from an e-mailed link before the first sign-in. */
export function SignUpScreen({ email: invitedEmail = '', next }: { email?: string; next?: string }) {
  const signUp = useSignUpMutation();
  const [sentTo, setSentTo] = useState<string | null>(null);
  const [formError, setFormError] = useState<string | null>(null);
  const { control, handleSubmit, setError } = useForm({
    resolver: zodResolver(signUpInputSchema),
    defaultValues: { displayName: '', email: invitedEmail, password: '' },
  });

  const signInHref = (email: string) => {
    const params = new URLSearchParams({ email });
    if (next) params.set('next', safeNextPath(next));
    return `/sign-in?${params.toString()}`;
  };

  const submit = handleSubmit(async (values) => {
    setFormError(null);
    try {
      await signUp.mutateAsync(values);
      setSentTo(values.email);
    } catch (error) {
      setFormError(applyServerErrors(error, setError, fieldNames));
    }
  });

  if (sentTo) {
    return (
      <AuthFrame title="Check your e-mail" testID="sign-up-done">
        <Card>
          <AppText variant="lead">
            We have sent a confirmation link to <AppText variant="lead" style={styles.strong}>{sentTo}</AppText>.
          </AppText>
          <AppText tone="soft">
            Open it to confirm the address, then sign in. The link works once and expires after a while; if it
            has, signing in with your password sends a fresh one. Nothing arrived? Check the spam folder.
          </AppText>
        </Card>
        <DevOutboxLink email={sentTo} />
        <LinkRow>
          <TextLink href={signInHref(sentTo)} testID="sign-up-done-sign-in">Confirmed? Sign in</TextLink>
        </LinkRow>
      </AuthFrame>
    );
  }

  return (
    <AuthFrame
      title="Create an account"
      intro="An account lets you join your group, read its library and, with the right role, add to it and review it."
      testID="sign-up-screen"
    >
      <View style={styles.form}>
        <FormTextField
          control={control}
          name="displayName"
          label="Display name"
          hint="How your group sees you, e.g. “A. Werner”."
          autoCapitalize="words"
          autoComplete="name"
          testID="sign-up-display-name"
        />
        <FormTextField
          control={control}
          name="email"
          label="E-mail address"
          keyboardType="email-address"
          autoComplete="email"
          testID="sign-up-email"
        />
        <FormTextField
          control={control}
          name="password"
          label="Password"
          hint={PASSWORD_RULES}
          onSubmitEditing={() => void submit()}
          secureTextEntry
          autoComplete="new-password"
          textContentType="newPassword"
          testID="sign-up-password"
        />
        <FormError message={formError} testID="sign-up-form-error" />
        <Button
          label={signUp.isPending ? 'Creating your account…' : 'Create account'}
          accessibilityLabel="Create account"
          onPress={() => void submit()}
          disabled={signUp.isPending}
          testID="sign-up-submit"
        />
        <LinkRow>
          <TextLink href={invitedEmail ? signInHref(invitedEmail) : next ? `/sign-in?next=${encodeURIComponent(safeNextPath(next))}` : '/sign-in'} testID="sign-up-to-sign-in">
            Already have an account? Sign in
          </TextLink>
        </LinkRow>
      </View>
    </AuthFrame>
  );
}

const styles = StyleSheet.create({
  form: { gap: spacing.lg },
  strong: { fontWeight: '600' },
});
