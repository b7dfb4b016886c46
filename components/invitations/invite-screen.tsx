/**
 * The page an invitation link opens (/invite/<token>): which shop, which role, who invited; then, for a visitor,
 * sign in or sign up with the invited e-mail (prefilled) and the invitation is accepted at once; for someone
 * already signed in with that e-mail, one button. The shop then becomes the current shop and its builds open.
 */
import { zodResolver } from '@hookform/resolvers/zod';
import { useRouter } from 'expo-router';
import { useState } from 'react';
import { useForm } from 'react-hook-form';
import { StyleSheet, View } from 'react-native';
import { signInBody, signUpBody } from '../../db/validation';
import { applyServerErrors } from '../../hooks/form-errors';
import { roleLabels } from '../../hooks/role-permissions';
import { writeShopChoice } from '../../hooks/shop-choice';
import { useSignIn, useSignOut, useSignUp } from '../../hooks/use-auth';
import { useAcceptInvitation, useInvitationPreview, type InvitationPreview } from '../../hooks/use-invitations';
import { useMe } from '../../hooks/use-me';
import { AuthFrame } from '../auth/auth-frame';
import { Button } from '../ui/button';
import { EMAIL_ENTRY, FormTextField } from '../ui/form-text-field';
import { Loading } from '../ui/loading';
import { Notice } from '../ui/notice';
import { Text } from '../ui/text';
import { palette, space } from '../ui/theme';

const ROLE_DOES: Record<InvitationPreview['role'], string> = {
  owner: 'run the shop with its owners',
  editor: 'work on builds at the bench: tick off pieces, read bevels, leave notes',
  viewer: 'follow builds: the 3D preview and the progress',
};

function Summary({ invitation }: { invitation: InvitationPreview }) {
  return (
    <View style={styles.summary}>
      <Text variant="overline">Invitation</Text>
      <Text>
        {`${invitation.invitedByName ?? 'The shop owner'} invites ${invitation.email} as ${roleLabels[invitation.role].name.toLowerCase()}, to ${ROLE_DOES[invitation.role]}.`}
      </Text>
      <Text variant="small">{`The link works until ${new Date(invitation.expiresAt).toLocaleString()}.`}</Text>
    </View>
  );
}

const STATUS_TEXT: Record<'accepted' | 'expired' | 'revoked', string> = {
  accepted: 'This invitation was already accepted; each link works once. Sign in to reach the shop.',
  expired: 'This invitation has expired. Ask the shop owner to send it again.',
  revoked: 'The shop owner withdrew this invitation. Ask them for a new one if you still need access.',
};

/** Renders the invite page for link token `token`. */
export function InviteScreen({ token }: { token: string }) {
  const router = useRouter();
  const preview = useInvitationPreview(token);
  const me = useMe();
  const accept = useAcceptInvitation(token);
  const signOut = useSignOut();
  const [acceptError, setAcceptError] = useState<string | null>(null);

  const acceptNow = () => {
    setAcceptError(null);
    accept.mutate(undefined, {
      onSuccess: (accepted) => {
        writeShopChoice(accepted.shopId);
        router.replace('/builds');
      },
      onError: (e) => setAcceptError(e.message),
    });
  };

  if (preview.isPending || me.isPending) return <Loading label="Opening the invitation" />;
  if (preview.error) {
    return (
      <AuthFrame title="Invitation">
        <Notice tone="error">{preview.error.message}</Notice>
      </AuthFrame>
    );
  }
  const invitation = preview.data;
  const signedIn = me.data ?? null;
  const title = `Join ${invitation.shopName}`;

  if (invitation.status !== 'pending') {
    return (
      <AuthFrame title={title}>
        <Summary invitation={invitation} />
        <Notice tone="caution">{STATUS_TEXT[invitation.status]}</Notice>
        <Button label="Go to sign in" tone="secondary" onPress={() => router.replace(signedIn ? '/builds' : '/sign-in')} />
      </AuthFrame>
    );
  }

  return (
    <AuthFrame title={title}>
      <Summary invitation={invitation} />
      {acceptError ? <Notice tone="error">{acceptError}</Notice> : null}
      {signedIn && signedIn.user.email === invitation.email ? (
        <Button label="Accept and open the shop" onPress={acceptNow} busy={accept.isPending} />
      ) : signedIn ? (
        <>
          <Notice tone="caution">
            {`You are signed in as ${signedIn.user.email}, but this invitation is for ${invitation.email}. Sign out, then sign in or sign up with ${invitation.email}.`}
          </Notice>
          <Button label="Sign out" tone="secondary" onPress={() => signOut.mutate()} busy={signOut.isPending} />
        </>
      ) : (
        <JoinForms invitation={invitation} onSignedIn={acceptNow} busyAccepting={accept.isPending} />
      )}
    </AuthFrame>
  );
}

/** Sign-in or sign-up with the invited address; `onSignedIn` runs once the session exists. */
function JoinForms({ invitation, onSignedIn, busyAccepting }: { invitation: InvitationPreview; onSignedIn: () => void; busyAccepting: boolean }) {
  const [mode, setMode] = useState<'signin' | 'signup'>(invitation.hasAccount ? 'signin' : 'signup');
  return (
    <View style={styles.forms}>
      {mode === 'signin' ? <InviteSignIn email={invitation.email} onDone={onSignedIn} busyAccepting={busyAccepting} /> : <InviteSignUp email={invitation.email} onDone={onSignedIn} busyAccepting={busyAccepting} />}
      <View style={styles.switch}>
        <Text variant="small">{mode === 'signin' ? 'No account with this address yet?' : 'Already have an account with this address?'}</Text>
        <Button compact tone="quiet" label={mode === 'signin' ? 'Create an account' : 'Sign in instead'} onPress={() => setMode(mode === 'signin' ? 'signup' : 'signin')} />
      </View>
    </View>
  );
}

function InviteSignIn({ email, onDone, busyAccepting }: { email: string; onDone: () => void; busyAccepting: boolean }) {
  const signIn = useSignIn();
  const [formError, setFormError] = useState<string | null>(null);
  const { control, handleSubmit, setError } = useForm({ resolver: zodResolver(signInBody), defaultValues: { email, password: '' } });
  const submit = handleSubmit((body) => {
    setFormError(null);
    signIn.mutate(body, { onSuccess: onDone, onError: (e) => setFormError(applyServerErrors(e, ['email', 'password'], setError)) });
  });
  return (
    <>
      <Text variant="bodyStrong" style={styles.formTitle}>Sign in to accept</Text>
      <FormTextField control={control} name="email" label="E-mail" {...EMAIL_ENTRY} onSubmitEditing={submit} />
      <FormTextField control={control} name="password" label="Password" autoComplete="current-password" secureTextEntry onSubmitEditing={submit} />
      {formError ? <Notice tone="error">{formError}</Notice> : null}
      <Button label="Sign in and accept" onPress={submit} busy={signIn.isPending || busyAccepting} />
    </>
  );
}

function InviteSignUp({ email, onDone, busyAccepting }: { email: string; onDone: () => void; busyAccepting: boolean }) {
  const signUp = useSignUp();
  const [formError, setFormError] = useState<string | null>(null);
  const { control, handleSubmit, setError } = useForm({ resolver: zodResolver(signUpBody), defaultValues: { name: '', email, password: '' } });
  const submit = handleSubmit((body) => {
    setFormError(null);
    signUp.mutate(body, { onSuccess: onDone, onError: (e) => setFormError(applyServerErrors(e, ['name', 'email', 'password'], setError)) });
  });
  return (
    <>
      <Text variant="bodyStrong" style={styles.formTitle}>Create your account to accept</Text>
      <FormTextField control={control} name="name" label="Your name" autoComplete="name" onSubmitEditing={submit} />
      <FormTextField control={control} name="email" label="E-mail" {...EMAIL_ENTRY} onSubmitEditing={submit} />
      <FormTextField control={control} name="password" label="Password" hint="At least 10 characters." autoComplete="new-password" secureTextEntry onSubmitEditing={submit} />
      {formError ? <Notice tone="error">{formError}</Notice> : null}
      <Button label="Create account and accept" onPress={submit} busy={signUp.isPending || busyAccepting} />
    </>
  );
}

const styles = StyleSheet.create({
  summary: { gap: space.xs, marginBottom: space.xl, paddingBottom: space.lg, borderBottomWidth: 1, borderBottomColor: palette.rule },
  forms: { gap: space.xs },
  formTitle: { marginBottom: space.md },
  switch: { flexDirection: 'row', flexWrap: 'wrap', gap: space.xs, marginTop: space.lg, alignItems: 'center' },
});
