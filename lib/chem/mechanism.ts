/**
 * How a ligand comes on or off: the Langford–Gray class of a substitution (C. H. Langford &
 * H. B. Gray, Ligand Substitution Processes, Benjamin, New York, 1965).
 *
 *   D   dissociative: the leaving group goes first, a lower-coordinate intermediate is found
 *   Id  dissociative interchange: one step, bond breaking leads
 *   I   interchange with neither leading
 *   Ia  associative interchange: one step, bond making leads
 *   A   associative: the entering group binds first, a higher-coordinate intermediate is found
 *
 * A published activation volume decides where there is one (data/activation-volumes.json);
 * otherwise the trend that applies to the ion and its ligands, said as such, with a confidence.
 */
import activationVolumeData from '@/data/activation-volumes.json';
import { assistedPaths, type AssistedPath } from './conjugate-base';
import type { Checked, Confidence, Geometry, LigandInstance } from './types';

export type MechanismClass = 'D' | 'Id' | 'I' | 'Ia' | 'A';

export interface Mechanism {
  class: MechanismClass;
  evidence: 'measured' | 'trend';
  /** ΔV‡ of solvent exchange (cm³ mol⁻¹), when measured for this species. */
  activationVolume?: number;
  /** ΔS‡ (J K⁻¹ mol⁻¹), when published beside ΔV‡. */
  activationEntropy?: number;
  /** The publication of the measured values. */
  source?: string;
  checked?: Checked;
  confidence: Confidence;
  /** The rate law that goes with the class. */
  rateLaw: string;
  /** The coordination number of the intermediate (A: n+1, D: n−1); null for interchange (no intermediate). */
  intermediateCoordination: number | null;
  reasons: string[];
  /** Base hydrolysis and acid-catalysed aquation, where they apply (Co(III) amines with a leaving group). */
  assistedPaths?: AssistedPath[];
}

export interface MechanismInput {
  metal: string;
  oxidationState: number;
  series: string;
  electronShell: 'd' | 'f' | 'sp';
  dElectrons: number;
  spinState: 'high' | 'low' | null;
  geometry: Geometry;
  coordinationNumber: number;
  ligands: readonly LigandInstance[];
  organometallic: boolean;
  valenceElectronCount: number | null;
}

interface ActivationVolumeRecord {
  species: string;
  metal: string;
  oxidationState: number;
  ligands: Record<string, number>;
  exchanging: string;
  dV: number;
  dS: number | null;
  source: string;
  checked: Checked;
}

const activationVolumes = activationVolumeData.records as unknown as ActivationVolumeRecord[];

const byIon = new Map<string, ActivationVolumeRecord[]>();
for (const record of activationVolumes) {
  const key = `${record.metal}/${record.oxidationState}`;
  byIon.set(key, [...(byIon.get(key) ?? []), record]);
}

function sameLigandSet(ligands: readonly LigandInstance[], counts: Record<string, number>): boolean {
  const ids = Object.keys(counts);
  if (ligands.length !== ids.length) return false;
  for (const instance of ligands) if (counts[instance.ligand.id] !== instance.count) return false;
  return true;
}

/** The measured activation volume of this very species, if published. */
export function measuredActivationVolume(metal: string, oxidationState: number, ligands: readonly LigandInstance[]): ActivationVolumeRecord | undefined {
  return byIon.get(`${metal}/${oxidationState}`)?.find((record) => sameLigandSet(ligands, record.ligands));
}

/** Every published activation volume (for the tests and the card's comparison). */
export const activationVolumeRecords: readonly ActivationVolumeRecord[] = activationVolumes;

/**
 * The class that an activation volume for solvent exchange points to. A limiting mechanism
 * changes the volume by roughly ±13.5 cm³ mol⁻¹, the volume of a bound water molecule (the
 * limits discussed by L. Helm & A. E. Merbach, Chem. Rev. 2005, 105, 1923); values within
 * 1 cm³ mol⁻¹ of zero show no lead of either bond (common practice).
 */
export function classFromActivationVolume(dV: number): MechanismClass {
  if (dV <= -13) return 'A';
  if (dV <= -1) return 'Ia';
  if (dV < 1) return 'I';
  if (dV < 13) return 'Id';
  return 'D';
}

const ORDER: readonly MechanismClass[] = ['D', 'Id', 'I', 'Ia', 'A'];

/** One step towards the dissociative end (steric crowding, a labilising hydroxo ligand). */
function towardsDissociative(mechanismClass: MechanismClass): MechanismClass {
  const index = ORDER.indexOf(mechanismClass);
  return ORDER[Math.max(0, index - 1)] as MechanismClass;
}

const CLASS_WORDS: Record<MechanismClass, string> = {
  D: 'dissociative (D)',
  Id: 'dissociative interchange (Id)',
  I: 'interchange (I)',
  Ia: 'associative interchange (Ia)',
  A: 'associative (A)',
};

const RATE_LAW: Record<MechanismClass, string> = {
  D: 'rate = k1[complex], independent of the entering ligand once it is in excess',
  Id: 'rate = K_os·k_i[complex][Y] / (1 + K_os[Y]): first order in Y at low [Y], saturating at high [Y]; k_i varies little with Y',
  I: 'rate = K_os·k_i[complex][Y] / (1 + K_os[Y]), saturating at high [Y]',
  Ia: 'rate = K_os·k_i[complex][Y] / (1 + K_os[Y]), with k_i depending on the entering ligand Y',
  A: 'rate = k2[complex][Y]',
};

const SQUARE_PLANAR_RATE_LAW = 'rate = (k1 + k2[Y])[complex]: k1 the solvent path (solvent enters first, then Y), k2 the direct attack of Y';

/** Ligands bulky enough to crowd the metal (cone angle ≥ 145° or equivalent; common practice). */
const BULKY = new Set(['PPh3', 'PCy3', 'PBu3', 'Cp*', 'IPr', 'IMes', 'CNtBu', 'P(OPh)3', 'tpp', 'PMePh2']);
const AMINES = new Set(['NH3', 'en', 'tn', 'pn', 'dien', 'trien', 'tren', 'MeNH2', 'cyclam', 'cyclen', 'tacn', 'dach']);

function intermediateFor(mechanismClass: MechanismClass, coordinationNumber: number): number | null {
  if (mechanismClass === 'A') return coordinationNumber + 1;
  if (mechanismClass === 'D') return coordinationNumber - 1;
  return null;
}

function classWords(mechanismClass: MechanismClass): string {
  return CLASS_WORDS[mechanismClass];
}

interface Trend {
  mechanismClass: MechanismClass;
  confidence: Confidence;
  reason: string;
}

/** The trend that applies when no activation volume has been published for the species. */
function trendFor(input: MechanismInput): Trend {
  const { metal, oxidationState, dElectrons, electronShell, geometry, coordinationNumber, ligands } = input;
  const ion = `${metal}(${roman(oxidationState)})`;
  if (geometry === 'square-planar' && electronShell === 'd' && dElectrons === 8) {
    return {
      mechanismClass: 'A',
      confidence: 'high',
      reason: `square-planar d8 ${ion}: the open axial site takes the entering ligand, through a five-coordinate intermediate (associative, A)`,
    };
  }
  if (input.organometallic && input.valenceElectronCount !== null) {
    if (input.valenceElectronCount >= 18) {
      return { mechanismClass: 'D', confidence: 'medium', reason: `${input.valenceElectronCount}-electron organometallic: no low-lying empty orbital takes an entering ligand, so a ligand leaves first (dissociative, D)` };
    }
    if (input.valenceElectronCount === 17) {
      return { mechanismClass: 'A', confidence: 'medium', reason: '17-electron organometallic radical: the half-filled orbital takes the entering ligand through a 19-electron intermediate, so substitution is associative (A) and fast' };
    }
    return { mechanismClass: 'A', confidence: 'low', reason: `${input.valenceElectronCount}-electron organometallic: below 18 electrons an entering ligand can bind first (associative, A)` };
  }
  const hasAmine = ligands.some((instance) => AMINES.has(instance.ligand.id));
  if (hasAmine && oxidationState === 3 && geometry === 'octahedral') {
    if (metal === 'Co') {
      return { mechanismClass: 'Id', confidence: 'high', reason: 'Co(III) amine: substitution is dissociatively activated (Id); the rate hardly depends on the entering ligand, and the leaving group sets it' };
    }
    if (metal === 'Cr' || metal === 'Rh' || metal === 'Ir') {
      return { mechanismClass: 'Ia', confidence: 'medium', reason: `${ion} amine: the larger or t2g-open ion lets the entering ligand share the activation, leaning associative (Ia)` };
    }
  }
  if (electronShell === 'f') {
    return coordinationNumber <= 8
      ? { mechanismClass: 'Ia', confidence: 'low', reason: `${ion} with ${coordinationNumber} donors: room for a ninth, so exchange leans associative (Ia), as for the eight-coordinate heavy lanthanide aqua ions` }
      : { mechanismClass: 'Id', confidence: 'low', reason: `${ion} with ${coordinationNumber} donors: crowded, so exchange leans dissociative (Id), as for the nine-coordinate light lanthanide aqua ions` };
  }
  if (geometry === 'tetrahedral' || geometry === 'linear' || geometry === 'trigonal-planar') {
    return { mechanismClass: 'A', confidence: 'low', reason: `${geometry} ${ion} with ${coordinationNumber} donors: low coordination leaves room for the entering ligand (associative, A), as for [Be(H2O)4]²⁺` };
  }
  if (geometry === 'octahedral') {
    const aquaTrend = aquaSeriesTrend(input, ion);
    if (aquaTrend) {
      const allWater = ligands.every((instance) => instance.ligand.id === 'H2O');
      return allWater ? aquaTrend : { ...aquaTrend, confidence: 'low', reason: `${aquaTrend.reason}; taken over from the aqua ions for this ligand set, so held with less confidence` };
    }
    if (electronShell === 'sp') {
      return { mechanismClass: 'Id', confidence: 'medium', reason: `main-group ${ion}, octahedral: no d electrons to steer the entering ligand; exchange on such ions (Mg²⁺, Al³⁺, Ga³⁺) is dissociatively activated (Id)` };
    }
    return { mechanismClass: 'Id', confidence: 'low', reason: `octahedral ${ion}: with no closer trend, six-coordinate substitution is taken as dissociatively activated (Id)` };
  }
  if (coordinationNumber >= 7) {
    return { mechanismClass: 'Id', confidence: 'low', reason: `${coordinationNumber}-coordinate ${ion}: crowded, so a ligand leaving leads (Id)` };
  }
  return { mechanismClass: 'I', confidence: 'low', reason: `${geometry} ${ion}: no trend applies closely; interchange (I) is the neutral assumption` };
}

/** The trends along the octahedral aqua ions (Helm & Merbach, Chem. Rev. 2005, 105, 1923). */
function aquaSeriesTrend(input: MechanismInput, ion: string): Trend | null {
  const { metal, oxidationState, series } = input;
  if (series === '3d') {
    const atomicOrder = ['Sc', 'Ti', 'V', 'Cr', 'Mn', 'Fe', 'Co', 'Ni', 'Cu', 'Zn'];
    const place = atomicOrder.indexOf(metal);
    if (oxidationState === 2 && place >= 0) {
      return place <= atomicOrder.indexOf('Mn')
        ? { mechanismClass: 'Ia', confidence: 'medium', reason: `along the 3d M²⁺ aqua series exchange changes from associative interchange (Ia) for the early ions (V²⁺, Mn²⁺) to dissociative interchange (Id) from Fe²⁺ on: ${ion} is on the early side` }
        : { mechanismClass: 'Id', confidence: 'medium', reason: `along the 3d M²⁺ aqua series exchange changes from associative interchange (Ia) for the early ions (V²⁺, Mn²⁺) to dissociative interchange (Id) from Fe²⁺ on: ${ion} is on the late side` };
    }
    if (oxidationState === 3 && place >= 0) {
      return place <= atomicOrder.indexOf('Fe')
        ? { mechanismClass: 'Ia', confidence: 'medium', reason: `3d M³⁺ ions from Ti³⁺ to Fe³⁺ exchange by associative interchange (Ia): small, highly charged and with room in t2g or a spherical d5 shell, ${ion} follows them` }
        : { mechanismClass: 'Id', confidence: 'low', reason: `late 3d M³⁺ ${ion}: filled t2g shields the metal from attack, so substitution leans dissociative (Id)` };
    }
  }
  if ((series === '4d' || series === '5d') && oxidationState >= 3) {
    return { mechanismClass: 'Ia', confidence: 'medium', reason: `${series} ${ion}: the larger ion leaves room for the entering ligand, so exchange leans associative (Ia), as on [Ru(H2O)6]³⁺, [Rh(H2O)6]³⁺ and [Ir(H2O)6]³⁺` };
  }
  if ((series === '4d' || series === '5d') && oxidationState === 2) {
    return { mechanismClass: 'I', confidence: 'low', reason: `${series} ${ion}: a lower charge on a larger ion; neither bond leads clearly (I), as on [Ru(H2O)6]²⁺` };
  }
  return null;
}

function roman(value: number): string {
  const numerals = ['0', 'I', 'II', 'III', 'IV', 'V', 'VI', 'VII', 'VIII'];
  return value < 0 ? `−${numerals[-value] ?? String(-value)}` : (numerals[value] ?? String(value));
}

function formatSigned(value: number): string {
  return `${value < 0 ? '−' : '+'}${Math.abs(value).toFixed(1)}`;
}

/** The mechanism class of a classified complex, with its evidence. */
export function mechanismFor(input: MechanismInput): Mechanism {
  const { metal, oxidationState, geometry, coordinationNumber, ligands } = input;
  const measured = measuredActivationVolume(metal, oxidationState, ligands);
  const reasons: string[] = [];
  let mechanismClass: MechanismClass;
  let confidence: Confidence;
  const squarePlanarD8 = geometry === 'square-planar' && input.electronShell === 'd' && input.dElectrons === 8;
  if (measured) {
    const fromVolume = classFromActivationVolume(measured.dV);
    // Square-planar d8: a negative volume with the two-term rate law and the five-coordinate
    // intermediate is the associative mechanism itself (Helm & Merbach, Chem. Rev. 2005, 105, 1923).
    mechanismClass = squarePlanarD8 && measured.dV < 0 ? 'A' : fromVolume;
    const nearBoundary = [-13, -1, 1, 13].some((edge) => Math.abs(measured.dV - edge) < 1);
    confidence = nearBoundary ? 'medium' : 'high';
    reasons.push(
      `ΔV‡ = ${formatSigned(measured.dV)} cm³ mol⁻¹ measured for ${measured.exchanging === 'H2O' ? 'water' : measured.exchanging} exchange on ${measured.species}` +
        `${measured.dS !== null ? `, ΔS‡ = ${formatSigned(measured.dS)} J K⁻¹ mol⁻¹` : ''} (${measured.source})`,
    );
    reasons.push(
      fromVolume === 'I'
        ? `an activation volume near zero: neither bond leads — ${classWords(mechanismClass)}`
        : measured.dV < 0
          ? `a negative activation volume: the transition state is more compact, the entering ligand is already bound — ${classWords(mechanismClass)}`
          : `a positive activation volume: the leaving ligand is on its way out in the transition state — ${classWords(mechanismClass)}`,
    );
    if (squarePlanarD8 && fromVolume !== 'A') reasons.push('square-planar d8: the volume goes with the two-term rate law and a five-coordinate intermediate, so the class is A');
  } else {
    const trend = trendFor(input);
    mechanismClass = trend.mechanismClass;
    confidence = trend.confidence;
    reasons.push(trend.reason);
    const crowded = ligands.filter((instance) => BULKY.has(instance.ligand.id)).reduce((sum, instance) => sum + instance.count, 0);
    if (crowded >= 2 && mechanismClass !== 'D' && !squarePlanarD8) {
      mechanismClass = towardsDissociative(mechanismClass);
      reasons.push(`steric crowding (${crowded} bulky ligands) hinders an entering ligand and helps one leave: one step towards dissociative, ${classWords(mechanismClass)}`);
    } else if (crowded >= 2 && squarePlanarD8) {
      reasons.push('bulky ligands crowd the axial sites: still associative, but slower, and very crowded complexes can turn dissociative');
    }
    const hydroxo = ligands.some((instance) => instance.ligand.id === 'OH');
    if (hydroxo && geometry === 'octahedral' && input.electronShell !== 'f' && (mechanismClass === 'Ia' || mechanismClass === 'I')) {
      mechanismClass = towardsDissociative(mechanismClass);
      reasons.push(`a hydroxo ligand pushes electron density onto the metal and labilises the others: one step towards dissociative, ${classWords(mechanismClass)} (as for [Fe(H2O)5(OH)]²⁺)`);
    }
    const aqua = byIon.get(`${metal}/${oxidationState}`)?.find((record) => Object.keys(record.ligands).length === 1 && record.exchanging in record.ligands);
    if (aqua) {
      const aquaClass = squarePlanarD8 && aqua.dV < 0 ? 'A' : classFromActivationVolume(aqua.dV);
      reasons.push(`for comparison, the solvated ion ${aqua.species} has ΔV‡ = ${formatSigned(aqua.dV)} cm³ mol⁻¹ (${aqua.source}): ${classWords(aquaClass)}`);
    }
    reasons.push('class from the trend that applies, not from a measurement on this species');
  }
  const rateLaw = squarePlanarD8 ? SQUARE_PLANAR_RATE_LAW : RATE_LAW[mechanismClass];
  const paths = assistedPaths(metal, oxidationState, ligands);
  return {
    class: mechanismClass,
    evidence: measured ? 'measured' : 'trend',
    ...(measured ? { activationVolume: measured.dV, source: measured.source, checked: measured.checked } : {}),
    ...(measured && measured.dS !== null ? { activationEntropy: measured.dS } : {}),
    confidence,
    rateLaw,
    intermediateCoordination: intermediateFor(mechanismClass, coordinationNumber),
    reasons,
    ...(paths.length > 0 ? { assistedPaths: paths } : {}),
  };
}
