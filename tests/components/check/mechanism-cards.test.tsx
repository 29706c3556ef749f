import { fireEvent, render, screen } from '@testing-library/react-native';
import { IncomingLigandCard } from '@/components/check/incoming-ligand-card';
import { MechanismCard } from '@/components/check/mechanism-card';
import { classifyFormula } from '@/lib/chem/classify';

describe('MechanismCard', () => {
  // Ducommun, Earl & Merbach, Inorg. Chem. 1979: ΔV‡ = +7.1 cm³ mol⁻¹ for water exchange on Ni(II), Id (recalled).
  it('shows the class, the measured evidence and the pathway picture', () => {
    render(<MechanismCard result={classifyFormula('[Ni(H2O)6]2+')} />);
    expect(screen.getByTestId('mechanism-class')).toHaveTextContent('Id');
    expect(screen.getByTestId('mechanism-evidence')).toHaveTextContent(/measured · ΔV‡ = \+7\.1/);
    expect(screen.getByTestId('mechanism-picture')).toBeTruthy();
  });

  it('says when the class comes from a trend, and lists base hydrolysis for a Co(III) amine with a leaving group', () => {
    render(<MechanismCard result={classifyFormula('[Co(NH3)5Cl]2+')} />);
    expect(screen.getByTestId('mechanism-evidence')).toHaveTextContent(/from the trend/);
    expect(screen.getByTestId('mechanism-base-hydrolysis')).toHaveTextContent(/k_OH\[complex\]\[OH⁻\]/);
  });
});

describe('IncomingLigandCard', () => {
  it('gives nothing until a ligand is picked, then the formation rate with the published comparison', () => {
    render(<IncomingLigandCard result={classifyFormula('[Ni(H2O)6]2+')} />);
    expect(screen.queryByTestId('incoming-ligand-result')).toBeNull();
    fireEvent.press(screen.getByTestId('incoming-ligand-NH3'));
    // Published k_f 5e3 M⁻¹ s⁻¹ (Wilkins 1991, recalled); the estimate K_os·0.75·k_ex ≈ 3.9e3.
    expect(screen.getByTestId('incoming-ligand-kf')).toHaveTextContent(/k_f ≈ 3\.9 × 10³|k_f ≈ 39\d\d/);
    expect(screen.getByTestId('incoming-ligand-published')).toHaveTextContent(/5\.0 × 10³|5000/);
  });

  it('says what is wrong with an unknown ligand', () => {
    render(<IncomingLigandCard result={classifyFormula('[Ni(H2O)6]2+')} />);
    fireEvent.changeText(screen.getByTestId('incoming-ligand-input'), 'XYZ');
    expect(screen.getByText(/"XYZ" is not in the ligand table/)).toBeTruthy();
  });
});
