import { useState } from 'react';
import { StyleSheet, View } from 'react-native';
import { ErrorBlock, LoadingBlock, StaleNotice } from '@/components/account/query-states';
import { BulletList } from '@/components/ui/bullet-list';
import { Chip } from '@/components/ui/chip';
import { AppText } from '@/components/ui/text';
import { colors, spacing } from '@/components/ui/theme';
import { useRevisionDiffQuery, useRevisionsQuery } from '@/lib/api/library';
import type { Revision } from '@/lib/schemas/library';
import { relativeAge } from './library-format';

const KIND_WORDS: Record<Revision['kind'], string> = {
  create: 'Created',
  edit: 'Edited',
  submit: 'Submitted',
  review: 'Reviewed',
  retire: 'Retired',
  restore: 'Restored',
};

/** One line per revision: its own words when they already say what kind of change it was ("Created with …", "Renamed; …"). */
export function revisionLine(revision: Pick<Revision, 'kind' | 'message'>): string {
  const kind = KIND_WORDS[revision.kind];
  const message = revision.message.trim();
  if (!message || message.toLowerCase() === kind.toLowerCase()) return kind;
  // An edit's summary, a review's decision and a creation's line say it themselves.
  if (revision.kind === 'edit' || revision.kind === 'review' || message.toLowerCase().startsWith(kind.toLowerCase())) return message;
  return `${kind} · ${message}`;
}

/** Every change with author and time, and what changed between any two revisions. */
export function RevisionHistory({ complexId }: { complexId: string }) {
  const revisions = useRevisionsQuery(complexId);
  if (revisions.data === undefined) {
    return revisions.isError ? (
      <ErrorBlock title="The history could not be loaded" error={revisions.error} onRetry={() => void revisions.refetch()} testID="complex-revisions-error" />
    ) : (
      <LoadingBlock label="Loading the history…" testID="complex-revisions-loading" />
    );
  }
  return (
    <View style={styles.wrap} testID="complex-revisions">
      {revisions.isError ? <StaleNotice error={revisions.error} onRetry={() => void revisions.refetch()} /> : null}
      {revisions.data.map((revision) => (
        <View key={revision.id} style={styles.revision} testID={`revision-${revision.number}`}>
          <AppText tone="accent" style={styles.number}>v{revision.number}</AppText>
          <View style={styles.revisionText}>
            <AppText>
              {revisionLine(revision)}
            </AppText>
            <AppText variant="caption" tone="muted">
              {revision.author?.displayName ?? 'someone no longer in the group'} · {relativeAge(revision.createdAt)}
            </AppText>
          </View>
        </View>
      ))}
      {revisions.data.length > 1 ? <DiffPicker complexId={complexId} revisions={revisions.data} /> : null}
    </View>
  );
}

function DiffPicker({ complexId, revisions }: { complexId: string; revisions: readonly Revision[] }) {
  // Revisions arrive newest first; by default compare the one before the newest with the newest.
  const newest = revisions[0]?.number ?? 1;
  const previous = revisions[1]?.number ?? newest;
  const [picked, setPicked] = useState<{ from?: number; to?: number }>({});
  const from = picked.from ?? previous;
  const to = picked.to ?? newest;
  const setFrom = (n: number) => setPicked((p) => ({ ...p, from: n }));
  const setTo = (n: number) => setPicked((p) => ({ ...p, to: n }));
  const diff = useRevisionDiffQuery(complexId, from, to);
  const numbers = [...revisions].map((r) => r.number).sort((a, b) => a - b);
  return (
    <View style={styles.diff} testID="complex-diff-picker">
      <AppText variant="label" tone="muted">Compare revisions</AppText>
      <View style={styles.pickRow}>
        <AppText tone="soft" style={styles.pickLabel}>From</AppText>
        {numbers.map((n) => (
          <Chip key={n} label={`v${n}`} selected={from === n} onPress={() => setFrom(n)} testID={`revision-from-${n}`} />
        ))}
      </View>
      <View style={styles.pickRow}>
        <AppText tone="soft" style={styles.pickLabel}>To</AppText>
        {numbers.map((n) => (
          <Chip key={n} label={`v${n}`} selected={to === n} onPress={() => setTo(n)} testID={`revision-to-${n}`} />
        ))}
      </View>
      {from === to ? (
        <AppText tone="soft">Choose two different revisions to see what changed.</AppText>
      ) : diff.data === undefined ? (
        diff.isError ? (
          <ErrorBlock title="The comparison could not be loaded" error={diff.error} onRetry={() => void diff.refetch()} testID="complex-diff-error" />
        ) : (
          <LoadingBlock label="Comparing…" />
        )
      ) : (
        <View style={styles.diffBody} testID="complex-diff">
          <AppText variant="caption" tone="muted">
            Changes from v{diff.data.from} to v{diff.data.to}
          </AppText>
          {diff.data.summary.length > 0 ? (
            <BulletList items={diff.data.summary} />
          ) : (
            <AppText tone="soft">No differences in content (only the status or the history changed).</AppText>
          )}
        </View>
      )}
    </View>
  );
}

/** Submissions and review decisions, oldest first: the conversation between contributor and curators. */
export function ReviewThread({ complexId }: { complexId: string }) {
  const revisions = useRevisionsQuery(complexId);
  const events = (revisions.data ?? []).filter((r) => r.kind === 'submit' || r.kind === 'review').reverse();
  if (revisions.data === undefined) return null;
  if (events.length === 0) {
    return <AppText tone="soft" testID="complex-review-thread-empty">Not submitted for review yet.</AppText>;
  }
  return (
    <View style={styles.thread} testID="complex-review-thread">
      {events.map((event) => (
        <View key={event.id} style={StyleSheet.flatten([styles.post, event.kind === 'review' ? styles.reviewPost : null])}>
          <AppText variant="caption" tone="muted">
            {event.author?.displayName ?? 'someone no longer in the group'} · v{event.number} · {relativeAge(event.createdAt)}
          </AppText>
          <AppText>{event.message}</AppText>
        </View>
      ))}
    </View>
  );
}

const styles = StyleSheet.create({
  wrap: { gap: spacing.sm },
  revision: { flexDirection: 'row', gap: spacing.md, alignItems: 'flex-start' },
  number: { width: 36, paddingTop: 3 },
  revisionText: { flex: 1 },
  diff: { gap: spacing.sm, marginTop: spacing.md, paddingTop: spacing.md, borderTopWidth: 1, borderTopColor: colors.line },
  pickRow: { flexDirection: 'row', flexWrap: 'wrap', alignItems: 'center', gap: spacing.xs },
  pickLabel: { width: 44 },
  diffBody: { gap: spacing.sm },
  thread: { gap: spacing.sm },
  post: { borderLeftWidth: 3, borderLeftColor: colors.line, paddingLeft: spacing.md, gap: 2 },
  reviewPost: { borderLeftColor: colors.accent },
});
