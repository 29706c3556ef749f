import { render, screen } from '@testing-library/react-native';

import { FormulaText } from '@/components/ui/formula-text';

// Display forms written out by hand (IUPAC Red Book 2005, IR-4 formula style — common practice).
describe('FormulaText', () => {
  it('shows subscripts and the charge as superscripts, and speaks the formula as typed', () => {
    render(<FormulaText formula="[Co(NH3)6]3+" />);
    expect(screen.getByText('[Co(NH₃)₆]³⁺')).toBeTruthy();
    expect(screen.getByLabelText('[Co(NH3)6]3+')).toBeTruthy();
  });

  it('keeps the hydrate coefficient and ligand abbreviations as written', () => {
    render(<FormulaText formula="K3[Cr(ox)3].3H2O" variant="title" />);
    expect(screen.getByText('K₃[Cr(ox)₃]·3H₂O')).toBeTruthy();
  });
});
