/**
 * "Forgot password": asks for the account's e-mail and sends a reset link. The answer is the same whether or
 * not the address has an account, so the page cannot be used to find out who is registered.
 */
import { zodResolver } from '@hookform/resolvers/zod';
import { Link } from 'expo-router';
import { useState } from 'react';
import { useForm } from 'react-hook-form';
import { StyleSheet, View } from 'react-native';
import { passwordResetRequestBody } from '../../db/validation-crew';
import { applyServerErrors } from '../../hooks/form-errors';
import { useRequestPasswordReset } from '../../hooks/use-password-reset';
import { AuthFrame } from '../auth/auth-frame';
import { Button } from '../ui/button';
import { EMAIL_ENTRY, FormTextField } from '../ui/form-text-field';
import { Notice } from '../ui/notice';
import { Text } from '../ui/text';
import { palette, space } from '../ui/theme';

/** The form; after sending it shows the server's answer and a way back to sign-in. */
export function ForgotPasswordScreen() {
  const request = useRequestPasswordReset();
  const [formError, setFormError] = useState<string | null>(null);
  const { control, handleSubmit, setError } = useForm({ resolver: zodResolver(passwordResetRequestBody), defaultValues: { email: '' } });
  const submit = handleSubmit((body) => {
    setFormError(null);
    request.mutate(body, { onError: (e) => setFormError(applyServerErrors(e, ['email'], setError)) });
  });

  return (
    <AuthFrame title="Forgot your password?">
      {request.data ? (
        <Notice tone="note" title="Check your inbox">
          {request.data.message}
        </Notice>
      ) : (
        <>
          <Text style={styles.intro}>Enter the e-mail address of your account. We will send a link to choose a new password.</Text>
          <FormTextField
            control={control}
            name="email"
            label="E-mail"
            {...EMAIL_ENTRY}
            onSubmitEditing={submit}
          />
          {formError ? <Notice tone="error">{formError}</Notice> : null}
          <Button label="Send reset link" onPress={submit} busy={request.isPending} />
        </>
      )}
      <View style={styles.switch}>
        <Link href="/sign-in" style={styles.link}>
          Back to sign in
        </Link>
      </View>
    </AuthFrame>
  );
}

const styles = StyleSheet.create({
  intro: { marginBottom: space.lg },
  switch: { flexDirection: 'row', flexWrap: 'wrap', gap: space.xs, marginTop: space.xl, alignItems: 'center' },
  link: { color: palette.emberDeep, fontSize: 14, textDecorationLine: 'underline' },
});
