import { FlashList } from '@shopify/flash-list';
import Fuse from 'fuse.js';
import { useRouter } from 'expo-router';
import { useMemo, useState } from 'react';
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
import { ComplexDetailView } from './complex-detail';
import { ComplexListRow } from './complex-list-item';
import { LibraryFilters } from './library-filters';
import { useLibraryAccess, type LibraryAccess } from './use-library-access';

/** Wide screens: the list keeps this width and the chosen entry fills the rest. */
export const LIST_PANE_WIDTH_PX = 420;
const SEARCH_DEBOUNCE_MS = 300;

export interface LibraryScreenProps {
  /** The entry shown beside the list on a wide screen. */
  selectedId: string | null;
  onSelect: (id: string) => void;
}

/** Library: search, filters and the list; on a wide screen the chosen entry sits beside the list. */
export function LibraryScreen({ selectedId, onSelect }: LibraryScreenProps) {
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
  return <LibraryBrowser access={access} selectedId={selectedId} onSelect={onSelect} />;
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

function LibraryBrowser({ access, selectedId, onSelect }: { access: Member; selectedId: string | null; onSelect: (id: string) => void }) {
  const wide = useWideLayout();
  const router = useRouter();
  const [typed, setTyped] = useState('');
  const [filters, setFilters] = useState<ComplexFilters>({});
  const settled = useDebouncedValue(typed, SEARCH_DEBOUNCE_MS);
  const query = useComplexesQuery({ ...filters, q: settled });

  const loaded = useMemo(() => query.data?.pages.flatMap((page) => page.items) ?? [], [query.data]);
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

  const loadMore = () => {
    if (query.hasNextPage && !query.isFetchingNextPage && !localText) void query.fetchNextPage();
  };
  const clearAll = () => {
    setTyped('');
    setFilters({});
  };

  const header = (
    <View style={styles.header}>
      <View style={styles.titleRow}>
        <View style={styles.titleText}>
          <AppText variant="title" accessibilityRole="header">Library</AppText>
          <AppText variant="caption" tone="muted">
            {access.memberships.length === 1 ? access.memberships[0]?.groupName : `${access.memberships.length} groups`}
          </AppText>
        </View>
        {access.canContribute ? <Button label="New entry" onPress={() => router.push('/library/new')} testID="library-new" /> : null}
      </View>
      <View style={styles.actions}>
        {access.canContribute ? <Button label="Import CSV" kind="quiet" onPress={() => router.push('/library/import')} testID="library-import" /> : null}
        <ExportMenu filters={{ ...filters, q: settled }} />
      </View>
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
        style={styles.search}
      />
      <LibraryFilters filters={filters} onChange={setFilters} facets={facets.data} showStatus={!onlyViewer} />
      {query.data !== undefined ? (
        <View style={styles.countRow}>
          <AppText variant="caption" tone="muted" testID="library-count">
            {localText
              ? `${shown.length} of ${loaded.length} loaded entries match — searching the whole library…`
              : `${loaded.length} of ${totalLabel} ${totalLabel === '1' ? 'entry' : 'entries'}`}
          </AppText>
          {query.isFetching && !query.isFetchingNextPage ? <ActivityIndicator size="small" color={colors.accent} /> : null}
        </View>
      ) : null}
      {query.isError && query.data !== undefined ? (
        <StaleNotice error={query.error} onRetry={() => void query.refetch()} testID="library-stale" />
      ) : null}
    </View>
  );

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
  } else {
    body = (
      <View style={styles.fill} testID="library-list">
        <FlashList
          data={shown}
          keyExtractor={(item) => item.id}
          renderItem={({ item, index }) => (
            <ComplexListRow item={item} index={index} selected={item.id === selectedId} onPress={(picked) => onSelect(picked.id)} />
          )}
          extraData={selectedId}
          onEndReached={loadMore}
          onEndReachedThreshold={0.5}
          contentContainerStyle={styles.listContent}
          ListEmptyComponent={
            <AppText tone="soft" testID="library-local-none">
              No loaded entry matches “{typed.trim()}” — asking the server…
            </AppText>
          }
          ListFooterComponent={
            query.hasNextPage && !localText ? (
              <View style={styles.footer}>
                {query.isFetchingNextPage ? (
                  <LoadingBlock label="Loading more…" testID="library-loading-more" />
                ) : (
                  <Button label={`Load more (${loaded.length} of ${totalLabel})`} kind="quiet" onPress={loadMore} testID="library-load-more" />
                )}
              </View>
            ) : null
          }
        />
      </View>
    );
  }

  const listPane = (
    <View style={wide ? styles.listPaneWide : styles.fill}>
      {header}
      <View style={styles.fill}>{body}</View>
    </View>
  );
  if (!wide) return <View style={styles.screen}>{listPane}</View>;
  return (
    <View style={StyleSheet.flatten([styles.screen, styles.split])}>
      {listPane}
      <View style={styles.detailPane} testID="library-detail-pane">
        {selectedId ? (
          <ComplexDetailView id={selectedId} key={selectedId} />
        ) : (
          <View style={styles.choose}>
            <AppText variant="lead" tone="soft">Choose an entry to see its measurements, history and review.</AppText>
          </View>
        )}
      </View>
    </View>
  );
}

const styles = StyleSheet.create({
  screen: { flex: 1, backgroundColor: colors.paper },
  split: { flexDirection: 'row' },
  fill: { flex: 1 },
  listPaneWide: { width: LIST_PANE_WIDTH_PX, borderRightWidth: 1, borderRightColor: colors.line },
  detailPane: { flex: 1 },
  header: { paddingHorizontal: spacing.lg, paddingTop: spacing.xl, paddingBottom: spacing.sm, gap: spacing.md },
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
  },
  countRow: { flexDirection: 'row', alignItems: 'center', gap: spacing.sm },
  listContent: { paddingHorizontal: spacing.lg, paddingBottom: spacing.xl },
  footer: { paddingVertical: spacing.md, alignItems: 'flex-start' },
  message: { gap: spacing.sm, padding: spacing.lg },
  buttonStart: { alignSelf: 'flex-start', marginTop: spacing.sm },
  choose: { flex: 1, alignItems: 'center', justifyContent: 'center', padding: spacing.xl },
});
