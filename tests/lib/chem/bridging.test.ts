import { bridgeableLigands, rankBridgingCandidates } from '@/lib/chem/bridging';
import { parseFormula } from '@/lib/chem/formula-parser';
import type { BridgingCandidate } from '@/lib/chem/route-types';

const byLigand = (parsedFormula: string) =>
  Object.fromEntries(bridgeableLigands(parseFormula(parsedFormula)).map((assessment) => [assessment.ligand, assessment]));

const presentScore = (candidates: BridgingCandidate[], ligand: string): number => {
  const found = candidates.find((candidate) => candidate.ligand === ligand && candidate.present);
  if (!found) throw new Error(`${ligand} not among the present candidates`);
  return found.score;
};

describe('bridgeableLigands: a free lone pair after coordination (H. Taube; common practice)', () => {
  it('[Co(NH3)5Cl]2+: chloride bridges (adjacent), ammonia cannot', () => {
    const ligands = byLigand('[Co(NH3)5Cl]2+');
    expect(ligands.Cl).toMatchObject({ canBridge: true, strength: 'good', bridgingAtom: 'Cl', attack: 'adjacent' });
    expect(ligands.NH3).toMatchObject({ canBridge: false, strength: 'none', bridgingAtom: null });
    expect(ligands.NH3?.reason).toMatch(/lone pair/);
  });

  it.each(['[Co(NH3)6]3+', '[Co(en)3]3+', '[Ru(NH3)6]3+', '[Fe(phen)3]3+', '[Co(bpy)3]3+'])(
    '%s has no bridgeable ligand (electron_transfer.json section c: no bridging lone pair ⇒ outer-sphere)',
    (formula) => {
      const assessments = bridgeableLigands(parseFormula(formula));
      expect(assessments.length).toBeGreaterThan(0);
      expect(assessments.every((assessment) => !assessment.canBridge)).toBe(true);
    },
  );

  it('aqua ligand bridges only weakly and points to hydroxide (k(OH)/k(H2O) ~1e6 with Cr(II): electron_transfer.json section c)', () => {
    const ligands = byLigand('[Co(NH3)5(OH2)]3+');
    expect(ligands.H2O).toMatchObject({ canBridge: true, strength: 'weak' });
    expect(ligands.H2O?.reason).toMatch(/hydroxide/);
    expect(byLigand('[Co(NH3)5(OH)]2+').OH).toMatchObject({ canBridge: true, strength: 'good', bridgingAtom: 'O' });
  });

  it('thiocyanate linkage isomers bridge through the far atom (remote attack; Candlin & Halpern 1965)', () => {
    expect(byLigand('[Co(NH3)5(NCS)]2+').NCS).toMatchObject({ canBridge: true, bridgingAtom: 'S', attack: 'remote' });
    expect(byLigand('[Co(NH3)5(SCN)]2+').SCN).toMatchObject({ canBridge: true, bridgingAtom: 'N', attack: 'remote' });
  });

  it('cyanide bridges through N (remote) on [Fe(CN)6]3- (common practice)', () => {
    expect(byLigand('[Fe(CN)6]3-').CN).toMatchObject({ canBridge: true, bridgingAtom: 'N', attack: 'remote' });
  });
});

describe('rankBridgingCandidates', () => {
  const halides = ['F', 'Cl', 'Br', 'I'] as const;

  it('Co(III) pentaammine + Cr(II): I > Br > Cl > F (Candlin, Halpern & Trimm, J. Am. Chem. Soc. 1964, 86, 1019)', () => {
    const scores = halides.map((x) => presentScore(rankBridgingCandidates(`[Co(NH3)5${x}]2+`, '[Cr(H2O)6]2+'), x));
    const [f, cl, br, i] = scores as [number, number, number, number];
    expect(i).toBeGreaterThan(br);
    expect(br).toBeGreaterThan(cl);
    expect(cl).toBeGreaterThan(f);
  });

  it('the same order among the installable halides for [Co(NH3)6]3+ + Cr(II)', () => {
    const candidates = rankBridgingCandidates('[Co(NH3)6]3+', '[Cr(H2O)6]2+');
    const order = candidates.filter((candidate) => (halides as readonly string[]).includes(candidate.ligand)).map((c) => c.ligand);
    expect(order).toEqual(['I', 'Br', 'Cl', 'F']);
  });

  it('OH⁻ ≫ H2O with Cr(II) (about six orders of magnitude: Candlin & Halpern 1965; SCIENCE.md tolerances)', () => {
    const hydroxo = presentScore(rankBridgingCandidates('[Co(NH3)5(OH)]2+', '[Cr(H2O)6]2+'), 'OH');
    const aqua = presentScore(rankBridgingCandidates('[Co(NH3)5(OH2)]3+', '[Cr(H2O)6]2+'), 'H2O');
    expect(hydroxo - aqua).toBeGreaterThanOrEqual(20);
  });

  it('S-bound thiocyanate (bridging N) beats N-bound (bridging S) with Cr(II): k 1.9e5 vs 19 (Candlin & Halpern 1965, recalled)', () => {
    const sBound = presentScore(rankBridgingCandidates('[Co(NH3)5(SCN)]2+', '[Cr(H2O)6]2+'), 'SCN');
    const nBound = presentScore(rankBridgingCandidates('[Co(NH3)5(NCS)]2+', '[Cr(H2O)6]2+'), 'NCS');
    expect(sBound).toBeGreaterThan(nBound);
  });

  it('hard reductant Eu(II): the halide order reverses, F > Cl > Br > I (Candlin, Halpern & Trimm 1964)', () => {
    const scores = halides.map((x) => presentScore(rankBridgingCandidates(`[Co(NH3)5${x}]2+`, '[Eu(H2O)8]2+'), x));
    const [f, cl, br, i] = scores as [number, number, number, number];
    expect(f).toBeGreaterThan(cl);
    expect(cl).toBeGreaterThan(br);
    expect(br).toBeGreaterThan(i);
  });

  it('lists present ligands once, first, and installable bridges after them, each group best first', () => {
    const candidates = rankBridgingCandidates('[Co(NH3)5Cl]2+', '[Cr(H2O)6]2+');
    expect(candidates.filter((candidate) => candidate.ligand === 'Cl')).toHaveLength(1);
    expect(candidates.find((candidate) => candidate.ligand === 'Cl')?.present).toBe(true);
    expect(candidates.some((candidate) => candidate.ligand === 'NH3')).toBe(false);
    for (const id of ['F', 'Br', 'I', 'OH', 'N3', 'SCN', 'NCS', 'OAc', 'pz']) {
      expect(candidates.find((candidate) => candidate.ligand === id)?.present).toBe(false);
    }
    const firstInstallable = candidates.findIndex((candidate) => !candidate.present);
    expect(candidates.slice(0, firstInstallable).every((candidate) => candidate.present)).toBe(true);
    expect(candidates.slice(firstInstallable).every((candidate) => !candidate.present)).toBe(true);
    for (let k = 1; k < candidates.length; k++) {
      if (candidates[k - 1]!.present !== candidates[k]!.present) continue;
      expect(candidates[k - 1]!.score).toBeGreaterThanOrEqual(candidates[k]!.score);
    }
    for (const candidate of candidates) {
      expect(candidate.score).toBeGreaterThanOrEqual(0);
      expect(candidate.score).toBeLessThanOrEqual(100);
      expect(candidate.donorAtom).toMatch(/^[A-Z][a-z]?$/);
      expect(candidate.reasons.length).toBeGreaterThan(0);
    }
  });

  it('a pyrazine-type bridge is offered with remote attack (common practice)', () => {
    const pz = rankBridgingCandidates('[Co(NH3)6]3+', '[Cr(H2O)6]2+').find((candidate) => candidate.ligand === 'pz');
    expect(pz).toMatchObject({ attack: 'remote', donorAtom: 'N', present: false });
  });
});
