import { Pressable, StyleSheet, View } from 'react-native';
import type { Role } from '@/lib/schemas/groups';
import { AppText } from '@/components/ui/text';
import { colors, fonts, radius, spacing } from '@/components/ui/theme';

/** The invented Larkspur Coordination Lab's people, seeded on demo servers only. */
export const DEMO_PASSWORD = 'sphereline-demo';

export const demoAccounts: { role: Role; email: string; who: string }[] = [
  { role: 'admin', email: 'admin@larkspur.example.org', who: 'principal investigator' },
  { role: 'curator', email: 'curator@larkspur.example.org', who: 'lab manager' },
  { role: 'contributor', email: 'contributor@larkspur.example.org', who: 'graduate student' },
  { role: 'viewer', email: 'viewer@larkspur.example.org', who: 'visiting collaborator' },
];

/** Tap a person of the demo lab to fill the sign-in form with their address and the demo password. */
export function DemoLabPanel({ onPick }: { onPick: (email: string, password: string) => void }) {
  return (
    <View style={styles.panel} testID="demo-lab">
      <View style={styles.head}>
        <AppText variant="label" style={styles.tag}>Demo lab</AppText>
        <AppText variant="caption" tone="soft" style={styles.note}>
          Invented accounts of the fictional Larkspur Coordination Lab, present on demonstration servers
          only. Tap one to fill the form; the password for all four is “{DEMO_PASSWORD}”.
        </AppText>
      </View>
      {demoAccounts.map((account) => (
        <Pressable
          key={account.role}
          accessibilityRole="button"
          accessibilityHint="Fills in the sign-in form with this demo account"
          onPress={() => onPick(account.email, DEMO_PASSWORD)}
          testID={`demo-sign-in-${account.role}`}
          style={({ pressed }) => StyleSheet.flatten([styles.row, pressed ? styles.pressed : null])}
        >
          <AppText style={styles.role}>
            {account.role}
            <AppText variant="caption" tone="muted"> · {account.who}</AppText>
          </AppText>
          <AppText style={styles.email} numberOfLines={1}>{account.email}</AppText>
        </Pressable>
      ))}
    </View>
  );
}

const styles = StyleSheet.create({
  panel: {
    borderWidth: 1,
    borderStyle: 'dashed',
    borderColor: colors.notice,
    backgroundColor: colors.noticeSoft,
    borderRadius: radius.lg,
    padding: spacing.lg,
    gap: spacing.sm,
  },
  head: { gap: spacing.xs, marginBottom: spacing.xs },
  tag: { color: colors.notice },
  note: { lineHeight: 18 },
  row: {
    gap: 2,
    paddingVertical: spacing.sm,
    paddingHorizontal: spacing.sm,
    borderRadius: radius.md,
    backgroundColor: colors.card,
    borderWidth: 1,
    borderColor: colors.line,
  },
  pressed: { backgroundColor: colors.accentSoft },
  role: { fontFamily: fonts.strong, color: colors.accent },
  email: { fontFamily: fonts.mono, fontSize: 13 },
});
