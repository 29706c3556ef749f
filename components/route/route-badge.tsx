import { StyleSheet, View } from 'react-native';
import Svg, { Circle, Line, Path } from 'react-native-svg';
import type { RouteKind } from '@/lib/chem/route-types';
import { AppText } from '@/components/ui/text';
import { fonts, radius, routeColors, spacing } from '@/components/ui/theme';

const LOOK: Record<RouteKind, { fg: string; bg: string; word: string }> = {
  'inner-sphere': { ...routeColors['inner-sphere'], word: 'inner-sphere' },
  'outer-sphere': { ...routeColors['outer-sphere'], word: 'outer-sphere' },
  either: { ...routeColors.either, word: 'either route' },
};

/** Route verdict: two spheres joined (bridged), apart with an arc (outer), or joined by dots (either). */
export function RouteBadge({ route }: { route: RouteKind }) {
  const look = LOOK[route];
  return (
    <View style={[styles.badge, { backgroundColor: look.bg }]} testID={`route-${route}`} accessibilityRole="image" accessibilityLabel={`Route: ${look.word}`}>
      <Svg width={34} height={18} viewBox="0 0 34 18">
        <Circle cx={7} cy={10} r={6} stroke={look.fg} strokeWidth={1.8} fill="none" />
        <Circle cx={27} cy={10} r={6} stroke={look.fg} strokeWidth={1.8} fill="none" />
        {route === 'inner-sphere' ? <Line x1={13} y1={10} x2={21} y2={10} stroke={look.fg} strokeWidth={3} /> : null}
        {route === 'outer-sphere' ? (
          <Path d="M 24 4 Q 17 -1 10 4" stroke={look.fg} strokeWidth={1.6} strokeDasharray="2 2" fill="none" />
        ) : null}
        {route === 'either' ? <Line x1={13} y1={10} x2={21} y2={10} stroke={look.fg} strokeWidth={2} strokeDasharray="1.5 2" /> : null}
      </Svg>
      <AppText style={[styles.word, { color: look.fg }]}>{look.word}</AppText>
    </View>
  );
}

const styles = StyleSheet.create({
  badge: {
    flexDirection: 'row',
    alignItems: 'center',
    gap: spacing.sm,
    paddingVertical: spacing.xs,
    paddingHorizontal: spacing.md,
    borderRadius: radius.pill,
    alignSelf: 'flex-start',
  },
  word: { fontFamily: fonts.strong, fontSize: 16 },
});
