/**
 * The sign-in form.
 */
import { zodResolver } from '@hookform/resolvers/zod';
import { Link } from 'expo-router';
import { useState } from 'react';
import { useForm } from 'react-hook-form';
import { StyleSheet, View } from 'react-native';
import { signInBody } from '../../db/validation';
import { applyServerErrors } from '../../hooks/form-errors';
import { useSignIn } from '../../hooks/use-auth';
import { Button } from '../ui/button';
import { EMAIL_ENTRY, FormTextField } from '../ui/form-text-field';
import { Notice } from '../ui/notice';
import { Text } from '../ui/text';
import { palette, space } from '../ui/theme';
import { AuthFrame } from './auth-frame';

/**
 * Signs a person in with e-mail and password, checked by the same schema as the server (signInBody). Field
 * errors appear under the fields; the server's message for a wrong e-mail/password or too many attempts
 * appears above the button. On success the auth layout moves on to the builds list.
 */
export function SignInScreen() {
  const signIn = useSignIn();
  const [formError, setFormError] = useState<string | null>(null);
  const { control, handleSubmit, setError } = useForm({
    resolver: zodResolver(signInBody),
    defaultValues: { email: '', password: '' },
  });
  const submit = handleSubmit((body) => {
    setFormError(null);
    signIn.mutate(body, { onError: (e) => setFormError(applyServerErrors(e, ['email', 'password'], setError)) });
  });

  return (
    <AuthFrame title="Sign in">
      <FormTextField
        control={control}
        name="email"
        label="E-mail"
        {...EMAIL_ENTRY}
        onSubmitEditing={submit}
      />
      <FormTextField
        control={control}
        name="password"
        label="Password"
        autoComplete="current-password"
        secureTextEntry
        onSubmitEditing={submit}
      />
      {formError ? <Notice tone="error">{formError}</Notice> : null}
      <Button label="Sign in" onPress={submit} busy={signIn.isPending} />
      <Link href="/forgot-password" style={[styles.link, styles.forgot]}>
        Forgot your password?
      </Link>
      <View style={styles.switch}>
        <Text variant="small">New to Sheetsmith?</Text>
        <Link href="/sign-up" style={styles.link}>
          Create an account
        </Link>
      </View>
    </AuthFrame>
  );
}

const styles = StyleSheet.create({
  switch: { flexDirection: 'row', flexWrap: 'wrap', gap: space.xs, marginTop: space.xl, alignItems: 'center' },
  link: { color: palette.emberDeep, fontSize: 14, textDecorationLine: 'underline' },
  forgot: { marginTop: space.md, alignSelf: 'flex-start' },
});
