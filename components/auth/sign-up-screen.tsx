/**
 * The sign-up form.
 */
import { zodResolver } from '@hookform/resolvers/zod';
import { Link } from 'expo-router';
import { useState } from 'react';
import { useForm } from 'react-hook-form';
import { StyleSheet, View } from 'react-native';
import { signUpBody } from '../../db/validation';
import { applyServerErrors } from '../../hooks/form-errors';
import { useSignUp } from '../../hooks/use-auth';
import { Button } from '../ui/button';
import { EMAIL_ENTRY, FormTextField } from '../ui/form-text-field';
import { Notice } from '../ui/notice';
import { Text } from '../ui/text';
import { palette, space } from '../ui/theme';
import { AuthFrame } from './auth-frame';

/**
 * Creates an account (name, e-mail, password) checked by the same schema as the server (signUpBody). A taken
 * e-mail comes back from the server as a field error under the e-mail. The new account gets its own shop with
 * its owner role; the auth layout then moves on to the builds list.
 */
export function SignUpScreen() {
  const signUp = useSignUp();
  const [formError, setFormError] = useState<string | null>(null);
  const { control, handleSubmit, setError } = useForm({
    resolver: zodResolver(signUpBody),
    defaultValues: { name: '', email: '', password: '' },
  });
  const submit = handleSubmit((body) => {
    setFormError(null);
    signUp.mutate(body, { onError: (e) => setFormError(applyServerErrors(e, ['name', 'email', 'password'], setError)) });
  });

  return (
    <AuthFrame title="Create your account">
      <FormTextField control={control} name="name" label="Your name" autoComplete="name" onSubmitEditing={submit} />
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
        hint="At least 10 characters."
        autoComplete="new-password"
        secureTextEntry
        onSubmitEditing={submit}
      />
      {formError ? <Notice tone="error">{formError}</Notice> : null}
      <Button label="Create account" onPress={submit} busy={signUp.isPending} />
      <Text variant="small" style={styles.after}>
        Signing up opens a shop of your own, with you as its owner, ready for your first build.
      </Text>
      <View style={styles.switch}>
        <Text variant="small">Already have an account?</Text>
        <Link href="/sign-in" style={styles.link}>
          Sign in
        </Link>
      </View>
    </AuthFrame>
  );
}

const styles = StyleSheet.create({
  after: { marginTop: space.md },
  switch: { flexDirection: 'row', flexWrap: 'wrap', gap: space.xs, marginTop: space.xl, alignItems: 'center' },
  link: { color: palette.emberDeep, fontSize: 14, textDecorationLine: 'underline' },
});
