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
