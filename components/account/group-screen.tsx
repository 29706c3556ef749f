import { useRouter } from 'expo-router';
import { StyleSheet, View } from 'react-native';
import { ApiError } from '@/lib/api/api-client';
import { useMeQuery } from '@/lib/api/auth';
import { useGroupQuery } from '@/lib/api/groups';
import type { GroupDetail } from '@/lib/schemas/groups';
import { FormError } from '@/components/ui/form-error';
import { Screen } from '@/components/ui/screen';
import { AppText } from '@/components/ui/text';
import { spacing } from '@/components/ui/theme';
import { useWideLayout } from '@/components/ui/use-wide-layout';
import { formatDay, roleDescriptions, withArticle } from './account-format';
import { LinkRow, TextLink } from './auth-frame';
import { InvitationsCard } from './invitations-card';
import { MembersCard } from './members-card';
import { QueryContent } from './query-states';

/** One group: its members (admins change roles and remove people) and, for admins, its invitations. */
export function GroupScreen({ groupId }: { groupId: string }) {
  const group = useGroupQuery(groupId);
  const me = useMeQuery();
  const router = useRouter();
  const refused = group.data === undefined && group.error instanceof ApiError
    && (group.error.code === 'FORBIDDEN' || group.error.code === 'NOT_FOUND' || group.error.code === 'UNAUTHENTICATED');

  return (
    <Screen maxWidth={1040}>
      <TextLink href="/account" testID="group-back">← Account</TextLink>
      {refused && group.error instanceof ApiError ? (
        <View style={styles.block} testID="group-refused">
          <FormError
            message={
              group.error.code === 'UNAUTHENTICATED'
                ? 'Sign in to see this group.'
                : 'This group does not exist or you are not one of its members.'
            }
          />
          {group.error.code === 'UNAUTHENTICATED' ? (
            <LinkRow>
              <TextLink href={`/sign-in?next=${encodeURIComponent(`/account/groups/${groupId}`)}`} testID="group-sign-in">
                Sign in
              </TextLink>
            </LinkRow>
          ) : null}
        </View>
      ) : (
        <QueryContent query={group} loadingLabel="Loading the group…" errorTitle="The group could not be loaded" testID="group">
          {(detail) => (
            <GroupBody
              detail={detail}
              myUserId={me.data?.user.id ?? null}
              onLeft={() => router.replace('/account')}
            />
          )}
        </QueryContent>
      )}
    </Screen>
  );
}

function GroupBody({ detail, myUserId, onLeft }: { detail: GroupDetail; myUserId: string | null; onLeft: () => void }) {
  const wide = useWideLayout();
  const isAdmin = detail.myRole === 'admin';
  const members = <MembersCard detail={detail} myUserId={myUserId} onLeft={onLeft} />;
  return (
    <View style={styles.block} testID="group-screen">
      <View style={styles.head}>
        <AppText variant="display" accessibilityRole="header" testID="group-name">{detail.name}</AppText>
        <AppText tone="soft" testID="group-my-role">
          You are {withArticle(detail.myRole)} here: you can {roleDescriptions[detail.myRole]}.
        </AppText>
        <AppText variant="caption" tone="muted">Started {formatDay(detail.createdAt)}</AppText>
      </View>
      {isAdmin && wide ? (
        <View style={styles.columns}>
          <View style={styles.wideMembers}>{members}</View>
          <View style={styles.wideInvites}><InvitationsCard groupId={detail.id} /></View>
        </View>
      ) : (
        <View style={styles.block}>
          {members}
          {isAdmin ? <InvitationsCard groupId={detail.id} /> : null}
        </View>
      )}
    </View>
  );
}

const styles = StyleSheet.create({
  block: { gap: spacing.lg },
  head: { gap: spacing.xs },
  columns: { flexDirection: 'row', gap: spacing.xl, alignItems: 'flex-start' },
  wideMembers: { flex: 3, minWidth: 0 },
  wideInvites: { flex: 2, minWidth: 0 },
});
