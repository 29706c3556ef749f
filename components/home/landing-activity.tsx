import { useQuery } from '@tanstack/react-query';
import { Link } from 'expo-router';
import { Pressable, StyleSheet, View } from 'react-native';
import { relativeAge } from '@/components/library/library-format';
import { useLibraryAccess } from '@/components/library/use-library-access';
import { Card } from '@/components/ui/card';
import { FormulaText } from '@/components/ui/formula-text';
import { AppText } from '@/components/ui/text';
import { colors, spacing } from '@/components/ui/theme';
import { StatusPill, VerdictBadge } from '@/components/ui/verdict-badge';
import { useMeQuery } from '@/lib/api/auth';
import { formatInteger } from '@/lib/chem/number-format';
import { complexKeys, fetchComplexes, retryUnlessClientError, useReviewQueueQuery } from '@/lib/api/library';
import type { ComplexListItem, ReviewQueueResponse } from '@/lib/schemas/library';
import { RowLink } from './landing-links';

/** How many rows each list on the start page shows before "all of them" links on. */
const SHOWN = 4;

/**
 * The signed-in half of the start page: entries waiting for this curator's review, this person's
 * drafts and returned entries, and the library's size with its latest changes. Each list links on to
 * the full screen.
 */
export function LandingActivity() {
  const access = useLibraryAccess();
  const me = useMeQuery();
  const member = access.state === 'member' ? access : null;
  const queue = useReviewQueueQuery(!!member?.isCurator);
  const library = useQuery({
    // Newest change first: the page's count, and what moved lately.
    queryKey: [...complexKeys.all, 'start-page', 'recent'],
    queryFn: ({ signal }) => fetchComplexes({ sort: 'updated', dir: 'desc' }, 1, signal),
    enabled: !!member,
    retry: retryUnlessClientError,
  });
  const drafts = useMyEntries('draft', !!member?.canContribute);
  const returned = useMyEntries('returned', !!member?.canContribute);

  if (access.state === 'loading' || access.state === 'error') return null;
  if (access.state === 'signed-out') return null;
  if (!member) {
    return (
      <Card testID="landing-no-group">
        <AppText variant="title" accessibilityRole="header" aria-level={2}>Join a group</AppText>
        <AppText tone="soft">
          You are signed in as {access.displayName} but not yet in a research group. Ask a group’s admin for an invitation, or
          start a group of your own from Account.
        </AppText>
        <RowLink href="/account" testID="landing-to-account">Open Account</RowLink>
      </Card>
    );
  }
  const userId = me.data?.user.id;
  const mine = [...(returned.data ?? []), ...(drafts.data ?? [])].filter((item) => item.createdBy?.id === userId);
  return (
    <>
      {member.isCurator ? <ReviewList items={queue.data?.items} /> : null}
      {member.canContribute ? (
        <Card testID="landing-mine">
          <AppText variant="title" accessibilityRole="header" aria-level={2}>Your drafts</AppText>
          {drafts.data === undefined || returned.data === undefined ? (
            <AppText tone="muted">Looking…</AppText>
          ) : mine.length === 0 ? (
            <AppText tone="soft" testID="landing-mine-empty">
              Nothing of yours is in progress. A new entry starts as a draft only you and the curators see.
            </AppText>
          ) : (
            <EntryList items={mine.slice(0, SHOWN)} testID="landing-mine-list" />
          )}
          <RowLink href="/library/new" testID="landing-new-entry">Add an entry</RowLink>
        </Card>
      ) : null}
      <Card testID="landing-library-size">
        <AppText variant="title" accessibilityRole="header" aria-level={2}>The library</AppText>
        <AppText tone="soft">
          {library.data === undefined
            ? member.memberships.map((m) => m.groupName).join(', ')
            : `${libraryCountText(library.data.total, library.data.totalIsLowerBound)} in ${member.memberships.map((m) => m.groupName).join(', ')}.`}
        </AppText>
        {library.data && library.data.items.length > 0 ? (
          <>
            <AppText variant="label" tone="muted">Changed lately</AppText>
            <EntryList items={library.data.items.slice(0, SHOWN)} testID="landing-recent-list" />
          </>
        ) : null}
        <RowLink href="/library" testID="landing-to-library">Search the library</RowLink>
      </Card>
    </>
  );
}

function libraryCountText(total: number, lowerBound: boolean): string {
  if (lowerBound) return `More than ${formatInteger(total)} entries`;
  return total === 1 ? 'One entry' : `${formatInteger(total)} entries`;
}

/** Entries of one status that this person may see (page one), for the "your drafts" list. */
function useMyEntries(status: 'draft' | 'returned', enabled: boolean) {
  return useQuery({
    queryKey: [...complexKeys.all, 'start-page', status],
    queryFn: ({ signal }) => fetchComplexes({ status }, 1, signal).then((page) => page.items),
    enabled,
    retry: retryUnlessClientError,
  });
}

function ReviewList({ items }: { items: ReviewQueueResponse['items'] | undefined }) {
  return (
    <Card testID="landing-review">
      <AppText variant="title" accessibilityRole="header" aria-level={2}>Waiting for your review</AppText>
      {items === undefined ? (
        <AppText tone="muted">Looking…</AppText>
      ) : items.length === 0 ? (
        <AppText tone="soft" testID="landing-review-empty">Nothing waits for review.</AppText>
      ) : (
        <>
          <AppText tone="soft" testID="landing-review-count">
            {items.length === 1 ? 'One entry waits' : `${items.length} entries wait`}, oldest first.
          </AppText>
          <View style={styles.list}>
            {items.slice(0, SHOWN).map((item) => (
              <EntryRow
                key={item.id}
                id={item.id}
                formula={item.formula}
                name={item.name}
                detail={`${item.submittedBy?.displayName ?? 'Someone no longer in the group'} · ${item.submittedAt ? relativeAge(item.submittedAt) : 'submitted'}`}
                verdict={item.verdict}
              />
            ))}
          </View>
        </>
      )}
      <RowLink href="/review" testID="landing-to-review">Open the review queue</RowLink>
    </Card>
  );
}

function EntryList({ items, testID }: { items: ComplexListItem[]; testID: string }) {
  return (
    <View style={styles.list} testID={testID}>
      {items.map((item) => (
        <EntryRow
          key={item.id}
          id={item.id}
          formula={item.formula}
          name={item.name}
          detail={`Changed ${relativeAge(item.updatedAt)}`}
          status={item.status}
          verdict={item.verdict}
        />
      ))}
    </View>
  );
}

function EntryRow({ id, formula, name, detail, verdict, status }: {
  id: string;
  formula: string;
  name: string;
  detail: string;
  verdict?: ComplexListItem['verdict'];
  /** Shown when the entry is not (yet) accepted; an accepted entry shows its verdict. */
  status?: ComplexListItem['status'];
}) {
  return (
    <Link href={`/library/${id}`} asChild>
      <Pressable accessibilityRole="link" style={styles.row} testID={`landing-entry-${id}`}>
        <View style={styles.rowText}>
          <FormulaText formula={formula} variant="body" />
          <AppText variant="caption" tone="muted" numberOfLines={1}>{name} · {detail}</AppText>
        </View>
        {status && status !== 'accepted' ? <StatusPill status={status} /> : verdict ? <VerdictBadge verdict={verdict} size="sm" /> : null}
      </Pressable>
    </Link>
  );
}

const styles = StyleSheet.create({
  list: { borderTopWidth: 1, borderTopColor: colors.line },
  row: {
    minHeight: 44,
    flexDirection: 'row',
    alignItems: 'center',
    gap: spacing.sm,
    paddingVertical: spacing.xs,
    borderBottomWidth: 1,
    borderBottomColor: colors.line,
  },
  rowText: { flex: 1, minWidth: 0 },
});
