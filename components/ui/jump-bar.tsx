import { Platform, Pressable, StyleSheet, View, type ViewStyle } from 'react-native';
import { AppText } from './text';
import { colors, radius, spacing } from './theme';

export interface JumpTarget {
  /** The nativeID of the section (its id in the page). */
  id: string;
  label: string;
}

/**
 * Moves to a section of a long page: scrolls it to the top and hands it the keyboard focus, so the
 * next Tab continues from there. Web only (the product's target); elsewhere nothing happens.
 */
export function jumpTo(id: string): void {
  if (Platform.OS !== 'web' || typeof document === 'undefined') return;
  const section = document.getElementById(id);
  if (!section) return;
  section.scrollIntoView({ block: 'start', behavior: 'smooth' });
  if (!section.hasAttribute('tabindex')) section.setAttribute('tabindex', '-1');
  section.focus({ preventScroll: true });
}

/** "Verdict · Why · Ligand field · Safety": a row of links to the sections of a long page, kept in view. */
export function JumpBar({ targets, label, testID }: { targets: JumpTarget[]; label: string; testID?: string }) {
  return (
    <View role="navigation" aria-label={label} style={[styles.bar, Platform.OS === 'web' ? (sticky as ViewStyle) : null]} testID={testID}>
      {targets.map((target) => (
        <Pressable
          key={target.id}
          accessibilityRole="link"
          accessibilityLabel={`Jump to ${target.label}`}
          onPress={() => jumpTo(target.id)}
          style={({ pressed }) => [styles.link, pressed ? styles.pressed : null]}
          testID={`jump-${target.id}`}
        >
          <AppText style={styles.text}>{target.label}</AppText>
        </Pressable>
      ))}
    </View>
  );
}

// position: sticky is a web style react-native's types do not list; the bar stays at the top of the page.
const sticky = { position: 'sticky', top: 0, zIndex: 5 } as unknown as ViewStyle;

const styles = StyleSheet.create({
  bar: {
    flexDirection: 'row',
    flexWrap: 'wrap',
    columnGap: spacing.xs,
    backgroundColor: colors.paper,
    borderBottomWidth: 1,
    borderBottomColor: colors.line,
    marginHorizontal: -spacing.xs,
  },
  link: { minHeight: 44, minWidth: 44, justifyContent: 'center', paddingHorizontal: spacing.sm, borderRadius: radius.sm },
  pressed: { backgroundColor: colors.accentSoft },
  text: { color: colors.accent, fontWeight: '600' },
});
