// Turns the forecast's pmf into the bars the odds chart draws.

export interface ShowsBar {
  /** Number of people who show. */
  shows: number;
  /** P(shows = k), as a fraction. */
  p: number;
  /** More shows than seats: someone would be without a seat. */
  over: boolean;
}

/** Bars below this probability are invisible at chart scale; they are left out so the likely range fills the width. */
const VISIBLE_FROM = 1e-4;

/**
 * The bars worth drawing: from the first to the last k with a visible probability, always including the capacity
 * and one bar past it so the seat line sits inside the chart.
 */
export function showsBars(pmf: readonly number[], capacity: number): ShowsBar[] {
  if (pmf.length === 0) return [];
  let lo = pmf.findIndex((p) => p >= VISIBLE_FROM);
  let hi = pmf.length - 1;
  while (hi > 0 && pmf[hi] < VISIBLE_FROM) hi--;
  if (lo === -1) {
    lo = 0;
    hi = pmf.length - 1;
  }
  lo = Math.max(0, Math.min(lo, capacity - 1));
  hi = Math.min(pmf.length - 1, Math.max(hi, capacity + 1));
  const bars: ShowsBar[] = [];
  for (let k = lo; k <= hi; k++) bars.push({ shows: k, p: pmf[k] ?? 0, over: k > capacity });
  return bars;
}

/** The single most likely number of shows. */
export function mostLikelyShows(pmf: readonly number[]) {
  let best = 0;
  for (let k = 1; k < pmf.length; k++) if (pmf[k] > pmf[best]) best = k;
  return best;
}
