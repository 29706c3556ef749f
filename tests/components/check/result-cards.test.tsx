import { fireEvent, render, screen } from '@testing-library/react-native';

import { CautionsCard, IdentityCard, LigandFieldCard, VerdictCard } from '@/components/check/result-cards';
import { classifyFormula } from '@/lib/chem/classify';

describe('IdentityCard says how a formula was read', () => {
  // Commercial green CrCl3·6H2O is trans-[CrCl2(H2O)4]Cl·2H2O (Dance & Freeman, Inorg. Chem. 1965, 4, 1555 — recalled).
  it('shows the solid’s complex a hydrate was read as', () => {
    render(<IdentityCard result={classifyFormula('CrCl3·6H2O')} />);
    const readAs = screen.getByTestId('read-as');
    expect(screen.getByText('Read as the solid’s complex')).toBeTruthy();
    expect(readAs).toBeTruthy();
    expect(screen.getByText('trans-[CrCl₂(H₂O)₄]Cl·2H₂O')).toBeTruthy();
  });

  it('shows what was assumed for a complex written without a charge', () => {
    render(<IdentityCard result={classifyFormula('[Fe(H2O)6]')} />);
    expect(screen.getByTestId('formula-warning').props.children).toMatch(/taken as neutral.*Fe\(0\)/);
  });

  // Creutz–Taube ion: Ru(II)/Ru(III) bridged by pyrazine (Creutz & Taube, J. Am. Chem. Soc. 1969, 91, 3988).
  it('lists both centres of a bridged dinuclear species', () => {
    render(<IdentityCard result={classifyFormula('[(NH3)5Ru(μ-pz)Ru(NH3)5]5+')} />);
    expect(screen.getByText(/Centre 1 · Ru\(III\)/)).toBeTruthy();
    expect(screen.getByText(/Centre 2 · Ru\(II\)/)).toBeTruthy();
  });

  it('shows nothing extra for a formula read as written', () => {
    render(<IdentityCard result={classifyFormula('[Co(NH3)6]Cl3')} />);
    expect(screen.queryByTestId('read-as')).toBeNull();
    expect(screen.queryByTestId('formula-warning')).toBeNull();
  });
});

describe('VerdictCard: the verdict as the hero', () => {
  it('leads with the word, the half-life and one reason, and says what decided it', () => {
    // [Ni(H2O)6]2+: labile; two e_g electrons weaken the bonds (common practice: Basolo & Pearson's e_g rule).
    render(<VerdictCard result={classifyFormula('[Ni(NH3)6]2+')} />);
    const hero = screen.getByTestId('verdict-card');
    expect(hero).toHaveTextContent(/^Verdict\s*labile/);
    expect(screen.getByTestId('verdict-rate')).toHaveTextContent(/^t½ ≈ .+ at 25 °C · k ≈ /);
    expect(screen.getByTestId('verdict-key-reason')).toHaveTextContent(/σ-antibonding/);
    expect(screen.getByTestId('verdict-confidence')).toHaveTextContent(/^decided by the model: predicted · \w+ confidence/);
  });

  it('keeps the derivation under a "Why" toggle: closed when asked (phones), opened by a tap', () => {
    render(<VerdictCard result={classifyFormula('[Co(NH3)5Cl]Cl2')} whyOpenInitially={false} />);
    const toggle = screen.getByTestId('verdict-why-toggle');
    expect(screen.queryByTestId('verdict-reasons')).toBeNull();
    expect(toggle.props.accessibilityState).toMatchObject({ expanded: false });
    expect(toggle).toHaveTextContent(/Show \d+ reasons/);
    fireEvent.press(toggle);
    expect(screen.getByTestId('verdict-reasons')).toBeTruthy();
    expect(screen.getByTestId('verdict-why-toggle').props.accessibilityState).toMatchObject({ expanded: true });
  });

  it('prints the citation of a published measurement once', () => {
    // [Cr(H2O)6]3+ water exchange, k = 2.4 × 10⁻⁶ s⁻¹ (Xu, Krouse & Swaddle, Inorg. Chem. 1985, 24, 267).
    const result = classifyFormula('[Cr(H2O)6]3+');
    expect(result.measured).not.toBeNull();
    render(<VerdictCard result={result} />);
    expect(screen.getAllByText(/Inorg\. Chem\. 1985/)).toHaveLength(1);
  });
});

describe('LigandFieldCard and IdentityCard details', () => {
  it('shows one LFSE label, with Dq and kJ mol⁻¹ together', () => {
    render(<LigandFieldCard result={classifyFormula('[Cr(NH3)6]3+')} />);
    expect(screen.getAllByText('LFSE')).toHaveLength(1);
  });

  it.each([
    // Octahedral d3 is t2g³ and octahedral d8 t2g⁶e_g²: one arrangement each, with 3 and 2 unpaired
    // electrons (common practice: Hund's rule; no high/low-spin choice for these counts).
    ['[Cr(NH3)6]3+', /3 unpaired, S = 3\/2/],
    ['[Ni(NH3)6]2+', /2 unpaired, S = 1/],
  ])('says what the spin is for %s instead of a dash', (formula, spin) => {
    render(<IdentityCard result={classifyFormula(formula)} />);
    expect(screen.getByTestId('identity-card')).toHaveTextContent(spin);
    expect(screen.getByTestId('identity-card')).not.toHaveTextContent(/Spin\s*—/);
  });

  it('states under Safety that no caution is flagged, never that the compound is safe', () => {
    render(<CautionsCard result={classifyFormula('[Cr(NH3)6]3+')} />);
    expect(screen.getByTestId('no-cautions')).toHaveTextContent(/not a clearance/);
  });
});
