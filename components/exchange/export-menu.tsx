import { useState } from 'react';
import { Linking, Platform, StyleSheet, View } from 'react-native';
import { Button } from '@/components/ui/button';
import { AppText } from '@/components/ui/text';
import { colors, fonts, radius, spacing } from '@/components/ui/theme';
import { exportFormats, exportUrl, type ExportFormat } from '@/lib/api/exchange';
import type { ComplexFilters } from '@/lib/api/library';

const FORMATS = Object.keys(exportFormats) as ExportFormat[];

/**
 * "Export": the entries the list shows (same search and filters, every page) as CSV, or their
 * citations as BibTeX or RIS. On the web each choice is a plain download link (the session cookie
 * goes with it); elsewhere the system opens the address.
 */
export function ExportMenu({ filters }: { filters: ComplexFilters }) {
  const [open, setOpen] = useState(false);
  return (
    <View style={styles.wrap}>
      <Button label={open ? 'Close export' : 'Export'} kind="quiet" onPress={() => setOpen(!open)} testID="library-export" accessibilityLabel="Export the listed entries" />
      {open ? (
        <View style={styles.menu} testID="library-export-menu">
          <AppText variant="caption" tone="muted">The entries matching the current search and filters:</AppText>
          {FORMATS.map((format) => (
            <ExportLink key={format} url={exportUrl(format, filters)} label={exportFormats[format].label} testID={`library-export-${format}`} />
          ))}
        </View>
      ) : null}
    </View>
  );
}

/** react-native-web renders a Text with href as <a>; hrefAttrs.download makes it a download. */
function ExportLink({ url, label, testID }: { url: string; label: string; testID: string }) {
  const web = Platform.OS === 'web';
  const anchor = { href: url, hrefAttrs: { download: true } };
  return (
    <AppText
      {...anchor}
      accessibilityRole="link"
      onPress={web ? undefined : () => void Linking.openURL(url)}
      style={styles.link}
      testID={testID}
    >
      {label} ↓
    </AppText>
  );
}

const styles = StyleSheet.create({
  wrap: { position: 'relative' },
  menu: {
    marginTop: spacing.xs,
    gap: spacing.sm,
    padding: spacing.md,
    borderWidth: 1,
    borderColor: colors.line,
    borderRadius: radius.md,
    backgroundColor: colors.card,
  },
  link: { fontFamily: fonts.strong, color: colors.accent, textDecorationLine: 'underline' },
});
