import { randomUUID } from 'node:crypto';
import type { ComplexStatus, MeasurementInput, MeasurementUnit } from '@/lib/schemas/library';
import type { DerivedColumns } from './derive';

/**
 * The rows of a new library entry, built in one place for every writer — the form's create and
 * save, and the CSV import in bulk — so that the same entry is stored the same way whichever
 * way it came in.
 */

export type MeasurementValues = Omit<MeasurementInput, 'citation' | 'citationId' | 'version'>;

export function measurementRow(complexId: string, values: MeasurementValues, citationId: string | null, at: Date) {
  return {
    id: randomUUID(),
    complex: complexId,
    kind: values.kind,
    value: values.value,
    unit: values.unit as MeasurementUnit,
    temperatureK: values.temperatureK ?? null,
    ionicStrengthM: values.ionicStrengthM ?? null,
    medium: values.medium ?? null,
    method: values.method ?? null,
    partnerFormula: values.partnerFormula ?? null,
    citation: citationId,
    notes: values.notes ?? null,
    createdAt: at,
    updatedAt: at,
  };
}

export interface NewEntry {
  id: string;
  groupId: string;
  formula: string;
  name: string;
  notes: string | null | undefined;
  derived: DerivedColumns;
  authorId: string;
  /** Imports submit their entries at once; the form starts a draft. */
  submitted: boolean;
  measurementKinds: readonly string[];
  hasCitation: boolean;
  at: Date;
}

export function entryRow(entry: NewEntry) {
  const status: ComplexStatus = entry.submitted ? 'in-review' : 'draft';
  return {
    id: entry.id,
    groupId: entry.groupId,
    formula: entry.formula,
    name: entry.name,
    status,
    notes: entry.notes ?? null,
    ...entry.derived,
    measurementKinds: [...new Set(entry.measurementKinds)].sort(),
    hasCitation: entry.hasCitation,
    version: 1,
    createdById: entry.authorId,
    submittedById: entry.submitted ? entry.authorId : null,
    submittedAt: entry.submitted ? entry.at : null,
    acceptedSnapshot: null,
    acceptedVersion: null,
    acceptedAt: null,
    createdAt: entry.at,
    updatedAt: entry.at,
  };
}
