import { Link, usePathname } from 'expo-router';
import { TabList, TabSlot, TabTrigger, Tabs, type TabTriggerSlotProps } from 'expo-router/ui';
import { forwardRef } from 'react';
import { Pressable, StyleSheet, View } from 'react-native';
import { useSafeAreaInsets } from 'react-native-safe-area-context';
import { useCanReview } from '@/lib/api/viewer';
import { PageTitle } from '@/components/ui/page-title';
import { AppText } from '@/components/ui/text';
import { colors, fonts, spacing } from '@/components/ui/theme';
import { useWideLayout } from '@/components/ui/use-wide-layout';
import { NavGlyph, type NavGlyphName } from './nav-glyph';
import { sectionTitleParts } from './section-title';

interface Section {
  name: NavGlyphName;
  href: '/check' | '/route' | '/library' | '/review' | '/account';
  label: string;
  hint: string;
  /** Offered only to people who curate or run a group (the route still answers everyone, and says why). */
  curatorsOnly?: boolean;
}

/** The sections this visitor is offered: Review only for curators and admins. */
export function useVisibleSections(): Section[] {
  const canReview = useCanReview();
  return sections.filter((section) => !section.curatorsOnly || canReview);
}

export const sections: Section[] = [
  { name: 'check', href: '/check', label: 'Check', hint: 'One complex: labile or inert' },
  { name: 'route', href: '/route', label: 'Route', hint: 'A redox pair and Marcus' },
  { name: 'library', href: '/library', label: 'Library', hint: 'The group’s cited data' },
  { name: 'review', href: '/review', label: 'Review', hint: 'Curators’ queue', curatorsOnly: true },
  { name: 'account', href: '/account', label: 'Account', hint: 'Sign-in and groups' },
];

/**
 * The five tabs: a bottom bar on a phone, a side rail with the content beside it on a wide screen.
 * Headless tabs from expo-router/ui so the two layouts share one set of routes.
 */
export function AppShell() {
  const wide = useWideLayout();
  const insets = useSafeAreaInsets();
  const pathname = usePathname();
  const visible = useVisibleSections();
  return (
    <Tabs style={StyleSheet.flatten([styles.root, wide ? styles.rootWide : null])}>
      {/* The section's title; a screen that knows more (Check's formula) sets a deeper one that wins. */}
      <PageTitle parts={sectionTitleParts(pathname)} />
      <TabSlot style={styles.slot} />
      <TabList asChild>
        <View
          style={wide ? styles.rail : StyleSheet.flatten([styles.bar, { paddingBottom: Math.max(insets.bottom, spacing.xs) }])}
          // Sections of the app are places to go (links), not panels of one page (tabs).
          role="navigation"
          aria-label="Sections"
          testID={wide ? 'nav-rail' : 'nav-bar'}
        >
          {wide ? <Brand /> : null}
          {/* The landing view is a route of the tab set but has no button of its own. */}
          <TabTrigger name="index" href="/" style={styles.hidden} />
          {/* The order-of-addition planner is reached from Check (square-planar complexes), not from the bar. */}
          <TabTrigger name="planner" href="/planner" style={styles.hidden} />
          {sections.map((section) =>
            visible.includes(section) ? (
              <TabTrigger key={section.name} name={section.name} href={section.href} asChild>
                <NavItem section={section} wide={wide} />
              </TabTrigger>
            ) : (
              // The route stays part of the tab set (an address still opens it) without a button.
              <TabTrigger key={section.name} name={section.name} href={section.href} style={styles.hidden} />
            ),
          )}
        </View>
      </TabList>
    </Tabs>
  );
}

function Brand() {
  return (
    <Link href="/" asChild>
      <Pressable style={styles.brand} accessibilityRole="link">
        <AppText variant="title" tone="inverse" style={styles.brandText}>Sphereline</AppText>
        <AppText variant="caption" tone="inverse" style={styles.brandTag}>
          labile or inert · bridged or not
        </AppText>
      </Pressable>
    </Link>
  );
}

const NavItem = forwardRef<View, TabTriggerSlotProps & { section: Section; wide: boolean }>(
  function NavItem({ section, wide, isFocused, ...pressable }, ref) {
    const color = wide
      ? colors.railInk
      : isFocused
        ? colors.accent
        : colors.muted;
    return (
      <Pressable
        ref={ref}
        {...pressable}
        accessibilityRole="link"
        aria-current={isFocused ? 'page' : undefined}
        testID={`nav-${section.name}`}
        style={[
          wide ? styles.railItem : styles.barItem,
          wide && isFocused ? styles.railItemActive : null,
        ]}
      >
        <NavGlyph name={section.name} color={color} />
        <View style={wide ? styles.railLabels : null}>
          <AppText
            variant={wide ? 'body' : 'caption'}
            style={[{ color }, isFocused ? styles.focusedLabel : null]}
          >
            {section.label}
          </AppText>
          {wide ? (
            <AppText variant="caption" style={styles.railHint}>{section.hint}</AppText>
          ) : null}
        </View>
      </Pressable>
    );
  },
);

const styles = StyleSheet.create({
  root: { flex: 1, flexDirection: 'column', backgroundColor: colors.paper },
  rootWide: { flexDirection: 'row-reverse' },
  slot: { flex: 1 },
  hidden: { display: 'none' },
  bar: {
    flexDirection: 'row',
    justifyContent: 'space-around',
    backgroundColor: colors.card,
    borderTopWidth: 1,
    borderTopColor: colors.line,
    paddingTop: spacing.xs,
  },
  barItem: { flex: 1, alignItems: 'center', paddingVertical: spacing.xs, gap: 2 },
  rail: {
    width: 232,
    flexDirection: 'column',
    justifyContent: 'flex-start',
    backgroundColor: colors.rail,
    paddingVertical: spacing.xl,
    paddingHorizontal: spacing.md,
    gap: spacing.xs,
  },
  brand: { paddingHorizontal: spacing.sm, paddingBottom: spacing.xl },
  brandText: { color: colors.railInk },
  brandTag: { color: colors.railInkSoft },
  railItem: {
    flexDirection: 'row',
    alignItems: 'center',
    gap: spacing.md,
    paddingVertical: spacing.sm,
    paddingHorizontal: spacing.sm,
    borderRadius: 10,
  },
  railItemActive: { backgroundColor: colors.railActive },
  railLabels: { flexShrink: 1 },
  railHint: { color: colors.railInkSoft },
  focusedLabel: { fontFamily: fonts.strong },
});
