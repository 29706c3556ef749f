import { Controller, type Control, type FieldPathByValue, type FieldValues } from 'react-hook-form';
import { TextField, type TextFieldProps } from '@/components/ui/text-field';

/** A TextField bound to one text value of a react-hook-form form; its problem comes from the form. */
export function FormTextField<T extends FieldValues>({ control, name, ...field }: {
  control: Control<T>;
  name: FieldPathByValue<T, string>;
} & Omit<TextFieldProps, 'value' | 'onChangeText' | 'onBlur' | 'error'>) {
  return (
    <Controller
      control={control}
      name={name}
      render={({ field: bound, fieldState }) => (
        <TextField
          ref={bound.ref}
          {...field}
          value={typeof bound.value === 'string' ? bound.value : ''}
          onChangeText={bound.onChange}
          onBlur={bound.onBlur}
          error={fieldState.error?.message}
        />
      )}
    />
  );
}
