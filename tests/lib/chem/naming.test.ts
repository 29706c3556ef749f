import { anionicMetalName, romanNumeral, suggestedName } from '@/lib/chem/naming';

/**
 * Names suggested from the formula, checked against the additive names of IUPAC Nomenclature of
 * Inorganic Chemistry, Recommendations 2005 (the "Red Book"), chapter IR-9 — each check value is
 * recalled from its worked examples and rules ("from memory"), not copied from a page here.
 */
describe('suggestedName: IR-9 additive names', () => {
  it.each([
    // IUPAC 2005, IR-9 (from memory): cations, the ligand names aqua/ammine/chlorido, Roman oxidation state.
    ['[Co(NH3)6]3+', 'hexaamminecobalt(III)'],
    ['[Cr(H2O)6]3+', 'hexaaquachromium(III)'],
    ['[Co(NH3)5Cl]2+', 'pentaamminechloridocobalt(III)'],
    // IUPAC 2005, IR-9 (from memory): anions take "-ate", with the Latin stems for Fe, Cu, Ag, Au.
    ['[PtCl4]2-', 'tetrachloridoplatinate(II)'],
    ['[Fe(CN)6]3-', 'hexacyanidoferrate(III)'],
    ['[Fe(CN)6]4-', 'hexacyanidoferrate(II)'],
    ['[CuCl4]2-', 'tetrachloridocuprate(II)'],
    ['[Ag(CN)2]-', 'dicyanidoargentate(I)'],
    ['[AuCl4]-', 'tetrachloridoaurate(III)'],
    ['[Co(NO2)6]3-', 'hexakis(nitrito-κN)cobaltate(III)'],
    // IUPAC 2005, IR-9 (from memory): a neutral entity, and oxidation state zero.
    ['[PtCl2(NH3)2]', 'diamminedichloridoplatinum(II)'],
    ['[Ni(CO)4]', 'tetracarbonylnickel(0)'],
    // IUPAC 2005, IR-9 (from memory): bis/tris/tetrakis with enclosing marks for complex ligand names.
    ['[Co(en)3]3+', 'tris(ethane-1,2-diamine)cobalt(III)'],
    ['[Pt(py)4]2+', 'tetrakis(pyridine)platinum(II)'],
    ['[Cr(ox)3]3-', 'tris(oxalato)chromate(III)'],
    ['[Co(edta)]-', '(ethylenediaminetetraacetato)cobaltate(III)'],
    ['[Co(NH3)5(NO2)]2+', 'pentaammine(nitrito-κN)cobalt(III)'],
  ])('%s → %s', (formula, name) => {
    expect(suggestedName(formula)).toBe(name);
  });

  it('orders ligands alphabetically, ignoring multiplicative prefixes (IUPAC 2005, IR-9.2.2.3; from memory)', () => {
    // "dichlorido" sorts under c, after "aqua" — not under d.
    expect(suggestedName('[CrCl2(H2O)4]+')).toBe('tetraaquadichloridochromium(III)');
    expect(suggestedName('[Co(en)2Cl2]+')).toBe('dichloridobis(ethane-1,2-diamine)cobalt(III)');
    expect(suggestedName('[Co(NH3)4(H2O)Cl]2+')).toBe('tetraammineaquachloridocobalt(III)');
    // Locants are ignored too: 2,2′-bipyridine sorts under b, before chlorido.
    expect(suggestedName('[Rh(bpy)2Cl2]+')).toBe('bis(2,2′-bipyridine)dichloridorhodium(III)');
  });

  it('names the coordination entity of a salt, and keeps a stereodescriptor written before the formula', () => {
    expect(suggestedName('K3[Fe(CN)6]')).toBe('hexacyanidoferrate(III)');
    expect(suggestedName('[Co(NH3)6]Cl3')).toBe('hexaamminecobalt(III)');
    expect(suggestedName('cis-[PtCl2(NH3)2]')).toBe('cis-diamminedichloridoplatinum(II)');
  });

  it('suggests nothing rather than a doubtful name', () => {
    // Not a formula, or empty.
    expect(suggestedName('')).toBeNull();
    expect(suggestedName('[Qq(H2O)6]3+')).toBeNull();
    // Ligands outside the naming table (η-bound, κ choice, non-innocent NO).
    expect(suggestedName('[Fe(Cp)2]')).toBeNull();
    expect(suggestedName('[Fe(CN)5(NO)]2-')).toBeNull();
    // A salt read as the aqua ion it gives in water: the name would not be the formula's.
    expect(suggestedName('CoCl2·6H2O')).toBeNull();
    // Tungsten's "-ate" name is an IUPAC choice between two stems.
    expect(suggestedName('[WCl6]-')).toBeNull();
  });
});

describe('naming helpers', () => {
  it('writes oxidation states as Roman numerals (IUPAC 2005, IR-9.2.2.4; from memory)', () => {
    expect([0, 1, 2, 3, 4, 5, 6, 7, 8].map(romanNumeral)).toEqual(['0', 'I', 'II', 'III', 'IV', 'V', 'VI', 'VII', 'VIII']);
    expect(romanNumeral(-1)).toBe('−I');
  });

  it('gives anionic central-atom names: Latin stems and -ium → -ate (IUPAC 2005, Table X; from memory)', () => {
    expect(['Fe', 'Cu', 'Ag', 'Au', 'Pb', 'Sn'].map(anionicMetalName)).toEqual(['ferrate', 'cuprate', 'argentate', 'aurate', 'plumbate', 'stannate']);
    expect(['Co', 'Ni', 'Cr', 'Pt', 'Mn', 'Mo', 'Al'].map(anionicMetalName)).toEqual(['cobaltate', 'nickelate', 'chromate', 'platinate', 'manganate', 'molybdate', 'aluminate']);
    expect(anionicMetalName('W')).toBeNull();
  });
});
