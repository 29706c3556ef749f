import { useState } from 'react';
import { StyleSheet, View } from 'react-native';
import { useChangeRoleMutation, useRemoveMemberMutation } from '@/lib/api/groups';
import type { GroupDetail, Member, Role } from '@/lib/schemas/groups';
import { Button } from '@/components/ui/button';
import { Card } from '@/components/ui/card';
import { FormError } from '@/components/ui/form-error';
import { AppText } from '@/components/ui/text';
import { useToast } from '@/components/ui/toast';
import { colors, radius, spacing } from '@/components/ui/theme';
import { formatDay, roleDescriptions, roleLabels, withArticle } from './account-format';
import { describeError } from './form-errors';
import { RolePicker, RoleTag } from './role-chip';

/**
 * Members with their roles. Admins pick a role per person and remove people, each confirmed by a
 * second tap that says what will change; everyone can leave. The list is in name order, so a row does
 * not move when its role changes. The server keeps at least one admin and says so (409) when refused.
 */
export function MembersCard({ detail, myUserId, onLeft }: { detail: GroupDetail; myUserId: string | null; onLeft: () => void }) {
  const changeRole = useChangeRoleMutation(detail.id);
  const remove = useRemoveMemberMutation(detail.id);
  const toast = useToast();
  const [confirmingRemoval, setConfirmingRemoval] = useState<string | null>(null);
  const [pendingRole, setPendingRole] = useState<{ userId: string; role: Role } | null>(null);
  const [problem, setProblem] = useState<string | null>(null);
  const isAdmin = detail.myRole === 'admin';
  const members = [...detail.members].sort((a, b) => a.displayName.localeCompare(b.displayName) || a.userId.localeCompare(b.userId));

  const pickRole = (member: Member, role: Role) => {
    setProblem(null);
    setConfirmingRemoval(null);
    setPendingRole({ userId: member.userId, role });
  };

  const confirmRole = (member: Member, role: Role) => {
    changeRole.mutate(
      { userId: member.userId, role },
      {
        onSuccess: () => {
          setPendingRole(null);
          toast(`${member.displayName} is now ${withArticle(role)}.`);
        },
        onError: (error) => {
          setPendingRole(null);
          setProblem(describeError(error));
          toast(`Role not changed: ${describeError(error)}`, 'error');
        },
      },
    );
  };

  const confirmRemoval = (member: Member) => {
    setProblem(null);
    remove.mutate(member.userId, {
      onSuccess: () => {
        setConfirmingRemoval(null);
        toast(member.userId === myUserId ? `You left ${detail.name}.` : `${member.displayName} was removed from ${detail.name}.`);
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
          const newRole = pendingRole?.userId === member.userId ? pendingRole.role : null;
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
                <>
                  <RolePicker
                    value={newRole ?? member.role}
                    onChange={(role) => (role === member.role ? setPendingRole(null) : pickRole(member, role))}
                    disabled={busy}
                    label={`Role of ${member.displayName}`}
                    testIDPrefix={`member-role-${member.userId}`}
                  />
                  {newRole ? (
                    <View style={styles.confirmRole} testID={`member-role-confirm-${member.userId}`}>
                      <AppText variant="caption">
                        {`Make ${member.displayName} ${withArticle(newRole)} instead of ${withArticle(member.role)}? ${roleLabels[newRole]}s can ${roleDescriptions[newRole]}.`}
                      </AppText>
                      <View style={styles.buttons}>
                        <Button
                          label={busy ? 'Changing…' : 'Change role'}
                          accessibilityLabel={`Change role: make ${member.displayName} ${withArticle(newRole)}`}
                          onPress={() => confirmRole(member, newRole)}
                          disabled={busy}
                          testID={`member-role-yes-${member.userId}`}
                        />
                        <Button label="Cancel" kind="quiet" onPress={() => setPendingRole(null)} disabled={busy} testID={`member-role-no-${member.userId}`} />
                      </View>
                    </View>
                  ) : null}
                </>
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
                      // The name starts with the words shown (WCAG 2.5.3): "Remove Ada Fenwick", "Leave group".
                      accessibilityLabel={isMe ? undefined : `Remove ${member.displayName}`}
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
  confirmRole: { gap: spacing.sm, backgroundColor: colors.accentSoft, borderRadius: radius.sm, padding: spacing.sm },
  buttons: { flexDirection: 'row', flexWrap: 'wrap', gap: spacing.sm },
  removeButton: { alignSelf: 'flex-start' },
});
