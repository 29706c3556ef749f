import type { z } from 'zod';
import type { CsvColumn, ImportIssue } from '@/lib/schemas/exchange';
import {
  citationInputSchema,
  createComplexInputSchema,
  measurementInputSchema,
  measurementKindRules,
  type CitationInput,
  type MeasurementInput,
  type MeasurementKind,
} from '@/lib/schemas/library';
import { AppError } from '@/server/http/errors';
import { classifyOrExplain, derivedFromClassification, type DerivedColumns } from '@/server/modules/library/derive';
import type { Classification } from '@/lib/chem/types';
import { suggestedName } from '@/lib/chem/naming';
import type { ColumnMap, CsvTable } from './csv-file';

/**
 * Row-by-row validation of an import with the same rules as the forms: the shared zod schemas
 * (units, ranges, required fields) and the engine's formula parser (with the character position).
 */

export interface PlannedMeasurement {
  row: number;
  input: Omit<MeasurementInput, 'citation' | 'citationId' | 'version'>;
  citation: CitationInput | null;
}

export interface PlannedEntry {
  key: string;
  firstRow: number;
  formula: string;
  name: string;
  notes: string | null;
  derived: DerivedColumns;
  measurements: PlannedMeasurement[];
}

export interface ValidationResult {
  entries: PlannedEntry[];
  issues: ImportIssue[];
  measurementCount: number;
  /** Entries whose name cell was empty and that take the name suggested from the formula. */
  suggestedNames: { row: number; name: string }[];
}

/**
 * A kind as people write it: the code ("water-exchange") or the form's label in any case, with
 * spaces, hyphens or underscores ("Water exchange", "water_exchange", "Self exchange").
 */
const squash = (text: string) => text.toLowerCase().replace(/[\s_-]+/g, '');
const KIND_BY_WORDS: ReadonlyMap<string, MeasurementKind> = new Map(
  (Object.keys(measurementKindRules) as MeasurementKind[]).flatMap((kind) => [
    [squash(kind), kind],
    [squash(measurementKindRules[kind].label), kind],
  ]),
);
export function kindFromCell(cell: string): string {
  return KIND_BY_WORDS.get(squash(cell)) ?? cell;
}

const measurementColumns: Record<string, CsvColumn> = {
  kind: 'kind',
  value: 'value',
  unit: 'unit',
  temperatureK: 'temperature_K',
  ionicStrengthM: 'ionic_strength_M',
  medium: 'medium',
  method: 'method',
  partnerFormula: 'partner_formula',
  notes: 'measurement_notes',
};
const citationColumns: Record<string, CsvColumn> = {
  doi: 'doi',
  authors: 'authors',
  title: 'title',
  journal: 'journal',
  year: 'year',
  volume: 'volume',
  pages: 'pages',
};
const entryColumns: Record<string, CsvColumn> = { formula: 'formula', name: 'name', notes: 'notes' };

const entryFieldsSchema = createComplexInputSchema.pick({ formula: true, name: true, notes: true });

/** "2.4e-6", " 298.15 " → numbers; "" → null; anything else → the text back (the schema names the problem). */
function numberCell(cell: string): number | null | string {
  const text = cell.trim();
  if (text === '') return null;
  // A decimal comma is a common spreadsheet export; say so rather than guess.
  const value = Number(text.replace(/\u2212/g, '-'));
  return Number.isFinite(value) && /^[-+]?(\d+\.?\d*|\.\d+)([eE][-+]?\d+)?$/.test(text.replace(/\u2212/g, '-')) ? value : text;
}

export function validateRows(
  table: CsvTable,
  map: ColumnMap,
  onProgress: (processed: number) => void = () => {},
): ValidationResult {
  const issues: ImportIssue[] = [];
  const entries = new Map<string, PlannedEntry>();
  const formulaCache = new Map<string, Classification | AppError>();
  let measurementCount = 0;
  const suggestedNames: { row: number; name: string }[] = [];

  const cellOf = (row: string[], column: CsvColumn): string => {
    const at = map.index[column];
    return at === undefined ? '' : (row[at] ?? '').trim();
  };
  const add = (row: number, column: CsvColumn | null, message: string, position?: number) =>
    issues.push({ row, column: column ? map.headerOf(column) : null, message, ...(position !== undefined ? { position } : {}) });
  const addZodIssues = (row: number, error: z.ZodError, columns: Record<string, CsvColumn>) => {
    for (const issue of error.issues) {
      const field = String(issue.path[0] ?? '');
      const column = columns[field] ?? null;
      add(row, column, issue.message);
    }
  };
  const classify = (formula: string): Classification | AppError => {
    let cached = formulaCache.get(formula);
    if (!cached) {
      try {
        cached = classifyOrExplain(formula);
      } catch (error) {
        if (!(error instanceof AppError)) throw error;
        cached = error;
      }
      formulaCache.set(formula, cached);
    }
    return cached;
  };
  const formulaIssue = (row: number, column: CsvColumn, error: AppError) => {
    const position = typeof error.extra?.position === 'number' ? error.extra.position + 1 : undefined;
    add(row, column, error.message, position);
  };

  table.rows.forEach((cells, i) => {
    const row = table.rowNumbers[i] as number;
    if (i % 500 === 0) onProgress(i);
    const before = issues.length;

    // An empty name: the same entry's name on a later row of it, else the name suggested from the formula (if any).
    let nameCell = cellOf(cells, 'name');
    let nameSuggested = false;
    if (nameCell === '' && cellOf(cells, 'formula') !== '') {
      const earlier = cellOf(cells, 'entry') !== '' ? entries.get(`entry:${cellOf(cells, 'entry')}`) : undefined;
      const suggestion = earlier ? earlier.name : suggestedName(cellOf(cells, 'formula'));
      if (suggestion) {
        nameCell = suggestion;
        nameSuggested = !earlier;
      }
    }
    const entryParsed = entryFieldsSchema.safeParse({
      formula: cellOf(cells, 'formula'),
      name: nameCell,
      notes: cellOf(cells, 'notes') || null,
    });
    let classification: Classification | null = null;
    if (!entryParsed.success) addZodIssues(row, entryParsed.error, entryColumns);
    else {
      const result = classify(entryParsed.data.formula);
      if (result instanceof AppError) formulaIssue(row, 'formula', result);
      else classification = result;
    }

    let measurement: PlannedMeasurement | null = null;
    const hasMeasurement = ['kind', 'value', 'unit'].some((c) => cellOf(cells, c as CsvColumn) !== '');
    const hasCitation = Object.values(citationColumns).some((c) => cellOf(cells, c) !== '');
    if (hasMeasurement) {
      const raw = {
        kind: kindFromCell(cellOf(cells, 'kind')),
        value: numberCell(cellOf(cells, 'value')),
        unit: cellOf(cells, 'unit'),
        temperatureK: numberCell(cellOf(cells, 'temperature_K')),
        ionicStrengthM: numberCell(cellOf(cells, 'ionic_strength_M')),
        medium: cellOf(cells, 'medium') || null,
        method: cellOf(cells, 'method') || null,
        partnerFormula: cellOf(cells, 'partner_formula') || null,
        notes: cellOf(cells, 'measurement_notes') || null,
      };
      const parsed = measurementInputSchema.safeParse(raw);
      if (!parsed.success) addZodIssues(row, parsed.error, measurementColumns);
      else {
        if (parsed.data.partnerFormula) {
          const partner = classify(parsed.data.partnerFormula);
          if (partner instanceof AppError) formulaIssue(row, 'partner_formula', partner);
        }
        const { citation: _c, citationId: _id, version: _v, ...input } = parsed.data;
        measurement = { row, input, citation: null };
      }
      if (hasCitation) {
        const year = numberCell(cellOf(cells, 'year'));
        const citation = citationInputSchema.safeParse({
          doi: cellOf(cells, 'doi') || null,
          authors: cellOf(cells, 'authors'),
          title: cellOf(cells, 'title') || null,
          journal: cellOf(cells, 'journal'),
          year,
          volume: cellOf(cells, 'volume') || null,
          pages: cellOf(cells, 'pages') || null,
        });
        if (!citation.success) addZodIssues(row, citation.error, citationColumns);
        else if (measurement) measurement.citation = citation.data;
      }
    } else if (hasCitation) {
      add(row, 'doi', 'A citation belongs to a measurement: this row has citation cells but no kind, value and unit.');
    }

    if (issues.length > before || !entryParsed.success || !classification) return;
    const { formula, name } = entryParsed.data;
    const notes = entryParsed.data.notes ?? null;
    const label = cellOf(cells, 'entry');
    const key = label !== '' ? `entry:${label}` : `fn:${formula}\u0000${name}`;
    const existing = entries.get(key);
    if (existing) {
      if (existing.formula !== formula || existing.name !== name || (notes !== null && existing.notes !== notes)) {
        add(
          row,
          label !== '' ? 'entry' : 'formula',
          `This row belongs to the entry of row ${existing.firstRow} but its formula, name or notes differ from that row's. Use the same values, or another entry label.`,
        );
        return;
      }
      if (measurement) existing.measurements.push(measurement);
    } else {
      entries.set(key, {
        key,
        firstRow: row,
        formula,
        name,
        notes,
        derived: derivedFromClassification(classification, formula, name),
        measurements: measurement ? [measurement] : [],
      });
      if (nameSuggested) suggestedNames.push({ row, name });
    }
    if (measurement) measurementCount += 1;
  });
  onProgress(table.rows.length);
  return { entries: [...entries.values()], issues, measurementCount, suggestedNames };
}
