import type { Control, FieldPathByValue, FieldValues } from 'react-hook-form';
import { FormTextField } from '@/components/ui/form-text-field';

/**
 * The new password and the same again, as every form that sets one asks for it (reset by link,
 * change while signed in): the browser's password manager sees both as a new password.
 */
export function NewPasswordFields<T extends FieldValues>({ control, name, confirmName, hint, onSubmitEditing, testID }: {
  control: Control<T>;
  name: FieldPathByValue<T, string>;
  confirmName: FieldPathByValue<T, string>;
  hint?: string;
  /** Enter in the second field sends the form. */
  onSubmitEditing: () => void;
  /** The first field's test id; the second gets `${testID}-confirm`. */
  testID: string;
}) {
  return (
    <>
      <FormTextField
        control={control}
        name={name}
        label="New password"
        hint={hint}
        secureTextEntry
        autoComplete="new-password"
        textContentType="newPassword"
        testID={testID}
      />
      <FormTextField
        control={control}
        name={confirmName}
        label="New password, again"
        onSubmitEditing={onSubmitEditing}
        secureTextEntry
        autoComplete="new-password"
        textContentType="newPassword"
        testID={`${testID}-confirm`}
      />
    </>
  );
}
