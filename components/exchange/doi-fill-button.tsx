import { useWatch, type Control, type UseFormSetValue } from 'react-hook-form';
import { ActivityIndicator, StyleSheet, View } from 'react-native';
import { describeError } from '@/components/account/form-errors';
import { Button } from '@/components/ui/button';
import { AppText } from '@/components/ui/text';
import { colors, spacing } from '@/components/ui/theme';
import { ApiError } from '@/lib/api/api-client';
import { useDoiLookupMutation } from '@/lib/api/exchange';
import type { ComplexFormValues } from '@/lib/schemas/library-forms';

/** Why a look-up gave nothing, in words that say what to do next (the form still works by hand). */
export function doiLookupProblem(error: unknown): string {
  if (error instanceof ApiError) {
    if (error.code === 'NOT_FOUND') return 'No record was found for this DOI. Check it, or type the citation in by hand.';
    if (error.code === 'UNAVAILABLE' || error.code === 'NETWORK') {
      return 'The DOI service is slow or unreachable right now. Try again in a moment, or type the citation in by hand.';
    }
    if (error.code === 'VALIDATION_FAILED') return `${error.fields.doi ?? error.message} A DOI looks like 10.1021/ic00196a001.`;
  }
  return describeError(error);
}

/**
 * "Fill from DOI" beside a measurement's DOI field: looks the DOI up and writes authors, title,
 * journal, year, volume and pages into the form for the person to check before saving.
 */
export function DoiFillButton({ index, control, setValue }: {
  index: number;
  control: Control<ComplexFormValues>;
  setValue: UseFormSetValue<ComplexFormValues>;
}) {
  const prefix = `measurements.${index}.citation` as const;
  const doi = useWatch({ control, name: `${prefix}.doi` });
  const lookup = useDoiLookupMutation();
  const id = `complex-form-m-${index}-doi-fill`;

  const fill = () => {
    lookup.mutate(doi, {
      onSuccess: (found) => {
        const set = (field: 'doi' | 'authors' | 'title' | 'journal' | 'year' | 'volume' | 'pages', value: string) =>
          setValue(`${prefix}.${field}`, value, { shouldDirty: true, shouldValidate: true });
        set('doi', found.doi);
        set('authors', found.authors);
        set('title', found.title ?? '');
        set('journal', found.journal);
        set('year', found.year === null ? '' : String(found.year));
        set('volume', found.volume ?? '');
        set('pages', found.pages ?? '');
      },
    });
  };

  return (
    <View style={styles.wrap}>
      <View style={styles.row}>
        <Button label="Fill from DOI" kind="quiet" onPress={fill} disabled={!doi?.trim() || lookup.isPending} testID={id} />
        {lookup.isPending ? <ActivityIndicator size="small" color={colors.accent} /> : null}
      </View>
      {lookup.isSuccess ? (
        <AppText variant="caption" tone="accent" testID={`${id}-done`}>Filled from the DOI record — check the fields before saving.</AppText>
      ) : null}
      {lookup.isError ? (
        <AppText variant="caption" tone="danger" testID={`${id}-error`} accessibilityLiveRegion="polite">
          {doiLookupProblem(lookup.error)}
        </AppText>
      ) : null}
    </View>
  );
}

const styles = StyleSheet.create({
  wrap: { gap: spacing.xs, alignItems: 'flex-start' },
  row: { flexDirection: 'row', alignItems: 'center', gap: spacing.sm },
});
