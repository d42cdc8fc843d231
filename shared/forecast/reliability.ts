import { brierScore, requireForecastPairs } from './scores';
import { requirePositiveInteger } from './validate';

export interface ReliabilityBin {
  from: number;
  to: number;
  meanPredicted: number;
  observedRate: number;
  count: number;
}

/**
 * Reliability diagram data: forecasts cut into `bins` equal-width bins over [0, 1] (each [from, to), the last one
 * closed at 1), with the mean forecast and the observed frequency in each. Empty bins are left out.
 */
export function reliabilityBins(predicted: number[], observed: (0 | 1)[], bins: number): ReliabilityBin[] {
  requireForecastPairs(predicted, observed);
  requirePositiveInteger(bins, 'bins');
  const sums = Array.from({ length: bins }, () => ({ predicted: 0, observed: 0, count: 0 }));
  predicted.forEach((p, i) => {
    const b = Math.min(bins - 1, Math.floor(p * bins));
    sums[b].predicted += p;
    sums[b].observed += observed[i];
    sums[b].count += 1;
  });
  return sums.flatMap((s, b) =>
    s.count === 0
      ? []
      : [{ from: b / bins, to: (b + 1) / bins, meanPredicted: s.predicted / s.count, observedRate: s.observed / s.count, count: s.count }],
  );
}

/** One held-out flight: what the forecast said about oversale, and what happened at the gate. */
export interface OversaleOutcome {
  /** Forecast P(shows > seats). */
  pOversale: number;
  /** Forecast E[(shows - seats)+]. */
  expectedDenied: number;
  /** More people showed than there were seats. */
  oversold: boolean;
  /** People beyond the seats, (shows - seats)+, before any volunteer: what expectedDenied forecasts. */
  beyondSeats: number;
}

export interface OversaleBacktest {
  flights: number;
  meanPredicted: number;
  observedRate: number;
  brier: number;
  expectedDenied: number;
  actualDenied: number;
  bins: ReliabilityBin[];
}

/** The oversale odds checked against what happened on flights that were held out of training. */
export function oversaleBacktest(flights: OversaleOutcome[], bins = 5): OversaleBacktest {
  const predicted = flights.map((f) => f.pOversale);
  const observed = flights.map((f): 0 | 1 => (f.oversold ? 1 : 0));
  requireForecastPairs(predicted, observed);
  return {
    flights: flights.length,
    meanPredicted: predicted.reduce((s, p) => s + p, 0) / flights.length,
    observedRate: observed.reduce<number>((s, o) => s + o, 0) / flights.length,
    brier: brierScore(predicted, observed),
    expectedDenied: flights.reduce((s, f) => s + f.expectedDenied, 0),
    actualDenied: flights.reduce((s, f) => s + f.beyondSeats, 0),
    bins: reliabilityBins(predicted, observed, bins),
  };
}
