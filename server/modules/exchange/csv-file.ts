import { parse } from 'csv-parse/sync';
import { IMPORT_MAX_ROWS, planCsvColumns, type CsvColumn, type CsvMapping, type ImportIssue } from '@/lib/schemas/exchange';
import { AppError } from '@/server/http/errors';
import { binaryKindOf, binaryKindWords, decodeText } from '@/server/modules/attachments/file-sniff';
import { readSpreadsheetCell } from './spreadsheet-safety';

/**
 * Reading an uploaded CSV file before any row is validated: what the bytes are (magic numbers,
 * encoding), the CSV grammar (RFC 4180 with the usual relaxations), ragged rows and the header.
 * Every refusal here is a 4xx with a clear message; nothing is written.
 */

export interface CsvTable {
  headers: string[];
  /** Data rows; `rowNumbers[i]` is the spreadsheet row of `rows[i]` (the header is row 1). */
  rows: string[][];
  rowNumbers: number[];
}

const fileError = (message: string, issues?: ImportIssue[], code: 'VALIDATION_FAILED' | 'UNSUPPORTED_MEDIA' = 'VALIDATION_FAILED') =>
  new AppError(code, message, { file: message }, issues ? { issues } : undefined);

/** The delimiter the header line uses most: comma, semicolon (European spreadsheets) or tab. */
function sniffDelimiter(text: string): string {
  const firstLine = text.slice(0, text.search(/\r?\n|$/));
  const counts = [',', ';', '\t'].map((d) => [d, firstLine.split(d).length - 1] as const);
  counts.sort((a, b) => b[1] - a[1]);
  return counts[0] && counts[0][1] > 0 ? counts[0][0] : ',';
}

export function readCsvTable(bytes: Buffer): CsvTable {
  if (bytes.length === 0) throw fileError('The file is empty: send a CSV file with a header row and at least one data row.');
  const binary = binaryKindOf(bytes);
  if (binary) {
    throw fileError(`This file is ${binaryKindWords[binary]}, not a CSV text file. Export the sheet as "CSV UTF-8" and upload that.`, undefined, 'UNSUPPORTED_MEDIA');
  }
  const decoded = decodeText(bytes);
  if (!decoded.ok) throw fileError(decoded.reason, undefined, 'UNSUPPORTED_MEDIA');

  let records: string[][];
  try {
    records = parse(decoded.text, {
      delimiter: sniffDelimiter(decoded.text),
      relax_column_count: true,
      skip_empty_lines: true,
      trim: false,
    }) as string[][];
  } catch (error) {
    const e = error as { code?: string; message: string; lines?: number };
    const where = e.lines ? ` (near line ${e.lines})` : '';
    const what =
      e.code === 'CSV_QUOTE_NOT_CLOSED'
        ? 'a quoted cell is never closed'
        : e.code === 'CSV_INVALID_CLOSING_QUOTE'
          ? 'a quote inside a cell is not doubled ("" is how CSV writes a quote)'
          : e.message;
    throw fileError(`The file is not valid CSV${where}: ${what}.`);
  }
  // Rows that are only empty cells (spreadsheets write ",,,," for blank lines) are skipped.
  const [header, ...body] = records;
  if (!header || header.every((h) => h.trim() === '')) throw fileError('The file has no header row: the first line must name the columns (formula, name, kind, value, unit …).');
  const headers = header.map((h) => h.trim());
  const rows: string[][] = [];
  const rowNumbers: number[] = [];
  const ragged: ImportIssue[] = [];
  body.forEach((record, i) => {
    const row = i + 2;
    if (record.every((cell) => cell.trim() === '')) return;
    if (record.length !== headers.length) {
      ragged.push({
        row,
        column: null,
        message: `This row has ${record.length} cells but the header has ${headers.length} columns (a missing or extra delimiter, or an unquoted comma inside a cell).`,
      });
      return;
    }
    rows.push(record.map(readSpreadsheetCell));
    rowNumbers.push(row);
  });
  if (ragged.length > 0) {
    const first = ragged[0] as ImportIssue;
    throw fileError(`${ragged.length} row(s) do not have as many cells as the header; the first is row ${first.row}. Nothing was imported.`, ragged.slice(0, 1000));
  }
  if (rows.length === 0) throw fileError('The file has a header but no data rows.');
  if (rows.length > IMPORT_MAX_ROWS) throw fileError(`The file has ${rows.length} data rows; at most ${IMPORT_MAX_ROWS} are imported at once. Split it into smaller files.`);
  return { headers, rows, rowNumbers };
}

export interface ColumnMap {
  /** Our column → its index in the file. */
  index: Partial<Record<CsvColumn, number>>;
  /** Our column → the header as written in the file (for the report). */
  headerOf: (column: CsvColumn) => string;
  columns: { header: string; column: CsvColumn | null }[];
}

/** The shared column plan (lib/schemas/exchange.ts), refused with every problem when it cannot be used. */
export function mapColumns(headers: readonly string[], mapping: CsvMapping = {}): ColumnMap {
  const plan = planCsvColumns(headers, mapping);
  const problems: Record<string, string> = { ...(plan.problems as Record<string, string>) };
  for (const required of plan.missing) {
    problems[required] ??= `No column for "${required}" was found (headers: ${headers.join(', ') || 'none'}). Name a column "${required}" or map one with mapping={"${required}":"Your header"}.`;
  }
  if (Object.keys(problems).length > 0) {
    const first = Object.values(problems)[0] as string;
    throw new AppError('VALIDATION_FAILED', `The columns of the file cannot be used: ${first}`, problems);
  }
  const { index } = plan;
  return {
    index,
    headerOf: (column) => (index[column] !== undefined ? (headers[index[column] as number] as string) : column),
    columns: plan.columns,
  };
}
