import fc from 'fast-check';
import { parseFormula } from '@/lib/chem/formula-parser';
import {
  formatFixed,
  formatPrecision2,
  capitaliseSentence,
  formatCelsius,
  formatCelsiusFromKelvin,
  formatDate,
  formatDateTime,
  formatDecimal,
  formatDuration,
  formatInteger,
  formatPowerOfTen,
  formatRecorded,
  formatScientific,
  formatSignificant,
  formatSigned,
  MINUS,
  superscriptInteger,
  typesetFormulas,
  typesetRuns,
  unitText,
  UNITS,
} from '@/lib/chem/number-format';

/**
 * formatFixed must write exactly what the runtime's own Number.prototype.toFixed writes (ECMA-262
 * §21.1.3.3 is the reference): the engine's reason texts depend on it character for character.
 */
describe('formatFixed agrees with Number.prototype.toFixed', () => {
  it.each([
    [0, 1], [-0, 1], [0.05, 1], [0.15, 1], [0.25, 2], [1.005, 2], [2.675, 2], [-0.04, 1], [-0.004, 2],
    [9.95, 1], [99.995, 2], [123456.785, 2], [1e9, 2], [1e21, 1], [Number.NaN, 1], [Number.POSITIVE_INFINITY, 2],
    [Number.NEGATIVE_INFINITY, 1], [Number.MIN_VALUE, 2], [0.45, 1], [1.45, 1], [2.5e-7, 2],
  ] as const)('%p with %p digits', (value, digits) => {
    expect(formatFixed(value, digits)).toBe(value.toFixed(digits));
  });

  it('on any double, with 1 or 2 digits', () => {
    fc.assert(
      fc.property(fc.double({ noNaN: false }), fc.constantFrom(1 as const, 2 as const), (value, digits) => {
        expect(formatFixed(value, digits)).toBe(value.toFixed(digits));
      }),
      { numRuns: 20_000 },
    );
  });

  it('on values near the engine’s range and near rounding ties', () => {
    fc.assert(
      fc.property(fc.integer({ min: -2_000_000, max: 2_000_000 }), fc.integer({ min: -3, max: 3 }), fc.constantFrom(1 as const, 2 as const), (units, nudge, digits) => {
        // x.x5 / x.xx5 written in decimal are rarely exact in binary: the cases toFixed is famous for.
        const value = (units + 0.5) / (digits === 1 ? 10 : 100) + nudge * Number.EPSILON * Math.abs(units);
        expect(formatFixed(value, digits)).toBe(value.toFixed(digits));
      }),
      { numRuns: 20_000 },
    );
  });
});

/**
 * formatPrecision2 must write exactly what Number.prototype.toPrecision(2) writes (ECMA-262
 * §21.1.3.5 is the reference): the half-life in every verdict reason is written with it.
 */
describe('formatPrecision2 agrees with Number.prototype.toPrecision(2)', () => {
  it.each([
    0, -0, 1e-6, 9.9999e-7, 5e-7, 1e-7, 0.1, 0.01, 0.15, 0.25, 0.35, 1.25, 1.35, 9.95, 9.949999, 10, 15, 99.4, 99.5,
    99.49999999, 100, 123, 1e21, -0.5, -12, 6.931e-4, Number.NaN, Number.POSITIVE_INFINITY, Number.NEGATIVE_INFINITY,
    Number.MIN_VALUE, Number.MAX_VALUE,
  ])('%p', (value) => {
    expect(formatPrecision2(value)).toBe(value.toPrecision(2));
  });

  it('on any double', () => {
    fc.assert(
      fc.property(fc.double({ noNaN: false }), (value) => {
        expect(formatPrecision2(value)).toBe(value.toPrecision(2));
      }),
      { numRuns: 20_000 },
    );
  });

  it('on the magnitudes it handles itself (1e−6 to 100)', () => {
    fc.assert(
      fc.property(fc.double({ min: -15, max: 2.1, noNaN: true }), (exponent) => {
        const value = 10 ** exponent;
        expect(formatPrecision2(value)).toBe(value.toPrecision(2));
      }),
      { numRuns: 20_000 },
    );
  });

  it('near rounding ties and decade boundaries', () => {
    fc.assert(
      fc.property(fc.integer({ min: 10, max: 100 }), fc.integer({ min: -8, max: 2 }), fc.integer({ min: -3, max: 3 }), fc.boolean(), (units, exponent, nudge, tie) => {
        // n.5 × 10^e written in decimal is rarely exact in binary; 10^e itself sits on a boundary.
        const exact = ((tie ? units + 0.5 : units) * 10 ** exponent) / 10;
        const value = exact + nudge * Number.EPSILON * exact;
        expect(formatPrecision2(value)).toBe(value.toPrecision(2));
      }),
      { numRuns: 20_000 },
    );
  });
});

/*
 * The one notation (lib/chem/number-format.ts). Check values: the IUPAC Green Book (E. R. Cohen et
 * al., Quantities, Units and Symbols in Physical Chemistry, 3rd ed., RSC 2007, §1.3 and §7.1) for
 * unit symbols, negative exponents, the space between number and unit and the minus sign; the SI
 * Brochure (BIPM, 9th ed. 2019, §5.4.3) for "25 °C"; everything else common practice.
 */

describe('numbers as a × 10ⁿ with set significant figures (common practice; Green Book §7.1)', () => {
  it.each([
    [2.4e-6, 2, '2.4 × 10⁻⁶'],
    [1e-5, 2, '1.0 × 10⁻⁵'],
    [9.96e-6, 2, '1.0 × 10⁻⁵'], // rounding carries into the next decade
    [9.96e-6, 3, '9.96 × 10⁻⁶'],
    [-3.2e-7, 2, '−3.2 × 10⁻⁷'],
    [3.2e4, 2, '3.2 × 10⁴'],
    [1e12, 3, '1.00 × 10¹²'],
    [0.0123, 2, '0.012'],
    [0.0123, 3, '0.0123'],
    [31.6, 2, '32'],
    [2389.58, 3, '2390'],
    [0.5, 2, '0.50'],
    [0, 2, '0'],
  ] as const)('%p to %p figures → %p', (value, figures, expected) => {
    expect(formatScientific(value, figures)).toBe(expected);
  });

  it('never writes an ASCII hyphen as a minus, an "e" exponent, a caret or a middle-dot decimal', () => {
    fc.assert(
      fc.property(fc.double({ min: -1e30, max: 1e30, noNaN: true }), fc.integer({ min: 1, max: 4 }), (value, figures) => {
        const text = formatScientific(value, figures);
        expect(text).not.toMatch(/-|e[+-]?\d|\^|·/);
        if (value < 0 && Number(text.replace(MINUS, '-').split(' ')[0]) !== 0) expect(text.startsWith(MINUS)).toBe(true);
      }),
      { numRuns: 5_000 },
    );
  });

  it('keeps the requested number of significant figures (the mantissa has exactly that many digits)', () => {
    fc.assert(
      fc.property(fc.double({ min: 1e-30, max: 1e30, noNaN: true }), fc.integer({ min: 1, max: 4 }), (value, figures) => {
        const text = formatScientific(value, figures);
        const mantissa = text.split(' × ')[0] as string;
        if (!text.includes('×')) return; // plain range: trailing zeros of whole numbers are not significant
        expect(mantissa.replace('.', '').length).toBe(figures);
        // and the value it stands for is within half a unit of the last figure
        const [, exponent] = /10([⁻⁰¹²³⁴⁵⁶⁷⁸⁹]+)$/.exec(text) ?? [];
        const power = Number([...(exponent ?? '')].map((ch) => '⁰¹²³⁴⁵⁶⁷⁸⁹'.indexOf(ch) >= 0 ? String('⁰¹²³⁴⁵⁶⁷⁸⁹'.indexOf(ch)) : '-').join(''));
        const written = Number(mantissa) * 10 ** power;
        expect(Math.abs(written - value) / value).toBeLessThanOrEqual(0.5 * 10 ** (1 - figures) + 1e-9);
      }),
      { numRuns: 5_000 },
    );
  });

  it('writes 10^x from a log (−5.62 → 2.4 × 10⁻⁶: 10^−5.62 = 2.399 × 10⁻⁶, hand arithmetic)', () => {
    expect(formatPowerOfTen(-5.62)).toBe('2.4 × 10⁻⁶');
    expect(formatPowerOfTen(3.2)).toBe('1600');
    expect(superscriptInteger(-12)).toBe('⁻¹²');
  });

  it('keeps recorded values without invented trailing zeros', () => {
    expect(formatRecorded(2.4e-6)).toBe('2.4 × 10⁻⁶');
    expect(formatRecorded(1e-5)).toBe('1 × 10⁻⁵');
    expect(formatRecorded(108.6)).toBe('108.6');
    expect(formatRecorded(0.5)).toBe('0.5');
    expect(formatRecorded(5.7e-6)).toBe('5.7 × 10⁻⁶');
  });

  it('plain decimals use the real minus and never "−0"', () => {
    expect(formatDecimal(-249.84, 1)).toBe('−249.8');
    expect(formatDecimal(-0.04, 1)).toBe('0.0');
    expect(formatSigned(-1.26)).toBe('−1.3');
    expect(formatSigned(0.44)).toBe('+0.4');
    expect(formatSignificant(-3, 2)).toBe('−3.0');
  });
});

describe('one unit style (Green Book §1.3: negative exponents, a space between symbols and before the unit)', () => {
  it('writes the product’s units with superscripts', () => {
    expect([UNITS.perCentimetre, UNITS.perSecond, UNITS.perMolarPerSecond, UNITS.kilojoulePerMole, UNITS.cubicCentimetrePerMole]).toEqual([
      'cm⁻¹',
      's⁻¹',
      'M⁻¹ s⁻¹',
      'kJ mol⁻¹',
      'cm³ mol⁻¹',
    ]);
    expect(unitText('cm3/mol')).toBe('cm³ mol⁻¹');
    expect(unitText('J/(mol K)')).toBe('J K⁻¹ mol⁻¹');
    expect(unitText('M-1 s-1')).toBe('M⁻¹ s⁻¹');
  });

  it('writes Celsius with a space before °C (SI Brochure §5.4.3) and the real minus', () => {
    expect(formatCelsius(25)).toBe('25 °C');
    expect(formatCelsius(-40)).toBe('−40 °C');
    expect(formatCelsiusFromKelvin(298.15)).toBe('25 °C');
    expect(formatCelsiusFromKelvin(274.65)).toBe('1.5 °C');
  });
});

describe('one duration ladder: ps, ns, µs, ms, s, min, h, d, y with two or three figures (common practice)', () => {
  it.each([
    [2.4e-12, '2.4 ps'],
    [6.9e-13, '0.69 ps'],
    [2.4e-9, '2.4 ns'], // never "0.0024 µs"
    [3.4e-7, '340 ns'],
    [0.008, '8.0 ms'],
    [0.99996, '1.0 s'], // rounds up the ladder, never "1000 ms"
    [39, '39 s'],
    [59.97, '1.0 min'], // never "60 s"
    [90, '1.5 min'],
    [5400, '1.5 h'],
    [121_600, '1.4 d'], // ln 2 / 5.7 × 10⁻⁶ s⁻¹
    [3.156e8, '10 y'],
    [3e15, '9.5 × 10⁷ y'],
  ] as const)('%p s → %p', (seconds, expected) => {
    expect(formatDuration(seconds)).toBe(expected);
  });

  it('always gives a number between 1 and 1000 of a ladder unit (or below 1 ps, or a power of ten of years)', () => {
    fc.assert(
      fc.property(fc.double({ min: 1e-12, max: 3e10, noNaN: true }), (seconds) => {
        const text = formatDuration(seconds);
        const match = /^(\d+(?:\.\d+)?) (ps|ns|µs|ms|s|min|h|d|y)$/.exec(text);
        expect(match).not.toBeNull();
        const value = Number(match?.[1]);
        expect(value).toBeGreaterThanOrEqual(1);
        expect(value).toBeLessThan(1000);
        const digits = (match?.[1] ?? '').replace('.', '').replace(/^0+/, '');
        expect(digits.length).toBeGreaterThanOrEqual(2);
        expect(digits.length).toBeLessThanOrEqual(3);
      }),
      { numRuns: 5_000 },
    );
  });
});

describe('orbital labels, sentence case and dates', () => {
  it('marks the subscripts of t2g and eg as the trade prints them (t₂g, e_g), and leaves words such as "e.g." and "leg" alone', () => {
    expect(typesetRuns('t2g⁶, eg empty; e.g. a leg')).toEqual([
      { text: 't', kind: 'plain' },
      { text: '2g', kind: 'sub' },
      { text: '⁶, e', kind: 'plain' },
      { text: 'g', kind: 'sub' },
      { text: ' empty; e.g. a leg', kind: 'plain' },
    ]);
    expect(typesetRuns('no orbital here')).toEqual([{ text: 'no orbital here', kind: 'plain' }]);
  });

  it('capitalises sentences but not the symbols they may start with', () => {
    expect(capitaliseSentence('labile: k ≈ 1600 s⁻¹')).toBe('Labile: k ≈ 1600 s⁻¹');
    expect(capitaliseSentence('oxidant is inert')).toBe('Oxidant is inert');
    expect(capitaliseSentence('d3 with 3+ charge')).toBe('d3 with 3+ charge');
    expect(capitaliseSentence('t2g set filled')).toBe('t2g set filled');
    expect(capitaliseSentence('k ≈ 3 s⁻¹')).toBe('k ≈ 3 s⁻¹');
    expect(capitaliseSentence('Already capital')).toBe('Already capital');
  });

  it('writes one date style that follows the locale (CLDR medium dates)', () => {
    const moment = '2026-12-04T14:05:00Z';
    expect(formatDate(moment, 'en-GB')).toBe('4 Dec 2026');
    expect(formatDate(moment, 'en-US')).toBe('Dec 4, 2026');
    expect(formatDate(moment, 'de-DE')).toBe('04.12.2026');
    expect(formatDateTime(moment, 'en-GB')).toMatch(/^4 Dec 2026, \d\d:05$/);
    expect(formatDate('not a date', 'en-GB')).toBe('not a date');
  });
});

describe('whole quantities grouped as the Green Book writes them (3rd ed. 2007, §1.3)', () => {
  it('groups digits in threes by a thin space only beyond four digits, never by a comma', () => {
    expect(formatInteger(23800)).toBe('23\u202f800');
    expect(formatInteger(1740)).toBe('1740');
    expect(formatInteger(-12345)).toBe('−12\u202f345');
    expect(formatInteger(1234567)).toBe('1\u202f234\u202f567');
  });
});

describe('formulas typeset in running text (common practice: subscript counts, superscript charges)', () => {
  it('typesets the coordination formulas and hydrates in a sentence and leaves other brackets alone', () => {
    expect(typesetFormulas('CrCl3·6H2O (in the crystal trans-[CrCl2(H2O)4]Cl·2H2O) dissolves to [Cr(H2O)6]3+, so')).toBe(
      'CrCl₃·6H₂O (in the crystal trans-[CrCl₂(H₂O)₄]Cl·2H₂O) dissolves to [Cr(H₂O)₆]³⁺, so',
    );
    expect(typesetFormulas('K3[Fe(CN)6] and [PtCl4]2−.')).toBe('K₃[Fe(CN)₆] and [PtCl₄]²⁻.');
    expect(typesetFormulas('rate ∝ 1/[H+], faster at low acid')).toBe('rate ∝ 1/[H+], faster at low acid');
    expect(typesetFormulas('k11 [recalled].')).toBe('k11 [recalled].');
  });

  it('what it prints parses back to the same species (the parser reads Unicode sub- and superscripts)', () => {
    for (const formula of ['[Co(NH3)5Cl]2+', 'K3[Fe(CN)6]', '[Cr(H2O)6]3+', 'CrCl3·6H2O', '[Fe(Cp)2]+']) {
      const typed = parseFormula(formula);
      const shown = parseFormula(typesetFormulas(formula));
      expect({ metal: shown.metal, oxidationState: shown.oxidationState, charge: shown.complexCharge }).toEqual({
        metal: typed.metal,
        oxidationState: typed.oxidationState,
        charge: typed.complexCharge,
      });
    }
  });
});
