import { cautionsFor } from '@/lib/chem/cautions';
import { classifyFormula } from '@/lib/chem/classify';
import { parseFormula } from '@/lib/chem/formula-parser';

function cautions(formula: string): string[] {
  return classifyFormula(formula).cautions;
}

const DEFERS = /safety office.*safety data sheet.*local regulations|radiation safety officer.*safety office.*safety data sheet.*local regulations/;

describe('cautions for the worst hazards', () => {
  // Ni(CO)4: volatile liquid, b.p. 43 °C, extremely toxic by inhalation (CRC Handbook of Chemistry and Physics,
  // 97th ed., 2016, physical constants of inorganic compounds — recalled; supplier SDS classifies it acute tox. 2, inhalation).
  it('warns about volatile, extremely toxic binary carbonyls, worst first', () => {
    expect(cautions('[Ni(CO)4]')[0]).toMatch(/Ni\(CO\)4 is a volatile liquid.*most toxic/);
    expect(cautions('nickel tetracarbonyl')[0]).toMatch(/Ni\(CO\)4/);
    expect(cautions('[Fe(CO)5]')[0]).toMatch(/Fe\(CO\)5 is a volatile, toxic and flammable liquid/);
    expect(cautions('[Cr(CO)6]')[0]).toMatch(/Volatile metal carbonyl/);
    expect(cautions('[Mn(CO)5Br]').join(' ')).not.toMatch(/Volatile metal carbonyl/);
    expect(cautions('[Mn(CO)5]-').join(' ')).not.toMatch(/Volatile metal carbonyl/);
  });

  // Perchlorate salts of ammine complexes are explosive: W. C. Wolsey, Perchlorate salts, their uses and
  // alternatives, J. Chem. Educ. 1973, 50, A335 (recalled).
  it('warns that perchlorate salts of ammine and amine complexes can explode', () => {
    expect(cautions('[Co(NH3)6](ClO4)3').join(' ')).toMatch(/ammine or amine complex.*explosive/);
    expect(cautions('[Ni(en)3](ClO4)2').join(' ')).toMatch(/ammine or amine complex.*explosive/);
    expect(cautions('[Cu(cyclam)](ClO4)2').join(' ')).toMatch(/explosive/);
    expect(cautions('[Fe(H2O)6](ClO4)3').join(' ')).toMatch(/strong oxidiser/);
  });

  // Cisplatin is handled as a cytotoxic drug (NIOSH list of antineoplastic and other hazardous drugs, 2016 — recalled).
  it('gives cytotoxic handling advice for platinum amine drugs and other metallodrugs', () => {
    expect(cautions('cisplatin').join(' ')).toMatch(/cytotoxic/);
    expect(cautions('[Pt(en)Cl2]').join(' ')).toMatch(/cytotoxic/);
    expect(cautions('oxaliplatin').join(' ')).toMatch(/cytotoxic/);
    expect(cautions('carboplatin').join(' ')).toMatch(/cytotoxic/);
    expect(cautions('[PtCl4]2-').join(' ')).not.toMatch(/cytotoxic/);
    expect(cautions('[Ru(C6H6)Cl2(dmso)]').join(' ')).toMatch(/cytotoxic/);
    expect(cautions('[Au(PEt3)Cl]').join(' ')).toMatch(/cytotoxic/);
  });

  it('sends radiometal work to the radiation safety officer', () => {
    expect(cautions('[Tc(O)4]-').join(' ')).toMatch(/radiation safety officer/);
    expect(cautions('[Ga(nota)]').join(' ')).toMatch(/radiation safety officer/);
    expect(cautions('[Lu(dota)]-').join(' ')).toMatch(/radiation safety officer/);
    expect(cautions('[UO2(H2O)5]2+').join(' ')).toMatch(/radiation safety officer/);
    expect(cautions('[Gd(dota)(H2O)]-').join(' ')).not.toMatch(/radiation/);
  });
});

describe('every caution that existed before still fires (common practice hazards)', () => {
  it.each([
    ['[Ru(bpy)3](ClO4)2', /Perchlorate salt with organic ligands/],
    ['[Fe(H2O)6](ClO4)3', /Perchlorate salt: strong oxidiser/],
    ['[FeF6]3-', /Fluoride/],
    ['[Fe(CN)6]4-', /hydrogen cyanide/],
    ['[Co(NH3)5(NCS)]2+', /Thiocyanate/],
    ['[Co(NH3)5(N3)]2+', /Azide/],
    ['[Co(NH3)5(NO3)]2+', /Nitrate: oxidiser/],
    ['[Co(en)3]3+', /ethane-1,2-diamine/],
    ['[Fe(bpy)3]2+', /bipyridine is toxic/],
    ['[Fe(phen)3]2+', /phenanthroline is toxic/],
    ['[Cr(ox)3]3-', /Oxalates are harmful/],
    ['[Ru(NH3)5(py)]2+', /pyridine is flammable/],
    ['[Ni(PMe3)4]', /trimethylphosphine is pyrophoric/],
    ['[Mn(CO)5Br]', /carbon monoxide/],
    ['Na2[Fe(CN)5NO]', /nitrogen oxides/],
    ['[Ru(dmso)4Cl2]', /DMSO carries/],
    ['[Cu(dmf)6]2+', /reproductive toxicant/],
    ['[MoS4]2-', /hydrogen sulfide/],
    ['[Co(NH3)5(NCSe)]2+', /Selenocyanate/],
    ['[TiCl4(thf)2]', /peroxides/],
    ['[Co(NH3)6](CN)3', /Cyanide: contact with acid/],
    ['[Co(NH3)6](N3)3', /Azide: metal azides/],
    ['[Cr(H2O)6]2+', /Cr\(II\) is a strong reductant/],
    ['[V(H2O)6]2+', /V\(II\) is a strong reductant/],
    ['[Ti(H2O)6]3+', /Ti\(III\) is air-sensitive/],
    ['[Eu(H2O)7]2+', /Eu\(II\) is air-sensitive/],
    ['[UCl6]3-', /U\(III\) is air-sensitive/],
    ['[CrO4]2-', /Cr\(VI\) compounds are carcinogenic/],
    ['[OsO4]', /Os\(VIII\)/],
    ['KMnO4', /Permanganate is a strong oxidiser/],
    ['[Co(H2O)6]2+', /Cobalt compounds/],
    ['[Ni(H2O)6]2+', /Nickel compounds/],
    ['[PtCl6]2-', /Platinum salts/],
    ['[PdCl4]2-', /Palladium salts/],
    ['[HgI4]2-', /Mercury compounds/],
    ['[Cd(H2O)6]2+', /Cadmium compounds/],
    ['[TlCl4]-', /Thallium compounds/],
    ['[U(H2O)9]4+', /Uranium compounds/],
    ['[Th(H2O)9]4+', /Thorium compounds/],
    ['[Pu(H2O)9]3+', /Plutonium/],
    ['[Np(H2O)9]3+', /Neptunium/],
    ['[Am(H2O)9]3+', /Americium/],
    ['[Pm(H2O)9]3+', /Promethium/],
  ])('%s', (formula, expected) => {
    const list = cautions(formula);
    expect(list.join(' ')).toMatch(expected);
    for (const text of list) expect(text).toMatch(DEFERS);
  });

  it('metal hazards of main-group metals still come from the table (Pb, Ba, Be)', () => {
    for (const [metal, pattern] of [['Pb', /Lead/], ['Ba', /barium/], ['Be', /Beryllium/]] as const) {
      const parsed = { metal, ligands: parseFormula('[Co(H2O)6]2+').ligands, counterIons: [] };
      expect(cautionsFor(parsed, 2).join(' ')).toMatch(pattern);
    }
  });
});
