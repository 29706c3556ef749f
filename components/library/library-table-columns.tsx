import { useState } from 'react';
import { Pressable, StyleSheet, View } from 'react-native';
import { Button } from '@/components/ui/button';
import { AppText } from '@/components/ui/text';
import { colors, fonts, radius, spacing } from '@/components/ui/theme';
import { useLibraryPreferencesQuery, useSaveLibraryColumnsMutation } from '@/lib/api/library';
import { libraryColumnKeys, type LibraryColumn } from '@/lib/schemas/library';
import { COLUMN_SPECS } from './library-table';

/** Columns someone can hide; the formula names the row and always shows. */
export const HIDEABLE_COLUMNS = libraryColumnKeys.filter((column) => column !== 'formula');

/** The shown columns in table order, from a stored choice (null or unreadable: all of them). */
export function shownColumns(stored: readonly LibraryColumn[] | null | undefined): LibraryColumn[] {
  if (!stored) return [...libraryColumnKeys];
  return libraryColumnKeys.filter((column) => column === 'formula' || stored.includes(column));
}

/** The person's columns (stored on the server, so they follow them) and a setter. */
export function useLibraryColumns(): { columns: LibraryColumn[]; setColumns: (next: LibraryColumn[]) => void } {
  const preferences = useLibraryPreferencesQuery();
  const save = useSaveLibraryColumnsMutation();
  return {
    columns: shownColumns(preferences.data?.libraryColumns),
    setColumns: (next) => save.mutate(next.length === libraryColumnKeys.length ? null : next),
  };
}

/** "Columns": a switch per hideable column. */
export function LibraryColumnsMenu({ columns, onChange }: { columns: readonly LibraryColumn[]; onChange: (next: LibraryColumn[]) => void }) {
  const [open, setOpen] = useState(false);
  const toggle = (column: LibraryColumn) => {
    const next = columns.includes(column) ? columns.filter((c) => c !== column) : [...columns, column];
    onChange(libraryColumnKeys.filter((c) => next.includes(c)));
  };
  return (
    <View style={styles.wrap}>
      <Button
        label={open ? 'Close' : 'Columns'}
        kind="quiet"
        onPress={() => setOpen(!open)}
        accessibilityLabel={open ? 'Close the column choice' : 'Choose the table’s columns'}
        testID="library-columns"
      />
      {open ? (
        <View style={styles.menu} testID="library-columns-menu" role="group" aria-label="Columns shown">
          {HIDEABLE_COLUMNS.map((column) => {
            const on = columns.includes(column);
            const spec = COLUMN_SPECS[column];
            return (
              <Pressable key={column} role="switch" aria-checked={on} aria-label={spec.spoken ?? spec.header} onPress={() => toggle(column)} style={styles.option} testID={`library-columns-${column}`}>
                <View style={StyleSheet.flatten([styles.box, on ? styles.boxOn : null])}>{on ? <AppText style={styles.tick}>✓</AppText> : null}</View>
                <AppText>{spec.spoken ?? spec.header}</AppText>
              </Pressable>
            );
          })}
        </View>
      ) : null}
    </View>
  );
}

const styles = StyleSheet.create({
  wrap: { position: 'relative' },
  menu: {
    position: 'absolute',
    top: 48,
    right: 0,
    zIndex: 10,
    minWidth: 260,
    paddingVertical: spacing.xs,
    borderWidth: 1,
    borderColor: colors.lineStrong,
    borderRadius: radius.md,
    backgroundColor: colors.card,
  },
  option: { flexDirection: 'row', alignItems: 'center', gap: spacing.sm, minHeight: 44, paddingHorizontal: spacing.md },
  box: { width: 18, height: 18, borderRadius: 4, borderWidth: 1.5, borderColor: colors.lineStrong, alignItems: 'center', justifyContent: 'center' },
  boxOn: { backgroundColor: colors.accent, borderColor: colors.accent },
  tick: { color: colors.accentInk, fontSize: 13, lineHeight: 16, fontFamily: fonts.strong },
});
