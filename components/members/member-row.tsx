/**
 * One member in the members panel: name, role and whether they see print sets; for owners, the role choice,
 * the print-set switch for clients, and removal behind a confirmation.
 */
import { useState } from 'react';
import { Pressable, StyleSheet, View } from 'react-native';
import { ROLES } from '../../db/validation';
import type { Member } from '../../hooks/use-members';
import { useRemoveMember, useUpdateMember } from '../../hooks/use-members';
import { RoleBadge } from '../nav/role-badge';
import { Button } from '../ui/button';
import { Notice } from '../ui/notice';
import { Text } from '../ui/text';
import { palette, radius, space } from '../ui/theme';
import { RoleChoice } from './role-choice';

/**
 * Renders `member` of shop `shopId`; `manage` (the caller is an owner) shows the controls on other members'
 * rows; `isSelf` marks the caller's own row.
 */
export function MemberRow({ shopId, member, manage: isOwner, isSelf }: { shopId: string; member: Member; manage: boolean; isSelf: boolean }) {
  // Owners do not change or remove themselves here, so nobody locks themselves out by a slip; another owner can.
  const manage = isOwner && !isSelf;
  const update = useUpdateMember(shopId);
  const remove = useRemoveMember(shopId);
  const [confirming, setConfirming] = useState(false);
  const [error, setError] = useState<string | null>(null);
  const onError = (e: Error) => setError(e.message);
  const busy = update.isPending || remove.isPending;

  return (
    <View style={styles.row} role="listitem" accessibilityLabel={`${member.name}, ${member.role}`}>
      <View style={styles.head}>
        <View style={styles.who}>
          <Text variant="bodyStrong">{isSelf ? `${member.name} (you)` : member.name}</Text>
          {member.email ? <Text variant="small">{member.email}</Text> : null}
        </View>
        <RoleBadge role={member.role} />
      </View>
      {member.role === 'viewer' ? (
        manage ? (
          <Pressable
            role="switch"
            aria-checked={member.canSeePrintSets}
            accessibilityLabel={`Print sets for ${member.name}`}
            disabled={busy}
            onPress={() => {
              setError(null);
              update.mutate({ userId: member.userId, change: { canSeePrintSets: !member.canSeePrintSets } }, { onError });
            }}
            style={styles.switchRow}
          >
            <View style={[styles.track, member.canSeePrintSets && styles.trackOn]}>
              <View style={[styles.knob, member.canSeePrintSets && styles.knobOn]} />
            </View>
            <Text variant="small">{member.canSeePrintSets ? 'Sees print sets' : 'Print sets hidden'}</Text>
          </Pressable>
        ) : (
          <Text variant="small">{member.canSeePrintSets ? 'Sees print sets' : 'Print sets hidden'}</Text>
        )
      ) : null}
      {manage ? (
        <View style={styles.controls}>
          <RoleChoice
            label={`Role of ${member.name}`}
            roles={ROLES}
            value={member.role}
            disabled={busy}
            onChange={(role) => {
              setError(null);
              if (role !== member.role) update.mutate({ userId: member.userId, change: { role } }, { onError });
            }}
          />
          {confirming ? (
            <View style={styles.confirm}>
              <Text variant="small">{`Remove ${member.name} from the shop? They lose access at once.`}</Text>
              <View style={styles.confirmButtons}>
                <Button
                  compact
                  tone="danger"
                  label="Remove"
                  accessibilityLabel={`Confirm removing ${member.name}`}
                  busy={remove.isPending}
                  onPress={() => remove.mutate(member.userId, { onError, onSettled: () => setConfirming(false) })}
                />
                <Button compact tone="secondary" label="Keep" accessibilityLabel={`Keep ${member.name}`} onPress={() => setConfirming(false)} />
              </View>
            </View>
          ) : (
            <Button compact tone="quiet" label="Remove…" accessibilityLabel={`Remove ${member.name}`} onPress={() => setConfirming(true)} />
          )}
        </View>
      ) : null}
      {isOwner && isSelf ? <Text variant="small">Only another owner can change your role; a shop always keeps at least one owner.</Text> : null}
      {error ? <Notice tone="error">{error}</Notice> : null}
    </View>
  );
}

const styles = StyleSheet.create({
  row: { paddingVertical: space.md, borderBottomWidth: 1, borderBottomColor: palette.rule, gap: space.sm },
  head: { flexDirection: 'row', alignItems: 'center', justifyContent: 'space-between', gap: space.md },
  who: { flex: 1, minWidth: 0 },
  controls: { flexDirection: 'row', flexWrap: 'wrap', alignItems: 'center', justifyContent: 'space-between', gap: space.sm },
  switchRow: { flexDirection: 'row', alignItems: 'center', gap: space.sm, minHeight: 36 },
  track: { width: 36, height: 20, borderRadius: radius.pill, backgroundColor: palette.ruleStrong, padding: 2 },
  trackOn: { backgroundColor: palette.sage },
  knob: { width: 16, height: 16, borderRadius: radius.pill, backgroundColor: palette.sheet },
  knobOn: { transform: [{ translateX: 16 }] },
  confirm: { gap: space.xs, padding: space.sm, backgroundColor: palette.dangerWash, borderRadius: radius.sm },
  confirmButtons: { flexDirection: 'row', gap: space.sm },
});
