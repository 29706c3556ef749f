import { classifyFormula } from '@/lib/chem/classify';
import { molarMassGPerMol } from '@/lib/chem/elements';
import { aquaIonTable, normalizeFormula, parseFormula, trivialNameTable } from '@/lib/chem/formula-parser';
import { ligandCatalogue } from '@/lib/chem/ligands';
import { FormulaError } from '@/lib/chem/types';

function errorOf(formula: string): FormulaError {
  try {
    parseFormula(formula);
  } catch (error) {
    if (error instanceof FormulaError) return error;
    throw error;
  }
  throw new Error(`no error for ${formula}`);
}

function ligandCounts(formula: string): Record<string, number> {
  return Object.fromEntries(parseFormula(formula).ligands.map((instance) => [instance.ligand.id, instance.count]));
}

describe('plain salts, hydrates, alums and double salts', () => {
  // Solid: trans-[CrCl2(H2O)4]Cl·2H2O — I. G. Dance & H. C. Freeman, Inorg. Chem. 1965, 4, 1555 (recalled).
  it('reads commercial green CrCl3·6H2O as the complex in its solid, and says so', () => {
    const parsed = parseFormula('CrCl3·6H2O');
    expect([parsed.metal, parsed.oxidationState, parsed.complexCharge]).toEqual(['Cr', 3, 1]);
    expect(ligandCounts('CrCl3·6H2O')).toEqual({ Cl: 2, H2O: 4 });
    expect(parsed.readings[0]).toMatchObject({ kind: 'solid', species: 'trans-[CrCl2(H2O)4]Cl·2H2O' });
    const result = classifyFormula('CrCl3·6H2O');
    expect(result.coordinationNumber).toBe(6);
    expect(result.verdict).toBe('inert'); // Cr(III): Taube 1952, inert
    expect(result.reasons[0]).toMatch(/solid/);
    expect(result.readings?.[0]?.species).toBe('trans-[CrCl2(H2O)4]Cl·2H2O');
  });

  // Hexaaqua ions in water: L. Helm & A. E. Merbach, Chem. Rev. 2005, 105, 1923 (water-exchange table).
  it.each([
    ['KCr(SO4)2·12H2O', 'Cr', 3, 6],
    ['CoCl2·6H2O', 'Co', 2, 6],
    ['NiSO4·6H2O', 'Ni', 2, 6],
    ['CuSO4·5H2O', 'Cu', 2, 6],
    ['(NH4)2Fe(SO4)2·6H2O', 'Fe', 2, 6],
    ['Fe2(SO4)3·9H2O', 'Fe', 3, 6],
    ['Mn(ClO4)2·6H2O', 'Mn', 2, 6],
    ['Gd(NO3)3·6H2O', 'Gd', 3, 8],
  ])('%s dissolves to the aqua ion of %s(%i) with %i waters', (formula, metal, oxidationState, waters) => {
    const parsed = parseFormula(formula);
    expect([parsed.metal, parsed.oxidationState]).toEqual([metal, oxidationState]);
    expect(ligandCounts(formula)).toEqual({ H2O: waters });
    expect(parsed.readings[0]?.kind).toBe('dissolved');
    expect(classifyFormula(formula).coordinationNumber).toBe(waters);
  });

  // Molar masses of the salts as weighed (IUPAC 2021 atomic weights; CuSO4·5H2O 249.68, chrome alum 499.4 g/mol
  // as listed in the CRC Handbook of Chemistry and Physics, 97th ed., 2016 — recalled).
  it('keeps the molar mass of the salt as written, not of the aqua ion', () => {
    expect(classifyFormula('CuSO4·5H2O').molarMassGPerMol).toBeCloseTo(249.68, 1);
    expect(classifyFormula('KCr(SO4)2·12H2O').molarMassGPerMol).toBeCloseTo(499.4, 1);
    expect(parseFormula('(NH4)2Fe(SO4)2·6H2O').composition).toEqual({ Fe: 1, N: 2, H: 20, S: 2, O: 14 });
  });

  it('keeps perchlorate counter-ions for the cautions', () => {
    expect(parseFormula('Co(ClO4)2·6H2O').counterIons.map((ion) => ion.formula)).toContain('ClO4');
  });

  it('refuses a hydrate that is a mixture rather than guessing', () => {
    expect(errorOf('RhCl3·3H2O').message).toMatch(/mixture/);
  });

  it('still reads halometallates and oxoanions written without brackets as complex anions (common practice)', () => {
    expect(ligandCounts('K2PtCl4')).toEqual({ Cl: 4 });
    expect(parseFormula('K2PtCl4').complexCharge).toBe(-2);
    expect(ligandCounts('KMnO4')).toEqual({ O: 4 });
  });

  it('has an aqua ion record for every ion it reads, each with a source', () => {
    for (const record of aquaIonTable()) {
      expect(record.source).toMatch(/\d{4}/);
      expect(['primary', 'review', 'secondary', 'recalled']).toContain(record.checked);
    }
  });
});

describe('Unicode, caret charges and look-alike characters', () => {
  it.each([
    ['[Co(NH₃)₆]Cl₃', '[Co(NH3)6]Cl3'],
    ['[Co(NH₃)₆]³⁺', '[Co(NH3)6]3+'],
    ['[Fe(CN)₆]⁴⁻', '[Fe(CN)6]4-'],
    ['[Fe(CN)6]^4-', '[Fe(CN)6]4-'],
    ['[Fe(CN)6]4−', '[Fe(CN)6]4-'],
    ['K₃[Cr(ox)₃]·3H₂O', 'K3[Cr(ox)3]·3H2O'],
    ['[Fe(η⁵-C5H5)2]', '[Fe(Cp)2]'],
    ['[Ru(2,2′-bpy)3]2+', '[Ru(bpy)3]2+'],
  ])('%s reads like %s', (unicode, ascii) => {
    const a = parseFormula(unicode);
    const b = parseFormula(ascii);
    expect([a.metal, a.oxidationState, a.complexCharge, a.hydrateWaters]).toEqual([b.metal, b.oxidationState, b.complexCharge, b.hydrateWaters]);
    expect(ligandCounts(unicode)).toEqual(ligandCounts(ascii));
  });

  it('maps one character to one, so positions still point into the formula as written', () => {
    const text = '[Co(NH₃)₆]³⁺ µ η⁵';
    expect(normalizeFormula(text)).toHaveLength(text.length);
    expect(errorOf('[Co(NH₃)₆(xyz)]').position).toBe(10);
  });
});

describe('trivial names', () => {
  it.each([
    // Rosenberg et al., Nature 1969, 222, 385: cis-diamminedichloroplatinum(II)
    ['cisplatin', 'Pt', 2, { Cl: 2, NH3: 2 }],
    // Osborn, Jardine, Young & Wilkinson, J. Chem. Soc. A 1966, 1711: RhCl(PPh3)3
    ["Wilkinson's catalyst", 'Rh', 1, { Cl: 1, PPh3: 3 }],
    // Vaska & DiLuzio, J. Am. Chem. Soc. 1961, 83, 2784: IrCl(CO)(PPh3)2
    ['Vaska’s complex', 'Ir', 1, { Cl: 1, CO: 1, PPh3: 2 }],
    // Zeise, Ann. Phys. 1831, 97, 497: K[PtCl3(C2H4)]·H2O
    ['ZEISE’S SALT', 'Pt', 2, { Cl: 3, C2H4: 1 }],
    // Kealy & Pauson, Nature 1951, 168, 1039
    ['ferrocene', 'Fe', 2, { Cp: 2 }],
  ])('%s → %s(%i)', (name, metal, oxidationState, ligands) => {
    const parsed = parseFormula(name);
    expect([parsed.metal, parsed.oxidationState]).toEqual([metal, oxidationState]);
    expect(ligandCounts(name)).toEqual(ligands);
    expect(parsed.readings[0]?.kind).toBe('name');
  });

  it('every name in the table parses, and has a source with a year', () => {
    for (const record of trivialNameTable()) {
      expect(() => parseFormula(record.formula)).not.toThrow();
      expect(record.source).toMatch(/\b1[89]\d\d|20\d\d\b/);
    }
  });
});

describe('the ligand table', () => {
  it('holds the families chemists use (macrocycles, chelators, porphyrins, pyridines, phosphines, carbenes)', () => {
    const ids = new Set(ligandCatalogue.map((ligand) => ligand.id));
    for (const id of ['cyclam', 'cyclen', 'dota', 'nta', 'dtpa', 'tpp', 'pc', 'isn', 'inic', 'fum', 'pz', 'dppm', 'PBu3', 'IMes', 'CNtBu', '18C6', 'crypt222']) {
      expect(ids).toContain(id);
    }
    expect(ligandCatalogue.length).toBeGreaterThan(100);
  });

  // Donor sets and charges: DOTA4− octadentate N4O4 (Helm & Merbach 2005, Gd(III) contrast agents; common practice).
  it('charges and denticities balance in real complexes', () => {
    expect(parseFormula('[Gd(dota)(H2O)]-').oxidationState).toBe(3);
    expect(classifyFormula('[Gd(dota)(H2O)]-').coordinationNumber).toBe(9);
    expect(parseFormula('[Fe(tpp)Cl]').oxidationState).toBe(3);
    expect(parseFormula('[Ni(cyclam)]2+').oxidationState).toBe(2);
    expect(parseFormula('[Co(NH3)5(isn)]3+').oxidationState).toBe(3);
    expect(parseFormula('[Co(NH3)5(fum)]+').oxidationState).toBe(3);
  });

  it('marks remote bridges on the far atom of conjugated ligands', () => {
    const isn = ligandCatalogue.find((ligand) => ligand.id === 'isn');
    expect(isn).toMatchObject({ bridgeMode: 'remote', bridgingAtom: 'O', donorAtoms: ['N'] });
  });

  it('keeps each ligand’s composition consistent with its molar mass being finite and positive', () => {
    for (const ligand of ligandCatalogue) expect(molarMassGPerMol(ligand.composition)).toBeGreaterThan(0);
  });
});

describe('errors point at the real mistake', () => {
  it.each([
    ['[Co(NH3)5Cl2+', 11, /Missing '\]' at character 12/],
    ['[Co(NH3)6 3+', 10, /Missing '\]'/],
    ['[Co(NH3)6·2H2O', 9, /Missing '\]'.*water of crystallisation/],
  ])('%s → position %i', (formula, position, message) => {
    const error = errorOf(formula);
    expect(error.position).toBe(position);
    expect(error.message).toMatch(message);
  });
});

describe('a missing charge', () => {
  it('warns and says what was assumed', () => {
    const parsed = parseFormula('[Fe(H2O)6]');
    expect(parsed.oxidationState).toBe(0);
    expect(parsed.warnings[0]).toMatch(/taken as neutral.*Fe\(0\)/);
    expect(classifyFormula('[Fe(H2O)6]').warnings?.[0]).toMatch(/Fe\(0\)/);
  });

  it('does not warn for neutral complexes that are written correctly', () => {
    expect(parseFormula('[Ni(CO)4]').warnings).toEqual([]);
    expect(parseFormula('[Pt(NH3)2Cl2]').warnings).toEqual([]);
    expect(parseFormula('[Fe(H2O)6]2+').warnings).toEqual([]);
  });
});

describe('µ-bridged dinuclear species, classified per metal centre', () => {
  // Creutz–Taube ion: C. Creutz & H. Taube, J. Am. Chem. Soc. 1969, 91, 3988 — Ru(II)/Ru(III) bridged by pyrazine.
  it('reads the Creutz–Taube ion as a mixed-valence Ru(III)/Ru(II) pair and says what it assumed', () => {
    const parsed = parseFormula('[(NH3)5Ru(μ-pz)Ru(NH3)5]5+');
    expect(parsed.centres?.map((centre) => [centre.metal, centre.oxidationState])).toEqual([['Ru', 3], ['Ru', 2]]);
    expect(parsed.warnings[0]).toMatch(/mixed valence/);
    expect(parsed.composition).toEqual({ Ru: 2, N: 12, H: 34, C: 4 });
  });

  // µ-amido and µ-hydroxo bis(pentaamminecobalt(III)): A. Werner's polynuclear ammines (common practice: Co(III) both).
  it.each([
    ['[(NH3)5Co(μ-OH)Co(NH3)5]5+', 'Co', 3, 3],
    ['[Co(NH3)5(µ-NH2)Co(NH3)5]5+', 'Co', 3, 3],
    // Hydrolytic Cr(III) dimer [Cr2(μ-OH)2(H2O)8]4+ (D. T. Richens, The Chemistry of Aqua Ions, 1997 — recalled).
    ['[Cr2(μ-OH)2(H2O)8]4+', 'Cr', 3, 3],
    // [Ru2OCl10]4−: µ-oxo Ru(IV)–O–Ru(IV) (A. M. Mathieson, D. P. Mellor & N. C. Stephenson, Acta Crystallogr. 1952, 5, 185 — recalled).
    ['[Cl5Ru(μ-O)RuCl5]4-', 'Ru', 4, 4],
    // Binuclear Co(III)–NC–Fe(II) from [Co(NH3)5(OH2)]3+ + [Fe(CN)6]4− (D. Gaswick & A. Haim, J. Am. Chem. Soc. 1971, 93, 7347 — recalled).
    ['[Co(III)(NH3)5(μ-NC)Fe(II)(CN)5]-', 'Co', 3, 2],
  ])('%s → %s centres %i / %i', (formula, metal, first, second) => {
    const parsed = parseFormula(formula);
    expect(parsed.centres).toHaveLength(2);
    expect(parsed.centres?.[0]?.metal).toBe(metal);
    expect(parsed.centres?.map((centre) => centre.oxidationState)).toEqual([first, second]);
    const result = classifyFormula(formula);
    expect(result.centres).toHaveLength(2);
    for (const [index, centre] of (result.centres ?? []).entries()) {
      // Each centre's species parses back to the same metal and oxidation state, six-coordinate.
      expect(parseFormula(centre.species).oxidationState).toBe([first, second][index]);
      expect(centre.coordinationNumber).toBe(6);
    }
  });

  it('binds an ambidentate bridge by its far end to the second centre (Co–N≡C–Fe)', () => {
    const centres = parseFormula('[Co(III)(NH3)5(μ-NC)Fe(II)(CN)5]-').centres ?? [];
    expect(centres[0]?.ligands.map((instance) => instance.ligand.id)).toContain('NC');
    expect(centres[1]?.species).toBe('[Fe(CN)6]4-');
  });

  it('keeps refusing metal–metal bonded species without a written bridge', () => {
    expect(errorOf('[Co2(CO)8]').message).toMatch(/Polynuclear/);
    expect(errorOf('[Co(NH3)5(μ-OH)]2+').message).toMatch(/two metal centres/);
    expect(errorOf('[Co(III)(NH3)5(μ-NC)Fe(III)(CN)5]-').message).toMatch(/do not balance/);
  });
});

describe('more mistakes, each named where it is', () => {
  it.each([
    ['Co(NH3)6]Cl3', 0, /Missing '\[' at character 1/],
    ['[Co(NH3)6]]Cl3', 10, /Extra '\]' at character 11/],
    ['[Co(NH3)6]3', 10, /needs a sign to be a charge \(3\+ or 3-\)/],
    ['[Fe(CN)6]4', 9, /4\+ or 4-/],
    ['[Co(NH3)6]3+Cl3', 12, /either the charge or the counter-ions/],
  ])('%s → position %i', (formula, position, message) => {
    const error = errorOf(formula);
    expect(error.position).toBe(position);
    expect(error.message).toMatch(message);
  });
});

describe('more trivial names', () => {
  it.each([
    // Creutz & Taube, J. Am. Chem. Soc. 1969, 91, 3988: pyrazine-bridged decaammine diruthenium(5+)
    ['Creutz–Taube ion', 'Ru', 2],
    // Kidani et al., J. Med. Chem. 1978, 21, 1315: Pt(II) with 1,2-diaminocyclohexane and oxalate
    ['oxaliplatin', 'Pt', 2],
    // Schwab, Grubbs & Ziller, J. Am. Chem. Soc. 1996, 118, 100: RuCl2(=CHPh)(PCy3)2, Ru(II) with a neutral carbene
    ['Grubbs catalyst', 'Ru', 2],
    // Greenwood & Earnshaw 1997: Cp2TiCl2, Ti(IV)
    ['Cp2TiCl2', 'Ti', 4],
    ['cis-platin', 'Pt', 2],
    // Ferrocene written ligands first (Kealy & Pauson, Nature 1951, 168, 1039).
    ['Cp2Fe', 'Fe', 2],
    ['Cp2Co+', 'Co', 3],
  ])('%s → %s(%i)', (name, metal, oxidationState) => {
    const result = classifyFormula(name);
    expect([result.metal, result.oxidationState]).toEqual([metal, oxidationState]);
    expect(result.readings?.[0]?.kind).toBe('name');
  });
});

describe('bridged names and formulas chemists write without brackets', () => {
  // Dichromate: two CrO4 tetrahedra sharing an oxygen, Cr(VI) (Greenwood & Earnshaw 1997); K2Cr2O7 294.18 g/mol
  // (CRC Handbook of Chemistry and Physics, 97th ed., 2016 — recalled).
  it('reads K2Cr2O7 as the µ-oxo dichromate', () => {
    const result = classifyFormula('K2Cr2O7');
    expect(result.centres?.map((centre) => [centre.metal, centre.oxidationState, centre.coordinationNumber])).toEqual([['Cr', 6, 4], ['Cr', 6, 4]]);
    expect(result.molarMassGPerMol).toBeCloseTo(294.18, 1);
    expect(result.cautions.join(' ')).toMatch(/Cr\(VI\)/);
  });

  // Co2(CO)8 (solid form: two bridging CO) and Fe2(CO)9 (three bridging CO), Co(0) and Fe(0) (Greenwood & Earnshaw 1997).
  it.each([
    ['Co2(CO)8', 'Co', 0],
    ['Fe2(CO)9', 'Fe', 0],
    ['Al2Cl6', 'Al', 3],
  ])('%s → two %s(%i) centres', (formula, metal, oxidationState) => {
    const parsed = parseFormula(formula);
    expect(parsed.centres?.map((centre) => [centre.metal, centre.oxidationState])).toEqual([[metal, oxidationState], [metal, oxidationState]]);
  });
});

describe('complexes written without brackets, Werner style (common practice)', () => {
  it.each([
    // Hexaamminecobalt(III) chloride and chloropentaamminecobalt(III) chloride (Werner, Z. Anorg. Chem. 1893, 3, 267).
    ['Co(NH3)6Cl3', '[Co(NH3)6]Cl3', 3, 6, 3],
    ['Co(NH3)5Cl3', '[Co(NH3)5Cl]Cl2', 3, 6, 2],
    ['Co(NH3)5Cl2+', '[Co(NH3)5Cl]2+', 3, 6, 2],
    ['Ni(en)3Cl2', '[Ni(en)3]Cl2', 2, 6, 2],
    ['Co(NH3)6(ClO4)3', null, 3, 6, 3],
  ])('%s is read as %s', (formula, bracketed, oxidationState, cn, charge) => {
    const result = classifyFormula(formula);
    expect([result.oxidationState, result.coordinationNumber, result.complexCharge]).toEqual([oxidationState, cn, charge]);
    if (bracketed !== null) {
      expect(result.warnings?.[0]).toContain(`Read without brackets as ${bracketed}`);
      expect(result.molarMassGPerMol).toBeCloseTo(classifyFormula(bracketed).molarMassGPerMol, 6);
    }
  });

  it('leaves six-coordinate and neutral bare entities as written', () => {
    expect(classifyFormula('Cr(CO)6').warnings).toBeUndefined();
    expect(classifyFormula('Pt(NH3)2Cl2').coordinationNumber).toBe(4);
    expect(classifyFormula('Cr(H2O)6 3+').warnings).toBeUndefined();
  });
});
