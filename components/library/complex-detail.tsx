import { useState } from 'react';
import { ScrollView, StyleSheet, View } from 'react-native';
import { ErrorBlock, LoadingBlock, StaleNotice } from '@/components/account/query-states';
import { Link, useRouter } from 'expo-router';
import { CautionsCard, IdentityCard, VerdictCard } from '@/components/check/result-cards';
import { useClassification } from '@/components/check/use-classification';
import { Card } from '@/components/ui/card';
import { Chip } from '@/components/ui/chip';
import { FormulaText } from '@/components/ui/formula-text';
import { AppText } from '@/components/ui/text';
import { colors, fonts, radius, spacing } from '@/components/ui/theme';
import { StatusPill, VerdictBadge } from '@/components/ui/verdict-badge';
import { ApiError } from '@/lib/api/api-client';
import { classifyFormula } from '@/lib/chem/classify';
import { verdictFromLogK } from '@/lib/chem/lability';
import { decideByLibrary, logKMovedTo, modelGapLogUnits, needsSecondLook, pickDecidingMeasurement, SECOND_LOOK_LOG_UNITS } from '@/lib/chem/library-decision';
import type { LibraryMeasurementRef } from '@/lib/chem/types';
import { roleAtLeast } from '@/lib/schemas/groups';
import { ACCEPTED_STATUS } from '@/lib/schemas/library-status';
import { useComplexQuery } from '@/lib/api/library';
import type { ComplexDetail, ComplexSnapshot } from '@/lib/schemas/library';
import { AttachmentsPanel } from '@/components/exchange/attachments-panel';
import { ComplexActions } from './complex-actions';
import { dateTimeText, metalLabel } from './library-format';
import { MeasurementsTable } from './measurements-table';
import { ReviewThread, RevisionHistory } from './revision-history';
import { useLibraryAccess } from './use-library-access';

/** Room temperature for the engine's estimate beside the measured values. */
const DISPLAY_TEMPERATURE_C = 25;

/** One library entry: identity, the engine's view, measurements, history, review and actions. */
/**
 * "← Library": back to the list as it was left (its search, filters, order and pages are in the
 * address of the history entry before), or to the library's start when the entry was opened directly.
 */
function BackToLibrary() {
  const router = useRouter();
  return (
    <Link
      href="/library"
      testID="complex-back"
      style={styles.backLink}
      onPress={(event) => {
        if (!router.canGoBack()) return;
        event.preventDefault();
        router.back();
      }}
    >
      ← Library
    </Link>
  );
}

export function ComplexDetailView({ id, showBackLink = false }: { id: string; showBackLink?: boolean }) {
  const query = useComplexQuery(id);
  return (
    <ScrollView style={styles.scroll} contentContainerStyle={styles.content}>
      <View style={styles.column} testID="complex-detail">
        {showBackLink ? <BackToLibrary /> : null}
        {query.data === undefined ? (
          query.isError ? (
            <ErrorBlock
              title={query.error instanceof ApiError && query.error.code === 'NOT_FOUND' ? 'This entry is not in your library' : 'The entry could not be loaded'}
              error={query.error}
              onRetry={() => void query.refetch()}
              testID="complex-detail-error"
            />
          ) : (
            <LoadingBlock label="Loading the entry…" testID="complex-detail-loading" />
          )
        ) : (
          <>
            {query.isError ? <StaleNotice error={query.error} onRetry={() => void query.refetch()} testID="complex-detail-stale" /> : null}
            <EntryBody entry={query.data} />
          </>
        )}
      </View>
    </ScrollView>
  );
}

function EntryBody({ entry }: { entry: ComplexDetail }) {
  const [showApproved, setShowApproved] = useState(false);
  const shown: ComplexSnapshot = showApproved && entry.accepted ? entry.accepted : entry;
  const deciding = entryDecidingMeasurement(entry);
  const headVerdict = deciding ? verdictFromLogK(logKMovedTo(deciding.kPerSecond, deciding.temperatureK, DISPLAY_TEMPERATURE_C + 273.15)) : shown.verdict;
  return (
    <>
      <View style={styles.head}>
        <FormulaText formula={shown.formula} variant="display" testID="complex-formula" />
        <AppText variant="lead" tone="soft" testID="complex-name">{shown.name}</AppText>
        <View style={styles.badges}>
          <VerdictBadge verdict={headVerdict} />
          {deciding ? <AppText variant="caption" tone="accent" testID="complex-decided-by">measured</AppText> : null}
          <StatusPill status={shown.status} />
          <AppText variant="caption" tone="muted">
            {metalLabel(shown.metal, shown.oxidationState)} · d{shown.dElectrons}
            {shown.spinState ? ` · ${shown.spinState} spin` : ''} · v{entry.version}
          </AppText>
        </View>
        <AppText variant="caption" tone="muted">
          Added by {entry.createdBy?.displayName ?? 'someone no longer in the group'} · last change {dateTimeText(entry.updatedAt)}
          {entry.acceptedAt ? ` · accepted ${dateTimeText(entry.acceptedAt)}` : ''}
        </AppText>
      </View>

      <PendingBanner entry={entry} showApproved={showApproved} onToggle={() => setShowApproved(!showApproved)} />
      <LatestReviewNote entry={entry} />
      <ComplexActions entry={entry} />

      <Card title="Measured" testID="complex-measured-card">
        <MeasurementsTable measurements={shown.measurements} />
      </Card>
      {shown.notes ? (
        <Card title="Notes">
          <AppText testID="complex-notes">{shown.notes}</AppText>
        </Card>
      ) : null}
      <AttachmentsPanel entry={entry} />
      <EnginePanel formula={shown.formula} entry={entry} />
      <Card title="Review" testID="complex-review-card">
        <ReviewThread complexId={entry.id} />
      </Card>
      <Card title="History" testID="complex-history-card">
        <RevisionHistory complexId={entry.id} />
      </Card>
    </>
  );
}

/** An accepted version stays the group's data while a newer revision waits. */
function PendingBanner({ entry, showApproved, onToggle }: { entry: ComplexDetail; showApproved: boolean; onToggle: () => void }) {
  if (!entry.hasPendingRevision) return null;
  const published = entry.view === 'published';
  return (
    <View style={styles.banner} testID="complex-pending-banner" accessibilityRole="alert">
      <AppText style={styles.bannerText}>
        {published
          ? 'Accepted version shown; a newer revision awaits review.'
          : showApproved
            ? 'Accepted version shown; the newer revision below it awaits review.'
            : 'You are looking at the newer revision; the accepted version stays the group’s data until this one is accepted.'}
      </AppText>
      {!published && entry.accepted ? (
        <Chip
          label={showApproved ? 'Show the newer revision' : 'Show the accepted version'}
          onPress={onToggle}
          selected={showApproved}
          testID="complex-toggle-accepted"
        />
      ) : null}
    </View>
  );
}

function LatestReviewNote({ entry }: { entry: ComplexDetail }) {
  const review = entry.latestReview;
  if (!review || review.decision === 'accept' || (entry.status !== 'returned' && entry.status !== 'declined')) return null;
  return (
    <View style={styles.reviewNote} testID="complex-latest-review">
      <AppText variant="label" style={styles.reviewNoteTitle}>
        {review.decision === 'return' ? 'Returned' : 'Declined'} by {review.reviewer?.displayName ?? 'a curator'}
      </AppText>
      <AppText>{review.comment}</AppText>
    </View>
  );
}

/** The snapshot whose measurements count: the entry once accepted, or its accepted version while an edit waits. */
function acceptedSnapshot(entry: ComplexDetail): ComplexSnapshot | null {
  if (entry.status === ACCEPTED_STATUS) return entry;
  return entry.accepted && entry.accepted.status === ACCEPTED_STATUS ? entry.accepted : null;
}

/** The accepted first-order rate of this entry that decides its verdict, if any. */
function entryDecidingMeasurement(entry: ComplexDetail): LibraryMeasurementRef | null {
  const accepted = acceptedSnapshot(entry);
  if (!accepted) return null;
  return pickDecidingMeasurement(
    [{ entryId: entry.id, entryName: accepted.name, entryFormula: accepted.formula, measurements: accepted.measurements }],
    DISPLAY_TEMPERATURE_C + 273.15,
  );
}

/**
 * The engine's reading of the formula, computed here (pure and instant). When the accepted entry
 * holds a first-order rate, that measurement decides the verdict and the headline and the model's
 * prediction is the footnote; curators see a flag when the two differ by more than two log units.
 */
function EnginePanel({ formula, entry }: { formula: string; entry: ComplexDetail }) {
  const state = useClassification(formula, DISPLAY_TEMPERATURE_C, null);
  const access = useLibraryAccess();
  if (state.kind !== 'result') {
    return state.kind === 'problem' ? (
      <Card title="Prediction">
        <AppText tone="danger">The engine cannot read this formula: {state.problem.message}</AppText>
      </Card>
    ) : null;
  }
  const ref = entryDecidingMeasurement(entry);
  const result = ref ? decideByLibrary(state.result, ref) : state.result;
  const curator = access.state === 'member' && access.memberships.some((m) => m.groupId === entry.groupId && roleAtLeast(m.role, 'curator'));
  const gap = ref && curator ? modelGapAt(formula, ref) : null;
  return (
    <View style={styles.engine} testID="complex-engine">
      {gap !== null && needsSecondLook(gap) ? (
        <View style={styles.banner} testID="complex-second-look" accessibilityRole="alert">
          <AppText style={styles.bannerText}>
            Measurement and model differ by {gap.toFixed(1)} log units (more than {SECOND_LOOK_LOG_UNITS}): this entry deserves a second look —
            check the units, the temperature, the species and the citation.
          </AppText>
        </View>
      ) : null}
      <AppText variant="caption" tone="muted">
        {ref
          ? `Decided by this entry’s accepted measurement at ${DISPLAY_TEMPERATURE_C} °C; the model’s prediction is the footnote.`
          : `Predicted by Sphereline’s rules of thumb at ${DISPLAY_TEMPERATURE_C} °C — an estimate, not a measurement; once the entry is accepted with a measured rate, the measurement decides.`}
      </AppText>
      <VerdictCard result={result} />
      <IdentityCard result={state.result} />
      <CautionsCard result={state.result} />
    </View>
  );
}

/** Model against measurement, both at the temperature the measurement was made at (null when the engine cannot go there). */
function modelGapAt(formula: string, ref: LibraryMeasurementRef): number | null {
  try {
    const model = classifyFormula(formula, { temperatureC: ref.temperatureK - 273.15 });
    return modelGapLogUnits(ref.kPerSecond, model.predictedLogKPerSecond ?? model.logKPerSecond);
  } catch {
    return null;
  }
}

const styles = StyleSheet.create({
  scroll: { flex: 1, backgroundColor: colors.paper },
  backLink: { fontFamily: fonts.strong, color: colors.accent, textDecorationLine: 'underline', minHeight: 44, paddingVertical: spacing.sm, alignSelf: 'flex-start' },
  content: { paddingHorizontal: spacing.lg, paddingVertical: spacing.xl, alignItems: 'center' },
  column: { width: '100%', maxWidth: 880, gap: spacing.lg },
  head: { gap: spacing.xs },
  badges: { flexDirection: 'row', flexWrap: 'wrap', alignItems: 'center', gap: spacing.sm },
  banner: {
    backgroundColor: colors.noticeSoft,
    borderLeftWidth: 4,
    borderLeftColor: colors.notice,
    borderRadius: radius.md,
    padding: spacing.md,
    gap: spacing.sm,
    alignItems: 'flex-start',
  },
  bannerText: { color: colors.ink },
  reviewNote: { borderLeftWidth: 4, borderLeftColor: colors.notice, paddingLeft: spacing.md, gap: 2 },
  reviewNoteTitle: { color: colors.notice },
  engine: { gap: spacing.md },
});
