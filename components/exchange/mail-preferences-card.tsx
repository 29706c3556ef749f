import { Pressable, StyleSheet, View } from 'react-native';
import { describeError } from '@/components/account/form-errors';
import { QueryContent } from '@/components/account/query-states';
import { Card } from '@/components/ui/card';
import { AppText } from '@/components/ui/text';
import { useToast } from '@/components/ui/toast';
import { colors, spacing } from '@/components/ui/theme';
import { useMailPreferencesQuery, useUpdateMailPreferencesMutation } from '@/lib/api/exchange';
import type { MeResponse } from '@/lib/schemas/auth';
import type { MailPreferences } from '@/lib/schemas/exchange';
import { roleAtLeast } from '@/lib/schemas/groups';

/** E-mail about reviews: curators hear of new submissions, submitters of decisions. Each can be turned off. */
export function MailPreferencesCard({ me }: { me: Pick<MeResponse, 'memberships'> }) {
  const query = useMailPreferencesQuery();
  const update = useUpdateMailPreferencesMutation();
  const toast = useToast();
  const save = (change: Partial<MailPreferences>) =>
    update.mutate(change, {
      onSuccess: () => toast('Saved: your e-mail choices.'),
      onError: (error) => toast(`Not saved: ${describeError(error)}`, 'error'),
    });
  const curator = me.memberships.some((m) => roleAtLeast(m.role, 'curator'));
  return (
    <Card title="E-mail" testID="mail-preferences">
      <QueryContent query={query} loadingLabel="Loading your e-mail choices…" errorTitle="Your e-mail choices could not be loaded" testID="mail-preferences">
        {(prefs: MailPreferences) => (
          <View style={styles.list}>
            <PreferenceSwitch
              label="New submissions to review"
              detail={curator ? 'A message when an entry of your group is submitted for review.' : 'For curators and admins: you are not a curator in any group yet.'}
              value={prefs.reviewSubmissions}
              onChange={(reviewSubmissions) => save({ reviewSubmissions })}
              disabled={!curator}
              testID="mail-pref-submissions"
            />
            <PreferenceSwitch
              label="Decisions on my entries"
              detail="A message when a curator accepts, returns or declines something you submitted."
              value={prefs.reviewDecisions}
              onChange={(reviewDecisions) => save({ reviewDecisions })}
              testID="mail-pref-decisions"
            />
            {update.isError ? (
              <AppText variant="caption" tone="danger" testID="mail-pref-error">
                Not saved: {describeError(update.error)}
              </AppText>
            ) : null}
          </View>
        )}
      </QueryContent>
    </Card>
  );
}

/**
 * A switch the whole row operates: the label and its explanation are part of the target (at least
 * 44 px tall), and the track is drawn here rather than with the platform switch, whose 20 px control
 * is too small to tap.
 */
function PreferenceSwitch({ label, detail, value, onChange, disabled, testID }: {
  label: string;
  detail: string;
  value: boolean;
  onChange: (next: boolean) => void;
  disabled?: boolean;
  testID: string;
}) {
  return (
    <Pressable
      accessibilityRole="switch"
      accessibilityState={{ checked: value, disabled: !!disabled }}
      aria-checked={value}
      disabled={disabled}
      onPress={() => onChange(!value)}
      style={({ pressed }) => [styles.row, pressed ? styles.pressed : null]}
      testID={testID}
    >
      <View style={styles.text}>
        <AppText>{label}</AppText>
        <AppText variant="caption" tone="muted">{detail}</AppText>
      </View>
      <View style={[styles.track, value ? styles.trackOn : null, disabled ? styles.trackDisabled : null]} aria-hidden>
        <View style={[styles.thumb, value ? styles.thumbOn : null]} />
      </View>
    </Pressable>
  );
}

const styles = StyleSheet.create({
  list: { gap: spacing.md },
  row: { flexDirection: 'row', alignItems: 'center', gap: spacing.md, minHeight: 44, borderRadius: 8 },
  pressed: { opacity: 0.8 },
  track: { width: 44, height: 26, borderRadius: 13, backgroundColor: colors.lineStrong, padding: 3, justifyContent: 'center' },
  trackOn: { backgroundColor: colors.accent },
  trackDisabled: { opacity: 0.45 },
  thumb: { width: 20, height: 20, borderRadius: 10, backgroundColor: colors.card },
  thumbOn: { alignSelf: 'flex-end' },
  text: { flex: 1, gap: 2 },
});
