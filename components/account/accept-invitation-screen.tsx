import { useRouter } from 'expo-router';
import { useState } from 'react';
import { StyleSheet, View } from 'react-native';
import { ApiError } from '@/lib/api/api-client';
import { useMeQuery, useSignOutMutation } from '@/lib/api/auth';
import { useAcceptInvitationMutation, useInvitationPreviewQuery } from '@/lib/api/groups';
import type { AcceptInvitationResponse, InvitationPreview } from '@/lib/schemas/groups';
import { Button } from '@/components/ui/button';
import { Card } from '@/components/ui/card';
import { FormError } from '@/components/ui/form-error';
import { AppText } from '@/components/ui/text';
import { spacing } from '@/components/ui/theme';
import { formatDay, roleDescriptions, roleLabels, withArticle } from './account-format';
import { AuthFrame, LinkRow, TextLink } from './auth-frame';
import { describeError } from './form-errors';
import { ErrorBlock, LoadingBlock, QueryContent } from './query-states';

function describePreviewError(error: unknown): string {
  if (error instanceof ApiError && error.code === 'NOT_FOUND') {
    return 'This invitation cannot be used: it may have been accepted already, revoked or expired. Ask the group’s admin to send a new one.';
  }
  return describeError(error);
}

/** Opened from an invitation e-mail (?token=): shows the group and role, then joins it. */
export function AcceptInvitationScreen({ token }: { token: string }) {
  const preview = useInvitationPreviewQuery(token);
  return (
    <AuthFrame title="Join a group" testID="accept-invitation-screen">
      {!token ? (
        <FormError
          message="This page needs the link from your invitation e-mail. Open the link from the message, or copy it whole into the address bar."
          testID="invitation-missing-token"
        />
      ) : preview.isError && preview.data === undefined && preview.error instanceof ApiError && preview.error.code === 'NOT_FOUND' ? (
        <View style={styles.block}>
          <FormError message={describePreviewError(preview.error)} testID="invitation-invalid" />
          <LinkRow>
            <TextLink href="/account" testID="invitation-to-account">Go to your account</TextLink>
          </LinkRow>
        </View>
      ) : (
        <QueryContent query={preview} loadingLabel="Reading the invitation…" errorTitle="The invitation could not be read" testID="invitation-preview">
          {(invitation) => <InvitationBody token={token} invitation={invitation} />}
        </QueryContent>
      )}
    </AuthFrame>
  );
}

function InvitationBody({ token, invitation }: { token: string; invitation: InvitationPreview }) {
  const me = useMeQuery();
  const router = useRouter();
  const accept = useAcceptInvitationMutation();
  const signOut = useSignOutMutation();
  const [joined, setJoined] = useState<AcceptInvitationResponse | null>(null);
  const here = `/invitations/accept?token=${encodeURIComponent(token)}`;
  const withInvitee = (path: string) =>
    `${path}?${new URLSearchParams({ email: invitation.email, next: here }).toString()}`;

  if (joined) {
    return (
      <View style={styles.block} testID="invitation-accepted">
        <Card>
          <AppText variant="lead">
            You are now a member of {joined.groupName}, as {withArticle(joined.role)}.
          </AppText>
          <AppText tone="soft">You can {roleDescriptions[joined.role]}.</AppText>
        </Card>
        <LinkRow>
          <TextLink href={`/account/groups/${joined.groupId}`} testID="invitation-open-group">Open the group</TextLink>
          <TextLink href="/library" testID="invitation-open-library">Go to the library</TextLink>
        </LinkRow>
      </View>
    );
  }

  const summary = (
    <Card testID="invitation-preview">
      <AppText variant="label" tone="muted">Invitation</AppText>
      <AppText variant="title" testID="invitation-group-name">{invitation.groupName}</AppText>
      <AppText>
        Role offered: <AppText style={styles.strong} testID="invitation-role">{roleLabels[invitation.role]}</AppText> — you would be able to {roleDescriptions[invitation.role]}.
      </AppText>
      <AppText variant="caption" tone="muted">
        Sent to {invitation.email} · valid until {formatDay(invitation.expiresAt)}
      </AppText>
    </Card>
  );

  if (me.data === undefined) {
    return (
      <View style={styles.block}>
        {summary}
        {me.isError ? (
          <ErrorBlock title="We could not tell whether you are signed in" error={me.error} onRetry={() => void me.refetch()} testID="invitation-me-error" />
        ) : (
          <LoadingBlock label="Checking your sign-in…" />
        )}
      </View>
    );
  }

  if (me.data === null) {
    return (
      <View style={styles.block}>
        {summary}
        <AppText tone="soft">
          Sign in as {invitation.email} to accept. No account yet? Create one with that address; after confirming it,
          sign in and you will come back here.
        </AppText>
        <View style={styles.actions}>
          <Button label={`Sign in as ${invitation.email}`} onPress={() => router.push(withInvitee('/sign-in'))} testID="invitation-sign-in" />
          <Button label="Create an account" kind="quiet" onPress={() => router.push(withInvitee('/sign-up'))} testID="invitation-sign-up" />
        </View>
      </View>
    );
  }

  const signedInAs = me.data.user.email;
  const otherAddress = signedInAs.toLowerCase() !== invitation.email.toLowerCase();

  const switchAccount = async () => {
    await signOut.mutateAsync();
    router.push(withInvitee('/sign-in'));
  };

  return (
    <View style={styles.block}>
      {summary}
      {otherAddress ? (
        <FormError
          message={`You are signed in as ${signedInAs}, but this invitation was sent to ${invitation.email}. Only that account can accept it.`}
          testID="invitation-other-account"
        >
          <View style={styles.actions}>
            <Button
              label={signOut.isPending ? 'Signing out…' : `Sign out and sign in as ${invitation.email}`}
              kind="quiet"
              disabled={signOut.isPending}
              onPress={() => void switchAccount().catch(() => undefined)}
              testID="invitation-switch-account"
            />
          </View>
        </FormError>
      ) : (
        <>
          <AppText tone="soft">Signed in as {me.data.user.displayName} ({signedInAs}).</AppText>
          <FormError message={accept.isError ? describeError(accept.error) : null} testID="invitation-accept-error" />
          <View style={styles.actions}>
            <Button
              label={accept.isPending ? 'Joining…' : `Join ${invitation.groupName}`}
              disabled={accept.isPending}
              onPress={() => accept.mutate({ token }, { onSuccess: setJoined })}
              testID="invitation-accept"
            />
            <Button label="Not now" kind="quiet" onPress={() => router.replace('/account')} testID="invitation-decline" />
          </View>
        </>
      )}
      {signOut.isError ? <FormError message={describeError(signOut.error)} /> : null}
    </View>
  );
}

const styles = StyleSheet.create({
  block: { gap: spacing.lg },
  actions: { gap: spacing.sm },
  strong: { fontWeight: '600' },
});
