import { classifyFormula } from '@/lib/chem/classify';

// [formula, metal, oxidation state, d electrons, coordination number, geometry] — electron counting
// by charge balance and d = group − oxidation state (common practice; geometries recalled from
// standard textbook structures, e.g. Greenwood & Earnshaw 1997).
const cases: [string, string, number, number, number, string][] = [
  ['[Co(en)2(NO2)Cl]NO3', 'Co', 3, 6, 6, 'octahedral'],
  ['K3[Cr(ox)3]·3H2O', 'Cr', 3, 3, 6, 'octahedral'],
  ['[Cr(NH3)5(OH2)]3+', 'Cr', 3, 3, 6, 'octahedral'],
  ['[Rh(bpy)2Cl2]PF6', 'Rh', 3, 6, 6, 'octahedral'],
  ['[Mn(CO)5Br]', 'Mn', 1, 6, 6, 'octahedral'],
  ['[ReO4]-', 'Re', 7, 0, 4, 'tetrahedral'],
  ['[Cu(en)2]2+', 'Cu', 2, 9, 4, 'square-planar'],
  ['[Co(NH3)6]2(SO4)3', 'Co', 3, 6, 6, 'octahedral'],
  ['[Pt(NH3)2Cl2]', 'Pt', 2, 8, 4, 'square-planar'],
  ['Na2[Fe(CN)5NO]', 'Fe', 2, 6, 6, 'octahedral'],
  ['[Fe(H2O)6]2+', 'Fe', 2, 6, 6, 'octahedral'],
  ['[Ni(CN)4]2-', 'Ni', 2, 8, 4, 'square-planar'],
  ['[NiCl4]2-', 'Ni', 2, 8, 4, 'tetrahedral'],
  ['[Fe(C5H5)2]', 'Fe', 2, 6, 6, 'sandwich'], // two parallel Cp rings, counted as 6 sites (Wilkinson et al., J. Am. Chem. Soc. 1952, 74, 2125; recalled)
  ['[Ru(bpy)3]Cl2·6H2O', 'Ru', 2, 6, 6, 'octahedral'],
  ['[Cr(H2O)6](ClO4)3', 'Cr', 3, 3, 6, 'octahedral'],
  ['[PtCl4]2-', 'Pt', 2, 8, 4, 'square-planar'],
  ['[CoCl4]2-', 'Co', 2, 7, 4, 'tetrahedral'],
  ['(NH4)2[PtCl6]', 'Pt', 4, 6, 6, 'octahedral'],
  ['H[AuCl4]', 'Au', 3, 8, 4, 'square-planar'],
  ['[Ni(CO)4]', 'Ni', 0, 10, 4, 'tetrahedral'],
  ['[Fe(CO)5]', 'Fe', 0, 8, 5, 'trigonal-bipyramidal'],
  ['[Cr(CO)6]', 'Cr', 0, 6, 6, 'octahedral'],
  ['[Mn(CO)5]-', 'Mn', -1, 8, 5, 'trigonal-bipyramidal'],
  ['[MnO4]-', 'Mn', 7, 0, 4, 'tetrahedral'],
  ['K2[CrO4]', 'Cr', 6, 0, 4, 'tetrahedral'],
  ['[VO(H2O)5]SO4', 'V', 4, 1, 6, 'octahedral'],
  ['[Ag(NH3)2]NO3', 'Ag', 1, 10, 2, 'linear'],
  ['[Zn(NH3)4]2+', 'Zn', 2, 10, 4, 'tetrahedral'],
  ['[Ga(H2O)6]3+', 'Ga', 3, 10, 6, 'octahedral'],
  ['[SnCl6]2-', 'Sn', 4, 10, 6, 'octahedral'],
  ['[Al(H2O)6]Cl3', 'Al', 3, 0, 6, 'octahedral'],
  ['[Mg(H2O)6]Cl2', 'Mg', 2, 0, 6, 'octahedral'],
  ['[Co(edta)]-', 'Co', 3, 6, 6, 'octahedral'],
  ['[Fe(terpy)2]2+', 'Fe', 2, 6, 6, 'octahedral'],
  ['[Cu(NH3)4(H2O)2]SO4·H2O', 'Cu', 2, 9, 6, 'octahedral'],
  ['[Rh(PPh3)3Cl]', 'Rh', 1, 8, 4, 'square-planar'],
  ['[IrCl(CO)(PPh3)2]', 'Ir', 1, 8, 4, 'square-planar'],
];

describe('electron counting (common practice)', () => {
  it.each(cases)('%s: %s(%i), d%i, CN %i, %s', (formula, metal, oxidationState, d, cn, geometry) => {
    const result = classifyFormula(formula);
    expect(result.metal).toBe(metal);
    expect(result.oxidationState).toBe(oxidationState);
    expect(result.dElectrons).toBe(d);
    expect(result.coordinationNumber).toBe(cn);
    expect(result.geometry).toBe(geometry);
  });

  it('f-block ions report their f count as the open-shell count (PRODUCT.md: "d (or f) electron count") (Gd3+ 4f7, Ce4+ 4f0, U(IV) 5f2; recalled)', () => {
    const gadolinium = classifyFormula('[Gd(H2O)8]3+');
    expect([gadolinium.electronShell, gadolinium.dElectrons, gadolinium.fElectrons]).toEqual(['f', 7, 7]);
    expect(classifyFormula('[Ce(NO3)6]2-').fElectrons).toBe(0);
    expect(classifyFormula('[UCl6]2-').fElectrons).toBe(2);
  });

  it('main-group ions use the sp shell (Ga3+ d10, Al3+ d0; documented convention)', () => {
    expect(classifyFormula('[Ga(H2O)6]3+').electronShell).toBe('sp');
    expect(classifyFormula('[Al(H2O)6]3+').electronShell).toBe('sp');
  });

  it('18-electron counts by the ionic model (common practice)', () => {
    expect(classifyFormula('[Cr(CO)6]').valenceElectronCount).toBe(18);
    expect(classifyFormula('[Fe(C5H5)2]').valenceElectronCount).toBe(18);
    expect(classifyFormula('[Ni(CO)4]').valenceElectronCount).toBe(18);
    expect(classifyFormula('[Fe(CO)5]').valenceElectronCount).toBe(18);
  });

  it('a caller can override the geometry', () => {
    const result = classifyFormula('[NiCl4]2-', { geometry: 'square-planar' });
    expect(result.geometry).toBe('square-planar');
    expect(result.geometrySource).toBe('given');
  });

  it('says that nitrosyl is counted as NO+ (common practice)', () => {
    expect(classifyFormula('Na2[Fe(CN)5NO]').reasons.join(' ')).toMatch(/NO⁺/);
  });
});

describe('ambidentate carbonate (common practice)', () => {
  it('counts carbonate as chelating when it completes the octahedron, monodentate otherwise', () => {
    // [Co(NH3)4(CO3)]+: chelating carbonate, six-coordinate Co(III) (common practice, textbook salt).
    const chelated = classifyFormula('[Co(NH3)4(CO3)]NO3');
    expect([chelated.coordinationNumber, chelated.geometry, chelated.verdict]).toEqual([6, 'octahedral', 'inert']);
    // [Co(NH3)5(OCO2)]+: monodentate carbonate beside five ammines (common practice).
    const monodentate = classifyFormula('[Co(NH3)5(CO3)]+');
    expect(monodentate.coordinationNumber).toBe(6);
    expect(monodentate.ligands.find((l) => l.id === 'CO3')?.donorAtoms).toEqual(['O']);
  });
});
