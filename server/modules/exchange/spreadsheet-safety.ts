/**
 * CSV cells a spreadsheet would run as a formula (OWASP "CSV Injection"): a cell starting with
 * = + - @, a tab or a carriage return is written with a leading apostrophe, which spreadsheets show
 * as text and do not display. Plain numbers ("-5.6", "+3", "1e-6") are left as they are: a
 * spreadsheet reads them as numbers, never as formulas, and they must stay numbers.
 * The importer removes that one apostrophe again (readSpreadsheetCell), so an export imports back unchanged.
 */
const FORMULA_TRIGGER = /^[=+\-@\t\r]/;
const PLAIN_NUMBER = /^[-+]?(\d+(\.\d*)?|\.\d+)([eE][-+]?\d+)?$/;

export function spreadsheetSafe(cell: string): string {
  if (!FORMULA_TRIGGER.test(cell) || PLAIN_NUMBER.test(cell)) return cell;
  return `'${cell}`;
}

/** The cell as exported before spreadsheetSafe, when it was protected; any other cell unchanged. */
export function readSpreadsheetCell(cell: string): string {
  return cell.startsWith("'") && FORMULA_TRIGGER.test(cell.slice(1)) && !PLAIN_NUMBER.test(cell.slice(1)) ? cell.slice(1) : cell;
}
