import { zodResolver } from '@hookform/resolvers/zod';
import { useState } from 'react';
import { Controller, useForm } from 'react-hook-form';
import { StyleSheet, View } from 'react-native';
import { useCreateInvitationMutation, useInvitationsQuery, useRevokeInvitationMutation } from '@/lib/api/groups';
import { createInvitationInputSchema, type Invitation } from '@/lib/schemas/groups';
import { Button } from '@/components/ui/button';
import { Card } from '@/components/ui/card';
import { FormError } from '@/components/ui/form-error';
import { AppText } from '@/components/ui/text';
import { TextField } from '@/components/ui/text-field';
import { useToast } from '@/components/ui/toast';
import { colors, radius, spacing } from '@/components/ui/theme';
import { formatDay, roleDescriptions, roleLabels } from './account-format';
import { applyServerErrors, describeError } from './form-errors';
import { QueryContent } from './query-states';
import { RolePicker, RoleTag } from './role-chip';

/** Admins: invite by e-mail with a role, see who has not answered yet, withdraw an invitation. */
export function InvitationsCard({ groupId }: { groupId: string }) {
  const invitations = useInvitationsQuery(groupId, true);
  const revoke = useRevokeInvitationMutation(groupId);
  const toast = useToast();
  const onRevoke = (invitation: Invitation) =>
    revoke.mutate(invitation.id, {
      onSuccess: () => toast(`The invitation to ${invitation.email} was withdrawn.`),
      onError: (error) => toast(`Not withdrawn: ${describeError(error)}`, 'error'),
    });
  return (
    <Card title="Invitations" testID="invitations-card">
      <InviteForm groupId={groupId} />
      <View style={styles.divider} />
      <AppText variant="label" tone="muted">Waiting for an answer</AppText>
      <QueryContent query={invitations} loadingLabel="Loading invitations…" errorTitle="Invitations could not be loaded" testID="invitations">
        {(list) =>
          list.length === 0 ? (
            <AppText tone="muted" testID="invitations-empty">No invitations are waiting.</AppText>
          ) : (
            <View style={styles.list} testID="invitations-list">
              {list.map((invitation) => (
                <InvitationRow
                  key={invitation.id}
                  invitation={invitation}
                  revoking={revoke.isPending && revoke.variables === invitation.id}
                  onRevoke={() => onRevoke(invitation)}
                />
              ))}
            </View>
          )
        }
      </QueryContent>
      <FormError message={revoke.isError ? describeError(revoke.error) : null} testID="invitations-revoke-error" />
    </Card>
  );
}

function InvitationRow({ invitation, revoking, onRevoke }: { invitation: Invitation; revoking: boolean; onRevoke: () => void }) {
  const expired = invitation.status === 'expired';
  const [confirming, setConfirming] = useState(false);
  return (
    <View style={styles.row} testID={`invitation-row-${invitation.id}`}>
      <View style={styles.rowText}>
        <AppText style={styles.email} numberOfLines={1}>{invitation.email}</AppText>
        <AppText variant="caption" tone={expired ? 'danger' : 'muted'}>
          {expired ? `Expired ${formatDay(invitation.expiresAt)}` : `Valid until ${formatDay(invitation.expiresAt)}`}
          {invitation.invitedBy ? ` · by ${invitation.invitedBy.displayName}` : ''}
        </AppText>
      </View>
      <RoleTag role={invitation.role} />
      {confirming ? (
        <View style={styles.confirm} testID={`invitation-revoke-confirm-${invitation.id}`}>
          <AppText variant="caption">
            {expired ? `Remove the expired invitation to ${invitation.email}?` : `Withdraw the invitation to ${invitation.email}? The link in their e-mail stops working.`}
          </AppText>
          <View style={styles.buttons}>
            <Button
              label={revoking ? 'Withdrawing…' : expired ? 'Yes, remove' : 'Yes, withdraw'}
              accessibilityLabel={`${expired ? 'Yes, remove' : 'Yes, withdraw'} the invitation to ${invitation.email}`}
              disabled={revoking}
              onPress={onRevoke}
              testID={`invitation-revoke-yes-${invitation.id}`}
            />
            <Button label="Cancel" kind="quiet" disabled={revoking} onPress={() => setConfirming(false)} testID={`invitation-revoke-no-${invitation.id}`} />
          </View>
        </View>
      ) : (
        <Button
          label={expired ? 'Remove' : 'Withdraw'}
          accessibilityLabel={`${expired ? 'Remove' : 'Withdraw'} the invitation to ${invitation.email}`}
          kind="quiet"
          disabled={revoking}
          onPress={() => setConfirming(true)}
          testID={`invitation-revoke-${invitation.id}`}
        />
      )}
    </View>
  );
}

function InviteForm({ groupId }: { groupId: string }) {
  const create = useCreateInvitationMutation(groupId);
  const toast = useToast();
  const [formError, setFormError] = useState<string | null>(null);
  const [sentTo, setSentTo] = useState<string | null>(null);
  const { control, handleSubmit, setError, reset, formState: { errors } } = useForm({
    resolver: zodResolver(createInvitationInputSchema),
    defaultValues: { email: '', role: 'contributor' as const },
  });

  const submit = handleSubmit(async (values) => {
    setFormError(null);
    setSentTo(null);
    try {
      await create.mutateAsync(values);
      reset({ email: '', role: values.role });
      setSentTo(values.email);
      toast(`Invitation sent to ${values.email}.`);
    } catch (error) {
      setFormError(applyServerErrors(error, setError, ['email', 'role']));
    }
  });

  return (
    <View style={styles.form} testID="invite-form">
      <Controller
        control={control}
        name="email"
        render={({ field }) => (
          <TextField
            ref={field.ref}
            label="Invite by e-mail"
            value={field.value}
            onChangeText={(text) => {
              setSentTo(null);
              field.onChange(text);
            }}
            onBlur={field.onBlur}
            error={errors.email?.message}
            keyboardType="email-address"
            autoComplete="email"
            testID="invite-email"
          />
        )}
      />
      <Controller
        control={control}
        name="role"
        render={({ field }) => (
          <View style={styles.roleField}>
            <AppText variant="label" tone="muted">Role</AppText>
            <RolePicker value={field.value} onChange={field.onChange} label="Role for the new member" testIDPrefix="invite-role" />
            <AppText variant="caption" tone={errors.role ? 'danger' : 'muted'}>
              {errors.role?.message ?? `${roleLabels[field.value]}s can ${roleDescriptions[field.value]}.`}
            </AppText>
          </View>
        )}
      />
      <FormError message={formError} testID="invite-error" />
      <FormError message={sentTo ? `Invitation sent to ${sentTo}.` : null} tone="done" testID="invite-sent" />
      <View style={styles.action}>
        <Button
          label={create.isPending ? 'Sending…' : 'Send invitation'}
          accessibilityLabel="Send invitation"
          onPress={() => void submit()}
          disabled={create.isPending}
          testID="invite-submit"
        />
      </View>
    </View>
  );
}

const styles = StyleSheet.create({
  form: { gap: spacing.md },
  roleField: { gap: spacing.xs },
  action: { alignSelf: 'flex-start' },
  divider: { height: 1, backgroundColor: colors.line, marginVertical: spacing.sm },
  list: { gap: spacing.sm },
  row: {
    flexDirection: 'row',
    flexWrap: 'wrap',
    alignItems: 'center',
    gap: spacing.sm,
    padding: spacing.md,
    borderRadius: radius.md,
    borderWidth: 1,
    borderColor: colors.line,
  },
  rowText: { flex: 1, minWidth: 160, gap: 2 },
  email: { fontWeight: '600' },
  confirm: { gap: spacing.sm, flexBasis: '100%' },
  buttons: { flexDirection: 'row', flexWrap: 'wrap', gap: spacing.sm },
});
