/**
 * Safety cautions for a parsed formula. Short, specific and always deferring to the people and
 * documents that actually govern lab safety.
 */
import type { ParsedFormula } from './types';

const DEFER = " Follow the institution's safety office, the supplier's safety data sheet and local regulations.";
const DEFER_RADIATION = " Work with radioactive material only under the institution's radiation protection rules: consult the radiation safety officer first, and follow the safety office, the supplier's safety data sheet and local regulations.";

const withDeferral = (text: string): string => `${text}${DEFER}`;
const withRadiationDeferral = (text: string): string => `${text}${DEFER_RADIATION}`;

const PERCHLORATE_ORGANIC = withDeferral('Perchlorate salt with organic ligands: potentially explosive, especially when dry, heated or scraped; prepare small amounts only and prefer a non-oxidising anion (PF6⁻, BF4⁻, triflate).');
const PERCHLORATE = withDeferral('Perchlorate salt: strong oxidiser; keep away from organic material and do not heat the dry solid.');
const PERCHLORATE_AMINE = withDeferral('Perchlorate salt of an ammine or amine complex: fuel and oxidiser in one solid, potentially explosive when dry, heated, ground or scraped; prepare small amounts only, never dry it in an oven, and prefer a non-oxidising anion (PF6⁻, BF4⁻, triflate, chloride).');
const VOLATILE_CARBONYL = withDeferral('Volatile metal carbonyl: extremely toxic by inhalation and readily absorbed, with delayed lung injury; it also releases carbon monoxide. Handle only in a closed system or a fume hood, never on the open bench.');
const NICKEL_CARBONYL = withDeferral('Ni(CO)4 is a volatile liquid (boiling point about 43 °C) and one of the most toxic substances met in a laboratory: work only in a closed system inside a fume hood with a carbon monoxide monitor, and have an exposure plan in place before starting.');
const IRON_PENTACARBONYL = withDeferral('Fe(CO)5 is a volatile, toxic and flammable liquid that gives off carbon monoxide and can ignite in air when finely dispersed: closed system or fume hood only.');
const CYTOTOXIC_PLATINUM = withDeferral('Platinum amine complexes of the cisplatin family are cytotoxic, mutagenic and probably carcinogenic: handle them as cytotoxic drugs (designated area, double gloves, no dust, cytotoxic waste stream).');
const CYTOTOXIC_METALLODRUG = withDeferral('This metal complex belongs to a family of cytotoxic metallodrugs: handle it as a cytotoxic compound (designated area, gloves, no dust, cytotoxic waste stream).');
const RADIOLABEL_CHELATE = withRadiationDeferral('Chelates of this kind carry medical radiometals (⁶⁸Ga, ⁶⁴Cu, ⁹⁰Y, ¹¹¹In, ¹⁷⁷Lu, ²²⁵Ac…): if the metal is a radioisotope, radiation rules apply.');
// metal → oxidation state → caution (nested maps: no "Cr/2" key string per formula).
const AIR_SENSITIVE_REDUCTANT: ReadonlyMap<string, ReadonlyMap<number, string>> = new Map([
  ['Cr', new Map([[2, withDeferral('Cr(II) is a strong reductant and very air-sensitive: handle under nitrogen or argon.')]])],
  ['V', new Map([[2, withDeferral('V(II) is a strong reductant and air-sensitive: handle under an inert atmosphere.')]])],
  ['Ti', new Map([[3, withDeferral('Ti(III) is air-sensitive: handle under an inert atmosphere.')]])],
  ['Eu', new Map([[2, withDeferral('Eu(II) is air-sensitive: handle under an inert atmosphere.')]])],
  ['U', new Map([[3, withDeferral('U(III) is air-sensitive and uranium is radioactive and toxic.')]])],
]);
const METAL_HAZARD: Record<string, string> = {
  Co: withDeferral('Cobalt compounds are skin and respiratory sensitisers and suspected carcinogens: avoid dust and skin contact.'),
  Ni: withDeferral('Nickel compounds are skin sensitisers and carcinogenic by inhalation: avoid dust and skin contact.'),
  Pt: withDeferral('Platinum salts (especially chloroplatinates) are potent respiratory sensitisers.'),
  Pd: withDeferral('Palladium salts can sensitise skin.'),
  Hg: withDeferral('Mercury compounds are highly toxic (absorbed through skin, volatile): use closed handling and collect all waste.'),
  Cd: withDeferral('Cadmium compounds are toxic and carcinogenic.'),
  Tl: withDeferral('Thallium compounds are extremely toxic and absorbed through the skin.'),
  Pb: withDeferral('Lead compounds are toxic (reproductive toxicant).'),
  As: withDeferral('Arsenic compounds are toxic and carcinogenic.'),
  Be: withDeferral('Beryllium compounds are toxic and carcinogenic, especially as dust.'),
  Ba: withDeferral('Soluble barium salts are toxic if swallowed.'),
  U: withRadiationDeferral('Uranium compounds are radioactive and chemically toxic.'),
  Th: withRadiationDeferral('Thorium compounds are radioactive.'),
  Tc: withRadiationDeferral('Technetium has no stable isotope: radioactive material rules apply.'),
  Pu: withRadiationDeferral('Plutonium is radioactive and highly toxic: licensed facilities only.'),
  Np: withRadiationDeferral('Neptunium is radioactive: licensed facilities only.'),
  Am: withRadiationDeferral('Americium is radioactive: licensed facilities only.'),
  Pm: withRadiationDeferral('Promethium has no stable isotope: radioactive material rules apply.'),
  Cm: withRadiationDeferral('Curium is intensely radioactive: licensed facilities only.'),
  Pa: withRadiationDeferral('Protactinium is radioactive and highly toxic: licensed facilities only.'),
  Ac: withRadiationDeferral('Actinium has no stable isotope: radioactive material rules apply.'),
  Ra: withRadiationDeferral('Radium is radioactive and releases radon: licensed facilities only.'),
  Po: withRadiationDeferral('Polonium is intensely radioactive and extremely toxic: licensed facilities only.'),
};
// Chelators used to carry radiometals in nuclear medicine, and the metals they carry (common practice).
const RADIOLABEL_CHELATORS: ReadonlySet<string> = new Set(['dota', 'nota', 'dtpa', 'tacn', 'cyclam', 'cyclen']);
const RADIOMETALS: ReadonlySet<string> = new Set(['Ga', 'Cu', 'Y', 'In', 'Lu', 'Zr', 'Sc', 'Tb', 'Ho', 'Sm', 'Bi', 'Pb', 'Ac', 'Tc', 'Re']);
// Amine N donors (N with hydrogen or carbon on it): NH3, en, dien, cyclam…; not nitrite, nitrate, cyanide or pyridine-type rings.
const AMINE_LIGANDS: ReadonlySet<string> = new Set(['NH3', 'en', 'dien', 'trien', 'tren', 'tacn', 'tmeda', 'cyclam', 'cyclen', 'pn', 'tn', 'MeNH2', 'NH2', 'gly', 'edta', 'dota', 'nota', 'dtpa', 'nta', 'ida', 'tpa', 'dach']);
// Ruthenium and gold drug families with published cytotoxicity (common practice): arene and
// imidazole Ru, phosphine gold.
const CYTOTOXIC_RU_LIGANDS: ReadonlySet<string> = new Set(['C6H6', 'imH', 'dmso']);
const CYANIDE_COUNTER_ION = withDeferral('Cyanide: contact with acid releases highly toxic hydrogen cyanide (HCN) gas.');
const AZIDE_COUNTER_ION = withDeferral('Azide: metal azides can be shock- and heat-sensitive explosives; acid releases toxic, explosive hydrazoic acid (HN3).');
const CHROMIUM_VI = withDeferral('Cr(VI) compounds are carcinogenic, toxic and sensitising.');
const OSMIUM_VIII = withDeferral('Os(VIII) (OsO4-type) is highly toxic and volatile and fixes tissue, including the eyes: fume hood only.');
const MANGANESE_VII = withDeferral('Permanganate is a strong oxidiser; keep away from organic material.');

/** Cautions in a fixed order: anion, ligand hazards, oxidation-state hazards, metal hazards. */
export function cautionsFor(
  parsed: Pick<ParsedFormula, 'metal' | 'ligands' | 'counterIons'> & { complexCharge?: number },
  oxidationState: number,
): string[] {
  const cautions: string[] = [];
  let organicLigands = false;
  let amineLigands = false;
  let onlyCarbonyls = parsed.ligands.length > 0;
  let radiolabelChelator = false;
  let cytotoxicRuLigand = false;
  let phosphine = false;
  for (const instance of parsed.ligands) {
    const id = instance.ligand.id;
    if ((instance.ligand.composition.C ?? 0) > 0 && id !== 'CN' && id !== 'CO') organicLigands = true;
    if (AMINE_LIGANDS.has(id)) amineLigands = true;
    if (id !== 'CO') onlyCarbonyls = false;
    if (RADIOLABEL_CHELATORS.has(id)) radiolabelChelator = true;
    if (CYTOTOXIC_RU_LIGANDS.has(id)) cytotoxicRuLigand = true;
    if (instance.ligand.donorAtoms[0] === 'P') phosphine = true;
  }
  let perchlorate = false;
  for (const ion of parsed.counterIons) if (ion.formula === 'ClO4') perchlorate = true;
  if (perchlorate) cautions.push(amineLigands ? PERCHLORATE_AMINE : organicLigands ? PERCHLORATE_ORGANIC : PERCHLORATE);
  // Neutral binary carbonyls (Ni(CO)4, Fe(CO)5, Cr(CO)6…) are volatile: the worst hazard comes first.
  if (onlyCarbonyls && (parsed.complexCharge ?? 0) === 0) {
    const carbonyls = parsed.ligands[0]?.count ?? 0;
    if (parsed.metal === 'Ni' && carbonyls === 4) cautions.push(NICKEL_CARBONYL);
    else if (parsed.metal === 'Fe' && carbonyls === 5) cautions.push(IRON_PENTACARBONYL);
    else cautions.push(VOLATILE_CARBONYL);
  }
  if (parsed.metal === 'Pt' && amineLigands) cautions.push(CYTOTOXIC_PLATINUM);
  else if ((parsed.metal === 'Ru' && cytotoxicRuLigand) || (parsed.metal === 'Au' && phosphine) || (parsed.metal === 'Pd' && amineLigands)) cautions.push(CYTOTOXIC_METALLODRUG);
  if (radiolabelChelator && RADIOMETALS.has(parsed.metal)) cautions.push(RADIOLABEL_CHELATE);
  for (const instance of parsed.ligands) {
    for (const hazard of instance.ligand.hazards) {
      const text = withDeferralCached(hazard);
      if (!cautions.includes(text)) cautions.push(text);
    }
  }
  for (const ion of parsed.counterIons) {
    if (ion.formula === 'CN') pushUnique(cautions, CYANIDE_COUNTER_ION);
    if (ion.formula === 'N3') pushUnique(cautions, AZIDE_COUNTER_ION);
  }
  const reductant = AIR_SENSITIVE_REDUCTANT.get(parsed.metal)?.get(oxidationState);
  if (reductant) cautions.push(reductant);
  if (parsed.metal === 'Cr' && oxidationState === 6) cautions.push(CHROMIUM_VI);
  if (parsed.metal === 'Os' && oxidationState === 8) cautions.push(OSMIUM_VIII);
  if (parsed.metal === 'Mn' && oxidationState === 7) cautions.push(MANGANESE_VII);
  const metalHazard = METAL_HAZARD[parsed.metal];
  if (metalHazard) cautions.push(metalHazard);
  return cautions;
}

function pushUnique(list: string[], text: string): void {
  if (!list.includes(text)) list.push(text);
}

const deferredHazards = new Map<string, string>();
function withDeferralCached(hazard: string): string {
  let text = deferredHazards.get(hazard);
  if (text === undefined) {
    text = withDeferral(hazard.endsWith('.') ? hazard : `${hazard}.`);
    deferredHazards.set(hazard, text);
  }
  return text;
}
