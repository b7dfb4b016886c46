/**
 * The owner's form to invite someone by e-mail as crew or client, checked by the same schema as the server
 * (invitationCreateBody). After sending it says whether the mail went out.
 */
import { zodResolver } from '@hookform/resolvers/zod';
import { useState } from 'react';
import { Controller, useForm } from 'react-hook-form';
import { StyleSheet, View } from 'react-native';
import { INVITE_ROLES, invitationCreateBody } from '../../db/validation-crew';
import { applyServerErrors } from '../../hooks/form-errors';
import { useCreateInvitation } from '../../hooks/use-invitations';
import { RoleChoice } from '../members/role-choice';
import { Button } from '../ui/button';
import { EMAIL_ENTRY, FormTextField } from '../ui/form-text-field';
import { Notice } from '../ui/notice';
import { Text } from '../ui/text';
import { space } from '../ui/theme';

/** Renders the invite form for shop `shopId`. */
export function InviteForm({ shopId }: { shopId: string }) {
  const create = useCreateInvitation(shopId);
  const [formError, setFormError] = useState<string | null>(null);
  const [outcome, setOutcome] = useState<{ tone: 'note' | 'caution'; text: string } | null>(null);
  const { control, handleSubmit, setError, reset } = useForm({
    resolver: zodResolver(invitationCreateBody),
    defaultValues: { email: '', role: 'editor' as (typeof INVITE_ROLES)[number] },
  });
  const submit = handleSubmit((body) => {
    setFormError(null);
    setOutcome(null);
    create.mutate(body, {
      onSuccess: ({ invitation, mail }) => {
        setOutcome(
          mail.sent
            ? { tone: 'note', text: `Invitation sent to ${invitation.email}. The link works for 7 days.` }
            : { tone: 'caution', text: mail.message ?? `The invitation to ${invitation.email} is saved but its e-mail did not go out; use Resend below.` },
        );
        reset({ email: '', role: body.role });
      },
      onError: (e) => setFormError(applyServerErrors(e, ['email', 'role'], setError)),
    });
  });

  return (
    <View style={styles.form}>
      <Text variant="heading" heading={3}>
        Invite someone
      </Text>
      <FormTextField control={control} name="email" label="E-mail to invite" {...EMAIL_ENTRY} autoComplete="off" onSubmitEditing={submit} />
      <Text variant="label">As</Text>
      <Controller
        control={control}
        name="role"
        render={({ field }) => <RoleChoice label="Role to invite as" roles={INVITE_ROLES} value={field.value} onChange={(r) => field.onChange(r)} />}
      />
      <Text variant="small" style={styles.hint}>
        Crew work on builds at the bench; a client follows builds and sees print sets only if you allow it.
      </Text>
      {formError ? <Notice tone="error">{formError}</Notice> : null}
      {outcome ? <Notice tone={outcome.tone}>{outcome.text}</Notice> : null}
      <Button label="Send invitation" onPress={submit} busy={create.isPending} />
    </View>
  );
}

const styles = StyleSheet.create({
  form: { gap: space.xs },
  hint: { marginTop: space.xs, marginBottom: space.md },
});
