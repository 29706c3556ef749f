import { StyleSheet, View } from 'react-native';
import { AppText } from './text';
import { colors, radius, spacing } from './theme';

/** Says plainly what is (not yet) here and what will be. */
export function EmptyState({ title, body, testID }: { title: string; body: string; testID?: string }) {
  return (
    <View style={styles.box} testID={testID}>
      <AppText variant="title">{title}</AppText>
      <AppText tone="soft">{body}</AppText>
    </View>
  );
}

const styles = StyleSheet.create({
  box: {
    borderWidth: 1,
    borderStyle: 'dashed',
    borderColor: colors.lineStrong,
    borderRadius: radius.lg,
    padding: spacing.xl,
    gap: spacing.sm,
  },
});
