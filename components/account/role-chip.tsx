import { StyleSheet, View } from 'react-native';
import type { Role } from '@/lib/schemas/groups';
import { Chip } from '@/components/ui/chip';
import { AppText } from '@/components/ui/text';
import { colors, radius, spacing } from '@/components/ui/theme';
import { roleLabels } from './account-format';
import { roles } from '@/lib/schemas/groups';

/** A role as a quiet tag: admins get a filled tag so the people who manage the group stand out. */
export function RoleTag({ role, testID }: { role: Role; testID?: string }) {
  const strong = role === 'admin' || role === 'curator';
  return (
    <View style={StyleSheet.flatten([styles.tag, strong ? styles.tagStrong : null])} testID={testID}>
      <AppText variant="caption" style={strong ? styles.tagStrongText : styles.tagText}>{roleLabels[role]}</AppText>
    </View>
  );
}

/** Choose one of the four roles (a row of chips: every choice visible, one tap). */
export function RolePicker({ value, onChange, disabled, testIDPrefix, label }: {
  value: Role;
  onChange: (role: Role) => void;
  disabled?: boolean;
  testIDPrefix: string;
  label: string;
}) {
  return (
    <View style={styles.picker} accessibilityRole="radiogroup" accessibilityLabel={label} testID={testIDPrefix}>
      {roles.map((role) => (
        <Chip
          key={role}
          label={roleLabels[role]}
          selected={role === value}
          onPress={() => {
            if (!disabled && role !== value) onChange(role);
          }}
          testID={`${testIDPrefix}-${role}`}
        />
      ))}
    </View>
  );
}

const styles = StyleSheet.create({
  tag: {
    alignSelf: 'flex-start',
    borderWidth: 1,
    borderColor: colors.lineStrong,
    borderRadius: radius.sm,
    paddingHorizontal: spacing.sm,
    paddingVertical: 2,
  },
  tagStrong: { backgroundColor: colors.accentSoft, borderColor: colors.accent },
  tagText: { color: colors.inkSoft },
  tagStrongText: { color: colors.accent, fontWeight: '600' },
  picker: { flexDirection: 'row', flexWrap: 'wrap', gap: spacing.xs },
});
