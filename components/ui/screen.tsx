import type { ReactNode } from 'react';
import { ScrollView, StyleSheet, View } from 'react-native';
import { colors, spacing } from './theme';

/** A scrolling page with the content column capped for reading on wide screens. */
export function Screen({ children, maxWidth = 1180 }: { children: ReactNode; maxWidth?: number }) {
  return (
    <ScrollView style={styles.scroll} contentContainerStyle={styles.content}>
      <View style={[styles.column, { maxWidth }]}>{children}</View>
    </ScrollView>
  );
}

const styles = StyleSheet.create({
  scroll: { flex: 1, backgroundColor: colors.paper },
  content: { paddingHorizontal: spacing.lg, paddingVertical: spacing.xl, alignItems: 'center' },
  column: { width: '100%', gap: spacing.lg },
});
