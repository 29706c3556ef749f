import { FlashList } from '@shopify/flash-list';
import Fuse from 'fuse.js';
import { useRouter } from 'expo-router';
import { useEffect, useMemo, useState } from 'react';
import { ActivityIndicator, StyleSheet, TextInput, View } from 'react-native';
import { ErrorBlock, LoadingBlock, StaleNotice } from '@/components/account/query-states';
import { TextLink } from '@/components/account/auth-frame';
import { Button } from '@/components/ui/button';
import { groupedInteger } from '@/components/ui/format';
import { Screen } from '@/components/ui/screen';
import { AppText } from '@/components/ui/text';
import { colors, fonts, radius, spacing } from '@/components/ui/theme';
import { useDebouncedValue } from '@/components/ui/use-debounced-value';
import { useWideLayout } from '@/components/ui/use-wide-layout';
import { normaliseFilters, useComplexFacetsQuery, useComplexesQuery, type ComplexFilters } from '@/lib/api/library';
import type { ComplexListItem } from '@/lib/schemas/library';
import { ExportMenu } from '@/components/exchange/export-menu';
import { ComplexListRow } from './complex-list-item';
import { LibraryFilters } from './library-filters';
import { LibraryTable } from './library-table';
import { LibraryColumnsMenu, useLibraryColumns } from './library-table-columns';
import { libraryUrlParams, readLibraryUrl, type LibraryUrlState } from './library-url-state';
import { useLibraryAccess, type LibraryAccess } from './use-library-access';

const SEARCH_DEBOUNCE_MS = 300;

export interface LibraryScreenProps {
  /** Opens an entry (its page). */
  onSelect: (id: string) => void;
  /** The address's query (search, filters, sort, dir, pages); without it the screen holds them itself. */
  urlParams?: Record<string, string | string[] | undefined>;
  /** Writes the list's state into the address (replace, not push). */
  onUrlChange?: (params: Record<string, string | undefined>) => void;
}

/**
 * Library: search, filters and the list — cards on a phone, a sortable table with row selection
 * on a wide screen. The list's state lives in the address (library-url-state.ts).
 */
export function LibraryScreen({ onSelect, urlParams, onUrlChange }: LibraryScreenProps) {
  const access = useLibraryAccess();
  if (access.state === 'loading') {
    return (
      <View style={styles.fill}>
        <LoadingBlock label="Opening the library…" testID="library-loading" />
      </View>
    );
  }
  if (access.state === 'error') {
    return (
      <Screen>
        <ErrorBlock title="The library could not be opened" error={access.error} onRetry={access.retry} testID="library-access-error" />
      </Screen>
    );
  }
  if (access.state === 'signed-out') return <SignedOutLibrary />;
  if (access.state === 'no-group') {
    return (
      <Screen maxWidth={640}>
        <View style={styles.message} testID="library-no-group">
          <AppText variant="title">Your library lives in a group</AppText>
          <AppText tone="soft">
            Library entries belong to a research group. Create one, or accept an invitation from your group’s admin, to see its entries here.
          </AppText>
          <TextLink href="/account" testID="library-to-account">Go to your account</TextLink>
        </View>
      </Screen>
    );
  }
  return <LibraryBrowser access={access} onSelect={onSelect} urlParams={urlParams} onUrlChange={onUrlChange} />;
}

function SignedOutLibrary() {
  return (
    <Screen maxWidth={640}>
      <View style={styles.message} testID="library-signed-out">
        <AppText variant="title">Sign in to see your group’s library</AppText>
        <AppText tone="soft">
          The library holds your group’s curated complexes, measured rate constants and their citations, so it is private to the group.
          Check and Route work without signing in.
        </AppText>
        <TextLink href="/sign-in?next=/library" testID="library-sign-in">Sign in to see your group’s library</TextLink>
      </View>
    </Screen>
  );
}

type Member = Extract<LibraryAccess, { state: 'member' }>;

type RawParams = Record<string, string | string[] | undefined>;

/**
 * The list's search, filters, order and loaded pages: in the address when the route gives it
 * (`urlParams` + `onUrlChange`: Back and shared links restore them), else held here.
 */
function useLibraryState(urlParams: RawParams | undefined, onUrlChange: ((params: Record<string, string | undefined>) => void) | undefined) {
  const [held, setHeld] = useState<LibraryUrlState>(() => readLibraryUrl(urlParams ?? {}));
  const fromUrl = useMemo(() => (urlParams && onUrlChange ? readLibraryUrl(urlParams) : null), [urlParams, onUrlChange]);
  const state = fromUrl ?? held;
  const setState = (next: LibraryUrlState) => {
    if (onUrlChange) onUrlChange(libraryUrlParams(next));
    else setHeld(next);
  };
  return [state, setState] as const;
}

function LibraryBrowser({ access, onSelect, urlParams, onUrlChange }: { access: Member } & Omit<LibraryScreenProps, 'selectedId'>) {
  const wide = useWideLayout();
  const router = useRouter();
  const [state, setState] = useLibraryState(urlParams, onUrlChange);
  const filters = state.filters;
  const [typed, setTyped] = useState(filters.q ?? '');
  const settled = useDebouncedValue(typed, SEARCH_DEBOUNCE_MS);
  const [selected, setSelected] = useState<ReadonlySet<string>>(() => new Set());
  const { columns, setColumns } = useLibraryColumns();

  // Settled search text goes to the address (replacing, not pushing); a new search starts at page one.
  const urlQ = filters.q ?? '';
  useEffect(() => {
    if (settled.trim() !== urlQ) setState({ ...state, filters: { ...filters, q: settled.trim() || undefined }, pages: 1 });
    // Only a settled change of the text writes the address.
    // eslint-disable-next-line react-hooks/exhaustive-deps
  }, [settled]);
  // The address changed from outside (Back, a shared link): the box shows its text.
  const [seenUrlQ, setSeenUrlQ] = useState(urlQ);
  if (urlQ !== seenUrlQ) {
    setSeenUrlQ(urlQ);
    if (urlQ !== settled.trim()) setTyped(urlQ);
  }

  const listFilters: ComplexFilters = { ...filters, q: settled, sort: state.sort, dir: state.sort ? state.dir ?? 'asc' : undefined };
  const query = useComplexesQuery(listFilters);
  const setFilters = (next: ComplexFilters) => setState({ ...state, filters: { ...next, q: filters.q }, pages: 1 });

  const loaded = useMemo(() => query.data?.pages.flatMap((page) => page.items) ?? [], [query.data]);
  const loadedPages = query.data?.pages.length ?? 0;
  const total = query.data?.pages.at(-1)?.total ?? 0;
  // Past 1 000 matches the server stops counting: "1,000+ entries".
  const totalLabel = `${groupedInteger(total)}${query.data?.pages.at(-1)?.totalIsLowerBound ? '+' : ''}`;
  // Until the server has answered for exactly what is typed, narrow the loaded page at once (fuzzy).
  const waitingForServer = typed.trim() !== settled.trim() || query.isPlaceholderData;
  const localText = waitingForServer ? typed.trim() : '';
  const fuse = useMemo(
    () => new Fuse(loaded, { keys: ['formula', 'name', 'metal', 'ligandIds'], threshold: 0.4, ignoreLocation: true }),
    [loaded],
  );
  const shown: ComplexListItem[] = useMemo(
    () => (localText ? fuse.search(localText).map((hit) => hit.item) : loaded),
    [fuse, loaded, localText],
  );
  const filtered = Object.keys(normaliseFilters({ ...filters, q: typed })).length > 0;
  const facets = useComplexFacetsQuery(filters.groupId);
  const onlyViewer = !access.canContribute;

  // The address says how many pages are loaded; fetch the missing ones one at a time, never
  // twice at once (a second call would abort the first) and never for a placeholder result.
  const { hasNextPage, isFetching, isPlaceholderData, fetchNextPage } = query;
  useEffect(() => {
    if (loadedPages === 0 || isPlaceholderData || isFetching || !hasNextPage) return;
    if (loadedPages < state.pages) void fetchNextPage({ cancelRefetch: false });
  }, [loadedPages, state.pages, isPlaceholderData, isFetching, hasNextPage, fetchNextPage]);
  // "Load more" asks for exactly the next page: one more than is loaded (pressing twice asks for the same one).
  const loadMore = () => {
    if (hasNextPage && !query.isFetchingNextPage && !localText) setState({ ...state, pages: loadedPages + 1 });
  };
  const clearAll = () => {
    setTyped('');
    setState({ filters: {}, sort: state.sort, dir: state.dir, pages: 1 });
  };
  const toggle = (id: string) => {
    const next = new Set(selected);
    if (next.has(id)) next.delete(id);
    else next.add(id);
    setSelected(next);
  };
  const toggleAll = (select: boolean) => {
    const next = new Set(selected);
    for (const item of shown) {
      if (select) next.add(item.id);
      else next.delete(item.id);
    }
    setSelected(next);
  };

  const countText = localText
    ? `${shown.length} of ${loaded.length} loaded entries match — searching the whole library…`
    : `${loaded.length} of ${totalLabel} ${totalLabel === '1' ? 'entry' : 'entries'}${selected.size > 0 ? ` · ${selected.size} selected` : ''}`;

  const searchBox = (
    <TextInput
      value={typed}
      onChangeText={setTyped}
      placeholder="Search formula, name, metal or ligand"
      placeholderTextColor={colors.muted}
      autoCapitalize="none"
      autoCorrect={false}
      spellCheck={false}
      accessibilityLabel="Search the library"
      testID="library-search"
      style={StyleSheet.flatten([styles.search, wide ? styles.searchWide : null])}
    />
  );
  const groupLine = access.memberships.length === 1 ? access.memberships[0]?.groupName : `${access.memberships.length} groups`;
  const exportMenu = (
    <ExportMenu filters={listFilters} selectedIds={[...selected]} onClearSelection={() => setSelected(new Set())} />
  );

  const header = wide ? (
    <View style={styles.headerWide}>
      <View style={styles.toolbar}>
        <View style={styles.titleWide}>
          <AppText variant="title" accessibilityRole="header">Library</AppText>
          <AppText variant="caption" tone="muted" numberOfLines={1}>{groupLine}</AppText>
        </View>
        {searchBox}
        <LibraryColumnsMenu columns={columns} onChange={setColumns} />
        {exportMenu}
        {access.canContribute ? <Button label="Import CSV" kind="quiet" onPress={() => router.push('/library/import')} testID="library-import" /> : null}
        {access.canContribute ? <Button label="New entry" onPress={() => router.push('/library/new')} testID="library-new" /> : null}
      </View>
      <LibraryFilters filters={filters} onChange={setFilters} facets={facets.data} showStatus={!onlyViewer} />
    </View>
  ) : (
    <View style={styles.header}>
      <View style={styles.titleRow}>
        <View style={styles.titleText}>
          <AppText variant="title" accessibilityRole="header">Library</AppText>
          <AppText variant="caption" tone="muted">{groupLine}</AppText>
        </View>
        {access.canContribute ? <Button label="New entry" onPress={() => router.push('/library/new')} testID="library-new" /> : null}
      </View>
      <View style={styles.actions}>
        {access.canContribute ? <Button label="Import CSV" kind="quiet" onPress={() => router.push('/library/import')} testID="library-import" /> : null}
        {exportMenu}
      </View>
      {searchBox}
      <LibraryFilters
        filters={filters}
        onChange={setFilters}
        facets={facets.data}
        showStatus={!onlyViewer}
        order={{ sort: state.sort, dir: state.dir, onChange: (sort, dir) => setState({ ...state, sort, dir, pages: 1 }) }}
      />
    </View>
  );
  const countRow =
    query.data !== undefined ? (
      <View style={StyleSheet.flatten([styles.countRow, wide ? styles.countRowWide : null])}>
        <AppText variant="caption" tone="muted" testID="library-count" aria-live="polite">
          {countText}
        </AppText>
        {query.isFetching && !query.isFetchingNextPage ? <ActivityIndicator size="small" color={colors.accent} /> : null}
      </View>
    ) : null;
  const stale =
    query.isError && query.data !== undefined ? (
      <View style={wide ? styles.padWide : styles.padPhone}>
        <StaleNotice error={query.error} onRetry={() => void query.refetch()} testID="library-stale" />
      </View>
    ) : null;

  const footer =
    query.hasNextPage && !localText ? (
      <View style={styles.footer}>
        {query.isFetchingNextPage ? (
          <LoadingBlock label="Loading more…" testID="library-loading-more" />
        ) : (
          <Button label={`Load more (${loaded.length} of ${totalLabel})`} kind="quiet" onPress={loadMore} testID="library-load-more" />
        )}
      </View>
    ) : null;

  let body;
  if (query.data === undefined) {
    body = query.isError ? (
      <ErrorBlock title="The library could not be loaded" error={query.error} onRetry={() => void query.refetch()} testID="library-error" />
    ) : (
      <LoadingBlock label="Loading entries…" testID="library-list-loading" />
    );
  } else if (loaded.length === 0 && !query.isPlaceholderData) {
    body = filtered ? (
      <View style={styles.message} testID="library-no-match">
        <AppText variant="lead">Nothing matches this search and these filters.</AppText>
        <AppText tone="soft">Try fewer filters, a shorter search, or a formula fragment such as “Co(NH3)” or a metal symbol.</AppText>
        <View style={styles.buttonStart}>
          <Button label="Clear search and filters" kind="quiet" onPress={clearAll} testID="library-clear" />
        </View>
      </View>
    ) : (
      <View style={styles.message} testID="library-empty">
        <AppText variant="lead">
          {access.canContribute ? 'No entries yet — add the first complex' : 'No accepted entries yet'}
        </AppText>
        <AppText tone="soft">
          {access.canContribute
            ? 'An entry is a complex with its measured constants and their citations. It becomes part of the group’s library once a curator accepts it.'
            : 'Contributors in your group add complexes and curators accept them; accepted entries appear here.'}
        </AppText>
        {access.canContribute ? (
          <View style={styles.buttonStart}>
            <Button label="Add the first complex" onPress={() => router.push('/library/new')} testID="library-add-first" />
          </View>
        ) : null}
      </View>
    );
  } else if (wide) {
    body = (
      <View style={styles.fill} testID="library-list">
        {shown.length === 0 ? (
          <AppText tone="soft" style={styles.message} testID="library-local-none">
            No loaded entry matches “{typed.trim()}” — asking the server…
          </AppText>
        ) : (
          <LibraryTable
            items={shown}
            columns={columns}
            sort={state.sort}
            dir={state.dir}
            searching={settled.trim() !== ''}
            onSort={(sort, dir) => setState({ ...state, sort, dir, pages: 1 })}
            selected={selected}
            onToggle={toggle}
            onToggleAll={toggleAll}
            onOpen={onSelect}
            total={query.data.pages.at(-1)?.totalIsLowerBound ? -1 : total}
            footer={footer}
          />
        )}
      </View>
    );
  } else {
    body = (
      <View style={styles.fill} testID="library-list">
        <FlashList
          data={shown}
          keyExtractor={(item) => item.id}
          renderItem={({ item, index }) => <ComplexListRow item={item} index={index} selected={false} onPress={(picked) => onSelect(picked.id)} />}
          contentContainerStyle={styles.listContent}
          ListEmptyComponent={
            <AppText tone="soft" testID="library-local-none">
              No loaded entry matches “{typed.trim()}” — asking the server…
            </AppText>
          }
          ListFooterComponent={footer}
        />
      </View>
    );
  }

  return (
    <View style={styles.screen}>
      {header}
      {countRow}
      {stale}
      <View style={styles.fill}>{body}</View>
    </View>
  );
}

const styles = StyleSheet.create({
  screen: { flex: 1, backgroundColor: colors.paper },
  fill: { flex: 1 },
  header: { paddingHorizontal: spacing.lg, paddingTop: spacing.xl, paddingBottom: spacing.sm, gap: spacing.md },
  headerWide: { paddingHorizontal: spacing.lg, paddingTop: spacing.lg, paddingBottom: spacing.xs, gap: spacing.sm, zIndex: 5 },
  toolbar: { flexDirection: 'row', alignItems: 'center', gap: spacing.sm, zIndex: 5 },
  titleWide: { minWidth: 150, marginRight: spacing.sm },
  titleRow: { flexDirection: 'row', alignItems: 'center', gap: spacing.md },
  titleText: { flex: 1 },
  actions: { flexDirection: 'row', flexWrap: 'wrap', alignItems: 'flex-start', gap: spacing.sm },
  search: {
    fontFamily: fonts.body,
    fontSize: 16,
    color: colors.ink,
    backgroundColor: colors.card,
    borderWidth: 1.5,
    borderColor: colors.lineStrong,
    borderRadius: radius.pill,
    paddingHorizontal: spacing.lg,
    paddingVertical: spacing.sm + 2,
    // A 44 px tap target at both sizes.
    minHeight: 44,
  },
  searchWide: { flex: 1 },
  countRow: { flexDirection: 'row', alignItems: 'center', gap: spacing.sm, paddingHorizontal: spacing.lg, paddingBottom: spacing.sm },
  countRowWide: { paddingBottom: spacing.xs },
  padWide: { paddingHorizontal: spacing.lg, paddingBottom: spacing.sm },
  padPhone: { paddingHorizontal: spacing.lg, paddingBottom: spacing.sm },
  listContent: { paddingHorizontal: spacing.lg, paddingBottom: spacing.xl },
  footer: { paddingVertical: spacing.md, paddingHorizontal: spacing.sm, alignItems: 'flex-start' },
  message: { gap: spacing.sm, padding: spacing.lg },
  buttonStart: { alignSelf: 'flex-start', marginTop: spacing.sm },
});
