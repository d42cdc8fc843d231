import { learnShowRates, lookupRate, type LearnOptions } from './learn';

/** Minutes before departure at which the share of eventual shows already checked in is learned. */
export const CHECK_IN_GRID = [1440, 720, 240, 180, 120, 60, 45, 30] as const;

/** One segment's shows and how many of them had checked in by each point of `grid`. */
export interface CheckInHistory {
  segment: string[];
  showed: number;
  /** checkedInBy[k]: shows already checked in at grid[k] minutes before departure. */
  checkedInBy: number[];
}

/**
 * The check-in curve (share of eventual shows checked in by each time before departure), learned per segment the
 * way show rates are: at each grid point the share is a rate over the segment's shows, shrunk toward the wider
 * levels by `learnShowRates`. A curve never falls as departure nears, so each point is raised to at least the one
 * before it. Returns [minutes, share] pairs from most to fewest minutes, for each segment key and wider level.
 */
export function learnCheckInCurve(
  history: CheckInHistory[],
  grid: readonly number[] = CHECK_IN_GRID,
  options?: LearnOptions,
): Map<string, Array<[number, number]>> {
  grid.forEach((m, k) => {
    if (!Number.isFinite(m) || m < 0 || (k > 0 && m >= grid[k - 1])) throw new RangeError('grid must list minutes from most to fewest');
  });
  history.forEach((h, i) => {
    if (h.checkedInBy.length !== grid.length) throw new RangeError(`history[${i}].checkedInBy must have one count per grid point (${grid.length})`);
  });
  const perPoint = grid.map((_, k) =>
    learnShowRates(history.map((h) => ({ segment: h.segment, booked: h.showed, showed: h.checkedInBy[k] })), options),
  );
  const out = new Map<string, Array<[number, number]>>();
  for (const key of perPoint[0]?.keys() ?? []) {
    const segment = key === '' ? [] : key.split('/');
    let floor = 0;
    out.set(key, grid.map((m, k): [number, number] => {
      floor = Math.max(floor, lookupRate(perPoint[k], segment)?.rate ?? 0);
      return [m, floor];
    }));
  }
  return out;
}
