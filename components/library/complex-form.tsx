import { zodResolver } from '@hookform/resolvers/zod';
import { useRouter } from 'expo-router';
import { useMemo, useState } from 'react';
import { Controller, useFieldArray, useForm, useWatch, type FieldPath, type UseFormSetError } from 'react-hook-form';
import { StyleSheet, View } from 'react-native';
import { describeError } from '@/components/account/form-errors';
import { ErrorBlock, LoadingBlock } from '@/components/account/query-states';
import { TextLink } from '@/components/account/auth-frame';
import { FormulaInput } from '@/components/check/formula-input';
import { useClassification } from '@/components/check/use-classification';
import { Button } from '@/components/ui/button';
import { Chip } from '@/components/ui/chip';
import { FormError } from '@/components/ui/form-error';
import { Screen } from '@/components/ui/screen';
import { AppText } from '@/components/ui/text';
import { colors, radius, spacing } from '@/components/ui/theme';
import { useDebouncedValue } from '@/components/ui/use-debounced-value';
import { FormulaText } from '@/components/ui/formula-text';
import { StatusPill, VerdictBadge } from '@/components/ui/verdict-badge';
import { ApiError } from '@/lib/api/api-client';
import { suggestedName } from '@/lib/chem/naming';
import { StaleVersionError, useComplexQuery, useCreateComplexMutation, useDuplicatesQuery, useSaveComplexMutation } from '@/lib/api/library';
import { roleAtLeast } from '@/lib/schemas/groups';
import type { ComplexDetail } from '@/lib/schemas/library';
import {
  blankMeasurement,
  complexFormSchema,
  createInputFromForm,
  describeFormChanges,
  formFromEntry,
  saveInputFromForm,
  type ComplexFormValues,
} from '@/lib/schemas/library-forms';
import { FormTextField } from '@/components/ui/form-text-field';
import { metalLabel } from './library-format';
import { MeasurementFields } from './measurement-fields';
import { StaleConflict } from './stale-conflict';
import { useLibraryAccess } from './use-library-access';

const LIVE_CHECK_DELAY_MS = 150;

const PLACEABLE = /^(formula|name|notes|message|groupId|measurements\.\d+\.(kind|value|unit|temperatureK|ionicStrengthM|medium|method|partnerFormula|notes|citation\.(doi|authors|title|journal|year|volume|pages)))$/;

/** Puts the server's field problems on their fields; returns the sentence for the form box, if any is left. */
export function placeServerErrors(error: unknown, setError: UseFormSetError<ComplexFormValues>): string | null {
  if (!(error instanceof ApiError)) return describeError(error);
  const entries = Object.entries(error.fields);
  let leftOver = entries.length === 0;
  let first = true;
  for (const [field, message] of entries) {
    if (PLACEABLE.test(field)) {
      setError(field as FieldPath<ComplexFormValues>, { type: 'server', message: sentence(field, message) }, { shouldFocus: first });
      first = false;
    } else {
      leftOver = true;
    }
  }
  return leftOver ? describeError(error) : null;
}

/** Formula messages of the shared schema are phrased to follow the word "Formula". */
function sentence(field: string, message: string): string {
  return field === 'formula' && /^[a-z]/.test(message) ? `The formula ${message}` : message;
}

export type ComplexFormScreenProps = { mode: 'create' } | { mode: 'edit'; complexId: string };

/** New entry, or an edit of one: the route decides which. */
export function ComplexFormScreen(props: ComplexFormScreenProps) {
  const access = useLibraryAccess();
  if (access.state === 'loading') return <Screen><LoadingBlock label="Loading…" /></Screen>;
  if (access.state === 'error') return <Screen><ErrorBlock title="Could not check your sign-in" error={access.error} onRetry={access.retry} /></Screen>;
  if (access.state !== 'member' || !access.canContribute) {
    return (
      <Screen maxWidth={720}>
        <View style={styles.message} testID="complex-form-not-allowed">
          <AppText variant="title">Adding to the library needs the contributor role</AppText>
          <AppText tone="soft">
            {access.state === 'signed-out'
              ? 'Sign in first: the library belongs to your group.'
              : 'Viewers read the group’s accepted entries; an admin of your group can make you a contributor.'}
          </AppText>
          <TextLink href={access.state === 'signed-out' ? '/sign-in?next=/library' : '/library'} testID="complex-form-leave">
            {access.state === 'signed-out' ? 'Sign in' : 'Back to the library'}
          </TextLink>
        </View>
      </Screen>
    );
  }
  const groups = access.memberships.filter((m) => roleAtLeast(m.role, 'contributor'));
  if (props.mode === 'create') return <ComplexForm base={null} groups={groups} />;
  return <EditLoader complexId={props.complexId} />;
}

function EditLoader({ complexId }: { complexId: string }) {
  const query = useComplexQuery(complexId);
  // The form keeps the version it was opened on; later refetches must not reset what is typed.
  const [base] = useState<ComplexDetail | undefined>(() => query.data);
  const opened = base ?? query.data;
  if (opened === undefined) {
    return (
      <Screen>
        {query.isError ? (
          <ErrorBlock title="The entry could not be loaded" error={query.error} onRetry={() => void query.refetch()} testID="complex-form-load-error" />
        ) : (
          <LoadingBlock label="Loading the entry…" />
        )}
      </Screen>
    );
  }
  if (!opened.permissions.canEdit) {
    return (
      <Screen maxWidth={720}>
        <View style={styles.message} testID="complex-form-not-editable">
          <AppText variant="title">This entry cannot be edited now</AppText>
          <AppText tone="soft">
            {opened.status === 'in-review'
              ? 'It is waiting for review: a curator decides first (accept, return for revision or decline).'
              : opened.status === 'retired' || opened.status === 'declined'
                ? 'Retired and declined entries stay as they are for the record; add a new entry instead.'
                : 'Contributors edit the entries they created; curators edit any entry.'}
          </AppText>
          <TextLink href={`/library/${complexId}`}>Back to the entry</TextLink>
        </View>
      </Screen>
    );
  }
  return <ComplexForm base={opened} groups={[]} />;
}

function ComplexForm({ base: openedOn, groups }: { base: ComplexDetail | null; groups: { groupId: string; groupName: string }[] }) {
  const router = useRouter();
  const editing = openedOn !== null;
  const [base, setBase] = useState<ComplexDetail | null>(openedOn);
  const [conflict, setConflict] = useState<{ current: ComplexDetail; changes: string[] } | null>(null);
  const [formError, setFormError] = useState<string | null>(null);
  const [notice, setNotice] = useState<string | null>(null);
  const create = useCreateComplexMutation();
  const save = useSaveComplexMutation(openedOn?.id ?? '');
  const { control, handleSubmit, setError, setValue, reset, clearErrors } = useForm<ComplexFormValues>({
    resolver: zodResolver(complexFormSchema),
    defaultValues: openedOn
      ? formFromEntry(openedOn)
      : { groupId: groups.length === 1 ? (groups[0]?.groupId ?? '') : '', formula: '', name: '', notes: '', message: '', measurements: [] },
  });
  const measurements = useFieldArray({ control, name: 'measurements', keyName: 'key' });
  const formula = useWatch({ control, name: 'formula' });
  const groupId = useWatch({ control, name: 'groupId' });
  const name = useWatch({ control, name: 'name' }) ?? '';
  const settledFormula = useDebouncedValue(formula, LIVE_CHECK_DELAY_MS);
  const live = useClassification(settledFormula, 25, null);
  // An IUPAC-style name from the formula, offered beside the name field; it never replaces what is typed.
  const suggestion = useMemo(() => (live.kind === 'result' ? suggestedName(settledFormula) : null), [live.kind, settledFormula]);
  // The same species already in the group: offered before a second entry is made.
  const formulaToCheck = live.kind === 'result' && settledFormula.trim() && settledFormula.trim() !== base?.formula ? settledFormula.trim() : null;
  const duplicates = useDuplicatesQuery(base?.groupId ?? (groupId || null), formulaToCheck, base?.id ?? null).data?.duplicates ?? [];
  const busy = create.isPending || save.isPending;

  const submit = handleSubmit(async (values) => {
    setFormError(null);
    setNotice(null);
    if (live.kind === 'problem') {
      setError('formula', { type: 'engine', message: `${live.problem.message} (character ${live.problem.position + 1})` }, { shouldFocus: true });
      return;
    }
    if (!editing && !values.groupId) {
      setError('groupId', { type: 'required', message: 'Choose the group this entry belongs to.' });
      return;
    }
    try {
      if (!base) {
        const entry = await create.mutateAsync(createInputFromForm(values));
        router.replace(`/library/${entry.id}`);
        return;
      }
      const input = saveInputFromForm(values, base);
      try {
        const entry = await save.mutateAsync(input);
        if (entry.version === base.version) {
          setNotice('Nothing has changed since the entry was opened, so there is nothing to save.');
          return;
        }
        router.replace(`/library/${entry.id}`);
      } catch (error) {
        if (error instanceof StaleVersionError) {
          setConflict({ current: error.current, changes: describeFormChanges(values, base) });
          return;
        }
        throw error;
      }
    } catch (error) {
      const message = placeServerErrors(error, setError);
      if (message) setFormError(message);
    }
  });

  const reapply = () => {
    if (!conflict) return;
    const { current } = conflict;
    setBase(current);
    setConflict(null);
    clearErrors();
    setNotice(`Your changes are back on top of version ${current.version}. Check them, then save again.`);
  };
  const discard = () => {
    if (!conflict) return;
    setBase(conflict.current);
    reset(formFromEntry(conflict.current));
    setConflict(null);
    setNotice(`Loaded version ${conflict.current.version}; your changes were dropped.`);
  };
  const removeRow = (index: number) => measurements.remove(index);

  return (
    <Screen maxWidth={880}>
      <View style={styles.form} testID="complex-form">
        <View style={styles.intro}>
          <AppText variant="title" accessibilityRole="header">{editing ? 'Edit entry' : 'New library entry'}</AppText>
          <AppText tone="soft">
            {editing
              ? `You are editing version ${base?.version}. Saving makes a new revision; an accepted entry stays published until a curator accepts the change.`
              : 'A complex with its measured values and their sources. It is a draft until you submit it and a curator accepts it.'}
          </AppText>
        </View>
        {conflict ? <StaleConflict current={conflict.current} yourChanges={conflict.changes} onReapply={reapply} onDiscard={discard} /> : null}

        {!editing && groups.length > 1 ? (
          <Controller
            control={control}
            name="groupId"
            render={({ fieldState }) => (
              <View style={styles.group} testID="complex-form-group">
                <AppText variant="label" tone="muted">Group</AppText>
                <View style={styles.chips}>
                  {groups.map((g) => (
                    <Chip key={g.groupId} label={g.groupName} selected={groupId === g.groupId} onPress={() => setValue('groupId', g.groupId)} testID={`complex-form-group-${g.groupId}`} />
                  ))}
                </View>
                {fieldState.error ? <AppText tone="danger" variant="caption" testID="complex-form-group-error">{fieldState.error.message}</AppText> : null}
              </View>
            )}
          />
        ) : null}

        <Controller
          control={control}
          name="formula"
          render={({ field, fieldState }) => (
            <View style={styles.group}>
              <FormulaInput
                label="Formula"
                value={field.value}
                onChangeText={field.onChange}
                problem={live.kind === 'problem' ? live.problem : null}
                testID="complex-form-formula"
              />
              {live.kind === 'problem' ? null : (
                <AppText variant="caption" tone="muted" testID="complex-form-formula-hint">
                  As written on paper, with the charge after the bracket. Example: [Cr(H2O)6]3+
                </AppText>
              )}
              {fieldState.error && live.kind !== 'problem' ? (
                <AppText tone="danger" variant="caption" testID="complex-form-formula-error">{sentence('formula', fieldState.error.message ?? '')}</AppText>
              ) : null}
            </View>
          )}
        />
        {live.kind === 'result' ? (
          <View style={styles.preview} testID="complex-form-preview">
            <VerdictBadge verdict={live.result.verdict} size="sm" />
            <AppText variant="caption" tone="soft">
              {metalLabel(live.result.metal, live.result.oxidationState)} · {live.result.electronShell === 'f' ? 'f' : 'd'}
              {live.result.dElectrons}
              {live.result.spinState ? ` ${live.result.spinState}-spin` : ''} · {live.result.geometry} · predicted at 25 °C
            </AppText>
          </View>
        ) : null}

        {formulaToCheck && duplicates.length > 0 ? (
          <View style={styles.duplicates} testID="complex-form-duplicates" accessibilityRole="alert">
            <AppText variant="label">This species is already in the library</AppText>
            {duplicates.map((d) => (
              <View key={d.id} style={styles.duplicateRow}>
                <FormulaText formula={d.formula} />
                <AppText>{d.name}</AppText>
                <StatusPill status={d.status} />
                <TextLink href={`/library/${d.id}`} testID={`complex-form-duplicate-${d.id}`}>Open it</TextLink>
              </View>
            ))}
            <AppText variant="caption" tone="soft">
              Same metal centre, oxidation state and ligand set. Add your measurements to that entry, or save this one if it is meant to stand apart.
            </AppText>
          </View>
        ) : null}

        <FormTextField control={control} name="name" label="Name" autoCapitalize="none" hint="Example: hexaaquachromium(III)" testID="complex-form-name" />
        {suggestion && suggestion !== name.trim() ? (
          <View style={styles.suggestion} testID="complex-form-name-suggestion">
            <AppText variant="caption" tone="soft" style={styles.suggestionText}>
              Suggested from the formula: <AppText variant="caption" style={styles.suggestionName}>{suggestion}</AppText>
            </AppText>
            <Button
              label="Use this name"
              accessibilityLabel={`Use this name: ${suggestion}`}
              kind="quiet"
              onPress={() => setValue('name', suggestion, { shouldDirty: true, shouldValidate: true })}
              testID="complex-form-use-name"
            />
          </View>
        ) : null}
        <FormTextField control={control} name="notes" label="Notes" autoCapitalize="sentences" multiline numberOfLines={4} hint="Preparation, caveats, anything a colleague should know." testID="complex-form-notes" />

        <View style={styles.section}>
          <AppText variant="label" tone="muted">Measurements</AppText>
          {measurements.fields.length === 0 ? (
            <AppText tone="soft">No measurements yet. Add the rate constants, potentials or activation parameters you have, each with its source.</AppText>
          ) : null}
          {measurements.fields.map((row, index) => (
            <MeasurementFields key={row.key} index={index} control={control} setValue={setValue} onRemove={() => removeRow(index)} />
          ))}
          <View style={styles.start}>
            <Button label="Add a measurement" kind="quiet" onPress={() => measurements.append(blankMeasurement())} testID="complex-form-add-measurement" />
          </View>
        </View>

        {editing ? (
          <FormTextField
            control={control}
            name="message"
            label="What changed (for the history)"
            autoCapitalize="sentences"
            hint="Example: Corrected the temperature"
            testID="complex-form-message"
          />
        ) : null}

        {conflict ? (
          <FormError
            message="Not saved: someone else saved this entry since you opened it. Their version and your choices are in the box at the top of the form."
            testID="complex-form-conflict-note"
          />
        ) : null}
        <FormError message={notice} tone="done" testID="complex-form-notice" />
        <FormError message={formError} testID="complex-form-error" />
        <View style={styles.actions}>
          <Button
            label={busy ? 'Saving…' : editing ? 'Save changes' : 'Save draft'}
            accessibilityLabel={editing ? 'Save changes' : 'Save draft'}
            onPress={() => void submit()}
            disabled={busy}
            testID="complex-form-save"
          />
          <Button
            label="Cancel"
            kind="quiet"
            onPress={() => (base ? router.replace(`/library/${base.id}`) : router.replace('/library'))}
            testID="complex-form-cancel"
          />
        </View>
      </View>
    </Screen>
  );
}

const styles = StyleSheet.create({
  form: { gap: spacing.lg },
  intro: { gap: spacing.xs },
  message: { gap: spacing.sm },
  group: { gap: spacing.xs },
  chips: { flexDirection: 'row', flexWrap: 'wrap', gap: spacing.xs },
  preview: {
    flexDirection: 'row',
    flexWrap: 'wrap',
    alignItems: 'center',
    gap: spacing.sm,
    padding: spacing.sm,
    borderRadius: radius.md,
    backgroundColor: colors.card,
    borderWidth: 1,
    borderColor: colors.line,
  },
  section: { gap: spacing.md },
  duplicates: { gap: spacing.xs, padding: spacing.sm, borderRadius: radius.md, borderWidth: 1, borderColor: colors.lineStrong, backgroundColor: colors.card },
  duplicateRow: { flexDirection: 'row', flexWrap: 'wrap', alignItems: 'center', gap: spacing.sm },
  start: { alignSelf: 'flex-start' },
  suggestion: { flexDirection: 'row', flexWrap: 'wrap', alignItems: 'center', gap: spacing.sm, marginTop: -spacing.sm },
  suggestionText: { flexShrink: 1 },
  suggestionName: { color: colors.ink },
  actions: { flexDirection: 'row', gap: spacing.sm, flexWrap: 'wrap' },
});
