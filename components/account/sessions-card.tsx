import { useState } from 'react';
import { StyleSheet, View } from 'react-native';
import { useRevokeSessionMutation, useSessionsQuery } from '@/lib/api/auth';
import type { SessionDto } from '@/lib/schemas/auth';
import { Button } from '@/components/ui/button';
import { Card } from '@/components/ui/card';
import { FormError } from '@/components/ui/form-error';
import { AppText } from '@/components/ui/text';
import { useToast } from '@/components/ui/toast';
import { colors, radius, spacing } from '@/components/ui/theme';
import { describeDevice, formatMoment } from './account-format';
import { describeError } from './form-errors';
import { QueryContent } from './query-states';

/** Where you are signed in: this device first and flagged; any other can be signed out from here. */
export function SessionsCard() {
  const sessions = useSessionsQuery();
  const revoke = useRevokeSessionMutation();
  const toast = useToast();
  const onRevoke = (session: SessionDto) =>
    revoke.mutate(session.id, {
      onSuccess: () => toast(`${describeDevice(session.userAgent)} was signed out.`),
      onError: (error) => toast(`Not signed out: ${describeError(error)}`, 'error'),
    });
  return (
    <Card title="Signed-in devices" testID="sessions-card">
      <QueryContent query={sessions} loadingLabel="Loading your sessions…" errorTitle="Your sessions could not be loaded" testID="sessions">
        {(list) => {
          const ordered = [...list].sort((a, b) => Number(b.current) - Number(a.current) || b.createdAt.localeCompare(a.createdAt));
          return (
            <View style={styles.list} testID="sessions-list">
              {ordered.map((session) => (
                <SessionRow
                  key={session.id}
                  session={session}
                  revoking={revoke.isPending && revoke.variables === session.id}
                  onRevoke={() => onRevoke(session)}
                />
              ))}
              {ordered.length === 1 ? (
                <AppText variant="caption" tone="muted" testID="sessions-only-this">
                  No other device is signed in.
                </AppText>
              ) : null}
            </View>
          );
        }}
      </QueryContent>
      <FormError message={revoke.isError ? describeError(revoke.error) : null} testID="sessions-revoke-error" />
    </Card>
  );
}

function SessionRow({ session, revoking, onRevoke }: { session: SessionDto; revoking: boolean; onRevoke: () => void }) {
  const [confirming, setConfirming] = useState(false);
  return (
    <View style={StyleSheet.flatten([styles.row, session.current ? styles.rowCurrent : null])} testID={`session-row-${session.id}`}>
      <View style={styles.rowText}>
        <View style={styles.rowHead}>
          <AppText style={styles.device}>{describeDevice(session.userAgent)}</AppText>
          {session.current ? (
            <View style={styles.flag} testID="session-current">
              <AppText variant="caption" style={styles.flagText}>This device</AppText>
            </View>
          ) : null}
        </View>
        <AppText variant="caption" tone="muted">
          Signed in {formatMoment(session.createdAt)}
          {session.ip ? ` · from ${session.ip}` : ''} · ends {formatMoment(session.expiresAt)}
        </AppText>
      </View>
      {session.current ? null : confirming ? (
        <View style={styles.confirm} testID={`session-revoke-confirm-${session.id}`}>
          <AppText variant="caption">Sign out {describeDevice(session.userAgent)}? Whoever uses it will have to sign in again.</AppText>
          <View style={styles.buttons}>
            <Button
              label={revoking ? 'Signing out…' : 'Yes, sign it out'}
              accessibilityLabel={`Yes, sign it out: ${describeDevice(session.userAgent)}`}
              disabled={revoking}
              onPress={onRevoke}
              testID={`session-revoke-yes-${session.id}`}
            />
            <Button label="Cancel" kind="quiet" disabled={revoking} onPress={() => setConfirming(false)} testID={`session-revoke-no-${session.id}`} />
          </View>
        </View>
      ) : (
        <Button
          label="Sign out"
          accessibilityLabel={`Sign out ${describeDevice(session.userAgent)}, signed in ${formatMoment(session.createdAt)}`}
          kind="quiet"
          disabled={revoking}
          onPress={() => setConfirming(true)}
          testID={`session-revoke-${session.id}`}
        />
      )}
    </View>
  );
}

const styles = StyleSheet.create({
  list: { gap: spacing.sm },
  row: {
    flexDirection: 'row',
    flexWrap: 'wrap',
    alignItems: 'center',
    gap: spacing.md,
    paddingVertical: spacing.sm,
    paddingHorizontal: spacing.md,
    borderRadius: radius.md,
    borderWidth: 1,
    borderColor: colors.line,
  },
  rowCurrent: { borderColor: colors.accent, backgroundColor: colors.accentSoft },
  confirm: { gap: spacing.sm, flexBasis: '100%' },
  buttons: { flexDirection: 'row', flexWrap: 'wrap', gap: spacing.sm },
  rowText: { flex: 1, minWidth: 200, gap: 2 },
  rowHead: { flexDirection: 'row', alignItems: 'center', gap: spacing.sm, flexWrap: 'wrap' },
  device: { fontWeight: '600' },
  flag: { backgroundColor: colors.accent, borderRadius: radius.pill, paddingHorizontal: spacing.sm, paddingVertical: 1 },
  flagText: { color: colors.accentInk },
});
