import { parse } from 'csv-parse/sync';
import type { Citation, ComplexSnapshot } from '@/lib/schemas/library';
import { citationsAsBibtex, citationsAsRis } from '@/server/modules/exchange/citation-formats';
import { readCsvTable } from '@/server/modules/exchange/csv-file';
import { snapshotsAsCsv } from '@/server/modules/exchange/export.service';
import { readSpreadsheetCell, spreadsheetSafe } from '@/server/modules/exchange/spreadsheet-safety';

/**
 * Exports that cannot attack their readers: CSV cells a spreadsheet would run (OWASP "CSV
 * Injection"), RIS fields that would start a forged record with a line break (RIS format: one
 * "TAG  - value" per line), BibTeX names that would pass TeX commands or close the entry.
 */
const hostileCells = ['=HYPERLINK("http://x.example","click")', '+1+cmd|\' /C calc\'!A0', '-2+3', '@SUM(A1:A9)', '\tTab first', '\rReturn first'];

describe('CSV cells', () => {
  it('protects every cell a spreadsheet would evaluate, and leaves plain numbers and text alone', () => {
    for (const cell of hostileCells) expect(spreadsheetSafe(cell)).toBe(`'${cell}`);
    for (const cell of ['-5.6', '+3', '1e-6', '-1.2E+3', '[Co(NH3)6]3+', 'hexaammine', '']) expect(spreadsheetSafe(cell)).toBe(cell);
  });

  it('the importer reads a protected cell back as it was', () => {
    for (const cell of [...hostileCells, '-5.6', "'quoted already", 'plain']) expect(readSpreadsheetCell(spreadsheetSafe(cell))).toBe(cell);
  });

  const snapshot = {
    formula: '[Co(NH3)6]3+',
    name: '=HYPERLINK("http://x.example","open")',
    notes: '@cmd',
    status: 'accepted',
    measurements: [],
  } as unknown as ComplexSnapshot;

  it('an export with hostile names and notes opens as text, and imports back unchanged', () => {
    const csv = snapshotsAsCsv([snapshot]);
    const [header, row] = parse(csv) as string[][];
    const cell = (column: string) => row?.[header?.indexOf(column) ?? -1];
    expect(cell('name')).toBe(`'=HYPERLINK("http://x.example","open")`);
    expect(cell('notes')).toBe("'@cmd");
    const table = readCsvTable(Buffer.from(csv, 'utf8'));
    expect(table.rows[0]?.[table.headers.indexOf('name')]).toBe('=HYPERLINK("http://x.example","open")');
  });
});

const hostileCitation: Citation = {
  id: 'c1',
  groupId: 'g1',
  kind: 'article',
  doi: null,
  authors: '\\input{/etc/passwd}, J. Smith',
  title: 'Water exchange}\n@misc{forged, title={x}',
  journal: 'Inorg. Chem.\r\nTY  - JOUR\r\nTI  - forged record',
  year: 2020,
  volume: '59',
  pages: '1-9',
  publisher: null,
  place: null,
  url: null,
};

describe('RIS', () => {
  it('keeps every field on its own line: one record, one TY, one ER, no forged tags', () => {
    const ris = citationsAsRis([hostileCitation]);
    const lines = ris.split(/\r\n/).filter(Boolean);
    expect(lines.filter((line) => line.startsWith('TY  -'))).toHaveLength(1);
    expect(lines.filter((line) => line.startsWith('ER  -'))).toHaveLength(1);
    expect(lines.filter((line) => line.startsWith('TI  -'))).toHaveLength(1);
    for (const line of lines) expect(line).toMatch(/^[A-Z][A-Z0-9] {2}-( |$)/);
  });
});

describe('BibTeX', () => {
  const bibtex = citationsAsBibtex([hostileCitation]);

  it('writes no TeX command from a field', () => {
    expect(bibtex).not.toMatch(/\\input\{/);
  });

  it('cannot be closed or split by a field: braces balance inside the one entry', () => {
    const unescaped = bibtex.replace(/\\text(?:brace(?:left|right)|backslash)\{\}/g, '').replace(/\\[{}]/g, '');
    let depth = 0;
    let closedEarly = false;
    for (const [index, ch] of [...unescaped].entries()) {
      if (ch === '{') depth += 1;
      if (ch === '}') depth -= 1;
      if (depth === 0 && ch === '}' && index < unescaped.trimEnd().length - 1) closedEarly = true;
    }
    expect(depth).toBe(0);
    expect(closedEarly).toBe(false);
    expect(bibtex.match(/^@/gm)).toHaveLength(1);
  });
});
