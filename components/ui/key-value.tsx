import { StyleSheet, View } from 'react-native';
import { AppText } from './text';
import { spacing } from './theme';

/** A compact grid of labelled values (identity cards, conditions). */
export function KeyValueGrid({ items, testID }: { items: { label: string; value: string }[]; testID?: string }) {
  return (
    <View style={styles.grid} testID={testID}>
      {items.map((item) => (
        <View key={item.label} style={styles.cell}>
          <AppText variant="caption" tone="muted">{item.label}</AppText>
          <AppText variant="lead">{item.value}</AppText>
        </View>
      ))}
    </View>
  );
}

const styles = StyleSheet.create({
  grid: { flexDirection: 'row', flexWrap: 'wrap', rowGap: spacing.md, columnGap: spacing.xl },
  cell: { minWidth: 96 },
});
