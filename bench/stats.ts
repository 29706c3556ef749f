/** Small statistics helpers for the bench: medians and percentiles over repeated runs. */

export function median(values: readonly number[]): number {
  return percentile(values, 50);
}

/** Linear-interpolated percentile (0–100) of the values; NaN for an empty list. */
export function percentile(values: readonly number[], p: number): number {
  if (values.length === 0) return Number.NaN;
  const sorted = [...values].sort((a, b) => a - b);
  const rank = (p / 100) * (sorted.length - 1);
  const low = Math.floor(rank);
  const high = Math.ceil(rank);
  const lowValue = sorted[low] ?? Number.NaN;
  const highValue = sorted[high] ?? lowValue;
  return lowValue + (highValue - lowValue) * (rank - low);
}

export function round(value: number, digits = 0): number {
  const factor = 10 ** digits;
  return Math.round(value * factor) / factor;
}

/** "253 k/s", "1.2 M/s" style for rates. */
export function formatRate(perSecond: number, unit = '/s'): string {
  if (!Number.isFinite(perSecond)) return 'n/a';
  if (perSecond >= 1e6) return `${(perSecond / 1e6).toFixed(2)} M${unit}`;
  if (perSecond >= 1e4) return `${Math.round(perSecond / 1e3)} k${unit}`;
  if (perSecond >= 1e3) return `${(perSecond / 1e3).toFixed(1)} k${unit}`;
  return `${perSecond.toFixed(perSecond < 10 ? 1 : 0)}${unit}`;
}

export function formatBytes(bytes: number): string {
  if (bytes >= 1024 * 1024) return `${(bytes / 1024 / 1024).toFixed(2)} MB`;
  return `${(bytes / 1024).toFixed(0)} KB`;
}
