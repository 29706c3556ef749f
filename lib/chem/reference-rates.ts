import measuredRates from '@/data/measured-rates.json';

export interface ReferenceRate {
  species: string;
  logKPerSecond: number;
  source: string;
}

/** Published exchange constants (data/measured-rates.json) as landmarks for the lability scale. */
export const referenceRates: readonly ReferenceRate[] = measuredRates.rates.map((rate) => ({
  species: rate.species,
  logKPerSecond: Math.log10(rate.kPerSecond),
  source: rate.source,
}));

/** The landmarks nearest to a log k, nearest first (for placing a complex among known ones). */
export function nearestReferenceRates(logKPerSecond: number, count = 4, exclude?: string): ReferenceRate[] {
  return referenceRates
    .filter((rate) => rate.species !== exclude)
    .map((rate) => ({ rate, distance: Math.abs(rate.logKPerSecond - logKPerSecond) }))
    .sort((a, b) => a.distance - b.distance)
    .slice(0, count)
    .map(({ rate }) => rate);
}
