import { zodResolver } from '@hookform/resolvers/zod';
import { useState } from 'react';
import { Controller, useForm } from 'react-hook-form';
import { StyleSheet, View } from 'react-native';
import { useUpdateMeMutation } from '@/lib/api/auth';
import { updateMeInputSchema, type UserDto } from '@/lib/schemas/auth';
import { Button } from '@/components/ui/button';
import { Card } from '@/components/ui/card';
import { FormError } from '@/components/ui/form-error';
import { AppText } from '@/components/ui/text';
import { useToast } from '@/components/ui/toast';
import { TextField } from '@/components/ui/text-field';
import { spacing } from '@/components/ui/theme';
import { applyServerErrors } from './form-errors';

/** Who you are to your group: the display name can change, the sign-in address cannot (here). */
export function ProfileCard({ user }: { user: UserDto }) {
  const update = useUpdateMeMutation();
  const toast = useToast();
  const [saved, setSaved] = useState(false);
  const [formError, setFormError] = useState<string | null>(null);
  const { control, handleSubmit, setError, reset, formState: { errors, isDirty } } = useForm({
    resolver: zodResolver(updateMeInputSchema),
    values: { displayName: user.displayName },
  });

  const submit = handleSubmit(async (values) => {
    setFormError(null);
    setSaved(false);
    try {
      const me = await update.mutateAsync(values);
      reset({ displayName: me.user.displayName });
      setSaved(true);
      toast('Saved: your display name.');
    } catch (error) {
      setFormError(applyServerErrors(error, setError, ['displayName']));
    }
  });

  return (
    <Card title="Profile" testID="profile-card">
      <View style={styles.form}>
        <View style={styles.readOnly}>
          <AppText variant="caption" tone="muted">Signs in as</AppText>
          <AppText testID="profile-email">{user.email}</AppText>
        </View>
        <Controller
          control={control}
          name="displayName"
          render={({ field }) => (
            <TextField
              ref={field.ref}
              label="Display name"
              hint="Shown to your groups beside your contributions and reviews."
              value={field.value}
              onChangeText={(text) => {
                setSaved(false);
                field.onChange(text);
              }}
              onBlur={field.onBlur}
              onSubmitEditing={() => void submit()}
              error={errors.displayName?.message}
              autoCapitalize="words"
              autoComplete="name"
              testID="profile-display-name"
            />
          )}
        />
        <FormError message={formError} testID="profile-error" />
        <FormError message={saved ? 'Display name saved.' : null} tone="done" testID="profile-saved" />
        <View style={styles.action}>
          <Button
            label={update.isPending ? 'Saving…' : 'Save name'}
            onPress={() => void submit()}
            disabled={update.isPending || !isDirty}
            testID="profile-save"
          />
        </View>
      </View>
    </Card>
  );
}

const styles = StyleSheet.create({
  form: { gap: spacing.md },
  readOnly: { gap: 2 },
  action: { alignSelf: 'flex-start' },
});
