import { parseFormula } from '@/lib/chem/formula-parser';
import { couplesNotIndexed, findCouple, listCouples } from '@/lib/chem/redox-couples';
import { isRouteError, predictRoute, predictRoutes, RouteInputError } from '@/lib/chem/route';

// Check values and their sources:
// - Cr(II) reductions of [Co(NH3)5X]: bridged, Cr–X product formed — J. P. Candlin, J. Halpern & D. L. Trimm,
//   J. Am. Chem. Soc. 1964, 86, 1019 (halides); J. P. Candlin & J. Halpern, Inorg. Chem. 1965, 4, 766 (N3, NCS, OH),
//   as in the electron-transfer reference notes section c.
// - Outer-sphere signs (no bridging lone pair, both partners inert, no ligand transfer): SCIENCE.md trap 5 and
//   electron_transfer.json section c, note_on_reversed_halide_order.
// - [Ru(NH3)6]2+ as an outer-sphere reductant of Co(III) ammines: J. F. Endicott & H. Taube, J. Am. Chem. Soc. 1964,
//   86, 1686 (electron_transfer.json section c).

const CR2 = '[Cr(H2O)6]2+';

describe('redox-couples table', () => {
  it('every couple formula is readable by the parser, except ligands the catalogue lacks (tacn)', () => {
    const unreadable = couplesNotIndexed().map((entry) => entry.coupleId);
    expect(unreadable.filter((id) => id !== 'ru-bis-tacn')).toEqual([]);
  });

  it('every record carries a source, and every value its own source', () => {
    for (const couple of listCouples()) {
      expect(couple.source.length).toBeGreaterThan(5);
      if (couple.k11) expect(couple.k11.source.length).toBeGreaterThan(5);
      if (couple.e0) expect(couple.e0.source.length).toBeGreaterThan(5);
    }
  });

  it('values copied from electron_transfer.json section a (Silverman & Dodson 1952; Harris / Bard et al. 1985)', () => {
    const fe = findCouple('[Fe(H2O)6]3+');
    expect(fe?.couple.k11?.valuePerMolarSecond).toBe(4.0);
    expect(fe?.couple.e0?.volts).toBeCloseTo(0.771, 3);
    expect(findCouple('[Cr(H2O)6]2+')?.couple.e0?.volts).toBeCloseTo(-0.41, 2);
    expect(findCouple('[Fe(CN)6]3-')?.couple.e0?.volts).toBeCloseTo(0.356, 3);
  });

  it('finds a couple from either oxidation state, by composition and charge, not by spelling', () => {
    expect(findCouple('[Fe(OH2)6]3+')).toMatchObject({ side: 'oxidised', couple: { id: 'fe-aqua' } });
    expect(findCouple('[Fe(H2O)6]2+')).toMatchObject({ side: 'reduced', couple: { id: 'fe-aqua' } });
    expect(findCouple('K4[Fe(CN)6]')).toMatchObject({ side: 'reduced', couple: { id: 'fe-hexacyano' } });
    expect(findCouple('[Ru(NH3)6]Cl3')).toMatchObject({ side: 'oxidised', couple: { id: 'ru-hexaammine' } });
    expect(findCouple(parseFormula('[Eu(H2O)9]2+'))).toMatchObject({ side: 'reduced', couple: { id: 'eu-aqua' } });
    expect(findCouple('[Co(NH3)5Cl]2+')).toBeNull();
  });
});

describe('predictRoute: bridged (inner-sphere) pairs', () => {
  it.each([
    ['[Co(NH3)5F]2+', 'F'],
    ['[Co(NH3)5Cl]2+', 'Cl'],
    ['[Co(NH3)5Br]2+', 'Br'],
    ['[Co(NH3)5I]2+', 'I'],
    ['[Co(NH3)5(N3)]2+', 'N3'],
    ['[Co(NH3)5(SCN)]2+', 'SCN'],
    ['[Co(NH3)5(NCS)]2+', 'NCS'],
    ['[Co(NH3)5(OH)]2+', 'OH'],
  ])('%s + Cr(II) ⇒ inner-sphere through %s (Candlin, Halpern & Trimm 1964; Candlin & Halpern 1965)', (oxidant, bridge) => {
    const result = predictRoute(oxidant, CR2);
    expect(result.route).toBe('inner-sphere');
    expect(result.transferredLigand?.ligand).toBe(bridge);
    expect(result.bridgeHost).toBe('oxidant');
    expect(result.bridgingCandidates[0]).toEqual(expect.objectContaining({ ligand: expect.any(String), donorAtom: expect.any(String), score: expect.any(Number) }));
    expect(result.bridgingCandidates.find((candidate) => candidate.ligand === bridge)?.present).toBe(true);
  });

  it('[Co(NH3)5Cl]2+ + Cr(II): Cl ends on inert Cr(III); Co(II) falls apart in acid (Cr–X product: Candlin, Halpern & Trimm 1964)', () => {
    const result = predictRoute('[Co(NH3)5Cl]2+', CR2);
    const products = result.expectedProducts.join(' | ');
    expect(products).toContain('[Cr(H2O)5Cl]2+');
    expect(products).toContain('[Co(H2O)6]2+');
    expect(products).toContain('5 NH4+');
    expect(result.transferredLigand).toMatchObject({ ligand: 'Cl', bridgingAtom: 'Cl', attack: 'adjacent', to: '[Cr(H2O)5Cl]2+' });
    expect(result.oxidant.metal).toBe('Co');
    expect(result.reductant.metal).toBe('Cr');
    expect(result.marcus).toBeNull();
  });

  it('S-bound thiocyanate bridges remotely and leaves N-bound thiocyanate on Cr(III) (Candlin & Halpern 1965)', () => {
    const result = predictRoute('[Co(NH3)5(SCN)]2+', CR2);
    expect(result.transferredLigand).toMatchObject({ attack: 'remote', bridgingAtom: 'N', to: '[Cr(H2O)5(NCS)]2+' });
  });

  it('cautions of both partners are merged', () => {
    const result = predictRoute('[Co(NH3)5Cl]2+', CR2);
    for (const caution of [...result.oxidant.cautions, ...result.reductant.cautions]) expect(result.cautions).toContain(caution);
    expect(new Set(result.cautions).size).toBe(result.cautions.length);
  });
});

describe('predictRoute: outer-sphere pairs', () => {
  it('[Co(NH3)6]3+ + Cr(II) ⇒ outer-sphere: no bridging lone pair (electron_transfer.json section c)', () => {
    const result = predictRoute('[Co(NH3)6]3+', CR2);
    expect(result.route).toBe('outer-sphere');
    expect(result.transferredLigand).toBeNull();
    expect(result.expectedProducts.join(' ')).toContain('[Cr(H2O)6]3+');
    expect(result.reasons.join(' ')).toMatch(/lone pair/);
    // The finder still proposes bridges to install (none present).
    expect(result.bridgingCandidates.length).toBeGreaterThan(0);
    expect(result.bridgingCandidates.every((candidate) => !candidate.present)).toBe(true);
  });

  it.each(['[Co(en)3]3+', '[Ru(NH3)6]3+', '[Fe(phen)3]3+'])('%s + Cr(II) ⇒ outer-sphere (no bridgeable ligand; common practice)', (oxidant) => {
    expect(predictRoute(oxidant, CR2).route).toBe('outer-sphere');
  });

  it('tris-chelates [Co(phen)3]3+ + [Fe(bpy)3]2+ ⇒ outer-sphere (SCIENCE.md trap 5: both inert, no bridge)', () => {
    expect(predictRoute('[Co(phen)3]3+', '[Fe(bpy)3]2+').route).toBe('outer-sphere');
  });

  it.each([
    ['[IrCl6]2-', '[Fe(CN)6]4-'],
    ['[Co(phen)3]3+', '[Ru(NH3)6]2+'],
    ['[Co(NH3)5Cl]2+', '[Ru(NH3)6]2+'],
  ])('both substitution-inert: %s + %s ⇒ outer-sphere (SCIENCE.md trap 5; Endicott & Taube 1964)', (oxidant, reductant) => {
    const result = predictRoute(oxidant, reductant);
    expect(result.route).toBe('outer-sphere');
    expect(result.reasons.join(' ')).toMatch(/inert/);
  });
});

describe('predictRoute: hard and moderately labile reductants', () => {
  it('Eu(II): reversed halide order but still not outer-sphere (SCIENCE.md trap 5; Candlin, Halpern & Trimm 1964)', () => {
    const result = predictRoute('[Co(NH3)5F]2+', '[Eu(H2O)8]2+');
    expect(result.route).not.toBe('outer-sphere');
    const halides = result.bridgingCandidates.filter((candidate) => ['F', 'Cl', 'Br', 'I'].includes(candidate.ligand)).map((c) => c.ligand);
    expect(halides).toEqual(['F', 'Cl', 'Br', 'I']);
    expect(result.reasons.join(' ')).toMatch(/not an outer-sphere signature/);
  });

  it('V(II) with a bridgeable oxidant ⇒ either (V(II) reductions often substitution-controlled; common practice)', () => {
    const result = predictRoute('[Co(NH3)5Cl]2+', '[V(H2O)6]2+');
    expect(result.route).toBe('either');
  });

  // The aqua complex reacts with Cr(II) through its hydroxo form, oxygen transferred (18O tracer:
  // Murmann, Taube & Posey, J. Am. Chem. Soc. 1957, 79, 262 — recalled): inner-sphere at low acid.
  it('aqua ligand only ⇒ inner-sphere through the hydroxo path, acid dependence stated (electron_transfer.json OH_vs_H2O_diagnostic)', () => {
    const result = predictRoute('[Co(NH3)5(OH2)]3+', CR2);
    expect(result.route).toBe('inner-sphere');
    expect(result.reasons.join(' ')).toMatch(/hydroxide|hydroxo/);
    expect(result.reasons.join(' ')).toMatch(/1\/\[H\+\]/);
  });

  it('a main-group reductant gets an answer and a note', () => {
    const result = predictRoute('[Co(NH3)5Cl]2+', '[SnCl4]2-');
    expect(['inner-sphere', 'outer-sphere', 'either']).toContain(result.route);
  });
});

describe('roles, non-redox pairs and Marcus', () => {
  it('order reversed from the potentials: [Fe(H2O)6]2+ given first, [Ru(bpy)3]3+ second (E° 0.771 and 1.26 V, electron_transfer.json)', () => {
    const result = predictRoute('[Fe(H2O)6]2+', '[Ru(bpy)3]3+');
    expect(result.roles).toMatchObject({ oxidant: 'from-potentials', swapped: true });
    expect(result.oxidant.metal).toBe('Ru');
    expect(result.reductant.metal).toBe('Fe');
    expect(result.route).toBe('outer-sphere');
    // electron_transfer.json section b, computed block: k12 1.194e8, f12 0.04602, K12 1.844e8.
    expect(result.marcus?.k12).toBeGreaterThan(1.194e8 * (1 - 5e-4));
    expect(result.marcus?.k12).toBeLessThan(1.194e8 * (1 + 5e-4));
    expect(result.marcus?.f12).toBeCloseTo(0.04602, 4);
  });

  it('[Ru(NH3)6]3+ + [V(H2O)6]2+: Marcus k12 ≈ 2390 M⁻¹ s⁻¹ (electron_transfer.json section b)', () => {
    const result = predictRoute('[Ru(NH3)6]3+', '[V(H2O)6]2+');
    expect(result.roles.oxidant).toBe('from-potentials');
    expect(result.roles.swapped).toBe(false);
    expect(Math.abs((result.marcus?.k12 ?? 0) - 2390) / 2390).toBeLessThan(5e-4);
    expect(result.route).toBe('outer-sphere');
  });

  it('a known reduced form given as the oxidant is moved to the reductant slot', () => {
    const result = predictRoute(CR2, '[Co(NH3)5Cl]2+');
    expect(result.roles).toMatchObject({ oxidant: 'from-oxidation-states', swapped: true });
    expect(result.oxidant.metal).toBe('Co');
    expect(result.route).toBe('inner-sphere');
    expect(predictRoute('[Co(NH3)5Cl]2+', CR2, { keepGivenRoles: true }).roles.swapped).toBe(false);
  });

  it('self-exchange pair: k12 = k11 (identity; K12 = 1)', () => {
    const result = predictRoute('[Ru(NH3)6]2+', '[Ru(NH3)6]3+');
    expect(result.oxidant.oxidationState).toBe(3);
    expect(result.marcus?.k12).toBe(4300);
  });

  it('the same formula twice: not a redox pair, still answered', () => {
    const result = predictRoute('[Co(NH3)6]3+', '[Co(NH3)6]3+');
    expect(result.redoxPair).toBe(false);
    expect(result.reasons.join(' ')).toMatch(/same species/i);
    expect(result.marcus).toBeNull();
  });

  it('same oxidation states: not a redox pair, still answered', () => {
    const result = predictRoute('[Co(NH3)5Cl]2+', '[Co(NH3)6]3+');
    expect(result.redoxPair).toBe(false);
    expect(result.reasons.join(' ')).toMatch(/same oxidation state/i);
  });

  it('both oxidised forms: not a redox pair', () => {
    const result = predictRoute('[IrCl6]2-', '[Fe(CN)6]3-');
    expect(result.redoxPair).toBe(false);
  });
});

describe('bad input', () => {
  it('a bad formula names the partner and the character position', () => {
    expect(() => predictRoute('[Co(NH3)5Qq]2+', CR2)).toThrow(RouteInputError);
    try {
      predictRoute('[Co(NH3)5Cl]2+', '[Cr(H2O)6');
    } catch (error) {
      expect(error).toBeInstanceOf(RouteInputError);
      expect((error as RouteInputError).field).toBe('reductant');
      expect(typeof (error as RouteInputError).position).toBe('number');
    }
  });

  it('predictRoutes keeps the order and reports errors in place', () => {
    const results = predictRoutes([
      ['[Co(NH3)5Cl]2+', CR2],
      ['[Co(NH3)5Qq]2+', CR2],
      ['[Co(NH3)6]3+', CR2],
    ]);
    expect(results).toHaveLength(3);
    expect(isRouteError(results[0]!)).toBe(false);
    const bad = results[1]!;
    expect(isRouteError(bad) && bad.field === 'oxidant' && typeof bad.position === 'number').toBe(true);
    expect(isRouteError(results[2]!) ? null : results[2]!.route).toBe('outer-sphere');
  });
});
