/**
 * Safety cautions for a parsed formula. Short, specific and always deferring to the people and
 * documents that actually govern lab safety.
 */
import type { ParsedFormula } from './types';

const DEFER = " Follow the institution's safety office, the supplier's safety data sheet and local regulations.";

const withDeferral = (text: string): string => `${text}${DEFER}`;

const PERCHLORATE_ORGANIC = withDeferral('Perchlorate salt with organic ligands: potentially explosive, especially when dry, heated or scraped; prepare small amounts only and prefer a non-oxidising anion (PF6⁻, BF4⁻, triflate).');
const PERCHLORATE = withDeferral('Perchlorate salt: strong oxidiser; keep away from organic material and do not heat the dry solid.');
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
  U: withDeferral('Uranium compounds are radioactive and chemically toxic.'),
  Th: withDeferral('Thorium compounds are radioactive.'),
  Tc: withDeferral('Technetium has no stable isotope: radioactive material rules apply.'),
  Pu: withDeferral('Plutonium is radioactive and highly toxic: licensed facilities only.'),
  Np: withDeferral('Neptunium is radioactive: licensed facilities only.'),
  Am: withDeferral('Americium is radioactive: licensed facilities only.'),
  Pm: withDeferral('Promethium has no stable isotope: radioactive material rules apply.'),
};
const CYANIDE_COUNTER_ION = withDeferral('Cyanide: contact with acid releases highly toxic hydrogen cyanide (HCN) gas.');
const AZIDE_COUNTER_ION = withDeferral('Azide: metal azides can be shock- and heat-sensitive explosives; acid releases toxic, explosive hydrazoic acid (HN3).');
const CHROMIUM_VI = withDeferral('Cr(VI) compounds are carcinogenic, toxic and sensitising.');
const OSMIUM_VIII = withDeferral('Os(VIII) (OsO4-type) is highly toxic and volatile and fixes tissue, including the eyes: fume hood only.');
const MANGANESE_VII = withDeferral('Permanganate is a strong oxidiser; keep away from organic material.');

/** Cautions in a fixed order: anion, ligand hazards, oxidation-state hazards, metal hazards. */
export function cautionsFor(parsed: Pick<ParsedFormula, 'metal' | 'ligands' | 'counterIons'>, oxidationState: number): string[] {
  const cautions: string[] = [];
  let organicLigands = false;
  for (const instance of parsed.ligands) {
    if ((instance.ligand.composition.C ?? 0) > 0 && instance.ligand.id !== 'CN' && instance.ligand.id !== 'CO') organicLigands = true;
  }
  let perchlorate = false;
  for (const ion of parsed.counterIons) if (ion.formula === 'ClO4') perchlorate = true;
  if (perchlorate) cautions.push(organicLigands ? PERCHLORATE_ORGANIC : PERCHLORATE);
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
