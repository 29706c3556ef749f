import { useRouter } from 'expo-router';
import { useState } from 'react';
import { StyleSheet, View } from 'react-native';
import { describeError } from '@/components/account/form-errors';
import { REVIEW_DONE_WORDS, ReviewPanel } from '@/components/review/review-panel';
import { Button } from '@/components/ui/button';
import { FormError } from '@/components/ui/form-error';
import { TextField } from '@/components/ui/text-field';
import { AppText } from '@/components/ui/text';
import { spacing } from '@/components/ui/theme';
import { StaleVersionError, useRetireComplexMutation, useSubmitComplexMutation } from '@/lib/api/library';
import { roleAtLeast } from '@/lib/schemas/groups';
import type { ComplexDetail } from '@/lib/schemas/library';

const STALE_ACTION =
  'Someone else saved this entry since you opened it. The current version is shown now — look it over and try again.';

function actionProblem(error: unknown): string {
  return error instanceof StaleVersionError ? STALE_ACTION : describeError(error);
}

/** What this person may do with this entry now (the server's permissions, never guessed here). */
export function ComplexActions({ entry }: { entry: ComplexDetail }) {
  const router = useRouter();
  const submit = useSubmitComplexMutation(entry.id);
  const retire = useRetireComplexMutation(entry.id);
  const [problem, setProblem] = useState<string | null>(null);
  const [done, setDone] = useState<string | null>(null);
  const [retiring, setRetiring] = useState(false);
  const [retireReason, setRetireReason] = useState('');
  const { permissions } = entry;
  const curator = roleAtLeast(entry.myRole, 'curator');
  const waitingForAnotherCurator = curator && entry.status === 'in-review' && !permissions.canReview;

  const onSubmit = async () => {
    setProblem(null);
    setDone(null);
    try {
      await submit.mutateAsync({ version: entry.version });
      setDone('Submitted: a curator of your group will review it. The review queue shows it oldest first.');
    } catch (error) {
      setProblem(actionProblem(error));
    }
  };
  const onRetire = async () => {
    setProblem(null);
    setDone(null);
    try {
      const reason = retireReason.trim();
      await retire.mutateAsync({ version: entry.version, ...(reason ? { message: `Retired: ${reason}` } : {}) });
      setRetiring(false);
      setRetireReason('');
      setDone('Retired: the entry stays in the history but no longer counts as the group’s data.');
    } catch (error) {
      setProblem(actionProblem(error));
    }
  };

  const anything = permissions.canEdit || permissions.canSubmit || permissions.canRetire || permissions.canReview || waitingForAnotherCurator;
  if (!anything && !done) return null;
  return (
    <View style={styles.wrap} testID="complex-actions">
      <View style={styles.row}>
        {permissions.canEdit ? (
          <Button label="Edit" kind="quiet" onPress={() => router.push(`/library/${entry.id}/edit`)} testID="complex-edit" />
        ) : null}
        {permissions.canSubmit ? (
          <Button
            label={submit.isPending ? 'Submitting…' : 'Submit for review'}
            accessibilityLabel="Submit for review"
            onPress={() => void onSubmit()}
            disabled={submit.isPending}
            testID="complex-submit"
          />
        ) : null}
        {permissions.canRetire && !retiring ? (
          <Button label="Retire…" kind="quiet" onPress={() => setRetiring(true)} testID="complex-retire" />
        ) : null}
      </View>
      {retiring ? (
        <View style={styles.retire} testID="complex-retire-box">
          <AppText>
            Retiring keeps the entry and its history for the record, but it leaves searches and no longer counts as the group’s data. It cannot be undone here.
          </AppText>
          <TextField
            label="Why (shown in the history)"
            value={retireReason}
            onChangeText={setRetireReason}
            autoCapitalize="sentences"
            placeholder="e.g. superseded by a better measurement"
            testID="complex-retire-reason"
          />
          <View style={styles.row}>
            <Button
              label={retire.isPending ? 'Retiring…' : 'Retire this entry'}
              accessibilityLabel="Retire this entry"
              onPress={() => void onRetire()}
              disabled={retire.isPending}
              testID="complex-retire-confirm"
            />
            <Button label="Keep it" kind="quiet" onPress={() => setRetiring(false)} testID="complex-retire-cancel" />
          </View>
        </View>
      ) : null}
      {waitingForAnotherCurator ? (
        <AppText tone="soft" testID="complex-own-submission">
          You submitted this revision, so another curator of the group reviews it.
        </AppText>
      ) : null}
      <FormError message={problem} testID="complex-action-error" />
      <FormError message={done} tone="done" testID="complex-action-done" />
      {permissions.canReview ? (
        // The panel goes once the decision is made (the entry is no longer "in-review"): the note stays here.
        <ReviewPanel complexId={entry.id} version={entry.version} onDone={({ review }) => setDone(REVIEW_DONE_WORDS[review.decision])} />
      ) : null}
    </View>
  );
}

const styles = StyleSheet.create({
  wrap: { gap: spacing.md },
  row: { flexDirection: 'row', flexWrap: 'wrap', gap: spacing.sm, alignItems: 'center' },
  retire: { gap: spacing.md },
});
