import { csvColumns } from '@/lib/schemas/exchange';

/**
 * The import template: every column the importer reads, in order, with one filled-in example
 * (an entry of two measurements on two lines sharing its `entry` number) that the person replaces.
 * Example values: [Cr(H2O)6]3+ water exchange and its activation enthalpy, Xu, Krouse & Swaddle,
 * Inorg. Chem. 1985, 24, 267–270.
 */
const EXAMPLE_ROWS: Record<(typeof csvColumns)[number], string>[] = [
  {
    entry: '1',
    formula: '[Cr(H2O)6]3+',
    name: 'hexaaquachromium(III)',
    notes: 'Replace these example lines with your own; keep the header line.',
    kind: 'water-exchange',
    value: '2.4e-6',
    unit: 's-1',
    temperature_K: '298.15',
    ionic_strength_M: '',
    medium: 'aqueous HClO4',
    method: '17O NMR',
    partner_formula: '',
    measurement_notes: '',
    doi: '',
    authors: 'F.-C. Xu, H. R. Krouse, T. W. Swaddle',
    title: 'Conjugate base pathway for water exchange on aqueous chromium(III)',
    journal: 'Inorg. Chem.',
    year: '1985',
    volume: '24',
    pages: '267-270',
  },
];

const quote = (cell: string) => (/[",\n\r]/.test(cell) ? `"${cell.replace(/"/g, '""')}"` : cell);

export function importTemplateCsv(): string {
  const lines = [csvColumns.join(','), ...EXAMPLE_ROWS.map((row) => csvColumns.map((c) => quote(row[c])).join(','))];
  return `${lines.join('\r\n')}\r\n`;
}
