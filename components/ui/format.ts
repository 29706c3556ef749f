/** Presentation of numbers for chemists: powers of ten with superscripts, durations in plain units. */
const SUPERSCRIPT: Record<string, string> = {
  '0': '⁰', '1': '¹', '2': '²', '3': '³', '4': '⁴', '5': '⁵', '6': '⁶', '7': '⁷', '8': '⁸', '9': '⁹', '-': '⁻', '.': '·',
};

export function superscript(text: string): string {
  return [...text].map((ch) => SUPERSCRIPT[ch] ?? ch).join('');
}

/** 10^x with x to one decimal, e.g. 10⁻⁵·⁶ (the middle dot keeps the decimal legible in superscript). */
export function powerOfTen(log10: number, decimals = 1): string {
  return `10${superscript(log10.toFixed(decimals))}`;
}

/** A value in scientific notation with a superscript exponent, e.g. 2.4 × 10⁻⁶. */
export function scientific(value: number, digits = 2): string {
  if (value === 0 || !Number.isFinite(value)) return String(value);
  const exponent = Math.floor(Math.log10(Math.abs(value)));
  if (exponent >= -2 && exponent <= 4) return String(Number(value.toPrecision(digits + 1)));
  const mantissa = value / 10 ** exponent;
  return `${mantissa.toFixed(digits - 1)} × 10${superscript(String(exponent))}`;
}

const UNITS: [number, string][] = [
  [365.25 * 86400, 'years'],
  [86400, 'days'],
  [3600, 'h'],
  [60, 'min'],
  [1, 's'],
  [1e-3, 'ms'],
  [1e-6, 'µs'],
  [1e-9, 'ns'],
  [1e-12, 'ps'],
];

/** A half-life in the largest unit that keeps the number ≥ 1, e.g. "3.3 days", "8 ms". */
export function duration(seconds: number): string {
  if (!Number.isFinite(seconds)) return 'forever';
  if (seconds > 1e6 * 365.25 * 86400) return `${scientific(seconds / (365.25 * 86400))} years`;
  for (const [size, unit] of UNITS) {
    if (seconds >= size) {
      const value = seconds / size;
      return `${value >= 100 ? Math.round(value) : Number(value.toPrecision(2))} ${unit}`;
    }
  }
  return `${scientific(seconds)} s`;
}

/**
 * A whole number with commas between groups of three digits ("22,870"), as `toLocaleString('en')` writes
 * it, without Intl: the first Intl call of a fresh page costs 40–150 ms in Chromium (locale data load),
 * which held back the first Check result.
 */
export function groupedInteger(value: number): string {
  const rounded = Math.round(value);
  const grouped = String(Math.abs(rounded)).replace(/\B(?=(\d{3})+(?!\d))/g, ',');
  return rounded < 0 ? `-${grouped}` : grouped;
}

/** Oxidation states as Roman numerals: one definition, in the engine. */
export { romanNumeral as roman } from '@/lib/chem/metal-ions';
