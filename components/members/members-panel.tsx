/**
 * Crew and clients of a shop, for the build page and the members page: everyone sees who is in the shop; an
 * owner also changes roles, lets clients see print sets, removes members, invites by e-mail and manages the
 * invitations still waiting.
 */
import { StyleSheet, View } from 'react-native';
import { useMe } from '../../hooks/use-me';
import { useMembers } from '../../hooks/use-members';
import { InviteForm } from '../invitations/invite-form';
import { PendingInvitations } from '../invitations/pending-invitations';
import { Card } from '../ui/card';
import { Loading } from '../ui/loading';
import { Notice } from '../ui/notice';
import { Text } from '../ui/text';
import { space } from '../ui/theme';
import { MemberRow } from './member-row';

/** Renders the panel for shop `shopId`; what the caller may change follows their role there (from /api/me). */
export function MembersPanel({ shopId }: { shopId: string }) {
  const me = useMe();
  const members = useMembers(shopId);
  const myRole = me.data?.memberships.find((m) => m.shopId === shopId)?.role ?? null;
  const manage = myRole === 'owner';

  return (
    <View style={styles.stack}>
      <Card edge>
        <Text variant="heading" heading={2} style={styles.heading}>
          Crew and clients
        </Text>
        {members.isPending ? (
          <Loading label="Loading members" />
        ) : members.error ? (
          <Notice tone="error">{members.error.message}</Notice>
        ) : (
          <View role="list" accessibilityLabel="Members">
            {members.data.map((m) => (
              <MemberRow key={m.userId} shopId={shopId} member={m} manage={manage} isSelf={m.userId === me.data?.user.id} />
            ))}
          </View>
        )}
      </Card>
      {manage ? (
        <Card>
          <InviteForm shopId={shopId} />
          <Text variant="heading" heading={3} style={styles.subheading}>
            Waiting for an answer
          </Text>
          <PendingInvitations shopId={shopId} />
        </Card>
      ) : null}
    </View>
  );
}

const styles = StyleSheet.create({
  stack: { gap: space.lg },
  heading: { marginBottom: space.sm },
  subheading: { marginTop: space.xl, marginBottom: space.xs },
});
