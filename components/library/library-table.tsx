import { Pressable, ScrollView, StyleSheet, View, type ViewStyle } from 'react-native';
import type { ReactNode } from 'react';
import { AppText } from '@/components/ui/text';
import { colors, fonts, spacing } from '@/components/ui/theme';
import { StatusPill, VerdictBadge } from '@/components/ui/verdict-badge';
import { toDisplayFormula } from '@/lib/chem/display-formula';
import { formatDateTime, formatDuration, formatInteger, formatRecorded } from '@/lib/chem/number-format';
import type { ComplexListItem, LibraryColumn, LibrarySort, SortDirection } from '@/lib/schemas/library';
import { metalLabel } from './library-format';

/**
 * The library as a dense table on a wide screen: one 44 px row per entry (the row is the tap
 * target and a keyboard stop; Enter opens the entry), a checkbox per row for exports, headers that
 * sort on the server. Real table semantics for screen readers: table, rows, column headers with
 * aria-sort, cells.
 */

export const LIBRARY_ROW_HEIGHT_PX = 44;

interface ColumnSpec {
  header: string;
  /** What a screen reader says for the header when the heading is a symbol. */
  spoken?: string;
  /** The server order this header asks for; none for a column the server cannot order. */
  sort?: LibrarySort;
  style: ViewStyle;
  numeric?: boolean;
  /** The heading is a symbol (dⁿ, k, t½): its letters keep their case. */
  symbolic?: boolean;
  cell: (item: ComplexListItem) => ReactNode;
}

/** "2.2 × 10⁻⁹ s⁻¹", or the half-life when a half-life decided ("t½ 3.2 h"); "—" without a rate. */
export function headlineRateText(rate: ComplexListItem['headlineRate']): string {
  if (!rate) return '—';
  if (rate.kind === 'half-life') return `t½ ${formatDuration(Math.LN2 / rate.kPerSecond)}`;
  return `${formatRecorded(rate.kPerSecond)} s⁻¹`;
}

export const COLUMN_SPECS: Record<LibraryColumn, ColumnSpec> = {
  formula: {
    header: 'Formula',
    sort: 'formula',
    style: { flex: 1.4, minWidth: 170 },
    // One line: a long formula ends in an ellipsis on screen; its name for screen readers is whole.
    cell: (item) => (
      <AppText variant="mono" numberOfLines={1} accessibilityLabel={item.formula} style={styles.formula}>
        {toDisplayFormula(item.formula)}
      </AppText>
    ),
  },
  name: {
    header: 'Name',
    sort: 'name',
    style: { flex: 2, minWidth: 160 },
    cell: (item) => (
      <AppText numberOfLines={1} style={styles.cellText}>
        {item.name}
      </AppText>
    ),
  },
  metal: {
    header: 'Metal',
    spoken: 'Metal and oxidation state',
    sort: 'metal',
    style: { width: 92 },
    cell: (item) => <AppText style={styles.cellText}>{metalLabel(item.metal, item.oxidationState)}</AppText>,
  },
  dCount: {
    header: 'dⁿ',
    spoken: 'd electron count',
    symbolic: true,
    sort: 'dCount',
    style: { width: 64 },
    cell: (item) => <AppText style={styles.cellText}>{`d${item.dElectrons}`}</AppText>,
  },
  verdict: {
    header: 'Verdict',
    sort: 'verdict',
    style: { width: 124 },
    cell: (item) => <VerdictBadge verdict={item.verdict} size="sm" />,
  },
  rate: {
    header: 'k or t½',
    spoken: 'Rate constant or half-life',
    symbolic: true,
    style: { width: 132 },
    numeric: true,
    cell: (item) => <AppText style={[styles.cellText, styles.mono]}>{headlineRateText(item.headlineRate)}</AppText>,
  },
  measurements: {
    header: 'Meas.',
    spoken: 'Measurements',
    sort: 'measurements',
    style: { width: 76 },
    numeric: true,
    cell: (item) => <AppText style={[styles.cellText, styles.mono]}>{formatInteger(item.measurementCount)}</AppText>,
  },
  status: {
    header: 'Status',
    sort: 'status',
    style: { width: 116 },
    cell: (item) => <StatusPill status={item.status} />,
  },
  updated: {
    header: 'Updated',
    sort: 'updated',
    style: { width: 156 },
    cell: (item) => (
      <AppText variant="caption" tone="soft" numberOfLines={1}>
        {formatDateTime(item.updatedAt)}
      </AppText>
    ),
  },
};

type AriaSort = 'ascending' | 'descending' | 'none';

/** The header's aria-sort: the chosen order, or name ascending when the list is in its default order without search text. */
export function ariaSortOf(column: LibraryColumn, sort: LibrarySort | undefined, dir: SortDirection | undefined, searching: boolean): AriaSort | undefined {
  const spec = COLUMN_SPECS[column];
  if (!spec.sort) return undefined;
  const current = sort ?? (searching ? undefined : 'name');
  if (current !== spec.sort) return 'none';
  return (sort ? dir ?? 'asc' : 'asc') === 'desc' ? 'descending' : 'ascending';
}

export interface LibraryTableProps {
  items: readonly ComplexListItem[];
  /** The columns to show, in the table's order (the formula is always among them). */
  columns: readonly LibraryColumn[];
  sort: LibrarySort | undefined;
  dir: SortDirection | undefined;
  /** Search text is given: without a chosen order the list is by relevance. */
  searching: boolean;
  onSort: (sort: LibrarySort, dir: SortDirection) => void;
  selected: ReadonlySet<string>;
  onToggle: (id: string) => void;
  /** Select (true) or clear (false) every loaded row. */
  onToggleAll: (select: boolean) => void;
  onOpen: (id: string) => void;
  /** Total matches, for aria-rowcount (−1 when unknown). */
  total: number;
  footer?: ReactNode;
}

export function LibraryTable({ items, columns, sort, dir, searching, onSort, selected, onToggle, onToggleAll, onOpen, total, footer }: LibraryTableProps) {
  const chosenHere = items.filter((item) => selected.has(item.id)).length;
  const allState: boolean | 'mixed' = chosenHere === 0 ? false : chosenHere === items.length ? true : 'mixed';
  return (
    <View style={styles.wrap}>
      <View role="table" aria-label="Library entries" aria-rowcount={total >= 0 ? total + 1 : -1} style={styles.table} testID="library-table">
        <View role="rowgroup">
          <View role="row" aria-rowindex={1} style={styles.headerRow} testID="library-table-header">
            <View role="columnheader" style={styles.checkCell}>
              <Checkbox
                checked={allState}
                label={allState === true ? 'Clear the selection of the loaded entries' : 'Select every loaded entry'}
                onPress={() => onToggleAll(allState !== true)}
                testID="library-select-all"
              />
            </View>
            {columns.map((column) => (
              <HeaderCell key={column} column={column} ariaSort={ariaSortOf(column, sort, dir, searching)} onSort={onSort} />
            ))}
          </View>
        </View>
        <ScrollView style={styles.body} contentContainerStyle={styles.bodyContent}>
          <View role="rowgroup" testID="library-table-body">
          {items.map((item, index) => (
            <Pressable
              key={item.id}
              role="row"
              aria-rowindex={index + 2}
              aria-selected={selected.has(item.id)}
              focusable
              onPress={() => onOpen(item.id)}
              testID={`library-row-${index}`}
              style={({ pressed, hovered }: { pressed: boolean; hovered?: boolean }) =>
                StyleSheet.flatten([styles.row, hovered ? styles.rowHover : null, pressed ? styles.rowPressed : null])
              }
            >
              <View role="cell" style={styles.checkCell}>
                <Checkbox
                  checked={selected.has(item.id)}
                  label={`Select ${item.name}`}
                  onPress={() => onToggle(item.id)}
                  testID={`library-select-${index}`}
                />
              </View>
              {columns.map((column) => (
                <View key={column} role="cell" style={StyleSheet.flatten([styles.cell, COLUMN_SPECS[column].style, COLUMN_SPECS[column].numeric ? styles.numeric : null])}>
                  {COLUMN_SPECS[column].cell(item)}
                </View>
              ))}
            </Pressable>
          ))}
          {footer ? (
            // "Load more" sits in a last row of its own, so the table holds only rows.
            <View role="row" aria-rowindex={items.length + 2} testID="library-table-footer">
              <View role="cell" aria-colspan={columns.length + 1}>
                {footer}
              </View>
            </View>
          ) : null}
          </View>
        </ScrollView>
      </View>
    </View>
  );
}

function HeaderCell({ column, ariaSort, onSort }: { column: LibraryColumn; ariaSort: AriaSort | undefined; onSort: (sort: LibrarySort, dir: SortDirection) => void }) {
  const spec = COLUMN_SPECS[column];
  const cellStyle = StyleSheet.flatten([styles.headerCell, spec.style, spec.numeric ? styles.numeric : null]);
  if (!spec.sort) {
    return (
      <View role="columnheader" style={cellStyle} testID={`library-column-${column}`}>
        <AppText variant="label" tone="muted" aria-label={spec.spoken} style={spec.symbolic ? styles.symbol : null}>
          {spec.header}
        </AppText>
      </View>
    );
  }
  const sortKey = spec.sort;
  const next: SortDirection = ariaSort === 'ascending' ? 'desc' : 'asc';
  const arrow = ariaSort === 'ascending' ? ' ↑' : ariaSort === 'descending' ? ' ↓' : '';
  return (
    <View role="columnheader" aria-sort={ariaSort} style={cellStyle} testID={`library-column-${column}`}>
      <Pressable
        role="button"
        aria-label={`${spec.header}${spec.spoken ? ` (${spec.spoken})` : ''}, sort ${next === 'asc' ? 'ascending' : 'descending'}`}
        onPress={() => onSort(sortKey, next)}
        style={styles.sortButton}
        testID={`library-sort-${column}`}
      >
        <AppText variant="label" tone={ariaSort === 'none' ? 'muted' : 'accent'} numberOfLines={1} style={spec.symbolic ? styles.symbol : null}>
          {spec.header}
          {arrow}
        </AppText>
      </Pressable>
    </View>
  );
}

function Checkbox({ checked, label, onPress, testID }: { checked: boolean | 'mixed'; label: string; onPress: () => void; testID: string }) {
  return (
    <Pressable role="checkbox" aria-checked={checked} aria-label={label} onPress={onPress} style={styles.checkTarget} testID={testID}>
      <View style={StyleSheet.flatten([styles.box, checked !== false ? styles.boxOn : null])}>
        {checked === true ? <AppText style={styles.tick}>✓</AppText> : checked === 'mixed' ? <AppText style={styles.tick}>–</AppText> : null}
      </View>
    </Pressable>
  );
}

const styles = StyleSheet.create({
  wrap: { flex: 1, paddingHorizontal: spacing.lg },
  table: { flex: 1, borderWidth: 1, borderColor: colors.line, borderRadius: 8, backgroundColor: colors.card, overflow: 'hidden' },
  headerRow: { flexDirection: 'row', alignItems: 'center', minHeight: 40, borderBottomWidth: 1, borderBottomColor: colors.lineStrong, backgroundColor: colors.paper },
  headerCell: { paddingHorizontal: spacing.sm, justifyContent: 'center' },
  sortButton: { minHeight: 40, justifyContent: 'center' },
  body: { flex: 1 },
  bodyContent: { paddingBottom: spacing.md },
  row: { flexDirection: 'row', alignItems: 'center', height: LIBRARY_ROW_HEIGHT_PX, borderBottomWidth: 1, borderBottomColor: colors.line },
  rowHover: { backgroundColor: colors.accentSoft },
  rowPressed: { opacity: 0.85 },
  cell: { paddingHorizontal: spacing.sm, justifyContent: 'center', overflow: 'hidden' },
  numeric: { alignItems: 'flex-end' },
  cellText: { fontSize: 14, lineHeight: 20 },
  formula: { fontSize: 14, lineHeight: 20 },
  mono: { fontFamily: fonts.mono },
  symbol: { textTransform: 'none', letterSpacing: 0 },
  checkCell: { width: 44, alignItems: 'center', justifyContent: 'center' },
  checkTarget: { width: 44, height: 44, alignItems: 'center', justifyContent: 'center' },
  box: { width: 18, height: 18, borderRadius: 4, borderWidth: 1.5, borderColor: colors.lineStrong, alignItems: 'center', justifyContent: 'center', backgroundColor: colors.card },
  boxOn: { backgroundColor: colors.accent, borderColor: colors.accent },
  tick: { color: colors.accentInk, fontSize: 13, lineHeight: 16, fontFamily: fonts.strong },
});
