/** Nearest-rank percentile (the smallest value with at least p % of the samples at or below it); NaN when empty. */
export function percentile(samples: readonly number[], p: number): number {
  if (!samples.length) return NaN;
  const sorted = Float64Array.from(samples).sort();
  const rank = Math.max(1, Math.ceil((p / 100) * sorted.length));
  return sorted[rank - 1];
}

export const ms = (value: number) => (Number.isFinite(value) ? `${Math.round(value)} ms` : 'n/a');
