import { useMemo } from 'react';
import { classifyFormula } from '@/lib/chem/classify';
import { FormulaError, type Classification, type Geometry } from '@/lib/chem/types';
import type { FormulaProblem } from './formula-input';

export type ClassificationState =
  | { kind: 'empty' }
  | { kind: 'problem'; problem: FormulaProblem }
  | { kind: 'result'; result: Classification };

/** Runs the lability engine in the app itself: it is pure and takes microseconds, so no round trip. */
export function useClassification(formula: string, temperatureC: number, geometry: Geometry | null): ClassificationState {
  return useMemo(() => {
    const trimmed = formula.trim();
    if (!trimmed) return { kind: 'empty' };
    try {
      return { kind: 'result', result: classifyFormula(trimmed, { temperatureC, geometry: geometry ?? undefined }) };
    } catch (error) {
      if (error instanceof FormulaError) {
        // Positions refer to the trimmed text; shift them back onto what the user typed.
        const offset = formula.length - formula.trimStart().length;
        return { kind: 'problem', problem: { message: error.message, position: error.position + offset } };
      }
      throw error;
    }
  }, [formula, temperatureC, geometry]);
}
