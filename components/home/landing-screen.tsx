import { Link } from 'expo-router';
import { Pressable, StyleSheet, View } from 'react-native';
import { usePreloadDeferredScreens } from '@/components/deferred/deferred';
import { useVisibleSections } from '@/components/shell/app-shell';
import { NavGlyph } from '@/components/shell/nav-glyph';
import { Card } from '@/components/ui/card';
import { Screen } from '@/components/ui/screen';
import { AppText } from '@/components/ui/text';
import { colors, spacing } from '@/components/ui/theme';
import { useWideLayout } from '@/components/ui/use-wide-layout';

/** The landing view: what Sphereline is, and a door to each part of it. */
export function LandingScreen() {
  const wide = useWideLayout();
  // Every door here but Check leads to the deferred screens: fetch them while the visitor reads.
  usePreloadDeferredScreens();
  const sections = useVisibleSections();
  return (
    <Screen maxWidth={960}>
      <View style={styles.hero} testID="landing">
        <AppText variant="display" accessibilityRole="header">Sphereline</AppText>
        <AppText variant="lead" tone="soft">
          Will a complex hold its ligands or swap them in seconds, and will two complexes trade an
          electron through a bridge or across their outer spheres? Answers from the ligand field,
          backed by your group’s reviewed, cited data.
        </AppText>
      </View>
      <View style={[styles.grid, wide ? styles.gridWide : null]}>
        {sections.map((section) => (
          <Link key={section.name} href={section.href} asChild>
            <Pressable style={StyleSheet.flatten([styles.tile, wide ? styles.tileWide : null])} accessibilityRole="link">
              <Card>
                <View style={styles.tileHead}>
                  <NavGlyph name={section.name} color={colors.accent} size={26} />
                  <AppText variant="title">{section.label}</AppText>
                </View>
                <AppText tone="soft">{section.hint}</AppText>
              </Card>
            </Pressable>
          </Link>
        ))}
      </View>
      <AppText variant="caption" tone="muted">
        Verdicts are rules of thumb from ligand-field theory, not measurements; where the library holds a
        measured value, it is shown beside the prediction and decides.
      </AppText>
    </Screen>
  );
}

const styles = StyleSheet.create({
  hero: { gap: spacing.md, paddingVertical: spacing.lg },
  grid: { gap: spacing.md },
  gridWide: { flexDirection: 'row', flexWrap: 'wrap' },
  tile: {},
  tileWide: { width: '48%' },
  tileHead: { flexDirection: 'row', alignItems: 'center', gap: spacing.sm },
});
