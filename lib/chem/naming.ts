/**
 * A name suggested from the formula: the additive name of the coordination entity, in the style of
 * IUPAC Nomenclature of Inorganic Chemistry (Recommendations 2005, chapter IR-9), e.g.
 * "[Co(NH3)5Cl]2+" → "pentaamminechloridocobalt(III)", "[PtCl4]2-" → "tetrachloridoplatinate(II)".
 *
 * The rules applied (IR-9.2.2): ligand names in alphabetical order, multiplicative prefixes
 * ignored; di/tri/tetra… for simple ligand names, bis/tris/tetrakis… with the name in parentheses
 * for names that are complex (organic, neutral other than aqua/ammine/carbonyl, or containing
 * locants, numerals or spaces); the central atom's name, with "-ate" (and the Latin stems for
 * iron, copper, silver, gold, lead and tin) when the entity is an anion; the oxidation state in
 * Roman numerals. No vowel is elided (hexaaqua, tetraammine).
 *
 * Only what can be named with confidence is named: a ligand outside the table below, a
 * µ-bridged or organometallic species, a salt read as another species, or an element without an
 * "-ate" form known here gives null — no suggestion rather than a wrong one.
 */
import { parseFormula, type ParsedComplex } from './formula-parser';
import { elementRecord } from './elements';
import { FormulaError } from './types';

/**
 * Ligand catalogue ids (data/ligands.json) → the ligand name used in additive names.
 * Most are the catalogue's own names; a few catalogue names carry notes in parentheses or an older
 * spelling, and are given here as IR-9 and its Table VII write them (cyanido-κN for N-bound
 * cyanide, nitrito-κN for nitro, the "-phosphane" names of phosphines). Ligands whose name needs
 * η, κ or a charge choice the catalogue cannot settle (NO, Cp, alkenes, dmso) are left out.
 */
const LIGAND_NAMES: Readonly<Record<string, string>> = {
  H2O: 'aqua',
  NH3: 'ammine',
  CO: 'carbonyl',
  OH: 'hydroxido',
  O: 'oxido',
  F: 'fluorido',
  Cl: 'chlorido',
  Br: 'bromido',
  I: 'iodido',
  H: 'hydrido',
  S: 'sulfido',
  N: 'nitrido',
  CN: 'cyanido',
  NC: 'cyanido-κN',
  NCS: 'thiocyanato-κN',
  SCN: 'thiocyanato-κS',
  NCSe: 'selenocyanato-κN',
  N3: 'azido',
  NO2: 'nitrito-κN',
  ONO: 'nitrito-κO',
  NO3: 'nitrato',
  SO4: 'sulfato',
  CO3: 'carbonato',
  ox: 'oxalato',
  mal: 'malonato',
  OAc: 'acetato',
  HCO2: 'formato',
  gly: 'glycinato',
  acac: 'acetylacetonato',
  edta: 'ethylenediaminetetraacetato',
  en: 'ethane-1,2-diamine',
  pn: 'propane-1,2-diamine',
  tn: 'propane-1,3-diamine',
  bpy: '2,2′-bipyridine',
  phen: '1,10-phenanthroline',
  terpy: '2,2′:6′,2″-terpyridine',
  py: 'pyridine',
  pz: 'pyrazine',
  NCMe: 'acetonitrile',
  dmf: 'N,N-dimethylformamide',
  MeNH2: 'methanamine',
  PPh3: 'triphenylphosphane',
  PMe3: 'trimethylphosphane',
  PEt3: 'triethylphosphane',
  N2: 'dinitrogen',
};

/**
 * Ligand names that take di/tri/tetra… without enclosing marks: the simple inorganic anion names
 * and aqua, ammine, carbonyl (IR-9.2.2.3). Every other name (organic ligands such as oxalato or
 * pyridine, names with locants or κ) is enclosed in parentheses and takes bis/tris/tetrakis….
 */
const SIMPLE_NAMES = new Set([
  'aqua', 'ammine', 'carbonyl', 'hydroxido', 'oxido', 'fluorido', 'chlorido', 'bromido', 'iodido', 'hydrido', 'sulfido', 'nitrido',
  'cyanido', 'azido', 'nitrato', 'sulfato', 'carbonato',
]);
const isSimpleName = (name: string) => SIMPLE_NAMES.has(name);

const SIMPLE_PREFIXES = ['', '', 'di', 'tri', 'tetra', 'penta', 'hexa', 'hepta', 'octa', 'nona', 'deca', 'undeca', 'dodeca'];
const COMPLEX_PREFIXES = ['', '', 'bis', 'tris', 'tetrakis', 'pentakis', 'hexakis', 'heptakis', 'octakis', 'nonakis', 'decakis'];

/** Sort key: the ligand name itself, without locants, primes, italic element locants (N,N-) and κ terms. */
function alphabeticalKey(name: string): string {
  return name
    .replace(/-κ[A-Z][a-z]?/g, '')
    .replace(/^([0-9,'′″]+-|[A-Z](,[A-Z])*-)+/, '')
    .replace(/[^a-z]/g, '');
}

/**
 * The "-ate" names that do not follow from "-ium"/"-um" → "-ate": the Latin stems (iron, copper,
 * silver, gold, lead, tin) and the other metals named here (IR-9.2.2.2; Table X of the 2005
 * recommendations).
 */
const ANION_NAMES: Readonly<Record<string, string>> = {
  Fe: 'ferrate',
  Cu: 'cuprate',
  Ag: 'argentate',
  Au: 'aurate',
  Pb: 'plumbate',
  Sn: 'stannate',
  Co: 'cobaltate',
  Ni: 'nickelate',
  Zn: 'zincate',
  Mn: 'manganate',
  Mo: 'molybdate',
  Hg: 'mercurate',
  Bi: 'bismuthate',
};

/** The central atom's name in an anionic entity: cobaltate, platinate, ferrate, … (null when not known here, e.g. tungsten). */
export function anionicMetalName(symbol: string): string | null {
  const known = ANION_NAMES[symbol];
  if (known) return known;
  const name = elementRecord(symbol)?.name.toLowerCase();
  if (!name || symbol === 'W') return null;
  return /(ium|um)$/.test(name) ? name.replace(/(ium|um)$/, 'ate') : null;
}

/** 3 → "III", 0 → "0", −1 → "−I" (IR-9.2.2.4; common practice for numbers above 8). */
export function romanNumeral(value: number): string {
  if (value === 0) return '0';
  const sign = value < 0 ? '−' : '';
  let rest = Math.abs(value);
  let out = '';
  for (const [n, r] of [[10, 'X'], [9, 'IX'], [5, 'V'], [4, 'IV'], [1, 'I']] as const) {
    while (rest >= n) {
      out += r;
      rest -= n;
    }
  }
  return sign + out;
}

/** The additive name of a parsed complex's coordination entity, or null when it cannot be named with confidence. */
export function additiveName(parsed: ParsedComplex): string | null {
  if (parsed.centres && parsed.centres.length > 0) return null;
  if (parsed.complexCount !== 1) return null;
  if ((parsed.readings ?? []).some((r) => r.kind !== 'name')) return null;
  const counts = new Map<string, number>();
  for (const instance of parsed.ligands) counts.set(instance.ligand.id, (counts.get(instance.ligand.id) ?? 0) + instance.count);
  if (counts.size === 0) return null;
  const parts: { key: string; text: string }[] = [];
  for (const [id, count] of counts) {
    const name = LIGAND_NAMES[id];
    if (!name) return null;
    const simple = isSimpleName(name);
    const prefix = (simple ? SIMPLE_PREFIXES : COMPLEX_PREFIXES)[count];
    if (prefix === undefined) return null;
    const text = simple ? `${prefix}${name}` : count === 1 ? `(${name})` : `${prefix}(${name})`;
    parts.push({ key: alphabeticalKey(name), text });
  }
  parts.sort((a, b) => (a.key < b.key ? -1 : a.key > b.key ? 1 : 0));
  const metal = parsed.complexCharge < 0 ? anionicMetalName(parsed.metal) : (elementRecord(parsed.metal)?.name.toLowerCase() ?? null);
  if (!metal) return null;
  return `${parts.map((p) => p.text).join('')}${metal}(${romanNumeral(parsed.oxidationState)})`;
}

/** Stereodescriptors written before the formula carry over to the name (cis-, trans-, fac-, mer-). */
const STEREO = /^\s*(cis|trans|fac|mer)-/i;

/**
 * The name suggested for a formula as typed, or null (not a formula the engine reads, or not one
 * this module names with confidence).
 */
export function suggestedName(formula: string): string | null {
  const text = formula.trim();
  if (text === '') return null;
  let parsed: ParsedComplex;
  try {
    parsed = parseFormula(text);
  } catch (error) {
    if (error instanceof FormulaError) return null;
    throw error;
  }
  const name = additiveName(parsed);
  if (!name) return null;
  const stereo = STEREO.exec(text)?.[1]?.toLowerCase();
  return stereo ? `${stereo}-${name}` : name;
}
