/**
 * "Choose a new password", opened from the mailed link (?token=...). On success every earlier session of the
 * account has ended, so the page sends the person to sign in with the new password.
 */
import { zodResolver } from '@hookform/resolvers/zod';
import { Link } from 'expo-router';
import { useState } from 'react';
import { useForm } from 'react-hook-form';
import { StyleSheet, View } from 'react-native';
import { z } from 'zod';
import { passwordField } from '../../db/validation';
import { linkTokenField } from '../../db/validation-crew';
import { applyServerErrors } from '../../hooks/form-errors';
import { useConfirmPasswordReset } from '../../hooks/use-password-reset';
import { AuthFrame } from '../auth/auth-frame';
import { Button } from '../ui/button';
import { FormTextField } from '../ui/form-text-field';
import { Notice } from '../ui/notice';
import { Text } from '../ui/text';
import { palette, space } from '../ui/theme';

/** The new password twice, so a typing slip does not lock the person out. */
const newPasswordForm = z
  .object({ password: passwordField, repeat: z.string() })
  .refine((f) => f.password === f.repeat, { message: 'The two passwords differ', path: ['repeat'] });

/** Renders the form for link token `token` (null when the address had none). */
export function ResetPasswordScreen({ token }: { token: string | null }) {
  const confirm = useConfirmPasswordReset();
  const [formError, setFormError] = useState<string | null>(null);
  const { control, handleSubmit, setError } = useForm({ resolver: zodResolver(newPasswordForm), defaultValues: { password: '', repeat: '' } });
  const tokenProblem = token === null ? 'This page needs the link from the reset e-mail; open the link from the mail again.' : linkTokenField.safeParse(token).error?.issues[0]?.message;
  const submit = handleSubmit(({ password }) => {
    if (token === null) return;
    setFormError(null);
    confirm.mutate({ token, password }, { onError: (e) => setFormError(applyServerErrors(e, ['password'], setError)) });
  });

  return (
    <AuthFrame title="Choose a new password">
      {confirm.data ? (
        <Notice tone="note" title="Password changed">
          {`The password of ${confirm.data.email} is set. You were signed out everywhere; sign in with the new password.`}
        </Notice>
      ) : tokenProblem ? (
        <Notice tone="error">{tokenProblem}</Notice>
      ) : (
        <>
          <FormTextField control={control} name="password" label="New password" hint="At least 10 characters." autoComplete="new-password" secureTextEntry onSubmitEditing={submit} />
          <FormTextField control={control} name="repeat" label="New password again" autoComplete="new-password" secureTextEntry onSubmitEditing={submit} />
          {formError ? <Notice tone="error">{formError}</Notice> : null}
          <Button label="Set new password" onPress={submit} busy={confirm.isPending} />
          <Text variant="small" style={styles.after}>
            Setting a new password signs this account out on every device.
          </Text>
        </>
      )}
      <View style={styles.switch}>
        <Link href="/sign-in" style={styles.link}>
          Go to sign in
        </Link>
        {formError ? (
          <Link href="/forgot-password" style={styles.link}>
            Ask for a new link
          </Link>
        ) : null}
      </View>
    </AuthFrame>
  );
}

const styles = StyleSheet.create({
  after: { marginTop: space.md },
  switch: { flexDirection: 'row', flexWrap: 'wrap', gap: space.lg, marginTop: space.xl, alignItems: 'center' },
  link: { color: palette.emberDeep, fontSize: 14, textDecorationLine: 'underline' },
});
