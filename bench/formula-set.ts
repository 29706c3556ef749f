/**
 * Benchmark formulas, generated from the ligand catalogue (data/ligands.json) and the metal-ion
 * table (data/metal-ions.json) so the mix follows the data: salts, hydrates, carbonyls, cyanides,
 * ammines, chelates, 4d/5d ions, the f block and main-group ions. Every formula in a set is
 * distinct (the engine keeps a small memo; a repeated formula would measure the memo, not the
 * engine). Only formulas the parser accepts are kept. Deterministic: the same seed gives the same set.
 */
import ligandData from '@/data/ligands.json';
import metalIonData from '@/data/metal-ions.json';
import { parseFormula } from '@/lib/chem/formula-parser';

export type FormulaCategory =
  | 'aqua salt'
  | 'hydrate'
  | 'ammine'
  | 'mixed ammine/halide'
  | 'cyanide'
  | 'carbonyl'
  | 'chelate'
  | 'halide'
  | '4d/5d'
  | 'f block'
  | 'main group';

export interface BenchFormula {
  formula: string;
  category: FormulaCategory;
}

interface Ion {
  metal: string;
  oxidationState: number;
  series: string;
}

interface LigandInfo {
  id: string;
  charge: number;
  denticity: number;
}

const ligandById = new Map<string, LigandInfo>(
  (ligandData.ligands as LigandInfo[]).map((ligand) => [ligand.id, { id: ligand.id, charge: ligand.charge, denticity: ligand.denticity }]),
);

const seriesBySymbol = new Map<string, string>(
  (metalIonData.elements as { symbol: string; series: string }[]).map((element) => [element.symbol, element.series]),
);

const ions: readonly Ion[] = (metalIonData.ions as { element: string; oxidationState: number }[]).map((ion) => ({
  metal: ion.element,
  oxidationState: ion.oxidationState,
  series: seriesBySymbol.get(ion.element) ?? 'main',
}));

/** Small deterministic PRNG (mulberry32) so the set is the same on every run. */
export function seededRandom(seed: number): () => number {
  let state = seed >>> 0;
  return () => {
    state = (state + 0x6d2b79f5) >>> 0;
    let t = state;
    t = Math.imul(t ^ (t >>> 15), t | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
}

function shuffle<T>(items: T[], random: () => number): T[] {
  for (let index = items.length - 1; index > 0; index--) {
    const other = Math.floor(random() * (index + 1));
    const held = items[index] as T;
    items[index] = items[other] as T;
    items[other] = held;
  }
  return items;
}

// Halides and other one-letter-ish ligands are written bare, as chemists do; the rest in ( ).
const BARE = new Set(['F', 'Cl', 'Br', 'I', 'O', 'S', 'H']);
function writeLigand(id: string, count: number): string {
  const body = BARE.has(id) ? id : `(${id})`;
  return count === 1 ? body : `${body}${count}`;
}

type LigandSet = readonly (readonly [string, number])[];

function ligandCharge(set: LigandSet): number {
  let total = 0;
  for (const [id, count] of set) total += (ligandById.get(id)?.charge ?? 0) * count;
  return total;
}

const ANIONS_1 = ['Cl', 'Br', 'I', 'NO3', 'ClO4', 'BF4', 'PF6', 'OTf', 'BPh4'];
const ANIONS_2 = ['SO4', 'CO3', 'C2O4'];
const CATIONS_1 = ['K', 'Na', 'Li', 'Cs', 'NH4', 'NEt4', 'NBu4', 'PPh4'];
const CATIONS_2 = ['Ba', 'Ca', 'Mg'];

/** Every way of writing the complex as a salt (or a written charge), as formula strings. */
function salts(inner: string, charge: number): string[] {
  if (charge === 0) return [inner];
  const magnitude = Math.abs(charge);
  const written = `${inner}${magnitude === 1 ? '' : magnitude}${charge > 0 ? '+' : '-'}`;
  const out: string[] = [written];
  // Element-like ions take a bare count (Cl2, K3); polyatomic ions are bracketed ((NO3)2).
  const multi = (ion: string, n: number) => (n === 1 ? ion : /^[A-Z][a-z]?$/.test(ion) ? `${ion}${n}` : `(${ion})${n}`);
  if (charge > 0) {
    for (const anion of ANIONS_1) out.push(`${inner}${multi(anion, magnitude)}`);
    if (magnitude % 2 === 0) for (const anion of ANIONS_2) out.push(`${inner}${multi(anion, magnitude / 2)}`);
    if (magnitude === 3) out.push(`${inner}2(SO4)3`);
  } else {
    for (const cation of CATIONS_1) out.push(`${multi(cation, magnitude)}${inner}`);
    if (magnitude % 2 === 0) for (const cation of CATIONS_2) out.push(`${multi(cation, magnitude / 2)}${inner}`);
  }
  return out;
}

function withHydrates(formula: string, waters: readonly number[]): string[] {
  return waters.map((n) => `${formula}·${n === 1 ? '' : n}H2O`);
}

interface Template {
  category: FormulaCategory;
  applies(ion: Ion): boolean;
  sets(ion: Ion): LigandSet[];
  hydrates?: readonly number[];
}

const isD = (ion: Ion) => ion.series === '3d' || ion.series === '4d' || ion.series === '5d';
const isHeavy = (ion: Ion) => ion.series === '4d' || ion.series === '5d';
const isF = (ion: Ion) => ion.series === '4f' || ion.series === '5f';
const MONODENTATE_PAIRS: readonly (readonly [string, string])[] = [
  ['NH3', 'Cl'], ['NH3', 'Br'], ['NH3', 'H2O'], ['NH3', 'NO2'], ['NH3', 'NCS'], ['NH3', 'OH'],
  ['H2O', 'Cl'], ['H2O', 'F'], ['H2O', 'OH'], ['py', 'Cl'], ['NH3', 'N3'], ['H2O', 'Br'],
  ['dmso', 'Cl'], ['NCMe', 'Cl'], ['py', 'H2O'], ['NH3', 'I'],
];

const TEMPLATES: readonly Template[] = [
  { category: 'aqua salt', applies: (ion) => !isF(ion), sets: () => [[['H2O', 6]], [['H2O', 4]]] },
  { category: 'hydrate', applies: (ion) => isD(ion) && ion.oxidationState >= 2 && ion.oxidationState <= 3, sets: () => [[['H2O', 6]]], hydrates: [1, 2, 3, 4, 6] },
  { category: 'ammine', applies: (ion) => isD(ion) && ion.oxidationState >= 1 && ion.oxidationState <= 4, sets: () => [[['NH3', 6]], [['NH3', 4]], [['NH3', 2]]] },
  {
    category: 'mixed ammine/halide',
    applies: (ion) => isD(ion) && ion.oxidationState >= 2 && ion.oxidationState <= 4,
    sets: () => MONODENTATE_PAIRS.flatMap(([a, b]) => [1, 2, 3, 4, 5].map((n): LigandSet => [[a, 6 - n], [b, n]])),
  },
  {
    category: 'cyanide',
    applies: (ion) => isD(ion) && ion.oxidationState >= 0 && ion.oxidationState <= 4,
    sets: () => [[['CN', 6]], [['CN', 4]], [['CN', 5], ['NO', 1]], [['CN', 5], ['NH3', 1]], [['CN', 5], ['H2O', 1]], [['CN', 2]], [['CN', 8]]],
  },
  {
    category: 'carbonyl',
    applies: (ion) => isD(ion) && ion.oxidationState <= 1,
    sets: () => [
      [['CO', 6]], [['CO', 5]], [['CO', 4]], [['CO', 5], ['Cl', 1]], [['CO', 5], ['Br', 1]], [['CO', 5], ['Me', 1]],
      [['CO', 4], ['PPh3', 2]], [['CO', 3], ['PPh3', 3]], [['CO', 5], ['PPh3', 1]], [['CO', 3], ['Cp', 1]], [['CO', 2], ['Cp', 1]],
      [['CO', 4], ['PMe3', 1]], [['CO', 3], ['PMe3', 2]], [['CO', 1], ['Cl', 1], ['PPh3', 2]],
    ],
  },
  {
    category: 'chelate',
    applies: (ion) => isD(ion) && ion.oxidationState >= 2 && ion.oxidationState <= 4,
    sets: () => [
      [['en', 3]], [['bpy', 3]], [['phen', 3]], [['ox', 3]], [['acac', 3]], [['gly', 3]], [['terpy', 2]], [['edta', 1]],
      [['en', 2], ['Cl', 2]], [['en', 2], ['NO2', 2]], [['en', 2], ['H2O', 2]], [['en', 2], ['NH3', 1], ['Cl', 1]],
      [['bpy', 2], ['Cl', 2]], [['phen', 2], ['Cl', 2]], [['ox', 2], ['H2O', 2]], [['acac', 2], ['H2O', 2]],
      [['dien', 2]], [['tren', 1], ['Cl', 2]], [['terpy', 1], ['Cl', 3]], [['edta', 1], ['H2O', 1]],
      [['bpy', 1], ['Cl', 2]], [['en', 1], ['Cl', 2]], [['en', 1]], [['ox', 2]],
    ],
  },
  {
    category: 'halide',
    applies: (ion) => isD(ion) && ion.oxidationState >= 1,
    sets: () => (['F', 'Cl', 'Br', 'I'] as const).flatMap((x) => [[[x, 6]], [[x, 4]], [[x, 5], ['H2O', 1]]] as LigandSet[]),
  },
  {
    category: '4d/5d',
    applies: (ion) => isHeavy(ion),
    sets: () => [
      [['PPh3', 2], ['Cl', 2]], [['PPh3', 3], ['Cl', 1]], [['py', 4], ['Cl', 2]], [['NH3', 4], ['Cl', 2]], [['NH3', 2], ['Cl', 2]],
      [['dmso', 4], ['Cl', 2]], [['NH3', 5], ['Cl', 1]], [['bpy', 2], ['NCS', 2]], [['NH3', 3], ['Cl', 3]], [['H2O', 2], ['Cl', 4]],
      [['NCMe', 4], ['Cl', 2]], [['SCN', 4]], [['PMe3', 4]], [['H', 1], ['CO', 1], ['PPh3', 3]],
    ],
  },
  {
    category: 'f block',
    applies: (ion) => isF(ion),
    sets: () => [
      [['H2O', 9]], [['H2O', 8]], [['H2O', 7]], [['edta', 1], ['H2O', 2]], [['edta', 1], ['H2O', 3]], [['dmso', 8]], [['H2O', 6], ['Cl', 2]],
      [['NO3', 3], ['H2O', 4]], [['acac', 3], ['H2O', 2]], [['ox', 3], ['H2O', 2]], [['Cl', 6]], [['phen', 2], ['NO3', 3]], [['terpy', 3]],
      [['dmf', 8]], [['H2O', 5], ['Cl', 3]],
    ],
    hydrates: [1, 2, 4],
  },
  {
    category: 'main group',
    applies: (ion) => ion.series === 'main',
    sets: () => [
      [['H2O', 6]], [['H2O', 4]], [['F', 6]], [['Cl', 6]], [['Cl', 4]], [['Br', 4]], [['OH', 4]], [['OH', 6]], [['edta', 1]],
      [['ox', 3]], [['acac', 3]], [['en', 3]], [['NH3', 4]], [['dmso', 6]], [['H2O', 5], ['Cl', 1]], [['I', 4]], [['CN', 2]], [['NH3', 2]],
    ],
    hydrates: [1, 2, 6],
  },
];

function complexInner(metal: string, set: LigandSet): string {
  return `[${metal}${set.map(([id, count]) => writeLigand(id, count)).join('')}]`;
}

function isParsable(formula: string): boolean {
  try {
    parseFormula(formula);
    return true;
  } catch {
    return false;
  }
}

let cachedPool: Map<FormulaCategory, string[]> | null = null;

/** Every distinct parsable formula the templates give, grouped by category (built once). */
export function formulaPool(): ReadonlyMap<FormulaCategory, readonly string[]> {
  if (cachedPool) return cachedPool;
  const pool = new Map<FormulaCategory, string[]>();
  const seen = new Set<string>();
  for (const template of TEMPLATES) {
    const list = pool.get(template.category) ?? [];
    pool.set(template.category, list);
    for (const ion of ions) {
      if (!template.applies(ion)) continue;
      for (const set of template.sets(ion)) {
        if (!set.every(([id]) => ligandById.has(id))) continue;
        const inner = complexInner(ion.metal, set);
        const charge = ion.oxidationState + ligandCharge(set);
        const written = salts(inner, charge);
        // Hydrates only of salts: a water of crystallisation after a bare written charge is not a solid.
        const saltsOnly = charge === 0 ? written : written.slice(1);
        const variants = template.hydrates ? [...written, ...saltsOnly.flatMap((salt) => withHydrates(salt, template.hydrates ?? []))] : written;
        for (const formula of variants) {
          if (seen.has(formula)) continue;
          seen.add(formula);
          if (isParsable(formula)) list.push(formula);
        }
      }
    }
  }
  cachedPool = pool;
  return pool;
}

/**
 * `blocks` × `blockSize` distinct formulas in blocks with the same category mix (as even as the
 * pool allows: a small category gives what it has and the others fill up), each block shuffled.
 * Timed runs use one block each, so every run measures the same mix.
 */
export function distinctBlocks(blocks: number, blockSize: number, seed = 20261210): BenchFormula[][] {
  const random = seededRandom(seed);
  const queues = [...formulaPool()].map(([category, list]) => ({ category, items: shuffle([...list], random), quota: 0 }));
  let remaining = blockSize;
  let open = queues.filter((queue) => queue.items.length >= blocks);
  while (remaining > 0 && open.length > 0) {
    const share = Math.max(1, Math.floor(remaining / open.length));
    for (const queue of open) {
      const room = Math.floor(queue.items.length / blocks) - queue.quota;
      const take = Math.min(share, room, remaining);
      queue.quota += take;
      remaining -= take;
    }
    open = open.filter((queue) => Math.floor(queue.items.length / blocks) > queue.quota);
  }
  if (remaining > 0) throw new Error(`The pool cannot give ${blocks} blocks of ${blockSize} distinct formulas.`);
  const out: BenchFormula[][] = [];
  for (let block = 0; block < blocks; block++) {
    const entries: BenchFormula[] = [];
    for (const queue of queues) {
      for (let index = 0; index < queue.quota; index++) {
        entries.push({ formula: queue.items[block * queue.quota + index] as string, category: queue.category });
      }
    }
    out.push(shuffle(entries, random));
  }
  return out;
}

/** `count` distinct formulas with the mix of distinctBlocks. */
export function distinctFormulas(count: number, seed = 20261210): BenchFormula[] {
  return distinctBlocks(1, count, seed)[0] ?? [];
}

/**
 * A realistic repeating batch: `size` requests drawn from `distinctCount` common formulas with a
 * Zipf-like popularity (a few textbook complexes asked for again and again, a long tail).
 */
export function repeatingBatch(size: number, distinctCount: number, seed = 7): string[] {
  const random = seededRandom(seed);
  const common = distinctFormulas(distinctCount, seed + 1).map((entry) => entry.formula);
  const weights = common.map((_, rank) => 1 / (rank + 1));
  const total = weights.reduce((sum, weight) => sum + weight, 0);
  const batch: string[] = [];
  for (let index = 0; index < size; index++) {
    let pick = random() * total;
    let chosen = common.length - 1;
    for (let rank = 0; rank < weights.length; rank++) {
      pick -= weights[rank] ?? 0;
      if (pick <= 0) {
        chosen = rank;
        break;
      }
    }
    batch.push(common[chosen] ?? '');
  }
  return batch;
}
