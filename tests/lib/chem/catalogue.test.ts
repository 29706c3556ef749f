import metalIonData from '@/data/metal-ions.json';
import measuredRateData from '@/data/measured-rates.json';
import { classifyFormula, classifyMany } from '@/lib/chem/classify';
import { findLigand, ligandCatalogue } from '@/lib/chem/ligands';

describe('ligand catalogue (data/ligands.json)', () => {
  it('every record has every LigandDefinition field and a source', () => {
    for (const ligand of ligandCatalogue) {
      expect(typeof ligand.source).toBe('string');
      expect(ligand.source.length).toBeGreaterThan(10);
      expect(ligand.donorAtoms.length).toBeGreaterThanOrEqual(ligand.denticity);
      expect(['sigma', 'pi-donor', 'pi-acceptor']).toContain(ligand.bondingClass);
      expect(['hard', 'borderline', 'soft']).toContain(ligand.softness);
      expect(ligand.bridgeMode === null).toBe(ligand.bridgingAtom === null);
    }
  });

  it('Jørgensen f values copied from jorgensen.json (Jørgensen 1971 via chemprof tables2.htm)', () => {
    expect(findLigand('H2O')?.jorgensenF).toBe(1.0);
    expect(findLigand('NH3')?.jorgensenF).toBe(1.25);
    expect(findLigand('CN')?.jorgensenF).toBe(1.7);
    expect(findLigand('Br')?.jorgensenF).toBe(0.72);
    expect(findLigand('bpy')?.jorgensenF).toBe(1.33);
  });

  it('spectrochemical ranks keep the ends and well-separated pairs (Shriver & Atkins 2001)', () => {
    const rank = (id: string): number => findLigand(id)?.spectrochemicalRank ?? Number.NaN;
    expect(rank('I')).toBe(0);
    expect(rank('CO')).toBe(21);
    expect(rank('Cl')).toBeLessThan(rank('H2O'));
    expect(rank('H2O')).toBeLessThan(rank('NH3'));
    expect(rank('NH3')).toBeLessThan(rank('CN'));
  });

  it('bridging atoms (common practice): halides and OH adjacent, CN through N, NCS through S, SCN through N, pyrazine remote, NH3 and en none', () => {
    expect([findLigand('Cl')?.bridgingAtom, findLigand('Cl')?.bridgeMode]).toEqual(['Cl', 'adjacent']);
    expect([findLigand('OH')?.bridgingAtom, findLigand('OH')?.bridgeMode]).toEqual(['O', 'adjacent']);
    expect([findLigand('CN')?.bridgingAtom, findLigand('CN')?.bridgeMode]).toEqual(['N', 'remote']);
    expect(findLigand('NCS')?.bridgingAtom).toBe('S');
    expect(findLigand('SCN')?.bridgingAtom).toBe('N');
    expect(findLigand('pz')?.bridgeMode).toBe('remote');
    expect(findLigand('NH3')?.bridgingAtom).toBeNull();
    expect(findLigand('en')?.bridgingAtom).toBeNull();
    expect(findLigand('H2O')?.bridgingAtom).toBeNull();
  });
});

describe('metal-ion and measured-rate tables', () => {
  it('every record carries a source', () => {
    for (const ion of metalIonData.ions) expect(ion.source.length).toBeGreaterThan(5);
    for (const rate of measuredRateData.rates) expect(rate.source.length).toBeGreaterThan(10);
  });
  it('g factors copied from jorgensen.json (Co(III) 18.2, Rh(III) 27.0, Pt(IV) 36.0)', () => {
    const g = (element: string, ox: number): number | null | undefined =>
      metalIonData.ions.find((ion) => ion.element === element && ion.oxidationState === ox)?.jorgensenG;
    expect(g('Co', 3)).toBe(18.2);
    expect(g('Rh', 3)).toBe(27.0);
    expect(g('Pt', 4)).toBe(36.0);
  });
});

describe('cautions', () => {
  const joined = (formula: string): string => classifyFormula(formula).cautions.join(' ');
  it('names the hazards chemists need (common practice) and defers to the safety office', () => {
    expect(joined('[Ru(bpy)3](ClO4)2')).toMatch(/explosive/);
    expect(joined('K4[Fe(CN)6]')).toMatch(/HCN/);
    expect(joined('[Co(NH3)5(N3)]2+')).toMatch(/explosive/);
    expect(joined('[Cr(H2O)6]2+')).toMatch(/air-sensitive/);
    expect(joined('K2[CrO4]')).toMatch(/carcinogenic/);
    expect(joined('[OsO4]')).toMatch(/volatile/);
    expect(joined('[PtCl4]2-')).toMatch(/sensitiser/);
    for (const caution of classifyFormula('[Co(NH3)6](ClO4)3').cautions) {
      expect(caution).toMatch(/safety office, the supplier's safety data sheet and local regulations/);
    }
  });
});

describe('classifyMany', () => {
  it('keeps order and turns parse errors into {formula, error, position}', () => {
    const results = classifyMany(['[Co(NH3)6]3+', '[Co(xyz)6]3+']);
    expect(results[0]).toEqual(expect.objectContaining({ metal: 'Co', verdict: 'inert' }));
    expect(results[1]).toEqual({ formula: '[Co(xyz)6]3+', error: expect.stringMatching(/Unknown ligand 'xyz'/), position: 4 });
  });
});
