/**
 * Number formatting for the engine's reasons, where it is a measurable share of the time.
 */

// Above this, value × 100 could be off by more than the tie margin below (and toFixed is rare there).
const FAST_LIMIT = 1e9;
// value × 10^digits is itself rounded (relative error ≤ 2⁻⁵³, i.e. < 1.2e−7 below FAST_LIMIT):
// a fraction this close to ½ might be on either side of the tie, so toFixed decides.
const TIE_MARGIN = 1e-6;

/**
 * Exactly `value.toFixed(digits)` for 1 or 2 digits. toFixed is a call into the runtime (~0.2 µs
 * in V8), and a classification formats five or six numbers: this does the same rounding (nearest,
 * ties away from zero on the exact value) in plain arithmetic and leaves near-ties, large values,
 * NaN and infinities to toFixed itself.
 */
export function formatFixed(value: number, digits: 1 | 2): string {
  const scale = digits === 1 ? 10 : 100;
  const scaled = Math.abs(value) * scale;
  if (!(scaled < FAST_LIMIT)) return value.toFixed(digits);
  const whole = Math.floor(scaled);
  const fraction = scaled - whole;
  if (Math.abs(fraction - 0.5) < TIE_MARGIN) return value.toFixed(digits);
  const units = fraction > 0.5 ? whole + 1 : whole;
  const integerPart = Math.floor(units / scale);
  const decimals = units - integerPart * scale;
  // toFixed writes "-" for any negative value, even when it rounds to zero ("-0.0"), never for −0.
  const sign = value < 0 ? '-' : '';
  return `${sign}${integerPart}.${digits === 2 && decimals < 10 ? '0' : ''}${decimals}`;
}

// 10^m, exact as doubles (m ≤ 22), so x × 10^m is rounded once.
const POWERS_OF_TEN = [1, 10, 100, 1e3, 1e4, 1e5, 1e6, 1e7];
// Fixed-notation prefixes of toPrecision(2) for x × 10^m in [10, 100): "0.", "0.0", … "0.00000".
const LEADING_ZEROS = ['', '', '0.', '0.0', '0.00', '0.000', '0.0000', '0.00000'];
// x × 10^m is within 2⁻⁵³ relative (< 1.2e−14 absolute below 100) of the exact product: a
// fraction this close to ½, or a product this close to a decade boundary, is left to toPrecision.
const PRECISION_MARGIN = 1e-9;

/**
 * Exactly `value.toPrecision(2)`. toPrecision is a runtime call (~0.3 µs in V8) and every
 * classification formats a half-life with it: this does the same rounding (nearest, ties up on
 * the exact value) for 1e−6 ≤ value < 99.5, where toPrecision writes fixed notation, and leaves
 * near-ties, decade boundaries, other magnitudes, negatives, NaN and infinities to toPrecision.
 */
export function formatPrecision2(value: number): string {
  if (!(value >= 1e-6 && value < 100)) return value.toPrecision(2);
  // Smallest m with value × 10^m ≥ 10: two significant digits are then the integer part.
  let power = 0;
  let scaled = value;
  while (scaled < 10) {
    power++;
    if (power >= POWERS_OF_TEN.length) return value.toPrecision(2);
    scaled = value * (POWERS_OF_TEN[power] as number);
  }
  if (scaled < 10 + PRECISION_MARGIN || scaled > 99.5 - PRECISION_MARGIN) return value.toPrecision(2);
  const whole = Math.floor(scaled);
  const fraction = scaled - whole;
  if (Math.abs(fraction - 0.5) < PRECISION_MARGIN) return value.toPrecision(2);
  const digits = fraction > 0.5 ? whole + 1 : whole;
  if (power === 0) return `${digits}`;
  if (power === 1) return `${Math.floor(digits / 10)}.${digits % 10}`;
  return `${LEADING_ZEROS[power] as string}${digits}`;
}
