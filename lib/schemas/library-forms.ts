import { z } from 'zod';
import {
  citationKindOf,
  createComplexInputSchema,
  measurementKindRules,
  measurementKindSchema,
  type Citation,
  type CitationInput,
  type ComplexDetail,
  type CreateComplexInput,
  type Measurement,
  type MeasurementInput,
  type MeasurementKind,
  type SaveComplexInput,
} from './library';

/**
 * The library's entry form as people fill it in: every number is typed as text (so "2.4e-6" can be
 * half-written), and the whole form is checked by converting it to the shared request schemas in
 * ./library.ts — the messages are the server's own, on the same paths (measurements.0.value …).
 */

const text = z.string();

export const citationFormSchema = z.object({
  /** article | book | chapter | web-page ("" reads as article). */
  kind: text,
  doi: text,
  authors: text,
  title: text,
  journal: text,
  year: text,
  volume: text,
  pages: text,
  publisher: text,
  place: text,
  url: text,
});
export type CitationFormValues = z.infer<typeof citationFormSchema>;

export const measurementFormSchema = z.object({
  /** Set for a measurement that already exists on the server. */
  id: z.string().nullable(),
  /** The stored citation this row started with (sent as citationId while the fields are unchanged). */
  citationId: z.string().nullable(),
  kind: measurementKindSchema,
  value: text,
  unit: text,
  temperatureK: text,
  ionicStrengthM: text,
  medium: text,
  method: text,
  partnerFormula: text,
  notes: text,
  citation: citationFormSchema,
});
export type MeasurementFormValues = z.infer<typeof measurementFormSchema>;

const complexFormShape = z.object({
  groupId: text,
  formula: text,
  name: text,
  notes: text,
  /** Edit form only: what the revision history should say. */
  message: text,
  measurements: z.array(measurementFormSchema),
});
export type ComplexFormValues = z.infer<typeof complexFormShape>;

/** "" → null, "1e-3" → 0.001, "abc" → NaN (which the shared schema reports as "must be a number"). */
export function parseNumberText(value: string): number | null {
  const trimmed = value.trim().replace(/\u2212/g, '-').replace(/\s+/g, '');
  if (trimmed === '') return null;
  // Chemists write "2.4×10^-6" or "2.4x10-6" as often as "2.4e-6".
  const power = /^([+-]?\d*\.?\d+)(?:[x×*]10\^?)([+-]?\d+)$/i.exec(trimmed);
  if (power) return Number(`${power[1]}e${power[2]}`);
  return /^[+-]?(\d+\.?\d*|\.\d+)(e[+-]?\d+)?$/i.test(trimmed) ? Number(trimmed) : Number.NaN;
}

const blankToNull = (value: string): string | null => (value.trim() === '' ? null : value.trim());

export function isCitationBlank(citation: CitationFormValues): boolean {
  // The kind alone (a chip left on "Article") is not a citation.
  const { kind: _kind, ...fields } = citation;
  return Object.values(fields).every((value) => value.trim() === '');
}

export function citationFromForm(citation: CitationFormValues): CitationInput | null {
  if (isCitationBlank(citation)) return null;
  const year = parseNumberText(citation.year);
  return {
    kind: citationKindOf(citation.kind),
    doi: blankToNull(citation.doi),
    authors: citation.authors.trim(),
    title: blankToNull(citation.title),
    journal: citation.journal.trim(),
    year,
    volume: blankToNull(citation.volume),
    pages: blankToNull(citation.pages),
    publisher: blankToNull(citation.publisher),
    place: blankToNull(citation.place),
    url: blankToNull(citation.url),
  };
}

export function citationToForm(citation: Citation | null): CitationFormValues {
  return {
    kind: citation?.kind ?? 'article',
    doi: citation?.doi ?? '',
    authors: citation?.authors ?? '',
    title: citation?.title ?? '',
    journal: citation?.journal ?? '',
    year: citation?.year === null || citation?.year === undefined ? '' : String(citation.year),
    volume: citation?.volume ?? '',
    pages: citation?.pages ?? '',
    publisher: citation?.publisher ?? '',
    place: citation?.place ?? '',
    url: citation?.url ?? '',
  };
}

/** The request body for a new measurement (before the shared schema checks it). */
export function measurementFromForm(row: MeasurementFormValues): Omit<MeasurementInput, 'version'> {
  return {
    kind: row.kind,
    value: parseNumberText(row.value) ?? Number.NaN,
    unit: row.unit.trim(),
    temperatureK: parseNumberText(row.temperatureK),
    ionicStrengthM: parseNumberText(row.ionicStrengthM),
    medium: blankToNull(row.medium),
    method: blankToNull(row.method),
    partnerFormula: row.kind === 'cross-reaction' ? blankToNull(row.partnerFormula) : null,
    citation: citationFromForm(row.citation),
    notes: blankToNull(row.notes),
  };
}

export function measurementToForm(measurement: Measurement): MeasurementFormValues {
  return {
    id: measurement.id,
    citationId: measurement.citation?.id ?? null,
    kind: measurement.kind,
    value: String(measurement.value),
    unit: measurement.unit,
    temperatureK: measurement.temperatureK === null ? '' : String(measurement.temperatureK),
    ionicStrengthM: measurement.ionicStrengthM === null ? '' : String(measurement.ionicStrengthM),
    medium: measurement.medium ?? '',
    method: measurement.method ?? '',
    partnerFormula: measurement.partnerFormula ?? '',
    notes: measurement.notes ?? '',
    citation: citationToForm(measurement.citation),
  };
}

/** A new, empty measurement row: water exchange at 25 °C, the commonest kind in the library. */
export function blankMeasurement(kind: MeasurementKind = 'water-exchange'): MeasurementFormValues {
  return {
    id: null,
    citationId: null,
    kind,
    value: '',
    unit: measurementKindRules[kind].units[0] ?? '',
    temperatureK: '298.15',
    ionicStrengthM: '',
    medium: '',
    method: '',
    partnerFormula: '',
    notes: '',
    citation: citationToForm(null),
  };
}

/** The body of POST /api/complexes from the form (citations always sent in full; the server finds them by DOI). */
export function createInputFromForm(values: ComplexFormValues): CreateComplexInput {
  return {
    ...(values.groupId ? { groupId: values.groupId } : {}),
    formula: values.formula.trim(),
    name: values.name.trim(),
    notes: blankToNull(values.notes),
    measurements: values.measurements.map(measurementFromForm),
  };
}

/**
 * The form checked with the shared create schema: the same rules as the server, on the same paths.
 * (groupId is checked by the server only: it is picked from the person's groups, never typed.)
 */
export const complexFormSchema = complexFormShape.superRefine((values, ctx) => {
  const result = createComplexInputSchema.safeParse(createInputFromForm({ ...values, groupId: '' }));
  if (result.success) return;
  for (const issue of result.error.issues) {
    ctx.addIssue({ code: 'custom', path: issue.path, message: issue.message });
  }
});

function sameCitation(row: CitationFormValues, stored: Citation | null): boolean {
  return JSON.stringify(citationFromForm(row)) === JSON.stringify(citationFromForm(citationToForm(stored)));
}

/** The form as it starts from a stored entry. */
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
 * The body of PUT /api/complexes/:id: the whole entry as the form holds it, based on `base`.
 * Rows keep their measurement id; an untouched citation stays linked by id, an edited one is sent
 * in full (the server finds it again by DOI), a cleared one is dropped.
 */
export function saveInputFromForm(values: ComplexFormValues, base: ComplexDetail): SaveComplexInput {
  const stored = new Map(base.measurements.map((m) => [m.id, m]));
  const message = values.message.trim();
  return {
    version: base.version,
    formula: values.formula.trim(),
    name: values.name.trim(),
    notes: blankToNull(values.notes),
    measurements: values.measurements.map((row) => {
      const { citation, ...fields } = measurementFromForm(row);
      const before = row.id ? stored.get(row.id) : undefined;
      const keepLink = before?.citation && sameCitation(row.citation, before.citation);
      return {
        ...(before ? { id: before.id } : {}),
        ...fields,
        ...(keepLink ? { citationId: before.citation!.id } : { citation }),
      };
    }),
    ...(message ? { message } : {}),
  };
}

/** One line per change the form holds against `base`, for the person to check after a conflict. */
export function describeFormChanges(values: ComplexFormValues, base: ComplexDetail): string[] {
  const lines: string[] = [];
  if (values.formula.trim() !== base.formula) lines.push(`Formula → ${values.formula.trim()}`);
  if (values.name.trim() !== base.name) lines.push(`Name → “${values.name.trim()}”`);
  if ((blankToNull(values.notes) ?? null) !== (base.notes ?? null)) lines.push('Notes changed');
  const kept = new Set(values.measurements.map((row) => row.id).filter(Boolean));
  for (const row of values.measurements) {
    const label = measurementKindRules[row.kind].label.toLowerCase();
    if (!row.id) lines.push(`Add a ${label} measurement (${row.value} ${row.unit})`);
  }
  for (const m of base.measurements) {
    if (!kept.has(m.id)) lines.push(`Remove the ${measurementKindRules[m.kind].label.toLowerCase()} measurement`);
  }
  return lines;
}
