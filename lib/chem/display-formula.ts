/**
 * Turns a coordination formula as typed ("[Co(NH3)6]3+", "K3[Cr(ox)3].3H2O") into display text
 * with Unicode subscripts and superscripts ("[Co(NH₃)₆]³⁺", "K₃[Cr(ox)₃]·3H₂O"), so it reads the
 * same in every font that carries those characters. Display only: it never rejects input, it
 * leaves anything it does not recognise as typed (the parser reports errors, not this helper).
 */

const SUBSCRIPT_DIGITS = '₀₁₂₃₄₅₆₇₈₉';
const SUPERSCRIPT_DIGITS = '⁰¹²³⁴⁵⁶⁷⁸⁹';
const SUPERSCRIPT_PLUS = '⁺';
const SUPERSCRIPT_MINUS = '⁻';
const HYDRATE_DOT = '·';

function mapDigits(digits: string, table: string): string {
  return [...digits].map((ch) => table[Number(ch)] ?? ch).join('');
}

/** "3", "+" → "³⁺"; a charge of 1 is written without the digit (IUPAC convention, common practice). */
function superscriptCharge(magnitude: string, sign: '+' | '-'): string {
  const digits = magnitude === '1' ? '' : mapDigits(magnitude, SUPERSCRIPT_DIGITS);
  return digits + (sign === '+' ? SUPERSCRIPT_PLUS : SUPERSCRIPT_MINUS);
}

interface SplitCharge {
  body: string;
  charge: string;
}

/**
 * Separates a trailing charge. After "]", ")" or "^" the digits belong to the charge ("]3+",
 * "^2-"); "+3"/"-2" at the end are always a charge; "Fe3+" (a lone element) is a charge; otherwise
 * digits before a final sign are a count and only the sign is the charge ("NH4+" → NH₄⁺).
 */
function splitCharge(formula: string): SplitCharge {
  const signFirst = /^(.*?)\^?([+-])(\d+)$/.exec(formula);
  if (signFirst && signFirst[1] !== undefined && signFirst[1] !== '' && signFirst[3] !== undefined) {
    return { body: signFirst[1], charge: superscriptCharge(signFirst[3], signFirst[2] as '+' | '-') };
  }
  const caretCharge = /^(.*)\^(\d*)([+-])$/.exec(formula);
  if (caretCharge && caretCharge[1] !== undefined) {
    return { body: caretCharge[1], charge: superscriptCharge(caretCharge[2] || '1', caretCharge[3] as '+' | '-') };
  }
  const digitsFirst = /^(.*?)(\d*)([+-])$/.exec(formula);
  if (digitsFirst && digitsFirst[1] !== undefined && digitsFirst[1] !== '') {
    const [, body, digits = '', sign] = digitsFirst;
    const chargeDigitsBelongToCharge = /[\])]$/.test(body) || /^[A-Z][a-z]?$/.test(body);
    if (chargeDigitsBelongToCharge || digits === '') {
      return { body, charge: superscriptCharge(digits || '1', sign as '+' | '-') };
    }
    return { body: body + digits, charge: superscriptCharge('1', sign as '+' | '-') };
  }
  return { body: formula, charge: '' };
}

/** Counts after an element, a lowercase abbreviation, ")" or "]" become subscripts; leading coefficients stay as typed. */
function subscriptCounts(body: string): string {
  let out = '';
  let previous = '';
  let index = 0;
  while (index < body.length) {
    const ch = body[index] ?? '';
    if (/\d/.test(ch)) {
      let end = index;
      while (end < body.length && /\d/.test(body[end] ?? '')) end++;
      const digits = body.slice(index, end);
      // Hapticity/denticity/bridging numbers after η, κ, μ are superscripts (η⁵-Cp), IUPAC usage.
      const isBondingNumber = /[ηκμ]/.test(previous);
      const isCount = /[A-Za-z)\]]/.test(previous);
      out += isBondingNumber ? mapDigits(digits, SUPERSCRIPT_DIGITS) : isCount ? mapDigits(digits, SUBSCRIPT_DIGITS) : digits;
      previous = digits.slice(-1);
      index = end;
      continue;
    }
    out += ch;
    previous = ch;
    index++;
  }
  return out;
}

export function toDisplayFormula(formula: string): string {
  const trimmed = formula.trim();
  if (trimmed === '') return '';
  // A charge set off by a space ("Cr(H2O)6 3+") is a charge whatever precedes it: the digits are never a count.
  const spaced = /^(.*\S)\s+\^?(?:(\d*)([+-])|([+-])(\d+))$/.exec(trimmed);
  const { body, charge } = spaced
    ? { body: spaced[1] ?? '', charge: superscriptCharge(spaced[2] || spaced[5] || '1', (spaced[3] ?? spaced[4]) as '+' | '-') }
    : splitCharge(trimmed.replace(/\s+(?=[\^+-]?\d*[+-]?$)/, ''));
  // Hydrate separators ".", "*", "·" (with optional spaces) become one middle dot.
  const parts = body.split(/\s*[.*·]\s*/);
  return parts.map(subscriptCounts).join(HYDRATE_DOT) + charge;
}
