/** The owner's list of invitations not yet accepted: who, as what, until when; resend or revoke each. */
import { useState } from 'react';
import { StyleSheet, View } from 'react-native';
import { roleLabels } from '../../hooks/role-permissions';
import { useInvitations, useResendInvitation, useRevokeInvitation, type Invitation } from '../../hooks/use-invitations';
import { Button } from '../ui/button';
import { Notice } from '../ui/notice';
import { Text } from '../ui/text';
import { palette, space } from '../ui/theme';

function InvitationRow({ shopId, invitation }: { shopId: string; invitation: Invitation }) {
  const resend = useResendInvitation(shopId);
  const revoke = useRevokeInvitation(shopId);
  const [message, setMessage] = useState<{ tone: 'note' | 'caution' | 'error'; text: string } | null>(null);
  const expired = invitation.status === 'expired';
  return (
    <View style={styles.row} role="listitem" accessibilityLabel={`Invitation to ${invitation.email}`}>
      <Text variant="bodyStrong">{invitation.email}</Text>
      <Text variant="small">
        {`${roleLabels[invitation.role].name} · ${expired ? 'expired' : 'waiting'} · ${expired ? 'ran out' : 'works until'} ${new Date(invitation.expiresAt).toLocaleDateString()}`}
      </Text>
      <View style={styles.buttons}>
        <Button
          compact
          tone="secondary"
          label="Resend"
          accessibilityLabel={`Resend the invitation to ${invitation.email}`}
          busy={resend.isPending}
          onPress={() =>
            resend.mutate(invitation.id, {
              onSuccess: ({ mail }) => setMessage(mail.sent ? { tone: 'note', text: 'Sent again with a new link; the earlier link no longer works.' } : { tone: 'caution', text: mail.message ?? 'The e-mail did not go out.' }),
              onError: (e) => setMessage({ tone: 'error', text: e.message }),
            })
          }
        />
        <Button
          compact
          tone="quiet"
          label="Revoke"
          accessibilityLabel={`Revoke the invitation to ${invitation.email}`}
          busy={revoke.isPending}
          onPress={() => revoke.mutate(invitation.id, { onError: (e) => setMessage({ tone: 'error', text: e.message }) })}
        />
      </View>
      {message ? <Notice tone={message.tone}>{message.text}</Notice> : null}
    </View>
  );
}

/** Renders the open invitations of shop `shopId` (owners only). */
export function PendingInvitations({ shopId }: { shopId: string }) {
  const list = useInvitations(shopId, true);
  if (list.isPending) return <Text variant="small">Loading invitations…</Text>;
  if (list.error) return <Notice tone="error">{list.error.message}</Notice>;
  if (list.data.length === 0) return <Text variant="small">No invitations waiting.</Text>;
  return (
    <View role="list" accessibilityLabel="Invitations waiting">
      {list.data.map((inv) => (
        <InvitationRow key={inv.id} shopId={shopId} invitation={inv} />
      ))}
    </View>
  );
}

const styles = StyleSheet.create({
  row: { paddingVertical: space.md, borderBottomWidth: 1, borderBottomColor: palette.rule, gap: space.xs },
  buttons: { flexDirection: 'row', gap: space.sm, marginTop: space.xs },
});
