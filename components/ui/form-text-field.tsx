import { Controller, type Control, type FieldPathByValue, type FieldValues } from 'react-hook-form';
import { TextField, type TextFieldProps } from './text-field';

export type FormTextFieldProps<T extends FieldValues> = Omit<TextFieldProps, 'value' | 'onChangeText' | 'onBlur' | 'error'> & {
  control: Control<T>;
  /** A field holding text (typed, so a number or list field cannot be bound by mistake). */
  name: FieldPathByValue<T, string>;
};

/**
 * A TextField bound to a react-hook-form field: value, change, blur, focus-on-error and the field's
 * problem (from the shared zod schema or from the server via setError) in one place.
 */
export function FormTextField<T extends FieldValues>({ control, name, ...props }: FormTextFieldProps<T>) {
  return (
    <Controller
      control={control}
      name={name}
      render={({ field, fieldState }) => (
        <TextField
          {...props}
          ref={field.ref}
          value={typeof field.value === 'string' ? field.value : ''}
          onChangeText={field.onChange}
          onBlur={field.onBlur}
          error={fieldState.error?.message}
        />
      )}
    />
  );
}
