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
 * citations as BibTeX or RIS; with rows ticked in the table, only those ("Export selected", their
 * ids go with the link and the server keeps only the ones the person may see). On the web each
 * choice is a plain download link (the session cookie goes with it); elsewhere the system opens
 * the address.
 */
export function ExportMenu({ filters, selectedIds = [], onClearSelection }: {
  filters: ComplexFilters;
  /** Ticked rows: when there are any, the export is of these alone. */
  selectedIds?: readonly string[];
  onClearSelection?: () => void;
}) {
  const [open, setOpen] = useState(false);
  const chosen = selectedIds.length;
  const label = chosen > 0 ? `Export selected (${chosen})` : 'Export';
  const scope: ComplexFilters = chosen > 0 ? { ids: [...selectedIds] } : filters;
  return (
    <View style={styles.wrap}>
      <Button
        label={open ? 'Close' : label}
        kind="quiet"
        onPress={() => setOpen(!open)}
        testID="library-export"
        accessibilityLabel={open ? 'Close the export choices' : chosen > 0 ? `Export the ${chosen} selected entries` : 'Export the listed entries'}
      />
      {open ? (
        <View style={styles.menu} testID="library-export-menu">
          <AppText variant="caption" tone="muted">
            {chosen > 0 ? `The ${chosen === 1 ? 'selected entry' : `${chosen} selected entries`}:` : 'The entries matching the current search and filters:'}
          </AppText>
          {FORMATS.map((format) => (
            <ExportLink key={format} url={exportUrl(format, scope)} label={exportFormats[format].label} testID={`library-export-${format}`} />
          ))}
          {chosen > 0 && onClearSelection ? (
            <Button label="Clear selection" kind="quiet" onPress={onClearSelection} testID="library-clear-selection" />
          ) : null}
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
  // 44 px tall rows: each format is a tap target of its own.
  link: { fontFamily: fonts.strong, color: colors.accent, textDecorationLine: 'underline', minHeight: 44, paddingVertical: spacing.sm },
});
