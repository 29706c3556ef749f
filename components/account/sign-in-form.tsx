import { zodResolver } from '@hookform/resolvers/zod';
import { useForm } from 'react-hook-form';
import { useState, type ReactNode } from 'react';
import { StyleSheet, View } from 'react-native';
import { ApiError } from '@/lib/api/api-client';
import { useSignInMutation } from '@/lib/api/auth';
import { signInInputSchema, type MeResponse } from '@/lib/schemas/auth';
import { Button } from '@/components/ui/button';
import { FormError } from '@/components/ui/form-error';
import { FormTextField } from '@/components/ui/form-text-field';
import { spacing } from '@/components/ui/theme';
import { DevOutboxLink } from './auth-frame';
import { DemoLabPanel } from './demo-lab-panel';
import { applyServerErrors, describeError, SIGN_IN_REFUSED } from './form-errors';

const fieldNames = ['email', 'password'] as const;

function describeSignInError(error: unknown): string {
  // One answer for an unknown address and a wrong password alike: nothing to learn about who has an account.
  if (error instanceof ApiError && error.code === 'UNAUTHENTICATED') return SIGN_IN_REFUSED;
  return describeError(error);
}

/** E-mail and password; on success hands the signed-in person to the caller (who decides where to go). */
export function SignInForm({ initialEmail = '', onSignedIn, showDemoLab = true, footer }: {
  initialEmail?: string;
  /** Links shown between the submit button and the demo panel. */
  footer?: ReactNode;
  onSignedIn: (me: MeResponse) => void;
  showDemoLab?: boolean;
}) {
  const signIn = useSignInMutation();
  const [formError, setFormError] = useState<{ message: string; unverified: boolean } | null>(null);
  const { control, handleSubmit, setError, setValue, clearErrors } = useForm({
    resolver: zodResolver(signInInputSchema),
    defaultValues: { email: initialEmail, password: '' },
  });

  const submit = handleSubmit(async (values) => {
    setFormError(null);
    try {
      const me = await signIn.mutateAsync(values);
      onSignedIn(me);
    } catch (error) {
      const message = applyServerErrors(error, setError, fieldNames, describeSignInError);
      // A right password on an unconfirmed address: the server has sent a fresh link.
      const unverified = error instanceof ApiError && error.code === 'FORBIDDEN';
      if (message) setFormError({ message, unverified });
    }
  });

  const fillDemo = (email: string, password: string) => {
    setValue('email', email);
    setValue('password', password);
    clearErrors();
    setFormError(null);
  };

  return (
    <View style={styles.form}>
      <FormTextField
        control={control}
        name="email"
        label="E-mail address"
        keyboardType="email-address"
        autoComplete="email"
        textContentType="emailAddress"
        testID="sign-in-email"
      />
      <FormTextField
        control={control}
        name="password"
        label="Password"
        onSubmitEditing={() => void submit()}
        secureTextEntry
        autoComplete="current-password"
        textContentType="password"
        testID="sign-in-password"
      />
      <FormError message={formError?.message} testID="sign-in-form-error">
        {formError?.unverified ? <DevOutboxLink /> : null}
      </FormError>
      <Button
        label={signIn.isPending ? 'Signing in…' : 'Sign in'}
        accessibilityLabel="Sign in"
        onPress={() => void submit()}
        disabled={signIn.isPending}
        testID="sign-in-submit"
      />
      {footer}
      {showDemoLab ? <DemoLabPanel onPick={fillDemo} /> : null}
    </View>
  );
}

const styles = StyleSheet.create({ form: { gap: spacing.lg } });
