import { eyringRatePerSecond, verdictFromLogK, ONE_MINUTE_LOG_K } from './lability';
import { capitaliseSentence, formatCelsius, formatCelsiusFromKelvin, formatDuration, formatPowerOfTen, formatRecorded } from './number-format';
import type { CitationRef, Classification, LibraryMeasurementRef, Verdict } from './types';

/**
 * Measured decides: when the signed-in person's group holds an accepted measurement of the same
 * species (same metal centre, oxidation state and ligand set), that measurement decides the
 * verdict and the headline; the model's prediction stays beside it as the footnote. Pure: the
 * server (POST /api/classify with groupId) and the app (Check, the entry page) apply the same rule.
 */

/** Measurement kinds that give a first-order lifetime of a bound ligand, in the order they decide. */
export const DECIDING_KINDS = ['water-exchange', 'ligand-exchange', 'substitution', 'half-life'] as const;
export type DecidingKind = (typeof DECIDING_KINDS)[number];

/** Model and measurement this far apart (log10 units) deserve a curator's second look. */
export const SECOND_LOOK_LOG_UNITS = 2;

/** Room temperature, where a measurement that states none is taken to have been made (common practice). */
export const ASSUMED_MEASUREMENT_TEMPERATURE_K = 298.15;

/** A measurement as the library stores it (the fields this rule reads). */
export interface StoredMeasurement {
  kind: string;
  value: number;
  unit: string;
  temperatureK: number | null;
  citation: CitationRef | null;
}

/** An accepted library entry of the same species with its measurements. */
export interface LibraryCandidate {
  entryId: string;
  entryName: string;
  entryFormula: string;
  measurements: readonly StoredMeasurement[];
}

/** Measurements listed one per row with their entry (GET /api/groups/:groupId/measured) → candidates per entry, in order. */
export function candidatesFromRows(
  rows: readonly (StoredMeasurement & { complexId: string; complexName: string; complexFormula: string })[],
): LibraryCandidate[] {
  const byEntry = new Map<string, { entryId: string; entryName: string; entryFormula: string; measurements: StoredMeasurement[] }>();
  for (const row of rows) {
    let candidate = byEntry.get(row.complexId);
    if (!candidate) {
      candidate = { entryId: row.complexId, entryName: row.complexName, entryFormula: row.complexFormula, measurements: [] };
      byEntry.set(row.complexId, candidate);
    }
    const c = row.citation;
    candidate.measurements.push({
      kind: row.kind,
      value: row.value,
      unit: row.unit,
      temperatureK: row.temperatureK,
      citation: c ? { authors: c.authors, title: c.title, journal: c.journal, year: c.year, volume: c.volume, pages: c.pages, doi: c.doi, kind: c.kind, publisher: c.publisher } : null,
    });
  }
  return [...byEntry.values()];
}

/**
 * The first-order rate constant a measurement gives, or null when it cannot decide a lability
 * verdict (second-order constants, potentials, Δo, activation parameters). t½ → k = ln 2 / t½.
 */
export function firstOrderK(measurement: Pick<StoredMeasurement, 'kind' | 'value' | 'unit'>): number | null {
  if (!(measurement.value > 0) || !Number.isFinite(measurement.value)) return null;
  if (measurement.kind === 'half-life') return measurement.unit === 's' ? Math.LN2 / measurement.value : null;
  if ((DECIDING_KINDS as readonly string[]).includes(measurement.kind) && measurement.unit === 's-1') return measurement.value;
  return null;
}

/**
 * The measurement that decides among the accepted entries of the same species: water exchange
 * before ligand exchange, substitution and a half-life; then the one measured nearest the
 * requested temperature; then the first entry in the order given (callers order by entry id).
 */
export function pickDecidingMeasurement(candidates: readonly LibraryCandidate[], temperatureK: number): LibraryMeasurementRef | null {
  let best: { ref: LibraryMeasurementRef; rank: number; distance: number } | null = null;
  for (const candidate of candidates) {
    for (const m of candidate.measurements) {
      const k = firstOrderK(m);
      if (k === null) continue;
      const rank = DECIDING_KINDS.indexOf(m.kind as DecidingKind);
      const measuredAtK = m.temperatureK ?? ASSUMED_MEASUREMENT_TEMPERATURE_K;
      const distance = Math.abs(measuredAtK - temperatureK);
      if (best && (rank > best.rank || (rank === best.rank && distance >= best.distance))) continue;
      best = {
        rank,
        distance,
        ref: {
          entryId: candidate.entryId,
          entryName: candidate.entryName,
          entryFormula: candidate.entryFormula,
          kind: m.kind as DecidingKind,
          kPerSecond: k,
          temperatureK: measuredAtK,
          citation: m.citation,
        },
      };
    }
  }
  return best?.ref ?? null;
}

const BOLTZMANN = 1.380649e-23; // J/K (CODATA 2018, exact)
const PLANCK = 6.62607015e-34; // J s (CODATA 2018, exact)
const GAS_CONSTANT = 8.314462618; // J/(mol K) (CODATA 2018)

/**
 * log10 k at temperatureK from k measured at measuredAtK, with Eyring's equation and the whole
 * barrier taken as enthalpic (ΔS‡ = 0), the same rough correction the engine uses for its own estimate.
 */
export function logKMovedTo(kPerSecond: number, measuredAtK: number, temperatureK: number): number {
  if (Math.abs(measuredAtK - temperatureK) < 1e-9) return Math.log10(kPerSecond);
  const deltaHJ = -GAS_CONSTANT * measuredAtK * Math.log((kPerSecond * PLANCK) / (BOLTZMANN * measuredAtK));
  return Math.log10(eyringRatePerSecond(deltaHJ / 1000, 0, temperatureK));
}

/** "Helm, Merbach, Chem. Rev. 2005, 105, 1923" — authors, journal, year, volume, pages, in one line. */
export function shortCitation(citation: CitationRef | null): string {
  if (!citation) return 'no citation given';
  if (citation.kind === 'book') {
    return [citation.authors, citation.title ?? citation.journal, citation.publisher, citation.year].filter((p) => p !== null && p !== undefined && p !== '').join(', ');
  }
  const parts = [citation.authors, [citation.journal, citation.year ?? undefined].filter((p) => p !== undefined && p !== '').join(' ')];
  if (citation.volume) parts.push(citation.volume);
  if (citation.pages) parts.push(citation.pages);
  return parts.filter((p) => p !== '').join(', ');
}

const KIND_WORDS: Record<DecidingKind, string> = {
  'water-exchange': 'water exchange',
  'ligand-exchange': 'ligand exchange',
  substitution: 'substitution',
  'half-life': 'half-life',
};

function celsius(kelvin: number): string {
  return formatCelsiusFromKelvin(kelvin);
}

/** A measured k as recorded: "2.2 × 10⁻⁹ s⁻¹". */
function kText(k: number): string {
  return `${formatRecorded(k)} s⁻¹`;
}

/** The headline that names the deciding entry and its citation. */
export function libraryHeadline(ref: LibraryMeasurementRef): string {
  return `Measured in your group’s library: ${ref.entryName}, ${KIND_WORDS[ref.kind]} k = ${kText(ref.kPerSecond)} at ${celsius(ref.temperatureK)} (${shortCitation(ref.citation)})`;
}

/**
 * The classification with the library measurement deciding: verdict, rate, half-life and
 * confidence from the measurement (moved to the requested temperature if it was measured at
 * another), reasons that are true for the measurement, and the model's verdict, rate and reasons
 * kept as the footnote (modelVerdict, predictedLogKPerSecond, modelReasons).
 */
export function decideByLibrary(
  result: Classification,
  ref: LibraryMeasurementRef,
): Classification {
  const temperatureK = result.temperatureC + 273.15;
  const logK = logKMovedTo(ref.kPerSecond, ref.temperatureK, temperatureK);
  const verdict: Verdict = verdictFromLogK(logK);
  const halfLifeSeconds = Math.LN2 / 10 ** logK;
  const modelLogK = result.predictedLogKPerSecond ?? result.logKPerSecond;
  const modelVerdict = verdictFromLogK(modelLogK);
  const side = verdict === 'intermediate' ? 'close to' : logK > ONE_MINUTE_LOG_K ? 'faster than' : 'slower than';
  const reasons = [`${libraryHeadline(ref)} decides.`];
  if (Math.abs(ref.temperatureK - temperatureK) > 1e-6) {
    reasons.push(`Moved from ${celsius(ref.temperatureK)} to ${formatCelsius(result.temperatureC)} assuming the whole barrier is enthalpic (ΔS‡ = 0): a rough correction`);
  }
  reasons.push(capitaliseSentence(`${verdict}: k ≈ ${formatPowerOfTen(logK)} s⁻¹, t½ ≈ ${formatDuration(halfLifeSeconds)} (${side} the one-minute line)`));
  reasons.push(`The model alone gives k ≈ ${formatPowerOfTen(modelLogK)} s⁻¹ (${modelVerdict}); it is kept below as the footnote`);
  // The measurement decides: no model range is left beside it (the model stays as the footnote).
  const { halfLifeRangeSeconds: _range, weakClass: _weak, ...model } = result;
  return {
    ...model,
    verdict,
    logKPerSecond: Math.round(logK * 100) / 100,
    halfLifeSeconds,
    confidence: 'high',
    decidedBy: 'library',
    libraryMeasurement: ref,
    modelVerdict,
    predictedLogKPerSecond: Math.round(modelLogK * 100) / 100,
    reasons,
    modelReasons: result.reasons,
  };
}

/**
 * How far the model is from a measurement, in log10 units, both at the measurement's temperature:
 * `modelLogKAtMeasurement` is the engine's predictedLogKPerSecond classified at that temperature.
 */
export function modelGapLogUnits(kPerSecond: number, modelLogKAtMeasurement: number): number {
  return Math.abs(Math.log10(kPerSecond) - modelLogKAtMeasurement);
}

/** True when a curator should give the entry a second look. */
export function needsSecondLook(gapLogUnits: number): boolean {
  return gapLogUnits > SECOND_LOOK_LOG_UNITS;
}
