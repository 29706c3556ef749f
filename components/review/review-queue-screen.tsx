import { useState } from 'react';
import { Pressable, StyleSheet, View } from 'react-native';
import { TextLink } from '@/components/account/auth-frame';
import { ErrorBlock, LoadingBlock, StaleNotice } from '@/components/account/query-states';
import { metalLabel, relativeAge } from '@/components/library/library-format';
import { useLibraryAccess } from '@/components/library/use-library-access';
import { FormulaText } from '@/components/ui/formula-text';
import { Screen } from '@/components/ui/screen';
import { AppText } from '@/components/ui/text';
import { colors, radius, spacing } from '@/components/ui/theme';
import { VerdictBadge } from '@/components/ui/verdict-badge';
import { useReviewQueueQuery } from '@/lib/api/library';
import type { ReviewQueueResponse, ReviewResponse } from '@/lib/schemas/library';
import { FormError } from '@/components/ui/form-error';
import { toDisplayFormula } from '@/lib/chem/display-formula';
import { REVIEW_DONE_WORDS, ReviewPanel } from './review-panel';

type QueueItem = ReviewQueueResponse['items'][number];

/** Review: the curators' queue of submitted entries, oldest submission first. */
export function ReviewQueueScreen() {
  const access = useLibraryAccess();
  const isCurator = access.state === 'member' && access.isCurator;
  const queue = useReviewQueueQuery(isCurator);

  if (access.state === 'loading') return <Screen><LoadingBlock label="Checking your role…" testID="review-loading" /></Screen>;
  if (access.state === 'error') {
    return <Screen><ErrorBlock title="Could not check your sign-in" error={access.error} onRetry={access.retry} testID="review-access-error" /></Screen>;
  }
  if (!isCurator) {
    return (
      <Screen maxWidth={720}>
        <View style={styles.message} testID="review-not-curator">
          <AppText variant="title">The review queue is for curators</AppText>
          <AppText tone="soft">
            Every library entry is checked by a curator of the group before the group relies on it: curators accept it, ask for changes or
            decline it, with a comment the author reads.
            {access.state === 'signed-out'
              ? ' Sign in with a curator account to review.'
              : ' You are not a curator in any of your groups; you can still submit entries and follow their review on each entry’s page.'}
          </AppText>
          {access.state === 'signed-out' ? (
            <TextLink href="/sign-in?next=/review" testID="review-sign-in">Sign in</TextLink>
          ) : (
            <TextLink href="/library" testID="review-to-library">Go to the library</TextLink>
          )}
        </View>
      </Screen>
    );
  }
  return (
    <Screen maxWidth={960}>
      <View style={styles.intro}>
        <AppText variant="title" accessibilityRole="header">Review queue</AppText>
        <AppText tone="soft">Entries in review in your groups, oldest first. A comment is required to return an entry for revision or to decline it.</AppText>
      </View>
      {queue.data === undefined ? (
        queue.isError ? (
          <ErrorBlock title="The queue could not be loaded" error={queue.error} onRetry={() => void queue.refetch()} testID="review-queue-error" />
        ) : (
          <LoadingBlock label="Loading the queue…" testID="review-queue-loading" />
        )
      ) : (
        <>
          {queue.isError ? <StaleNotice error={queue.error} onRetry={() => void queue.refetch()} testID="review-queue-stale" /> : null}
          <QueueList items={queue.data.items} />
        </>
      )}
    </Screen>
  );
}

function QueueList({ items }: { items: readonly QueueItem[] }) {
  const [openId, setOpenId] = useState<string | null>(null);
  // A decided entry leaves the queue (and its panel with it): say here what was done.
  const [lastDone, setLastDone] = useState<string | null>(null);
  const decided = (item: QueueItem) => (response: ReviewResponse) => {
    setLastDone(`${toDisplayFormula(item.formula)} — ${REVIEW_DONE_WORDS[response.review.decision]}`);
    setOpenId(null);
  };
  const doneNote = <FormError message={lastDone} tone="done" testID="review-queue-done" />;
  if (items.length === 0) {
    return (
      <View style={styles.message} testID="review-queue">
        {doneNote}
        <AppText variant="lead" testID="review-queue-empty">Nothing waits for review.</AppText>
        <AppText tone="soft">When someone in your groups submits an entry, it appears here.</AppText>
      </View>
    );
  }
  // One decision panel at a time: the first item's until another is chosen.
  const open = openId && items.some((i) => i.id === openId) ? openId : items[0]?.id;
  return (
    <View style={styles.list} testID="review-queue">
      <AppText variant="caption" tone="muted" testID="review-queue-count">
        {items.length === 1 ? '1 entry waits' : `${items.length} entries wait`} for review
      </AppText>
      {doneNote}
      {items.map((item, index) => (
        <QueueRow key={item.id} item={item} index={index} open={item.id === open} onOpen={() => setOpenId(item.id)} onDecided={decided(item)} />
      ))}
    </View>
  );
}

function QueueRow({ item, index, open, onOpen, onDecided }: {
  item: QueueItem;
  index: number;
  open: boolean;
  onOpen: () => void;
  onDecided: (response: ReviewResponse) => void;
}) {
  return (
    <View style={StyleSheet.flatten([styles.item, open ? styles.itemOpen : null])} testID={`review-item-${index}`}>
      {/* The button names the entry (formula and name on one line each); the details follow as text. */}
      <Pressable onPress={onOpen} accessibilityRole="button" accessibilityState={{ expanded: open }} style={styles.itemHead} testID={`review-item-${index}-open`}>
        <View style={styles.grow}>
          <FormulaText formula={item.formula} variant="lead" />
          <AppText tone="soft" numberOfLines={1}>{item.name}</AppText>
        </View>
        <VerdictBadge verdict={item.verdict} size="sm" />
      </Pressable>
      <View style={styles.meta}>
        <AppText variant="caption" tone="muted" testID={`review-item-${index}-meta`}>
          {item.submittedBy?.displayName ?? 'Someone no longer in the group'} · submitted {item.submittedAt ? relativeAge(item.submittedAt) : 'at an unknown time'} ·{' '}
          {item.groupName}
        </AppText>
        <AppText variant="caption" tone="muted">
          {metalLabel(item.metal, item.oxidationState)} · d{item.dElectrons} · {item.measurementCount}{' '}
          {item.measurementCount === 1 ? 'measurement' : 'measurements'}
          {item.hasCitation ? ' · cited' : ' · no citation yet'}
          {item.isEditOfApproved ? ' · edit of an accepted entry' : ' · new entry'}
        </AppText>
      </View>
      {open ? (
        <View style={styles.itemBody}>
          <TextLink href={`/library/${item.id}`} testID={`review-item-${index}-entry`}>Open the entry (measurements, citations, changes)</TextLink>
          <ReviewPanel complexId={item.id} version={item.version} onDone={onDecided} />
        </View>
      ) : null}
    </View>
  );
}

const styles = StyleSheet.create({
  intro: { gap: spacing.xs },
  message: { gap: spacing.sm },
  list: { gap: spacing.md },
  item: { borderWidth: 1, borderColor: colors.line, borderRadius: radius.md, backgroundColor: colors.card, padding: spacing.md, gap: spacing.md },
  itemOpen: { borderColor: colors.accent },
  itemHead: { flexDirection: 'row', gap: spacing.md, alignItems: 'flex-start', minHeight: 44 },
  meta: { gap: 2, marginTop: -spacing.sm },
  grow: { flex: 1, gap: 2 },
  itemBody: { gap: spacing.md },
});
