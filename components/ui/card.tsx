import type { ReactNode } from 'react';
import { StyleSheet, View, type ViewStyle, type StyleProp } from 'react-native';
import { AppText } from './text';
import { colors, radius, spacing } from './theme';

export function Card({ title, children, style, testID, nativeID }: {
  title?: string;
  /** The section's id in the page (jump bars link to it). */
  nativeID?: string;
  children: ReactNode;
  style?: StyleProp<ViewStyle>;
  testID?: string;
}) {
  return (
    <View style={[styles.card, style]} testID={testID} nativeID={nativeID}>
      {title ? <AppText variant="label" tone="muted">{title}</AppText> : null}
      {children}
    </View>
  );
}

const styles = StyleSheet.create({
  card: {
    backgroundColor: colors.card,
    borderRadius: radius.lg,
    borderWidth: 1,
    borderColor: colors.line,
    padding: spacing.lg,
    gap: spacing.sm,
  },
});
