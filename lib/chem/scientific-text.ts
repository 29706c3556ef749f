/**
 * Numbers in the engines' reasons as chemists write them: "3.2 × 10⁴" (superscript exponent, one
 * notation with the screens' values), plain below 10⁴ and above 10⁻² ("3920", "0.85").
 */
const SUPERSCRIPT_DIGITS = '⁰¹²³⁴⁵⁶⁷⁸⁹';

function superscriptInteger(value: number): string {
  const digits = [...String(Math.abs(value))].map((digit) => SUPERSCRIPT_DIGITS[Number(digit)] ?? digit).join('');
  return value < 0 ? `⁻${digits}` : digits;
}

export function scientificText(value: number, significant = 2): string {
  if (value === 0 || !Number.isFinite(value)) return String(value);
  const exponent = Math.floor(Math.log10(Math.abs(value)));
  if (exponent >= -2 && exponent < 4) return String(Number(value.toPrecision(significant)));
  const mantissa = Number((value / 10 ** exponent).toPrecision(significant));
  // Rounding can carry the mantissa to 10 (9.96 → 10): move it into the exponent.
  if (Math.abs(mantissa) >= 10) return `${(mantissa / 10).toFixed(significant - 1)} × 10${superscriptInteger(exponent + 1)}`;
  return `${mantissa.toFixed(significant - 1)} × 10${superscriptInteger(exponent)}`;
}
