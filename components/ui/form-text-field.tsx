/**
 * A TextField wired to a react-hook-form field.
 */
import { Controller, type Control, type FieldValues, type Path } from 'react-hook-form';
import { TextField, type TextFieldProps } from './text-field';

/**
 * Renders a TextField bound to field `name` of the form's `control`, showing that field's error (from the zod
 * resolver or from the server) under it. Other props go to the TextField.
 */
export function FormTextField<T extends FieldValues>({
  control,
  name,
  ...field
}: Omit<TextFieldProps, 'value' | 'onChangeText' | 'onBlur' | 'error'> & { control: Control<T>; name: Path<T> }) {
  return (
    <Controller
      control={control}
      name={name}
      render={({ field: { value, onChange, onBlur, ref }, fieldState: { error } }) => (
        <TextField
          {...field}
          ref={ref}
          value={typeof value === 'string' ? value : ''}
          onChangeText={onChange}
          onBlur={onBlur}
          error={error?.message}
        />
      )}
    />
  );
}

/**
 * Input settings for an e-mail address, spread into a (Form)TextField: the e-mail keyboard, no capitals,
 * corrections or spell check, filled in by the browser as an e-mail.
 */
export const EMAIL_ENTRY = {
  autoComplete: 'email',
  keyboardType: 'email-address',
  autoCapitalize: 'none',
  inputMode: 'email',
  autoCorrect: false,
  spellCheck: false,
} as const;
