import type { Classification } from '@/lib/chem/types';

/**
 * The one reason to print under the verdict: what in the electron configuration (or the kind of ion)
 * sets the rate, in the order a coordination chemist would name it. The engine's own reasons are
 * searched, so the sentence is the engine's, not a second wording; the full list stays under "Why".
 */
const DECISIVE: RegExp[] = [
  // Where the model is weak, that is the first thing to say.
  /only an order of magnitude is given|the rate is only a guess/,
  /\d+-electron (organometallic|count)/,
  /square-planar d8/i,
  /Jahn–Teller/,
  /σ-antibonding/,
  /vacant t/i,
  /\bt2g\b|t₂g/,
  /^d0:|^d10:/,
  /f-block ion/,
  /main-group/,
  /oxoanion|macrocycl/i,
  /charge density/,
];

export function keyReason(result: Pick<Classification, 'reasons'>): string | null {
  for (const pattern of DECISIVE) {
    const found = result.reasons.find((reason) => pattern.test(reason));
    if (found) return capitalise(found);
  }
  return null;
}

/**
 * Sentences begin with a capital (the engine writes reasons as list fragments), but symbols keep their
 * case: "d3 with 3+ charge", "f-block ion" and "t2g" stay as they are; only a plain word is raised.
 */
export function capitalise(text: string): string {
  return /^[a-z]{3,}(?![\w])/.test(text) || /^[a-z]{3,}-/.test(text) ? text[0]!.toUpperCase() + text.slice(1) : text;
}

/** "S = 3/2": the total spin of n unpaired electrons. */
export function totalSpin(unpaired: number): string {
  return unpaired % 2 === 0 ? String(unpaired / 2) : `${unpaired}/2`;
}
