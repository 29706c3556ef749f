import type { UseQueryResult } from '@tanstack/react-query';
import type { ReactNode } from 'react';
import { ActivityIndicator, StyleSheet, View } from 'react-native';
import { Button } from '@/components/ui/button';
import { AppText } from '@/components/ui/text';
import { colors, radius, spacing } from '@/components/ui/theme';
import { describeError } from './form-errors';

/** First load: a quiet line with a spinner, so the layout does not jump when data arrives. */
export function LoadingBlock({ label, testID }: { label: string; testID?: string }) {
  return (
    <View style={styles.loading} testID={testID} accessibilityLiveRegion="polite">
      <ActivityIndicator color={colors.accent} />
      <AppText tone="muted">{label}</AppText>
    </View>
  );
}

/** First load failed: what went wrong and a way to try again. */
export function ErrorBlock({ title, error, onRetry, testID }: {
  title: string;
  error: unknown;
  onRetry?: () => void;
  testID?: string;
}) {
  return (
    <View style={styles.error} testID={testID} accessibilityRole="alert">
      <AppText variant="lead" style={styles.errorTitle}>{title}</AppText>
      <AppText tone="soft">{describeError(error)}</AppText>
      {onRetry ? (
        <View style={styles.retry}>
          <Button label="Try again" kind="quiet" onPress={onRetry} testID={testID ? `${testID}-retry` : undefined} />
        </View>
      ) : null}
    </View>
  );
}

/** A refresh failed but older data is on screen: keep it, and say it may be out of date. */
export function StaleNotice({ error, onRetry, testID }: { error: unknown; onRetry: () => void; testID?: string }) {
  return (
    <View style={styles.stale} testID={testID}>
      <AppText variant="caption" style={styles.staleText}>
        Could not refresh — showing what was loaded before. {describeError(error)}
      </AppText>
      <AppText variant="caption" style={styles.staleAction} accessibilityRole="button" onPress={onRetry}>
        Retry
      </AppText>
    </View>
  );
}

/**
 * The four states of a data block in one place: loading (first time), error (nothing to show), content,
 * and content with a notice when a later refresh failed (the old data stays).
 */
export function QueryContent<T>({ query, loadingLabel, errorTitle, testID, children }: {
  query: UseQueryResult<T>;
  loadingLabel: string;
  errorTitle: string;
  testID: string;
  children: (data: T) => ReactNode;
}) {
  const retry = () => {
    void query.refetch();
  };
  if (query.data === undefined) {
    if (query.isError) return <ErrorBlock title={errorTitle} error={query.error} onRetry={retry} testID={`${testID}-error`} />;
    return <LoadingBlock label={loadingLabel} testID={`${testID}-loading`} />;
  }
  return (
    <>
      {query.isError ? <StaleNotice error={query.error} onRetry={retry} testID={`${testID}-stale`} /> : null}
      {children(query.data)}
    </>
  );
}

const styles = StyleSheet.create({
  loading: { flexDirection: 'row', alignItems: 'center', gap: spacing.sm, paddingVertical: spacing.md },
  error: {
    backgroundColor: colors.dangerSoft,
    borderRadius: radius.md,
    padding: spacing.lg,
    gap: spacing.sm,
  },
  errorTitle: { color: colors.danger },
  retry: { alignSelf: 'flex-start' },
  stale: {
    flexDirection: 'row',
    flexWrap: 'wrap',
    alignItems: 'center',
    gap: spacing.sm,
    backgroundColor: colors.noticeSoft,
    borderRadius: radius.sm,
    paddingHorizontal: spacing.md,
    paddingVertical: spacing.sm,
  },
  staleText: { color: colors.ink, flexShrink: 1 },
  staleAction: { color: colors.notice, textDecorationLine: 'underline', fontWeight: '600' },
});
