import { useState } from 'react';
import { StyleSheet, View } from 'react-native';
import { useChangeRoleMutation, useRemoveMemberMutation } from '@/lib/api/groups';
import { roleRank, type GroupDetail, type Member, type Role } from '@/lib/schemas/groups';
import { Button } from '@/components/ui/button';
import { Card } from '@/components/ui/card';
import { FormError } from '@/components/ui/form-error';
import { AppText } from '@/components/ui/text';
import { colors, radius, spacing } from '@/components/ui/theme';
import { formatDay } from './account-format';
import { describeError } from './form-errors';
import { RolePicker, RoleTag } from './role-chip';

/**
 * Members with their roles. Admins pick a role per person and remove people (with a second tap to
 * confirm); everyone can leave. The server keeps at least one admin and says so (409) when refused.
 */
export function MembersCard({ detail, myUserId, onLeft }: { detail: GroupDetail; myUserId: string | null; onLeft: () => void }) {
  const changeRole = useChangeRoleMutation(detail.id);
  const remove = useRemoveMemberMutation(detail.id);
  const [confirmingRemoval, setConfirmingRemoval] = useState<string | null>(null);
  const [problem, setProblem] = useState<string | null>(null);
  const isAdmin = detail.myRole === 'admin';
  const members = [...detail.members].sort(
    (a, b) => roleRank[b.role] - roleRank[a.role] || a.displayName.localeCompare(b.displayName),
  );

  const pickRole = (member: Member, role: Role) => {
    setProblem(null);
    setConfirmingRemoval(null);
    changeRole.mutate({ userId: member.userId, role }, { onError: (error) => setProblem(describeError(error)) });
  };

  const confirmRemoval = (member: Member) => {
    setProblem(null);
    remove.mutate(member.userId, {
      onSuccess: () => {
        setConfirmingRemoval(null);
        if (member.userId === myUserId) onLeft();
      },
      onError: (error) => {
        setConfirmingRemoval(null);
        setProblem(describeError(error));
      },
    });
  };

  return (
    <Card title={`Members (${members.length})`} testID="members-card">
      <FormError message={problem} testID="members-error" />
      <View style={styles.list} testID="members-list">
        {members.map((member) => {
          const isMe = member.userId === myUserId;
          const busy =
            (changeRole.isPending && changeRole.variables?.userId === member.userId) ||
            (remove.isPending && remove.variables === member.userId);
          const confirming = confirmingRemoval === member.userId;
          return (
            <View key={member.userId} style={styles.row} testID={`member-row-${member.userId}`}>
              <View style={styles.who}>
                <AppText style={styles.name}>
                  {member.displayName}
                  {isMe ? <AppText tone="muted"> (you)</AppText> : null}
                </AppText>
                <AppText variant="caption" tone="muted">
                  {member.email} · joined {formatDay(member.joinedAt)}
                </AppText>
              </View>
              {isAdmin ? (
                <RolePicker
                  value={member.role}
                  onChange={(role) => pickRole(member, role)}
                  disabled={busy}
                  label={`Role of ${member.displayName}`}
                  testIDPrefix={`member-role-${member.userId}`}
                />
              ) : (
                <RoleTag role={member.role} testID={`member-role-${member.userId}`} />
              )}
              {isAdmin || isMe ? (
                confirming ? (
                  <View style={styles.confirm} testID={`member-remove-confirm-${member.userId}`}>
                    <AppText variant="caption" tone="danger">
                      {isMe
                        ? 'Leave this group? You lose access to its library until someone invites you again.'
                        : `Remove ${member.displayName} from ${detail.name}? They lose access to its library.`}
                    </AppText>
                    <View style={styles.buttons}>
                      <Button
                        label={busy ? 'Removing…' : isMe ? 'Yes, leave' : 'Yes, remove'}
                        onPress={() => confirmRemoval(member)}
                        disabled={busy}
                        testID={`member-remove-yes-${member.userId}`}
                      />
                      <Button label="Cancel" kind="quiet" onPress={() => setConfirmingRemoval(null)} disabled={busy} testID={`member-remove-no-${member.userId}`} />
                    </View>
                  </View>
                ) : (
                  <View style={styles.removeButton}>
                    <Button
                      label={isMe ? 'Leave group' : 'Remove'}
                      accessibilityLabel={isMe ? 'Leave this group' : `Remove ${member.displayName}`}
                      kind="quiet"
                      disabled={busy}
                      onPress={() => {
                        setProblem(null);
                        setConfirmingRemoval(member.userId);
                      }}
                      testID={`member-remove-${member.userId}`}
                    />
                  </View>
                )
              ) : null}
            </View>
          );
        })}
      </View>
    </Card>
  );
}

const styles = StyleSheet.create({
  list: { gap: spacing.sm },
  row: {
    gap: spacing.sm,
    padding: spacing.md,
    borderRadius: radius.md,
    borderWidth: 1,
    borderColor: colors.line,
  },
  who: { gap: 2 },
  name: { fontWeight: '600' },
  confirm: { gap: spacing.sm, backgroundColor: colors.dangerSoft, borderRadius: radius.sm, padding: spacing.sm },
  buttons: { flexDirection: 'row', flexWrap: 'wrap', gap: spacing.sm },
  removeButton: { alignSelf: 'flex-start' },
});
