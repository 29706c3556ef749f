import { Pressable, StyleSheet } from 'react-native';
import { AppText } from './text';
import { colors, fonts, radius, spacing } from './theme';

/** A small tappable choice (examples, geometry override, filters). */
export function Chip({ label, onPress, selected, mono, testID }: {
  label: string;
  onPress: () => void;
  selected?: boolean;
  mono?: boolean;
  testID?: string;
}) {
  return (
    <Pressable
      accessibilityRole="button"
      accessibilityState={{ selected: !!selected }}
      onPress={onPress}
      testID={testID}
      style={({ pressed }) => [styles.chip, selected && styles.selected, pressed && styles.pressed]}
    >
      <AppText variant="caption" style={[styles.label, mono && styles.mono, selected && styles.selectedLabel]}>
        {label}
      </AppText>
    </Pressable>
  );
}

const styles = StyleSheet.create({
  chip: {
    borderWidth: 1,
    borderColor: colors.lineStrong,
    borderRadius: radius.pill,
    // 44 px tall: a tap target a thumb can hit (WCAG 2.2 SC 2.5.5).
    minHeight: 44,
    minWidth: 44,
    alignItems: 'center',
    justifyContent: 'center',
    paddingVertical: spacing.xs,
    paddingHorizontal: spacing.md,
    backgroundColor: colors.card,
  },
  selected: { backgroundColor: colors.accent, borderColor: colors.accent },
  pressed: { opacity: 0.75 },
  label: { color: colors.ink, fontSize: 13 },
  mono: { fontFamily: fonts.mono },
  selectedLabel: { color: colors.accentInk },
});
