import { useMemo } from 'react';
import { findCouple } from '@/lib/chem/redox-couples';
import { predictRoute, RouteInputError } from '@/lib/chem/route';
import type { RouteResult } from '@/lib/chem/route-types';
import type { MarcusForm } from '@/lib/schemas/chem';
import type { FormulaProblem } from '@/components/check/formula-input';

export type RouteState =
  | { kind: 'incomplete' }
  | { kind: 'problem'; field: 'oxidant' | 'reductant'; problem: FormulaProblem }
  | { kind: 'result'; result: RouteResult; marcusPrefill: MarcusForm };

/** The route engine runs in the app (pure, sub-millisecond); the API offers the same for scripts. */
export function useRoute(oxidant: string, reductant: string): RouteState {
  return useMemo(() => {
    if (!oxidant.trim() || !reductant.trim()) return { kind: 'incomplete' };
    try {
      const result = predictRoute(oxidant.trim(), reductant.trim());
      return { kind: 'result', result, marcusPrefill: marcusPrefill(result) };
    } catch (error) {
      if (error instanceof RouteInputError) {
        const typed = error.field === 'oxidant' ? oxidant : reductant;
        const offset = typed.length - typed.trimStart().length;
        return {
          kind: 'problem',
          field: error.field,
          problem: { message: error.message.replace(/ \(at character \d+\)$/, ''), position: (error.position ?? 0) + offset },
        };
      }
      throw error;
    }
  }, [oxidant, reductant]);
}

/** Self-exchange constants and potentials of the two couples, where the couples table knows them. */
function marcusPrefill(result: RouteResult): MarcusForm {
  const lookup = (formula: string) => {
    try {
      return findCouple(formula)?.couple ?? null;
    } catch {
      return null;
    }
  };
  const ox = lookup(result.oxidant.formula);
  const red = lookup(result.reductant.formula);
  const e0ox = ox?.e0?.volts;
  const e0red = red?.e0?.volts;
  return {
    k11: ox?.k11 ? String(ox.k11.valuePerMolarSecond) : '',
    k22: red?.k11 ? String(red.k11.valuePerMolarSecond) : '',
    dE: e0ox !== undefined && e0red !== undefined ? (e0ox - e0red).toFixed(3) : '',
    T: '25',
    observed: '',
  };
}
