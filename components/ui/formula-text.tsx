import { toDisplayFormula } from '@/lib/chem/display-formula';
import { AppText, type AppTextProps } from './text';

export interface FormulaTextProps {
  /** Formula as typed, e.g. "[Co(NH3)6]3+". */
  formula: string;
  variant?: AppTextProps['variant'];
  tone?: AppTextProps['tone'];
  testID?: string;
}

/** A coordination formula with real subscripts and superscripts (Unicode characters, which the app's typefaces carry). */
export function FormulaText({ formula, variant = 'mono', tone, testID }: FormulaTextProps) {
  return (
    <AppText variant={variant} tone={tone} accessibilityLabel={formula} testID={testID}>
      {toDisplayFormula(formula)}
    </AppText>
  );
}
