import { useState } from 'react';
import { StyleSheet, View } from 'react-native';
import { describeError } from '@/components/account/form-errors';
import { ApiError } from '@/lib/api/api-client';
import { Button } from '@/components/ui/button';
import { Chip } from '@/components/ui/chip';
import { FormError } from '@/components/ui/form-error';
import { TextField } from '@/components/ui/text-field';
import { AppText } from '@/components/ui/text';
import { colors, radius, spacing } from '@/components/ui/theme';
import { StaleVersionError, useReviewComplexMutation } from '@/lib/api/library';
import { reviewInputSchema, type ReviewDecision, type ReviewResponse } from '@/lib/schemas/library';

const DECISIONS: { decision: ReviewDecision; label: string; testID: string }[] = [
  { decision: 'accept', label: 'Accept', testID: 'review-accept' },
  { decision: 'return', label: 'Return for revision', testID: 'review-return' },
  { decision: 'decline', label: 'Decline', testID: 'review-decline' },
];

export const REVIEW_DONE_WORDS: Record<ReviewDecision, string> = {
  accept: 'Accepted: this version is now the one the group relies on.',
  'return': 'Returned: the author has been told what to change.',
  decline: 'Declined: the author has been told why.',
};

/**
 * A curator's decision on a submitted entry: accept, return for revision or decline, with a comment
 * (required unless accepting — the shared review schema says so, the server checks it again).
 */
export function ReviewPanel({ complexId, version, onDone }: {
  complexId: string;
  /** The version the curator is looking at: a newer one (someone edited meanwhile) is a 409. */
  version: number;
  onDone?: (response: ReviewResponse) => void;
}) {
  const review = useReviewComplexMutation(complexId);
  const [decision, setDecision] = useState<ReviewDecision | null>(null);
  const [comment, setComment] = useState('');
  const [commentError, setCommentError] = useState<string | null>(null);
  const [problem, setProblem] = useState<string | null>(null);
  const [done, setDone] = useState<ReviewDecision | null>(null);

  const send = async () => {
    setProblem(null);
    setCommentError(null);
    if (!decision) {
      setProblem('Choose a decision first: accept, return for revision or decline.');
      return;
    }
    const parsed = reviewInputSchema.safeParse({ decision, comment, version });
    if (!parsed.success) {
      const issue = parsed.error.issues.find((i) => i.path[0] === 'comment') ?? parsed.error.issues[0];
      if (issue?.path[0] === 'comment') setCommentError(issue.message);
      else setProblem(issue?.message ?? 'Check the decision and the comment.');
      return;
    }
    try {
      const response = await review.mutateAsync(parsed.data);
      setDone(parsed.data.decision);
      setComment('');
      setDecision(null);
      onDone?.(response);
    } catch (error) {
      if (error instanceof StaleVersionError) {
        setProblem('Someone changed this entry while you were reviewing it. The current version is shown now — look it over and decide again.');
      } else if (error instanceof ApiError && error.fields.comment) {
        setCommentError(error.fields.comment);
      } else {
        setProblem(describeError(error));
      }
    }
  };

  const needsComment = decision === 'return' || decision === 'decline';
  return (
    <View style={styles.panel} testID="review-panel">
      <AppText variant="lead">Your review (of version {version})</AppText>
      <View style={styles.choices} accessibilityRole="radiogroup">
        {DECISIONS.map((d) => (
          <Chip
            key={d.decision}
            label={d.label}
            selected={decision === d.decision}
            onPress={() => {
              setDecision(d.decision);
              setProblem(null);
              setDone(null);
            }}
            testID={d.testID}
          />
        ))}
      </View>
      <TextField
        label={needsComment ? 'Note to the author (required)' : 'Note to the author (may be left empty)'}
        value={comment}
        onChangeText={(text) => {
          setComment(text);
          if (commentError) setCommentError(null);
        }}
        hint={needsComment ? 'Say what should change, or why it is declined: the author reads this.' : undefined}
        error={commentError ?? undefined}
        autoCapitalize="sentences"
        testID="review-comment"
      />
      <FormError message={problem} testID="review-error" />
      <FormError message={done ? REVIEW_DONE_WORDS[done] : null} tone="done" testID="review-done" />
      <View style={styles.send}>
        <Button
          label={review.isPending ? 'Sending…' : 'Send review'}
          accessibilityLabel="Send review"
          onPress={() => void send()}
          disabled={review.isPending}
          testID="review-decision-submit"
        />
      </View>
    </View>
  );
}

const styles = StyleSheet.create({
  panel: {
    gap: spacing.md,
    padding: spacing.lg,
    borderRadius: radius.md,
    borderWidth: 1,
    borderColor: colors.accent,
    backgroundColor: colors.card,
  },
  choices: { flexDirection: 'row', flexWrap: 'wrap', gap: spacing.sm },
  send: { alignSelf: 'flex-start' },
});
