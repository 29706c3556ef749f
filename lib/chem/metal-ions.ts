/**
 * Metal elements and metal ions: periodic position, Jørgensen g, Racah B, pairing energies,
 * aqua-ion Δo and Shannon radii (data/metal-ions.json, each record cites its source).
 */
import metalIonData from '@/data/metal-ions.json';

export type MetalSeries = '3d' | '4d' | '5d' | '4f' | '5f' | 'main';

export interface MetalElement {
  symbol: string;
  atomicNumber: number;
  /** IUPAC group 1–18; null for the f series (La–Lu, Ac–Am counted with the f series here). */
  group: number | null;
  period: number;
  block: string;
  series: MetalSeries;
  source: string;
}

export interface MetalIon {
  element: string;
  oxidationState: number;
  ionicRadiusPm: number | null;
  ionicRadiusHighSpinPm: number | null;
  ionicRadiusLowSpinPm: number | null;
  radiusSource: string | null;
  /** Jørgensen g in 10³ cm⁻¹. */
  jorgensenG: number | null;
  jorgensenGReliable: boolean | null;
  gSource: string | null;
  aquaDeltaOcm: number | null;
  aquaDeltaSource: string | null;
  racahBcm: number | null;
  racahSource: string | null;
  pairingEnergyCm: number | null;
  pairingSource: string | null;
  source: string;
}

const metalElements: readonly MetalElement[] = metalIonData.elements as MetalElement[];
const metalIons: readonly MetalIon[] = metalIonData.ions;

const elementBySymbol: ReadonlyMap<string, MetalElement> = new Map(
  metalElements.map((element) => [element.symbol, element]),
);
// element → oxidation state → ion: looked up without building a "Co/3" key string per call.
const ionsByElement: ReadonlyMap<string, ReadonlyMap<number, MetalIon>> = (() => {
  const byElement = new Map<string, Map<number, MetalIon>>();
  for (const ion of metalIons) {
    const states = byElement.get(ion.element) ?? new Map<number, MetalIon>();
    states.set(ion.oxidationState, ion);
    byElement.set(ion.element, states);
  }
  return byElement;
})();

export function metalElement(symbol: string): MetalElement | undefined {
  return elementBySymbol.get(symbol);
}

export function isMetalSymbol(symbol: string): boolean {
  return elementBySymbol.has(symbol);
}

export function metalIon(symbol: string, oxidationState: number): MetalIon | undefined {
  return ionsByElement.get(symbol)?.get(oxidationState);
}

// Highest oxidation states known in compounds (Greenwood & Earnshaw, Chemistry of the Elements,
// 2nd ed., 1997; recalled). The group number alone would allow e.g. Co(IX).
const MAXIMUM_OXIDATION_STATE: Record<string, number> = {
  Sc: 3, Ti: 4, V: 5, Cr: 6, Mn: 7, Fe: 6, Co: 5, Ni: 4, Cu: 4, Zn: 2,
  Y: 3, Zr: 4, Nb: 5, Mo: 6, Tc: 7, Ru: 8, Rh: 6, Pd: 4, Ag: 3, Cd: 2,
  Hf: 4, Ta: 5, W: 6, Re: 7, Os: 8, Ir: 9, Pt: 6, Au: 5, Hg: 2,
};

export interface ElectronConfiguration {
  dElectrons: number;
  fElectrons: number;
  electronShell: 'd' | 'f' | 'sp';
}

/**
 * Electron count of the ion (common practice, documented convention):
 * - d block (groups 3–12): d = group − oxidation state (so Mn(−I) in [Mn(CO)5]⁻ is d8, Zn²⁺ d10);
 * - f series: dElectrons 0, fElectrons = Z − 54 − ox (Ln) or Z − 86 − ox (An);
 * - main group: d10 when a filled (n−1)d shell lies under the valence shell (Ga³⁺, In³⁺, Sn⁴⁺,
 *   Tl³⁺, Pb²⁺…, i.e. period ≥ 4 in groups 13–16), else 0 (alkali, Be, Mg, Ca, Al).
 * Returns null when the count is impossible (oxidation state beyond the valence electrons).
 */
export function electronConfiguration(
  element: MetalElement,
  oxidationState: number,
): ElectronConfiguration | null {
  if (element.series === '4f' || element.series === '5f') {
    const core = element.series === '4f' ? 54 : 86;
    const fElectrons = element.atomicNumber - core - oxidationState;
    if (fElectrons < 0 || fElectrons > 14) return null;
    return { dElectrons: 0, fElectrons, electronShell: 'f' };
  }
  const group = element.group ?? 0;
  if (element.series !== 'main') {
    const maximum = MAXIMUM_OXIDATION_STATE[element.symbol];
    if (maximum !== undefined && oxidationState > maximum) return null;
    const dElectrons = group - oxidationState;
    if (dElectrons < 0 || dElectrons > 10) return null;
    return { dElectrons, fElectrons: 0, electronShell: 'd' };
  }
  // Main group: valence electrons = group (1, 2) or group − 10 (13–18).
  const valence = group <= 2 ? group : group - 10;
  if (oxidationState > valence || oxidationState < 0) return null;
  const hasFilledDShell = group >= 13 && element.period >= 4;
  return { dElectrons: hasFilledDShell ? 10 : 0, fElectrons: 0, electronShell: 'sp' };
}

/** "Co(III)", "Mn(−I)", "Ni(0)". */
export function ionLabel(symbol: string, oxidationState: number): string {
  return `${symbol}(${romanNumeral(oxidationState)})`;
}

const ROMAN = ['0', 'I', 'II', 'III', 'IV', 'V', 'VI', 'VII', 'VIII', 'IX'];
export function romanNumeral(value: number): string {
  const magnitude = Math.abs(value);
  const text = ROMAN[magnitude] ?? String(magnitude);
  return value < 0 ? `−${text}` : text;
}

const ROUGH_RADIUS_BY_CHARGE_PM: Readonly<Record<number, number>> = { 1: 100, 2: 78, 3: 65, 4: 60, 5: 56, 6: 52 };

/**
 * Effective ionic radius (pm) for the charge-density term. Shannon (1976) CN6 where tabulated,
 * spin-specific where Shannon gives both; otherwise a rough estimate by series and charge
 * (flagged by `estimated`).
 */
export function ionicRadiusPm(
  element: MetalElement,
  oxidationState: number,
  spinState: 'high' | 'low' | null,
  // The caller's own metalIon(element.symbol, oxidationState), when it has one: no second look-up.
  ion: MetalIon | undefined = ionsByElement.get(element.symbol)?.get(oxidationState),
): { radiusPm: number; estimated: boolean } {
  if (ion) {
    const bySpin = spinState === 'low' ? ion.ionicRadiusLowSpinPm : ion.ionicRadiusHighSpinPm;
    const radius = bySpin ?? ion.ionicRadiusPm ?? ion.ionicRadiusHighSpinPm ?? ion.ionicRadiusLowSpinPm;
    if (radius !== null) return { radiusPm: radius, estimated: false };
  }
  if (element.series === '4f' && oxidationState === 3) {
    // Lanthanide contraction, rough: La³⁺ 103 pm falling ~1.2 pm per element (Shannon trend).
    return { radiusPm: 103.2 - 1.2 * (element.atomicNumber - 57), estimated: true };
  }
  const charge = Math.max(1, Math.min(oxidationState, 6));
  const base = ROUGH_RADIUS_BY_CHARGE_PM[charge] ?? 60;
  const rowAdd = element.series === '4d' || element.series === '5d' ? 5 : element.series === '5f' ? 25 : 0;
  return { radiusPm: base + rowAdd, estimated: true };
}
