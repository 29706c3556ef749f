import { zodResolver } from '@hookform/resolvers/zod';
import { useState } from 'react';
import { useForm } from 'react-hook-form';
import { StyleSheet, View } from 'react-native';
import { useChangePasswordMutation } from '@/lib/api/auth';
import { changePasswordFormSchema, type ChangePasswordForm } from '@/lib/schemas/auth-forms';
import { Button } from '@/components/ui/button';
import { Card } from '@/components/ui/card';
import { FormError } from '@/components/ui/form-error';
import { FormTextField } from '@/components/ui/form-text-field';
import { spacing } from '@/components/ui/theme';
import { applyServerErrors } from './form-errors';
import { NewPasswordFields } from './new-password-fields';
import { PASSWORD_RULES } from './sign-up-screen';

const EMPTY: ChangePasswordForm = { currentPassword: '', newPassword: '', confirmPassword: '' };

/** A new password while signed in: the current one first; other devices are signed out afterwards. */
export function PasswordCard() {
  const change = useChangePasswordMutation();
  const [done, setDone] = useState<string | null>(null);
  const [formError, setFormError] = useState<string | null>(null);
  const { control, handleSubmit, setError, reset } = useForm<ChangePasswordForm>({
    resolver: zodResolver(changePasswordFormSchema),
    defaultValues: EMPTY,
  });

  const submit = handleSubmit(async ({ currentPassword, newPassword }) => {
    setFormError(null);
    setDone(null);
    try {
      const answer = await change.mutateAsync({ currentPassword, newPassword });
      reset(EMPTY);
      setDone(answer.message);
    } catch (error) {
      setFormError(applyServerErrors(error, setError, ['currentPassword', 'newPassword']));
    }
  });

  return (
    <Card title="Password" testID="password-card">
      <View style={styles.form}>
        <FormTextField
          control={control}
          name="currentPassword"
          label="Current password"
          secureTextEntry
          autoComplete="current-password"
          textContentType="password"
          testID="password-current"
        />
        <NewPasswordFields
          control={control}
          name="newPassword"
          confirmName="confirmPassword"
          hint={PASSWORD_RULES}
          onSubmitEditing={() => void submit()}
          testID="password-new"
        />
        <FormError message={formError} testID="password-error" />
        <FormError message={done} tone="done" testID="password-done" />
        <View style={styles.action}>
          <Button
            label={change.isPending ? 'Changing…' : 'Change password'}
            onPress={() => void submit()}
            disabled={change.isPending}
            testID="password-submit"
          />
        </View>
      </View>
    </Card>
  );
}

const styles = StyleSheet.create({
  form: { gap: spacing.md },
  action: { alignSelf: 'flex-start' },
});
