import { toDisplayFormula } from './display-formula';

/**
 * The one formatting module: numbers, units, durations, orbital labels, dates and sentence case as the
 * product writes them (below), and the fast fixed-point helpers the engine's reasons use.
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

/*
 * ───────────────────────── The one notation ─────────────────────────
 *
 * Everything the product writes for people (reasons, cards, charts, the CLI, exports that are copy)
 * goes through the functions below, so a number, a unit, a duration, an orbital label and a date
 * read the same on every screen:
 *   numbers      a × 10ⁿ with set significant figures, Unicode superscripts, a real minus sign (−),
 *                a decimal point (never a middle dot); magnitudes from 0.01 to 9999 written plainly
 *   units        cm⁻¹, s⁻¹, M⁻¹ s⁻¹, kJ mol⁻¹, J K⁻¹ mol⁻¹, cm³ mol⁻¹, g mol⁻¹, °C — negative exponents,
 *                a space between unit symbols and between number and unit (IUPAC Green Book, 3rd ed.
 *                2007, §1.3 and §7.1; SI Brochure, 9th ed. 2019, §5.4.3 for "25 °C")
 *   durations    one ladder ps, ns, µs, ms, s, min, h, d, y, two or three significant figures
 *   orbitals     "t2g" and "eg" in text (never "e_g" or "t₂g"); typesetRuns() marks the subscripts
 *   dates        one style that follows the reader's locale
 *   sentences    start with a capital unless they start with a symbol ("d6", "t2g", "k")
 */

/** The real minus sign (U+2212), for negative numbers and signed exponents. */
export const MINUS = '\u2212';

const SUPERSCRIPT_CHARS: Readonly<Record<string, string>> = {
  '0': '⁰', '1': '¹', '2': '²', '3': '³', '4': '⁴', '5': '⁵', '6': '⁶', '7': '⁷', '8': '⁸', '9': '⁹',
  '-': '⁻', '\u2212': '⁻', '+': '⁺',
};

/** Digits and signs as superscripts ("-12" → "⁻¹²"); anything else (a decimal point included) is left as it is. */
export function superscript(text: string): string {
  let out = '';
  for (const ch of text) out += SUPERSCRIPT_CHARS[ch] ?? ch;
  return out;
}

/** An integer exponent as superscripts with the real minus: −5 → "⁻⁵". */
export function superscriptInteger(exponent: number): string {
  return superscript(String(Math.round(exponent)));
}

/** The ASCII hyphen-minus of a number written by the runtime replaced by the real minus sign. */
export function withMinus(text: string): string {
  return text.charCodeAt(0) === 45 ? MINUS + text.slice(1) : text;
}

/** Smallest and largest decimal exponents written without "× 10ⁿ" (0.01 … 9999). */
const PLAIN_FROM_EXPONENT = -2;
const PLAIN_TO_EXPONENT = 3;

/**
 * A value rounded to `significant` figures, in plain decimal notation (no exponent), with the real
 * minus sign: formatSignificant(0.012345, 2) → "0.012", formatSignificant(-3.0, 2) → "−3.0".
 */
export function formatSignificant(value: number, significant = 2): string {
  if (!Number.isFinite(value)) return nonFinite(value);
  if (value === 0) return significant > 1 ? `0.${'0'.repeat(significant - 1)}` : '0';
  const exponent = decimalExponent(value, significant);
  const decimals = Math.max(0, significant - 1 - exponent);
  // toFixed with the decimals that leave `significant` figures; large values are rounded to whole tens etc.
  if (decimals > 0) return withMinus(value.toFixed(Math.min(decimals, 100)));
  const scale = 10 ** (exponent - significant + 1);
  return withMinus(String(Math.round(value / scale) * scale));
}

/** The decimal exponent of a value after rounding it to `significant` figures (9.96 → 1 at 2 figures). */
function decimalExponent(value: number, significant: number): number {
  const magnitude = Math.abs(value);
  let exponent = Math.floor(Math.log10(magnitude));
  // log10 can land a hair below an exact power of ten; rounding can carry into the next decade.
  if (10 ** (exponent + 1) <= magnitude) exponent += 1;
  const mantissa = magnitude / 10 ** exponent;
  if (Number(mantissa.toFixed(significant - 1)) >= 10) exponent += 1;
  return exponent;
}

function nonFinite(value: number): string {
  if (Number.isNaN(value)) return '—';
  return value > 0 ? '∞' : `${MINUS}∞`;
}

/**
 * A value as a × 10ⁿ with `significant` figures, or plainly between 0.01 and 9999:
 * formatScientific(2.4e-6) → "2.4 × 10⁻⁶", formatScientific(1e-5) → "1.0 × 10⁻⁵",
 * formatScientific(0.0123, 3) → "0.0123", formatScientific(31.6) → "32".
 */
export function formatScientific(value: number, significant = 2): string {
  if (!Number.isFinite(value)) return nonFinite(value);
  if (value === 0) return '0';
  const exponent = decimalExponent(value, significant);
  if (exponent >= PLAIN_FROM_EXPONENT && exponent <= PLAIN_TO_EXPONENT) return formatSignificant(value, significant);
  const mantissa = value / 10 ** exponent;
  return `${withMinus(mantissa.toFixed(significant - 1))} × 10${superscriptInteger(exponent)}`;
}

/**
 * A recorded value (a library measurement) with up to `maxSignificant` figures and no trailing zeros,
 * since how many figures were recorded is not stored: 2.4e-6 → "2.4 × 10⁻⁶", 108.6 → "108.6",
 * 3.2e4 → "3.2 × 10⁴", 0.5 → "0.5".
 */
export function formatRecorded(value: number, maxSignificant = 4): string {
  const text = formatScientific(value, maxSignificant);
  // Trailing zeros of the decimal part (and a bare point) go: "2.400 × 10⁻⁶" → "2.4 × 10⁻⁶", "3.000" → "3".
  return text.replace(/(\.\d*?)0+(?=$| )/, '$1').replace(/\.(?=$| )/, '');
}

/** 10^log10 as a × 10ⁿ (two significant figures by default): formatPowerOfTen(−5.62) → "2.4 × 10⁻⁶". */
export function formatPowerOfTen(log10: number, significant = 2): string {
  return formatScientific(10 ** log10, significant);
}

/** The narrow no-break space that groups digits in threes (Green Book §1.3: a thin space, never a comma). */
export const DIGIT_GROUP = '\u202f';

/**
 * A whole number as a quantity is written (IUPAC Green Book, 3rd ed. 2007, §1.3): digits grouped in
 * threes by a thin space when there are more than four, never by a comma; the real minus sign.
 * formatInteger(23800) → "23 800", formatInteger(1740) → "1740", formatInteger(−12345) → "−12 345".
 */
export function formatInteger(value: number): string {
  if (!Number.isFinite(value)) return nonFinite(value);
  const rounded = Math.round(value);
  const digits = String(Math.abs(rounded));
  const grouped = digits.length > 4 ? digits.replace(/\B(?=(\d{3})+(?!\d))/g, DIGIT_GROUP) : digits;
  return rounded < 0 ? MINUS + grouped : grouped;
}

/** A signed number with the real minus and an explicit plus ("+0.4", "−1.3"), fixed decimals. */
export function formatSigned(value: number, decimals: 1 | 2 = 1): string {
  const text = formatFixed(Math.abs(value), decimals);
  if (Number(text) === 0) return text;
  return `${value < 0 ? MINUS : '+'}${text}`;
}

/** Fixed decimals with the real minus sign (−249.8), for values whose precision is set by the data. */
export function formatDecimal(value: number, decimals: 0 | 1 | 2 = 1): string {
  if (!Number.isFinite(value)) return nonFinite(value);
  const text = decimals === 0 ? String(Math.round(value)) : formatFixed(value, decimals);
  // "−0" and "−0.0" read as a glitch: a value that rounds to zero is written without a sign.
  if (Number(text) === 0) return text.replace('-', '');
  return withMinus(text);
}

/** The product's unit symbols (IUPAC Green Book, 3rd ed. 2007, §1.3: negative exponents, a space between symbols). */
export const UNITS = {
  perCentimetre: 'cm⁻¹',
  perSecond: 's⁻¹',
  perMolarPerSecond: 'M⁻¹ s⁻¹',
  kilojoulePerMole: 'kJ mol⁻¹',
  joulePerKelvinPerMole: 'J K⁻¹ mol⁻¹',
  cubicCentimetrePerMole: 'cm³ mol⁻¹',
  gramPerMole: 'g mol⁻¹',
  celsius: '°C',
  kelvin: 'K',
  volt: 'V',
  second: 's',
  molar: 'M',
} as const;

/** Units as the library stores them (ASCII codes) → the product's symbols. */
const STORED_UNIT_TEXT: Readonly<Record<string, string>> = {
  's-1': UNITS.perSecond,
  'M-1 s-1': UNITS.perMolarPerSecond,
  V: UNITS.volt,
  'cm-1': UNITS.perCentimetre,
  'kJ/mol': UNITS.kilojoulePerMole,
  'J/(mol K)': UNITS.joulePerKelvinPerMole,
  'cm3/mol': UNITS.cubicCentimetrePerMole,
  s: UNITS.second,
};

/** A stored unit code ("cm3/mol") as people read it ("cm³ mol⁻¹"); an unknown code is returned as it is. */
export function unitText(storedUnit: string): string {
  return STORED_UNIT_TEXT[storedUnit] ?? storedUnit;
}

/** A number and its unit, one space between (also before °C: SI Brochure, 9th ed. 2019, §5.4.3). */
export function withUnit(valueText: string, unit: string): string {
  return `${valueText} ${unit}`;
}

/** A Celsius temperature from kelvin, to a tenth where it is not whole: 298.15 → "25 °C", 310.15 → "37 °C", 274.65 → "1.5 °C". */
export function formatCelsiusFromKelvin(kelvin: number): string {
  return formatCelsius(kelvin - 273.15);
}

/** A Celsius temperature, to a tenth where it is not whole: 25 → "25 °C", −40 → "−40 °C". */
export function formatCelsius(celsius: number): string {
  const tenth = Math.round(celsius * 10) / 10;
  return withUnit(formatDecimal(tenth, Number.isInteger(tenth) ? 0 : 1), UNITS.celsius);
}

/** The duration ladder: symbol and length in seconds, shortest first. */
const DURATION_LADDER: readonly (readonly [string, number])[] = [
  ['ps', 1e-12],
  ['ns', 1e-9],
  ['µs', 1e-6],
  ['ms', 1e-3],
  ['s', 1],
  ['min', 60],
  ['h', 3600],
  ['d', 86400],
  ['y', 365.25 * 86400],
];

/** A count of units with two significant figures below 100 and whole numbers from 100 (3 figures below 1000). */
function ladderNumber(value: number): { text: string; rounded: number } {
  if (value >= 9.95) {
    const rounded = Math.round(value);
    return { text: String(rounded), rounded };
  }
  if (value >= 1) {
    const text = formatFixed(value, 1);
    return { text, rounded: Number(text) };
  }
  const text = formatPrecision2(value);
  return { text, rounded: Number(text) };
}

/**
 * A duration on the one ladder (ps, ns, µs, ms, s, min, h, d, y), in the largest unit that keeps the
 * number at 1 or more, with two or three significant figures: 0.008 → "8.0 ms", 2.4e-9 → "2.4 ns",
 * 39 → "39 s", 90 → "1.5 min", 121 600 → "1.4 d"; beyond 1000 years "1.2 × 10⁴ y"; below a
 * picosecond "0.69 ps". Never "0.0024 µs".
 */
export function formatDuration(seconds: number): string {
  if (Number.isNaN(seconds)) return '—';
  if (seconds === Number.POSITIVE_INFINITY) return 'forever';
  if (seconds <= 0) return withUnit('0', 's');
  let step = 0;
  while (step < DURATION_LADDER.length - 1 && seconds >= (DURATION_LADDER[step + 1] as readonly [string, number])[1]) step++;
  for (;;) {
    const [unit, size] = DURATION_LADDER[step] as readonly [string, number];
    const value = seconds / size;
    if (unit === 'y' && value >= 999.5) return withUnit(formatScientific(value, 2), unit);
    // After a step up the ladder the value can sit just under 1 (23.5 h → 0.98 d): at this precision it is 1.0.
    const { text, rounded } = value < 1 && step > 0 ? { text: '1.0', rounded: 1 } : ladderNumber(value);
    const next = DURATION_LADDER[step + 1];
    // 59.97 s rounds to "60 s": write "1.0 min" instead (and so on up the ladder).
    if (next !== undefined && rounded * size >= next[1]) {
      step++;
      continue;
    }
    return withUnit(text, unit);
  }
}

/** Orbital labels in text: one spelling each (the UI lowers the subscript part through typesetRuns). */
export const ORBITAL_LABELS = { t2g: 't2g', eg: 'eg', t2: 't2', e: 'e' } as const;

/** A run of text: plain, or lowered/raised (the subscript of an orbital label, a formula's counts). */
export interface TypesetRun {
  text: string;
  kind: 'plain' | 'sub';
}

// "t2g" and "eg" as whole words (so "e.g.", "leg", "egg" are left alone); occupancy superscripts may follow.
const ORBITAL_TOKEN = /(^|[^\p{L}0-9_])(t)(2g)(?![\p{L}0-9_])|(^|[^\p{L}0-9_.])(e)(g)(?![\p{L}0-9_.])/gu;

// A coordination formula inside running text: an optional cation prefix, a bracket that holds an
// element and a count or a parenthesis ("[Co(NH3)6]", not "[H+]" or "[recalled]"), an optional
// charge, and an optional hydrate ("·2H2O"); or a bracket-less hydrate salt ("CrCl3·6H2O").
const FORMULA_TOKEN =
  /(?<![\w\]])(?:(?:[A-Z][a-z]?\d*|\([A-Z][A-Za-z0-9]*\)\d*)*\[(?=[A-Z])(?=[^\]\s]*[\d(])[^\]\s]+\](?:\d*[+\-−](?![\w])|(?:[A-Z][a-z]?\d*|\([A-Z][A-Za-z0-9]*\)\d*)*)|(?:[A-Z][a-z]?\d*|\([A-Z][A-Za-z0-9]*\)\d*)+)(?:·\d*H2O)?/g;

/** Plain text with the coordination formulas in it typeset ("[Co(NH3)6]3+" → "[Co(NH₃)₆]³⁺"); other text unchanged. */
export function typesetFormulas(text: string): string {
  if (text.indexOf('[') < 0 && text.indexOf('·') < 0) return text;
  return text.replace(FORMULA_TOKEN, (token) => (token.includes('[') || token.includes('·') ? toDisplayFormula(token.replace(/−$/, '-')) : token));
}

/**
 * Text split into runs so a screen can lower the subscripts of the orbital labels the trade prints
 * as t₂g and e_g (Unicode has no subscript g): "t2g⁶, eg empty" → t, ₂g (sub), "⁶, ", e, g (sub), " empty".
 * Coordination formulas in the text come out typeset (Unicode sub- and superscripts), as everywhere
 * else on screen; the parser reads them back as typed.
 */
export function typesetRuns(rawText: string): TypesetRun[] {
  const text = typesetFormulas(rawText);
  const runs: TypesetRun[] = [];
  let last = 0;
  ORBITAL_TOKEN.lastIndex = 0;
  for (let match = ORBITAL_TOKEN.exec(text); match !== null; match = ORBITAL_TOKEN.exec(text)) {
    const before = match[1] ?? match[4] ?? '';
    const main = match[2] ?? match[5] ?? '';
    const sub = match[3] ?? match[6] ?? '';
    const start = match.index + before.length;
    if (start > last) runs.push({ text: text.slice(last, start), kind: 'plain' });
    runs.push({ text: main, kind: 'plain' });
    runs.push({ text: sub, kind: 'sub' });
    last = start + main.length + sub.length;
  }
  if (last < text.length) runs.push({ text: text.slice(last), kind: 'plain' });
  // Adjacent plain runs are merged so a screen renders as few pieces as possible.
  const merged: TypesetRun[] = [];
  for (const run of runs) {
    const previous = merged[merged.length - 1];
    if (previous && previous.kind === 'plain' && run.kind === 'plain') previous.text += run.text;
    else merged.push({ ...run });
  }
  return merged;
}

// A sentence that starts with one of these starts with a symbol, which keeps its case.
const SYMBOL_START = /^(?:[dfp]\d|t2g?\b|eg\b|e\b|k\b|k\d|k[a-z]*\s*[=≈]|log\b|pH\b|pK|n\b|x\b|cis-|trans-|fac-|mer-|[a-z]\()/;

/** A sentence with its first letter capitalised, unless it starts with a symbol ("d6 low spin", "k ≈ …", "t2g⁶"). */
export function capitaliseSentence(text: string): string {
  const first = text.charCodeAt(0);
  if (first < 97 || first > 122) return text;
  if (SYMBOL_START.test(text)) return text;
  return String.fromCharCode(first - 32) + text.slice(1);
}

const dateFormats = new Map<string, Intl.DateTimeFormat>();

function dateFormat(locale: string | undefined, withTime: boolean): Intl.DateTimeFormat {
  const key = `${locale ?? ''}|${withTime ? 't' : 'd'}`;
  let format = dateFormats.get(key);
  if (format === undefined) {
    format = new Intl.DateTimeFormat(locale, withTime ? { dateStyle: 'medium', timeStyle: 'short' } : { dateStyle: 'medium' });
    dateFormats.set(key, format);
  }
  return format;
}

/**
 * A date in the one style of the product, following the reader's locale (the runtime's default, or
 * the one given): "4 Dec 2026" in en-GB, "Dec 4, 2026" in en-US, "04.12.2026" in de. A value that
 * is not a date is returned as it came.
 */
export function formatDate(value: string | Date, locale?: string): string {
  const date = typeof value === 'string' ? new Date(value) : value;
  if (Number.isNaN(date.getTime())) return String(value);
  return dateFormat(locale, false).format(date);
}

/** A date with the time of day, in the same style (sessions, revisions): "4 Dec 2026, 14:05" in en-GB. */
export function formatDateTime(value: string | Date, locale?: string): string {
  const date = typeof value === 'string' ? new Date(value) : value;
  if (Number.isNaN(date.getTime())) return String(value);
  return dateFormat(locale, true).format(date);
}
