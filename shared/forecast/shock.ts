import { betaShape } from './binomial';
import { betaQuadrature } from './gauss-jacobi';
import type { ProbabilityTransform } from './poisson-binomial';
import type { CommonShock, ShockScenario } from './types';

/**
 * Gauss-Jacobi nodes used for the beta shock. The conditional pmf given the common rate is a polynomial in it of
 * degree `degree` (one per unit, s per partly showing party of s), so ceil((degree + 1) / 2) nodes are exact.
 * Large flights need far fewer: as a function of the rate the conditional pmf is a bump about 1/sqrt(people) wide,
 * and about 3 sqrt(people) nodes already reach rounding level (measured at 100, 400 and 2,500 people for rho 0.05
 * and 0.5, and at 850 people for rho 1e-4 to 0.9); 4 sqrt(people) + 16 leaves a margin. A test compares it with
 * the exact rule.
 */
export function quadratureNodeCount(degree: number, people: number): number {
  return Math.max(1, Math.min(Math.ceil((degree + 1) / 2), Math.ceil(4 * Math.sqrt(people)) + 16));
}

/** Scenario probabilities: p * factor, capped at 1 as the scenario shock is defined. */
export function scenarioTransform(factor: number): ProbabilityTransform {
  return (p) => Math.min(1, p * factor);
}

/**
 * Maps a passenger's booked probability p to the one that holds when the flight-wide show rate is theta, for a
 * group whose average (per person) booked probability is `mean`:
 *   p <= mean: p * theta / mean                      (the show probability scales with the rate)
 *   p >  mean: 1 - (1 - p)(1 - theta) / (1 - mean)   (the no-show probability scales with 1 - rate)
 * Both are linear in theta, stay inside [0, 1] for every theta, equal theta when p = mean (so identical passengers
 * give the exact beta-binomial), and average back to p because E[theta] = mean. So every passenger keeps the
 * booked show probability while all of them move up and down together.
 */
export function betaRateTransform(theta: number, mean: number): ProbabilityTransform {
  return (p) => {
    if (p <= mean) return Math.min(1, (p * theta) / mean);
    return Math.max(0, Math.min(1, 1 - ((1 - p) * (1 - theta)) / (1 - mean)));
  };
}

/** Weighted sum of conditional pmfs into one, with weights normalised to sum to exactly 1. */
function mix(parts: { weight: number; transform: ProbabilityTransform }[], conditional: Conditional): Float64Array {
  const weightSum = parts.reduce((sum, part) => sum + part.weight, 0);
  let mixed: Float64Array | undefined;
  for (const part of parts) {
    if (part.weight === 0) continue;
    const pmf = conditional(part.transform);
    const w = part.weight / weightSum;
    if (!mixed) mixed = new Float64Array(pmf.length);
    for (let k = 0; k < pmf.length; k++) mixed[k] += w * pmf[k];
  }
  return mixed ?? conditional((p) => p);
}

export type Conditional = (transform: ProbabilityTransform) => Float64Array;

export interface ShockContext {
  /** Average booked show probability per person, the mean of the common rate. */
  meanProbability: number;
  /** Degree of the conditional pmf as a polynomial in the common rate. */
  degree: number;
  /** People booked: the length of the pmf minus one. */
  people: number;
}

/** Integrates a conditional show-up pmf over a common shock; with no shock it is the conditional pmf itself. */
export function integrateOverShock(
  shock: CommonShock | undefined,
  context: ShockContext,
  conditional: Conditional,
): Float64Array {
  if (!shock) return conditional((p) => p);
  if (shock.kind === 'scenarios') {
    return mix(
      shock.scenarios.map((s: ShockScenario) => ({ weight: s.weight, transform: scenarioTransform(s.probabilityFactor) })),
      conditional,
    );
  }
  const mean = context.meanProbability;
  if (mean <= 0 || mean >= 1 || context.degree === 0) return conditional((p) => p);
  const { a, b } = betaShape(mean, shock.rho);
  // A mean within rounding of 0 or 1 makes a or b underflow to 0: the Beta is then a point mass at the mean, so the
  // shock changes nothing.
  if (!(a > 0 && b > 0 && Number.isFinite(a) && Number.isFinite(b))) return conditional((p) => p);
  const rule = betaQuadrature(quadratureNodeCount(context.degree, context.people), a, b);
  return mix(
    Array.from(rule.nodes, (theta, j) => ({ weight: rule.weights[j], transform: betaRateTransform(theta, mean) })),
    conditional,
  );
}
