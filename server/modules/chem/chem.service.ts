import type { EntityManager } from '@mikro-orm/postgresql';
import {
  classifyFormula,
  classifyMany,
  type ClassifyManyResult,
} from '@/lib/chem/classify';
import { formationRate, FormationInputError } from '@/lib/chem/formation';
import { decideByLibrary, pickDecidingMeasurement } from '@/lib/chem/library-decision';
import { marcusCrossRate, MarcusInputError, type MarcusInput } from '@/lib/chem/marcus';
import { predictRoute, predictRoutes, RouteInputError } from '@/lib/chem/route';
import { planSequence, SequenceInputError } from '@/lib/chem/sequence-planner';
import { FormulaError, formulaProblemText, GeometryMismatchError, type Classification, type LibraryMeasurementRef } from '@/lib/chem/types';
import type { ClassifyRequest, FormationRequest, MarcusRequest, RouteRequest, SequenceRequest } from '@/lib/schemas/chem';
import { AppError } from '@/server/http/errors';
import { ligandSetKeyOf } from '@/server/modules/library/derive';
import { findLibraryCandidates } from '@/server/modules/library/measured.service';

/** Thin adapters from the engine's typed errors to the API's error shape. */
export function classify(request: ClassifyRequest) {
  const options = { temperatureC: request.temperatureC, geometry: request.geometry };
  if (request.formulas) return classifyMany(request.formulas, options);
  const formula = request.formula ?? '';
  try {
    return classifyFormula(formula, options);
  } catch (error) {
    if (error instanceof GeometryMismatchError) {
      throw new AppError('VALIDATION_FAILED', error.message, { geometry: error.message });
    }
    if (error instanceof FormulaError) {
      throw new AppError(
        'VALIDATION_FAILED',
        `The formula cannot be read: ${error.message}`,
        { formula: formulaProblemText(error.message, error.position) },
        { position: error.position },
      );
    }
    throw error;
  }
}

/**
 * Measured decides: each classified formula whose species (metal, oxidation state, ligand set) the
 * group holds accepted first-order rate measurements for is decided by the best of them
 * (lib/chem/library-decision.ts); the rest keep the engine's answer ('reference' or 'model').
 * One look-up per distinct species.
 */
export async function decideWithLibrary<T extends Classification | ClassifyManyResult[]>(em: EntityManager, groupId: string, answer: T): Promise<T> {
  const lookups = new Map<string, Promise<LibraryMeasurementRef | null>>();
  const decide = async (result: Classification): Promise<Classification> => {
    const key = `${result.metal}|${result.oxidationState}|${ligandSetKeyOf(result.ligands)}|${result.temperatureC}`;
    let found = lookups.get(key);
    if (!found) {
      found = findLibraryCandidates(em, result, groupId).then((candidates) => pickDecidingMeasurement(candidates, result.temperatureC + 273.15));
      lookups.set(key, found);
    }
    const ref = await found;
    return ref ? decideByLibrary(result, ref) : result;
  };
  if (Array.isArray(answer)) {
    // One after the other: a batch of up to 1000 formulas should not take the whole connection pool.
    const items: ClassifyManyResult[] = [];
    for (const item of answer) items.push('error' in item ? item : await decide(item));
    return items as T;
  }
  return (await decide(answer as Classification)) as T;
}

export function route(request: RouteRequest) {
  const options = { temperatureC: request.temperatureC, keepGivenRoles: request.keepGivenRoles };
  if (request.pairs) {
    return predictRoutes(request.pairs.map((pair) => [pair.oxidant, pair.reductant] as const), options);
  }
  try {
    return predictRoute(request.oxidant ?? '', request.reductant ?? '', options);
  } catch (error) {
    if (error instanceof RouteInputError) {
      throw new AppError(
        'VALIDATION_FAILED',
        `The ${error.field} cannot be read: ${error.message}`,
        { [error.field]: error.message },
        { position: error.position },
      );
    }
    throw error;
  }
}

/** Maps the CLI/API field names (dE, T, observed) onto the engine's. */
export function toMarcusInput(request: MarcusRequest): MarcusInput {
  return {
    k11: request.k11,
    k22: request.k22,
    deltaEV: request.dE,
    K12: request.K12,
    temperatureC: request.T,
    observedK12: request.observed,
    workTerms:
      request.ionicStrength !== undefined && request.charges
        ? { ionicStrengthM: request.ionicStrength, charges: request.charges }
        : undefined,
  };
}

const marcusFieldNames: Record<string, string> = { deltaEV: 'dE', temperatureC: 'T', observedK12: 'observed' };

export function marcus(request: MarcusRequest) {
  try {
    return marcusCrossRate(toMarcusInput(request));
  } catch (error) {
    if (error instanceof MarcusInputError) {
      const field = marcusFieldNames[error.field] ?? error.field;
      throw new AppError('VALIDATION_FAILED', `The Marcus input is not valid: ${error.message}`, { [field]: error.message });
    }
    throw error;
  }
}

const formationFieldNames: Record<string, string> = { ionicStrength: 'I', temperature: 'T', contactDistance: 'a' };

/** The Eigen–Wilkins estimate; engine input errors become 400s naming the field (and the character). */
export function formation(request: FormationRequest) {
  try {
    return formationRate(request.complex, request.ligand, { ionicStrengthM: request.I, temperatureC: request.T, contactDistanceAngstrom: request.a });
  } catch (error) {
    if (error instanceof FormationInputError) {
      const field = formationFieldNames[error.field] ?? error.field;
      throw new AppError(
        'VALIDATION_FAILED',
        `The ${field === 'complex' ? 'complex' : field === 'ligand' ? 'entering ligand' : field} cannot be used: ${error.message}`,
        { [field]: error.message },
        error.position !== null ? { position: error.position } : undefined,
      );
    }
    throw error;
  }
}

/** The square-planar sequence plan; input errors become 400s naming the start or the ligand at fault. */
export function sequence(request: SequenceRequest) {
  try {
    return planSequence(request.start, request.ligands);
  } catch (error) {
    if (error instanceof SequenceInputError) {
      throw new AppError(
        'VALIDATION_FAILED',
        `The ${error.field === 'start' ? 'start complex' : 'entering ligands'} cannot be used: ${error.message}`,
        { [error.field]: error.message },
        error.position !== null ? { position: error.position } : undefined,
      );
    }
    throw error;
  }
}
