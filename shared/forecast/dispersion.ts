import type { CommonShock } from './types';
import { requireNonNegativeFinite, requireNonNegativeInteger } from './validate';

/** One closed flight: bookings, shows, and what independent passengers would give (mean and variance of shows). */
export interface FlightShowRecord {
  booked: number;
  showed: number;
  /** Sum of the passengers' show probabilities; defaults to booked times the pooled rate of all flights. */
  expectedShowed?: number;
  /** Sum of p(1 - p) over the passengers; defaults to booked * r(1 - r) with r = expectedShowed / booked. */
  independentVariance?: number;
}

export interface ShockEstimate {
  /** The beta-binomial shock for the existing show-up model, or undefined when the flights spread no more than chance. */
  shock: CommonShock | undefined;
  rho: number;
  flights: number;
  /** Observed squared deviations over what independent passengers would give: 1 means no common shock. */
  dispersionRatio: number;
}

/** Largest rho handed to the show-up model: a flight moving as one block is outside what we learn from a station. */
export const MAX_LEARNED_RHO = 0.5;

/**
 * The day-to-day common shock from the over-dispersion of flight-level shows. With a common rate drawn per flight
 * from a Beta of intra-class correlation rho (the model of shock.ts), identical passengers give
 * Var(shows) = n r(1-r) [1 + (n-1) rho]; so by the method of moments
 *   rho = sum_i [(y_i - E_i)^2 - V_i] / sum_i n_i (n_i - 1) r_i (1 - r_i),
 * clamped to [0, MAX_LEARNED_RHO]. For passengers with different probabilities the shared-rate covariance is close
 * to the identical case when the probabilities are close to their mean, which is what this estimate assumes.
 */
export function estimateCommonShock(flights: FlightShowRecord[]): ShockEstimate {
  const seen = flights.filter((f, i) => {
    requireNonNegativeInteger(f.booked, `flights[${i}].booked`);
    requireNonNegativeInteger(f.showed, `flights[${i}].showed`);
    if (f.showed > f.booked) throw new RangeError(`flights[${i}].showed must not exceed booked`);
    if (f.expectedShowed !== undefined) requireNonNegativeFinite(f.expectedShowed, `flights[${i}].expectedShowed`);
    if (f.independentVariance !== undefined) requireNonNegativeFinite(f.independentVariance, `flights[${i}].independentVariance`);
    return f.booked > 1;
  });
  const booked = seen.reduce((s, f) => s + f.booked, 0);
  const pooled = booked > 0 ? seen.reduce((s, f) => s + f.showed, 0) / booked : 0;
  let excess = 0;
  let independent = 0;
  let scale = 0;
  for (const f of seen) {
    const expected = f.expectedShowed ?? f.booked * pooled;
    const r = Math.min(1, expected / f.booked);
    const variance = f.independentVariance ?? f.booked * r * (1 - r);
    excess += (f.showed - expected) ** 2 - variance;
    independent += variance;
    scale += f.booked * (f.booked - 1) * r * (1 - r);
  }
  const rho = scale > 0 ? Math.min(MAX_LEARNED_RHO, Math.max(0, excess / scale)) : 0;
  return {
    shock: rho > 0 ? { kind: 'beta-binomial', rho } : undefined,
    rho,
    flights: seen.length,
    dispersionRatio: independent > 0 ? (excess + independent) / independent : 1,
  };
}
