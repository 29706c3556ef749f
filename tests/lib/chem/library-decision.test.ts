import { classifyFormula } from '@/lib/chem/classify';
import {
  candidatesFromRows,
  decideByLibrary,
  firstOrderK,
  libraryHeadline,
  logKMovedTo,
  modelGapLogUnits,
  needsSecondLook,
  pickDecidingMeasurement,
  type LibraryCandidate,
  type StoredMeasurement,
} from '@/lib/chem/library-decision';
import type { CitationRef } from '@/lib/chem/types';

/**
 * Measured decides: the group's accepted measurement decides the verdict and the headline, and the
 * model's prediction becomes the footnote. Check values are published water-exchange constants.
 */

// Xu, Krouse & Swaddle, Inorg. Chem. 1985, 24, 267: [Cr(H2O)6]3+ k_ex = 2.4e-6 s⁻¹ at 298 K.
const xu1985: CitationRef = { authors: 'F.-C. Xu, H. R. Krouse, T. W. Swaddle', title: null, journal: 'Inorg. Chem.', year: 1985, volume: '24', pages: '267-270', doi: null };
const CR_AQUA_K = 2.4e-6;
// Ducommun, Newman & Merbach, Inorg. Chem. 1980, 19, 3696: [Ni(H2O)6]2+ k_ex = 3.2e4 s⁻¹ at 298 K (recalled; as in the water-exchange reference table).
const ducommun1980: CitationRef = { authors: 'Y. Ducommun, K. E. Newman, A. E. Merbach', title: null, journal: 'Inorg. Chem.', year: 1980, volume: '19', pages: '3696-3703', doi: null };
const NI_AQUA_K = 3.2e4;
// Laurenczy et al., Magn. Reson. Chem. 1991, 29, S45: [Rh(H2O)6]3+ k_ex = 2.2e-9 s⁻¹ at 298 K.
const laurenczy1991: CitationRef = { authors: 'G. Laurenczy, I. Rapaport, D. Zbinden, A. E. Merbach', title: null, journal: 'Magn. Reson. Chem.', year: 1991, volume: '29', pages: 'S45-S51', doi: '10.1002/mrc.1260291311' };
const RH_AQUA_K = 2.2e-9;

// Taube 1952 (common practice): labile means t½ under about a minute, k > ln 2 / 60 s.
const oneMinuteK = Math.LN2 / 60;

const water = (value: number, citation: CitationRef, temperatureK: number | null = 298.15): StoredMeasurement => ({ kind: 'water-exchange', value, unit: 's-1', temperatureK, citation });
const entry = (entryId: string, entryName: string, entryFormula: string, measurements: StoredMeasurement[]): LibraryCandidate => ({ entryId, entryName, entryFormula, measurements });

describe('which measurements can decide', () => {
  it('first-order rates and half-lives decide; second-order constants, potentials and Δo do not', () => {
    expect(firstOrderK(water(CR_AQUA_K, xu1985))).toBe(CR_AQUA_K);
    // t½ = ln 2 / k (first-order kinetics, common practice): a 1-hour half-life is k = ln 2 / 3600 s.
    expect(firstOrderK({ kind: 'half-life', value: 3600, unit: 's' })).toBeCloseTo(Math.LN2 / 3600, 12);
    expect(firstOrderK({ kind: 'substitution', value: 1.2e-3, unit: 'M-1 s-1' })).toBeNull();
    expect(firstOrderK({ kind: 'self-exchange', value: 1.2e-3, unit: 'M-1 s-1' })).toBeNull();
    expect(firstOrderK({ kind: 'reduction-potential', value: 0.1, unit: 'V' })).toBeNull();
    expect(firstOrderK({ kind: 'ligand-field-splitting', value: 17400, unit: 'cm-1' })).toBeNull();
    expect(firstOrderK({ kind: 'water-exchange', value: 0, unit: 's-1' })).toBeNull();
  });

  it('water exchange before substitution, then the measurement nearest the temperature asked for', () => {
    const candidates = [
      entry('a', 'hexaaquachromium(III), substitution', '[Cr(H2O)6]3+', [{ kind: 'substitution', value: 1e-5, unit: 's-1', temperatureK: 298.15, citation: null }]),
      entry('b', 'hexaaquachromium(III)', '[Cr(OH2)6]3+', [water(CR_AQUA_K * 30, xu1985, 333.15), water(CR_AQUA_K, xu1985, 298.15)]),
    ];
    const at25 = pickDecidingMeasurement(candidates, 298.15);
    expect(at25).toMatchObject({ entryId: 'b', kind: 'water-exchange', kPerSecond: CR_AQUA_K, temperatureK: 298.15 });
    const at55 = pickDecidingMeasurement(candidates, 328.15);
    expect(at55).toMatchObject({ entryId: 'b', temperatureK: 333.15 });
    expect(pickDecidingMeasurement([entry('c', 'x', '[Cr(H2O)6]3+', [{ kind: 'reduction-potential', value: -0.41, unit: 'V', temperatureK: 298.15, citation: null }])], 298.15)).toBeNull();
  });

  it('a measurement without a temperature is taken at 25 °C', () => {
    expect(pickDecidingMeasurement([entry('a', 'x', 'y', [water(CR_AQUA_K, xu1985, null)])], 310)?.temperatureK).toBe(298.15);
  });

  it('rows from the measured look-up group into one candidate per entry, in order', () => {
    const rows = [
      { ...water(CR_AQUA_K, xu1985), complexId: 'e1', complexName: 'one', complexFormula: '[Cr(H2O)6]3+' },
      { kind: 'activation-enthalpy', value: 108.6, unit: 'kJ/mol', temperatureK: null, citation: xu1985, complexId: 'e1', complexName: 'one', complexFormula: '[Cr(H2O)6]3+' },
      { ...water(CR_AQUA_K, xu1985), complexId: 'e2', complexName: 'two', complexFormula: '[Cr(OH2)6](ClO4)3' },
    ];
    const candidates = candidatesFromRows(rows);
    expect(candidates.map((c) => [c.entryId, c.measurements.length])).toEqual([['e1', 2], ['e2', 1]]);
  });
});

describe('the measurement decides the verdict and the headline', () => {
  it.each([
    ['[Cr(H2O)6]3+', CR_AQUA_K, xu1985, 'hexaaquachromium(III)'],
    ['[Ni(H2O)6]2+', NI_AQUA_K, ducommun1980, 'hexaaquanickel(II)'],
    ['[Rh(H2O)6]3+', RH_AQUA_K, laurenczy1991, 'hexaaquarhodium(III)'],
  ])('%s: the verdict follows the measured k on the one-minute line', (formula, k, citation, name) => {
    const model = classifyFormula(formula);
    const ref = pickDecidingMeasurement([entry('id-1', name, formula, [water(k, citation)])], 298.15)!;
    const decided = decideByLibrary(model, ref);
    expect(decided.decidedBy).toBe('library');
    expect(decided.verdict).toBe(k > oneMinuteK * 5 ? 'labile' : k < oneMinuteK / 5 ? 'inert' : 'intermediate');
    expect(decided.logKPerSecond).toBeCloseTo(Math.log10(k), 2);
    expect(decided.halfLifeSeconds).toBeCloseTo(Math.LN2 / k, -Math.floor(Math.log10(Math.LN2 / k)) + 1);
    expect(decided.confidence).toBe('high');
    expect(decided.libraryMeasurement).toMatchObject({ entryId: 'id-1', kPerSecond: k, temperatureK: 298.15, citation });
    // The headline names the entry and its citation; the model is the footnote.
    expect(decided.reasons[0]).toContain(name);
    expect(decided.reasons[0]).toContain(`${citation.journal} ${citation.year}`);
    expect(decided.modelReasons).toEqual(model.reasons);
    expect(decided.predictedLogKPerSecond).toBeCloseTo(model.predictedLogKPerSecond!, 2);
  });

  it('overrules the model where they disagree (a long-lived Rh(III) value put on a labile Ni(II) model)', () => {
    const model = classifyFormula('[Ni(H2O)6]2+');
    expect(model.verdict).toBe('labile');
    const decided = decideByLibrary(model, pickDecidingMeasurement([entry('id', 'slow', '[Ni(H2O)6]2+', [water(RH_AQUA_K, laurenczy1991)])], 298.15)!);
    expect(decided.verdict).toBe('inert');
    expect(decided.modelVerdict).toBe('labile');
    expect(decided.reasons.join(' ')).not.toMatch(/prediction, not a measurement/);
  });

  it('moves a measurement to another temperature with Eyring and ΔS‡ = 0', () => {
    // Eyring (common practice) with ΔS‡ = 0: k = (kB T / h) exp(−ΔH‡/RT), so
    // k(T2) = (kB T2 / h) · (k1 h / (kB T1))^(T1/T2).
    const kB = 1.380649e-23;
    const h = 6.62607015e-34;
    const k2 = ((kB * 348.15) / h) * ((CR_AQUA_K * h) / (kB * 298.15)) ** (298.15 / 348.15);
    expect(logKMovedTo(CR_AQUA_K, 298.15, 348.15)).toBeCloseTo(Math.log10(k2), 6);
    const at75 = decideByLibrary(classifyFormula('[Cr(H2O)6]3+', { temperatureC: 75 }), { entryId: 'e', entryName: 'n', entryFormula: 'f', kind: 'water-exchange', kPerSecond: CR_AQUA_K, temperatureK: 298.15, citation: xu1985 });
    expect(at75.logKPerSecond).toBeCloseTo(Math.log10(k2), 2);
    expect(at75.reasons.join(' ')).toMatch(/Moved from 25 °C to 75 °C/);
  });

  it('the headline reads as product copy: entry, kind, k, temperature and a clean citation', () => {
    const text = libraryHeadline({ entryId: 'e', entryName: 'hexaaquarhodium(III)', entryFormula: '[Rh(H2O)6]3+', kind: 'water-exchange', kPerSecond: RH_AQUA_K, temperatureK: 298.15, citation: laurenczy1991 });
    expect(text).toBe('Measured in your group’s library: hexaaquarhodium(III), water exchange k = 2.2 × 10⁻⁹ s⁻¹ at 25 °C (G. Laurenczy, I. Rapaport, D. Zbinden, A. E. Merbach, Magn. Reson. Chem. 1991, 29, S45-S51)');
  });
});

describe('curators see a flag when measurement and model differ by more than two log units', () => {
  it('the published Cr(III) value sits within two log units of the model: no flag', () => {
    const model = classifyFormula('[Cr(H2O)6]3+');
    const gap = modelGapLogUnits(CR_AQUA_K, model.predictedLogKPerSecond!);
    expect(gap).toBeLessThanOrEqual(2);
    expect(needsSecondLook(gap)).toBe(false);
  });

  it('a unit slip (2.4 s⁻¹ typed for 2.4 × 10⁻⁶ s⁻¹) is flagged', () => {
    const model = classifyFormula('[Cr(H2O)6]3+');
    expect(needsSecondLook(modelGapLogUnits(2.4, model.predictedLogKPerSecond!))).toBe(true);
  });

  it('the threshold is strictly more than two log units', () => {
    expect(needsSecondLook(modelGapLogUnits(1e-4, -2))).toBe(false);
    expect(needsSecondLook(modelGapLogUnits(1e-5, -2))).toBe(true);
  });
});

describe('the half-life in the reasons reads as on the card', () => {
  it('k = 5.7e-6 s⁻¹ ([Co(NH3)5(OH2)]3+ water exchange, Hunt & Taube, J. Am. Chem. Soc. 1958, 80, 2642 — recalled): t½ = ln 2 / k ≈ 1.2e5 s ≈ 1.4 days', () => {
    const decided = decideByLibrary(classifyFormula('[Co(NH3)5(OH2)]3+'), { entryId: 'e', entryName: 'n', entryFormula: 'f', kind: 'water-exchange', kPerSecond: 5.7e-6, temperatureK: 298.15, citation: null });
    // 0.693 / 5.7e-6 = 121 600 s; / 86 400 = 1.41 d (the duration ladder writes days as "d").
    expect(decided.reasons.join(' ')).toMatch(/t½ ≈ 1\.4 d\b/);
  });
});
