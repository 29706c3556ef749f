import { render, screen } from '@testing-library/react-native';

import { IdentityCard } from '@/components/check/result-cards';
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
