import { StyleSheet, View } from 'react-native';
import Svg, { Path, Circle } from 'react-native-svg';
import { AppText } from './text';
import { colors, radius, spacing } from './theme';

/** Safety notes: always visible, never collapsed, always deferring to the institution's rules. */
export function CautionBox({ cautions, testID }: { cautions: string[]; testID?: string }) {
  if (cautions.length === 0) return null;
  return (
    <View style={styles.box} testID={testID} accessibilityRole="alert">
      <View style={styles.head}>
        <Svg width={18} height={18} viewBox="0 0 20 20">
          <Path d="M10 2 L19 18 H1 Z" fill={colors.hazard} />
          <Path d="M10 7.5 V12" stroke={colors.card} strokeWidth={2} strokeLinecap="round" />
          <Circle cx={10} cy={15} r={1.2} fill={colors.card} />
        </Svg>
        <AppText variant="label" style={styles.title}>Handle with care</AppText>
      </View>
      {cautions.map((caution) => (
        <AppText key={caution} style={styles.item}>{caution}</AppText>
      ))}
    </View>
  );
}

const styles = StyleSheet.create({
  box: {
    backgroundColor: colors.hazardSoft,
    borderLeftWidth: 4,
    borderLeftColor: colors.hazard,
    borderRadius: radius.md,
    padding: spacing.lg,
    gap: spacing.sm,
  },
  head: { flexDirection: 'row', alignItems: 'center', gap: spacing.sm },
  title: { color: colors.hazard },
  item: { color: colors.ink },
});
