import { useState, type ReactNode } from 'react';
import { StyleSheet, View } from 'react-native';
import { Chip } from '@/components/ui/chip';
import { AppText } from '@/components/ui/text';
import { spacing } from '@/components/ui/theme';
import type { ComplexFilters } from '@/lib/api/library';
import {
  complexStatuses,
  measurementKindRules,
  measurementKinds,
  type ComplexStatus,
  type LibrarySort,
  type MeasurementKind,
  type SortDirection,
} from '@/lib/schemas/library';
import type { ComplexFacets } from '@/lib/schemas/library-facets';
import { roman } from '@/components/ui/format';

/**
 * Options when the server's list (GET /api/complexes/facets) cannot be had: the metals most groups
 * hold and the usual ranges. With the server's list, only values present in what the person may
 * see are offered, whatever page happens to be loaded.
 */
const FALLBACK_METALS = ['Co', 'Cr', 'Cu', 'Fe', 'Ir', 'Mn', 'Ni', 'Pd', 'Pt', 'Rh', 'Ru', 'Zn'];
const FALLBACK_OXIDATION_STATES = [0, 1, 2, 3, 4];
const FALLBACK_D_COUNTS = [0, 1, 2, 3, 4, 5, 6, 7, 8, 9, 10];
const VERDICTS = ['labile', 'intermediate', 'inert'] as const;
const STATUS_WORDS: Record<(typeof complexStatuses)[number], string> = {
  draft: 'Draft',
  'in-review': 'In review',
  accepted: 'Accepted',
  'returned': 'Returned',
  declined: 'Declined',
  retired: 'Retired',
};

type FilterKey = Exclude<keyof ComplexFilters, 'q' | 'groupId' | 'ids' | 'sort' | 'dir'>;

/** The options to offer: the server's, else the fallback lists; a chosen value always stays visible. */
export function filterOptions(facets: ComplexFacets | undefined, filters: ComplexFilters) {
  const withChosen = <T extends string | number>(values: readonly T[], chosen: T | undefined, order: (a: T, b: T) => number) =>
    chosen === undefined || values.includes(chosen) ? [...values] : [...values, chosen].sort(order);
  const byText = (a: string, b: string) => (a < b ? -1 : a > b ? 1 : 0);
  const byNumber = (a: number, b: number) => a - b;
  const inList = <T extends string>(list: readonly T[]) => (a: T, b: T) => list.indexOf(a) - list.indexOf(b);
  return {
    metals: withChosen(facets ? facets.metals.map((f) => f.value) : FALLBACK_METALS, filters.metal, byText),
    oxidationStates: withChosen(facets ? facets.oxidationStates.map((f) => f.value) : FALLBACK_OXIDATION_STATES, filters.oxidationState, byNumber),
    dCounts: withChosen(facets ? facets.dCounts.map((f) => f.value) : FALLBACK_D_COUNTS, filters.dCount, byNumber),
    ligands: withChosen(facets ? facets.ligands.map((f) => f.value) : [], filters.ligand, byText),
    measurementKinds: withChosen<MeasurementKind>(facets ? facets.measurementKinds.map((f) => f.value) : measurementKinds, filters.measurementKind, inList(measurementKinds)),
    statuses: withChosen<ComplexStatus>(facets ? facets.statuses.map((f) => f.value) : complexStatuses, filters.status, inList(complexStatuses)),
  };
}

/** The active filters as short words, each removable ("Co", "d6", "inert", "has citation"). */
export function activeFilterLabels(filters: ComplexFilters): { key: FilterKey; label: string }[] {
  const out: { key: FilterKey; label: string }[] = [];
  if (filters.metal) out.push({ key: 'metal', label: filters.metal });
  if (filters.oxidationState !== undefined) out.push({ key: 'oxidationState', label: `oxidation state ${roman(filters.oxidationState)}` });
  if (filters.dCount !== undefined) out.push({ key: 'dCount', label: `d${filters.dCount}` });
  if (filters.verdict) out.push({ key: 'verdict', label: filters.verdict });
  if (filters.ligand) out.push({ key: 'ligand', label: `ligand ${filters.ligand}` });
  if (filters.status) out.push({ key: 'status', label: STATUS_WORDS[filters.status] });
  if (filters.measurementKind) out.push({ key: 'measurementKind', label: measurementKindRules[filters.measurementKind].label });
  if (filters.hasCitation !== undefined) out.push({ key: 'hasCitation', label: filters.hasCitation ? 'cited' : 'no citation' });
  return out;
}

/** Orders offered on a phone, where the table's sortable headings are not shown. */
const PHONE_ORDERS: { label: string; sort: LibrarySort; dir: SortDirection }[] = [
  { label: 'Name', sort: 'name', dir: 'asc' },
  { label: 'Formula', sort: 'formula', dir: 'asc' },
  { label: 'Newest change', sort: 'updated', dir: 'desc' },
  { label: 'Labile first', sort: 'verdict', dir: 'asc' },
  { label: 'Most measured', sort: 'measurements', dir: 'desc' },
];

export function LibraryFilters({ filters, onChange, facets, showStatus, order }: {
  filters: ComplexFilters;
  onChange: (next: ComplexFilters) => void;
  /** The list's order and its setter (offered on a phone; the wide table sorts from its headings). */
  order?: { sort: LibrarySort | undefined; dir: SortDirection | undefined; onChange: (sort: LibrarySort | undefined, dir: SortDirection | undefined) => void };
  /** The server's options for what the person may see; undefined while loading or unavailable. */
  facets: ComplexFacets | undefined;
  /** Viewers only ever see accepted entries: the status filter would be noise for them. */
  showStatus: boolean;
}) {
  const [open, setOpen] = useState(false);
  const active = activeFilterLabels(filters);
  const set = <K extends FilterKey>(key: K, value: ComplexFilters[K]) => {
    const next = { ...filters };
    if (next[key] === value || value === undefined) delete next[key];
    else next[key] = value;
    onChange(next);
  };
  const options = filterOptions(facets, filters);
  return (
    <View style={styles.wrap} testID="library-filters">
      <View style={styles.row}>
        <Chip label={open ? 'Hide filters' : `Filters${active.length ? ` (${active.length})` : ''}`} onPress={() => setOpen(!open)} testID="library-filters-toggle" />
        {active.map((item) => (
          <Chip key={item.key} label={`${item.label} ✕`} selected onPress={() => set(item.key, undefined)} testID={`library-filter-active-${item.key}`} />
        ))}
      </View>
      {open ? (
        <View style={styles.panel}>
          {order ? (
            <Group title="Order">
              {PHONE_ORDERS.map((choice) => {
                const chosen = order.sort === choice.sort && (order.dir ?? 'asc') === choice.dir;
                return (
                  <Chip
                    key={choice.sort}
                    label={choice.label}
                    selected={chosen}
                    onPress={() => (chosen ? order.onChange(undefined, undefined) : order.onChange(choice.sort, choice.dir))}
                    testID={`library-order-${choice.sort}`}
                  />
                );
              })}
            </Group>
          ) : null}
          <Group title="Metal">
            {options.metals.map((metal) => (
              <Chip key={metal} label={metal} mono selected={filters.metal === metal} onPress={() => set('metal', metal)} testID={`library-filter-metal-${metal}`} />
            ))}
          </Group>
          <Group title="Oxidation state">
            {options.oxidationStates.map((n) => (
              <Chip key={n} label={roman(n)} selected={filters.oxidationState === n} onPress={() => set('oxidationState', n)} testID={`library-filter-ox-${n}`} />
            ))}
          </Group>
          <Group title="d electrons">
            {options.dCounts.map((n) => (
              <Chip key={n} label={`d${n}`} selected={filters.dCount === n} onPress={() => set('dCount', n)} testID={`library-filter-d-${n}`} />
            ))}
          </Group>
          <Group title="Verdict">
            {VERDICTS.map((verdict) => (
              <Chip key={verdict} label={verdict} selected={filters.verdict === verdict} onPress={() => set('verdict', verdict)} testID={`library-filter-verdict-${verdict}`} />
            ))}
          </Group>
          {showStatus ? (
            <Group title="Status">
              {options.statuses.map((status) => (
                <Chip key={status} label={STATUS_WORDS[status]} selected={filters.status === status} onPress={() => set('status', status)} testID={`library-filter-status-${status}`} />
              ))}
            </Group>
          ) : null}
          <Group title="Measured">
            {options.measurementKinds.map((kind) => (
              <Chip
                key={kind}
                label={measurementKindRules[kind].label}
                selected={filters.measurementKind === kind}
                onPress={() => set('measurementKind', kind)}
                testID={`library-filter-kind-${kind}`}
              />
            ))}
          </Group>
          {options.ligands.length > 0 ? (
            <Group title="Ligand">
              {options.ligands.map((ligand) => (
                <Chip key={ligand} label={ligand} mono selected={filters.ligand === ligand} onPress={() => set('ligand', ligand)} testID={`library-filter-ligand-${ligand}`} />
              ))}
            </Group>
          ) : null}
          <Group title="Citation">
            <Chip label="cited" selected={filters.hasCitation === true} onPress={() => set('hasCitation', true)} testID="library-filter-cited" />
            <Chip label="no citation" selected={filters.hasCitation === false} onPress={() => set('hasCitation', false)} testID="library-filter-uncited" />
          </Group>
        </View>
      ) : null}
    </View>
  );
}

function Group({ title, children }: { title: string; children: ReactNode }) {
  return (
    <View style={styles.group}>
      <AppText variant="label" tone="muted">{title}</AppText>
      <View style={styles.row}>{children}</View>
    </View>
  );
}

const styles = StyleSheet.create({
  wrap: { gap: spacing.sm },
  row: { flexDirection: 'row', flexWrap: 'wrap', gap: spacing.xs },
  panel: { gap: spacing.md, paddingVertical: spacing.xs },
  group: { gap: spacing.xs },
});
