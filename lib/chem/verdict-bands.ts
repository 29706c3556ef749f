import type { Verdict } from './types';

/**
 * The three verdicts, defined once. Taube's criterion (H. Taube, Chem. Rev. 1952, 50, 69): a complex
 * is labile when its ligands are replaced within about a minute at 25 °C (0.1 M); anything slower is
 * inert. Sphereline marks the first few minutes of Taube's inert side apart, because a complex
 * replaced within about five minutes is "inert" on paper but changes while it is being handled:
 *
 *   labile        t½ < 1 min
 *   intermediate  1 min ≤ t½ < 5 min   (inert in Taube's sense, but only just)
 *   inert         t½ ≥ 5 min
 *
 * The one-minute line is therefore a band edge, never inside a band: a 39 s half-life is labile
 * everywhere the app shows it.
 */
export const LABILE_BELOW_SECONDS = 60;
export const INERT_FROM_SECONDS = 300;

/** log10 k (s⁻¹, first order) at the band edges: t½ = ln 2 / k. */
export const ONE_MINUTE_LOG_K = Math.log10(Math.LN2 / LABILE_BELOW_SECONDS);
export const FIVE_MINUTE_LOG_K = Math.log10(Math.LN2 / INERT_FROM_SECONDS);

export function verdictFromHalfLife(halfLifeSeconds: number): Verdict {
  if (halfLifeSeconds < LABILE_BELOW_SECONDS) return 'labile';
  if (halfLifeSeconds < INERT_FROM_SECONDS) return 'intermediate';
  return 'inert';
}

export function verdictFromLogK(logK: number): Verdict {
  return verdictFromHalfLife(Math.LN2 / 10 ** logK);
}

/** The definition shown beside every verdict (one sentence each, product copy). */
export const VERDICT_DEFINITIONS: Record<Verdict, string> = {
  labile: 'Labile: half of the ligands are replaced in under a minute at 25 °C (Taube’s criterion).',
  intermediate: 'Intermediate: half of the ligands are replaced in one to five minutes at 25 °C (inert by Taube’s criterion, but only just).',
  inert: 'Inert: half of the ligands take five minutes or more to be replaced at 25 °C.',
};

/** All three bands in one line, for legends and footnotes. */
export const VERDICT_BANDS_TEXT = 'Labile: t½ under 1 min at 25 °C (Taube). Intermediate: 1 to 5 min. Inert: 5 min or more.';
