import { zodResolver } from '@hookform/resolvers/zod';
import { Link } from 'expo-router';
import { useState } from 'react';
import { useForm } from 'react-hook-form';
import { Pressable, StyleSheet, View } from 'react-native';
import { useCreateGroupMutation, useGroupsQuery } from '@/lib/api/groups';
import { createGroupInputSchema, type GroupSummary } from '@/lib/schemas/groups';
import { Button } from '@/components/ui/button';
import { Card } from '@/components/ui/card';
import { FormError } from '@/components/ui/form-error';
import { AppText } from '@/components/ui/text';
import { FormTextField } from '@/components/ui/form-text-field';
import { colors, radius, spacing } from '@/components/ui/theme';
import { applyServerErrors } from './form-errors';
import { QueryContent } from './query-states';
import { RoleTag } from './role-chip';

/** Your groups with your role in each; a group page opens on tap. New groups start with you as admin. */
export function GroupsCard() {
  const groups = useGroupsQuery();
  return (
    <Card title="My groups" testID="groups-card">
      <QueryContent query={groups} loadingLabel="Loading your groups…" errorTitle="Your groups could not be loaded" testID="groups">
        {(list) =>
          list.length === 0 ? (
            <View style={styles.empty} testID="groups-empty">
              <AppText>You are not in a group yet.</AppText>
              <AppText tone="soft" variant="caption">
                An admin of your lab can invite you by e-mail, or you can start a group below and invite the others.
              </AppText>
            </View>
          ) : (
            <View style={styles.list} testID="groups-list">
              {list.map((group) => <GroupRow key={group.id} group={group} />)}
            </View>
          )
        }
      </QueryContent>
      <CreateGroupForm />
    </Card>
  );
}

function GroupRow({ group }: { group: GroupSummary }) {
  return (
    <Link href={`/account/groups/${group.id}`} asChild>
      <Pressable
        accessibilityRole="link"
        style={styles.row}
        testID={`group-row-${group.id}`}
      >
        <View style={styles.rowText}>
          <AppText style={styles.name} numberOfLines={2}>{group.name}</AppText>
          <AppText variant="caption" tone="muted">
            {group.memberCount} {group.memberCount === 1 ? 'member' : 'members'}
          </AppText>
        </View>
        <RoleTag role={group.role} testID={`group-role-${group.id}`} />
        <AppText tone="muted" accessibilityElementsHidden importantForAccessibility="no">›</AppText>
      </Pressable>
    </Link>
  );
}

function CreateGroupForm() {
  const create = useCreateGroupMutation();
  const [open, setOpen] = useState(false);
  const [formError, setFormError] = useState<string | null>(null);
  const [created, setCreated] = useState<string | null>(null);
  const { control, handleSubmit, setError, reset } = useForm({
    resolver: zodResolver(createGroupInputSchema),
    defaultValues: { name: '' },
  });

  const submit = handleSubmit(async (values) => {
    setFormError(null);
    try {
      const group = await create.mutateAsync(values);
      reset({ name: '' });
      setCreated(group.name);
      setOpen(false);
    } catch (error) {
      setFormError(applyServerErrors(error, setError, ['name']));
    }
  });

  if (!open) {
    return (
      <View style={styles.create}>
        <FormError message={created ? `${created} is ready, with you as its admin.` : null} tone="done" testID="create-group-done" />
        <View style={styles.action}>
          <Button label="Start a new group" kind="quiet" onPress={() => { setCreated(null); setOpen(true); }} testID="create-group-open" />
        </View>
      </View>
    );
  }

  return (
    <View style={StyleSheet.flatten([styles.create, styles.createOpen])} testID="create-group-form">
      <FormTextField
        control={control}
        name="name"
        label="New group’s name"
        hint="Usually the lab’s name, such as Larkspur Coordination Lab. You become its admin and can invite the others."
        onSubmitEditing={() => void submit()}
        autoCapitalize="words"
        testID="create-group-name"
      />
      <FormError message={formError} testID="create-group-error" />
      <View style={styles.buttons}>
        <Button
          label={create.isPending ? 'Creating…' : 'Create group'}
          accessibilityLabel="Create group"
          onPress={() => void submit()}
          disabled={create.isPending}
          testID="create-group-submit"
        />
        <Button label="Cancel" kind="quiet" onPress={() => { setOpen(false); setFormError(null); }} testID="create-group-cancel" />
      </View>
    </View>
  );
}

const styles = StyleSheet.create({
  list: { gap: spacing.sm },
  empty: { gap: spacing.xs, paddingVertical: spacing.sm },
  row: {
    flexDirection: 'row',
    alignItems: 'center',
    gap: spacing.md,
    paddingVertical: spacing.md,
    paddingHorizontal: spacing.md,
    borderRadius: radius.md,
    borderWidth: 1,
    borderColor: colors.line,
    backgroundColor: colors.card,
  },
  rowText: { flex: 1, minWidth: 0, gap: 2 },
  name: { fontWeight: '600' },
  create: { gap: spacing.sm, marginTop: spacing.sm },
  createOpen: { borderTopWidth: 1, borderTopColor: colors.line, paddingTop: spacing.md },
  action: { alignSelf: 'flex-start' },
  buttons: { flexDirection: 'row', flexWrap: 'wrap', gap: spacing.sm },
});
