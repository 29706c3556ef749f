import { render, screen } from '@testing-library/react-native';
import { TypesetText } from '@/components/ui/typeset-text';

// Formulas in running text are typeset (subscript counts, superscript charges; common practice) and
// the orbital labels keep their words: a screen reader and a copy still read "t2g".
describe('TypesetText', () => {
  it('typesets a formula in a sentence without orbital labels', () => {
    render(<TypesetText testID="t">{'Dissolves to [Cr(H2O)6]3+, so'}</TypesetText>);
    expect(screen.getByTestId('t')).toHaveTextContent('Dissolves to [Cr(H₂O)₆]³⁺, so');
  });

  it('typesets formulas and lowers the orbital subscripts in one sentence', () => {
    render(<TypesetText testID="t">{'[Co(NH3)6]3+ is low-spin d6: t2g⁶, eg empty'}</TypesetText>);
    expect(screen.getByTestId('t')).toHaveTextContent('[Co(NH₃)₆]³⁺ is low-spin d6: t2g⁶, eg empty');
  });
});
