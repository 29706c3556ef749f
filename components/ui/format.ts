/**
 * Presentation of numbers for the screens. The notation itself lives in one place,
 * lib/chem/number-format.ts (shared with the engine's reasons and the CLI); these are the names the
 * components use.
 */
import { formatDuration, formatPowerOfTen, formatRecorded, formatScientific, superscript } from '@/lib/chem/number-format';

export { superscript };

/** 10^x as a × 10ⁿ with two significant figures, e.g. powerOfTen(−5.62) → "2.4 × 10⁻⁶". */
export function powerOfTen(log10: number): string {
  return formatPowerOfTen(log10, 2);
}

/** A recorded value (a measurement) with up to four significant figures: "2.4 × 10⁻⁶", "108.6". */
export function scientific(value: number): string {
  return formatRecorded(value);
}

/** A computed estimate with set significant figures (two by default): "1.3 × 10⁵". */
export function estimate(value: number, significant = 2): string {
  return formatScientific(value, significant);
}

/** A half-life on the one duration ladder (ps … y): "3.3 d", "8.0 ms". */
export function duration(seconds: number): string {
  return formatDuration(seconds);
}

/**
 * A whole number with commas between groups of three digits ("22,870"), as `toLocaleString('en')` writes
 * it, without Intl: the first Intl call of a fresh page costs 40–150 ms in Chromium (locale data load),
 * which held back the first Check result.
 */
export function groupedInteger(value: number): string {
  const rounded = Math.round(value);
  const grouped = String(Math.abs(rounded)).replace(/\B(?=(\d{3})+(?!\d))/g, ',');
  return rounded < 0 ? `\u2212${grouped}` : grouped;
}

/** Oxidation states as Roman numerals: one definition, in the engine. */
export { romanNumeral as roman } from '@/lib/chem/metal-ions';
