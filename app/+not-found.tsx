import { Link } from 'expo-router';
import { Pressable, StyleSheet, View } from 'react-native';
import { Screen } from '@/components/ui/screen';
import { EmptyState } from '@/components/ui/empty-state';
import { PageTitle } from '@/components/ui/page-title';
import { AppText } from '@/components/ui/text';
import { spacing } from '@/components/ui/theme';

export default function NotFound() {
  return (
    <Screen maxWidth={720}>
      <PageTitle parts={['Page not found']} />
      <View style={styles.body} testID="not-found">
        <EmptyState title="No such page" body="This address is not part of Sphereline. It may have been mistyped, or the page has moved." />
        <View style={styles.links}>
          <Link href="/" asChild>
            <Pressable accessibilityRole="link" style={styles.link} testID="not-found-home">
              <AppText tone="accent" style={styles.linkText}>Go to the start page</AppText>
            </Pressable>
          </Link>
          <Link href="/check" asChild>
            <Pressable accessibilityRole="link" style={styles.link} testID="not-found-check">
              <AppText tone="accent" style={styles.linkText}>Check a complex</AppText>
            </Pressable>
          </Link>
        </View>
      </View>
    </Screen>
  );
}

const styles = StyleSheet.create({
  body: { gap: spacing.md },
  links: { flexDirection: 'row', flexWrap: 'wrap', columnGap: spacing.lg },
  // A 44 px tall target for a text link.
  link: { minHeight: 44, justifyContent: 'center' },
  linkText: { textDecorationLine: 'underline' },
});
