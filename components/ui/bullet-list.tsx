import { StyleSheet, View } from 'react-native';
import { TypesetText } from './typeset-text';
import { colors, spacing } from './theme';

export function BulletList({ items, testID }: { items: string[]; testID?: string }) {
  return (
    <View style={styles.list} testID={testID}>
      {items.map((item) => (
        <View key={item} style={styles.row}>
          <View style={styles.dot} />
          <TypesetText style={styles.text}>{item}</TypesetText>
        </View>
      ))}
    </View>
  );
}

const styles = StyleSheet.create({
  list: { gap: spacing.sm },
  row: { flexDirection: 'row', gap: spacing.sm, alignItems: 'flex-start' },
  dot: { width: 6, height: 6, borderRadius: 3, backgroundColor: colors.accent, marginTop: 8 },
  text: { flex: 1 },
});
