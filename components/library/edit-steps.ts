import type { EditStep } from '@/lib/api/library';
import { measurementKindRules, type ComplexDetail } from '@/lib/schemas/library';
import { measurementFromForm, measurementPatch, measurementToForm, type ComplexFormValues } from '@/lib/schemas/library-forms';

/** The entry as the form starts from it. */
export function formFromEntry(entry: ComplexDetail): ComplexFormValues {
  return {
    groupId: entry.groupId,
    formula: entry.formula,
    name: entry.name,
    notes: entry.notes ?? '',
    message: '',
    measurements: entry.measurements.map(measurementToForm),
  };
}

/**
 * The changes between the entry the edit is based on and the form, as the chain of requests that
 * saves them. `removedIds` are the rows the person removed (only those are deleted: a measurement
 * someone else added meanwhile is not in the form, and must not be deleted by this save).
 */
export function editSteps(base: ComplexDetail, values: ComplexFormValues, removedIds: readonly string[]): EditStep[] {
  const steps: EditStep[] = [];
  const formula = values.formula.trim();
  const name = values.name.trim();
  const notes = values.notes.trim() === '' ? null : values.notes.trim();
  const entryChange: Extract<EditStep, { kind: 'update-entry' }>['input'] = {};
  if (formula !== base.formula) entryChange.formula = formula;
  if (name !== base.name) entryChange.name = name;
  if (notes !== (base.notes ?? null)) entryChange.notes = notes;
  if (Object.keys(entryChange).length > 0) {
    const message = values.message.trim();
    steps.push({ kind: 'update-entry', input: { ...entryChange, ...(message ? { message } : {}) } });
  }
  const stored = new Map(base.measurements.map((m) => [m.id, m]));
  for (const id of removedIds) {
    if (stored.has(id)) steps.push({ kind: 'delete-measurement', measurementId: id });
  }
  values.measurements.forEach((row, index) => {
    const fieldPrefix = `measurements.${index}.`;
    const existing = row.id ? stored.get(row.id) : undefined;
    if (row.id && existing) {
      const patch = measurementPatch(row, existing);
      if (patch) steps.push({ kind: 'update-measurement', measurementId: row.id, input: patch, fieldPrefix });
    } else {
      steps.push({ kind: 'add-measurement', input: measurementFromForm(row), fieldPrefix });
    }
  });
  return steps;
}

/** People-readable lines for the steps ("Name → …", "Add a water-exchange measurement"). */
export function describeSteps(steps: readonly EditStep[]): string[] {
  return steps.map((step) => {
    switch (step.kind) {
      case 'update-entry': {
        const parts: string[] = [];
        if (step.input.formula !== undefined) parts.push(`formula → ${step.input.formula}`);
        if (step.input.name !== undefined) parts.push(`name → “${step.input.name}”`);
        if (step.input.notes !== undefined) parts.push('notes changed');
        return parts.join(', ');
      }
      case 'add-measurement':
        return `add a ${measurementKindRules[step.input.kind].label.toLowerCase()} measurement (${step.input.value} ${step.input.unit})`;
      case 'update-measurement':
        return `change measurement ${Number(step.fieldPrefix.split('.')[1]) + 1}`;
      case 'delete-measurement':
        return 'remove a measurement';
    }
  });
}
