import type { OversaleRisk } from './types';
import { probabilityOut, requireNonNegativeInteger, requireOpenUnitInterval, requireProbability, validatePmf } from './validate';

function total(pmf: ArrayLike<number>): number {
  let sum = 0;
  for (let k = 0; k < pmf.length; k++) sum += pmf[k];
  return sum;
}

/** P(X >= from), summed from the top so a small tail keeps its own precision instead of being 1 - cdf. */
export function upperTail(pmf: ArrayLike<number>, from: number): number {
  let tail = 0;
  for (let k = pmf.length - 1; k >= Math.max(0, from); k--) tail += pmf[k];
  return probabilityOut(tail, 'upperTail');
}

/**
 * Smallest k with P(X <= k) >= q. q = 0 gives the lowest value with positive probability, q = 1 the highest.
 * Above the median the search runs on the upper tail from the top, so high quantiles are not lost to rounding.
 */
export function quantile(pmf: ArrayLike<number>, q: number): number {
  validatePmf(pmf);
  requireProbability(q, 'q');
  const sum = total(pmf);
  if (q === 0) {
    for (let k = 0; k < pmf.length; k++) if (pmf[k] > 0) return k;
  }
  if (q <= 0.5) {
    let cumulative = 0;
    for (let k = 0; k < pmf.length; k++) {
      cumulative += pmf[k];
      if (cumulative >= q * sum) return k;
    }
    return pmf.length - 1;
  }
  const allowedAbove = (1 - q) * sum;
  let above = 0;
  for (let k = pmf.length - 1; k >= 1; k--) {
    // here `above` is P(X > k); k is the answer once adding P(X = k) would exceed what may lie above k - 1
    if (above + pmf[k] > allowedAbove) return k;
    above += pmf[k];
  }
  return 0;
}

/** Oversale figures for `capacity` seats; denied boarding counts people before any volunteer is sought. */
export function oversaleRisk(pmf: ArrayLike<number>, capacity: number): OversaleRisk {
  validatePmf(pmf);
  requireNonNegativeInteger(capacity, 'capacity');
  let pOversale = 0;
  let expectedDenied = 0;
  for (let k = pmf.length - 1; k > capacity; k--) {
    pOversale += pmf[k];
    expectedDenied += (k - capacity) * pmf[k];
  }
  // X >= 0 always holds, so capacity 0 gives exactly 1 rather than the rounded sum of the pmf
  const pFullOrOver = capacity === 0 ? 1 : capacity < pmf.length ? pOversale + pmf[capacity] : 0;
  let mean = 0;
  for (let k = 0; k < pmf.length; k++) mean += k * pmf[k];
  let variance = 0;
  for (let k = 0; k < pmf.length; k++) variance += (k - mean) * (k - mean) * pmf[k];
  return {
    pOversale: probabilityOut(pOversale, 'pOversale'),
    pFullOrOver: probabilityOut(pFullOrOver, 'pFullOrOver'),
    expectedDenied, mean, sd: Math.sqrt(variance), median: quantile(pmf, 0.5),
  };
}

/**
 * Smallest number of volunteers v such that, once v people give up their seats, P(X - v > C) <= alpha:
 * the gate's target for a volunteer round at risk level alpha.
 */
export function volunteerTarget(pmf: ArrayLike<number>, capacity: number, alpha: number): number {
  validatePmf(pmf);
  requireNonNegativeInteger(capacity, 'capacity');
  requireOpenUnitInterval(alpha, 'alpha');
  const allowed = alpha * total(pmf);
  // find the smallest level j >= capacity with P(X > j) <= alpha, walking down from the top
  let above = 0;
  let level = pmf.length - 1;
  while (level > capacity && above + pmf[level] <= allowed) {
    above += pmf[level];
    level--;
  }
  const target = Math.max(0, level - capacity);
  // Nobody beyond the people who could show can volunteer: the target never exceeds bookings minus seats.
  const mostWhoCouldShow = pmf.length - 1;
  if (target > Math.max(0, mostWhoCouldShow - capacity)) {
    throw new RangeError(`volunteerTarget: ${target} exceeds bookings minus seats (${mostWhoCouldShow} - ${capacity})`);
  }
  return target;
}

/**
 * Pmf of the sum of independent counts, e.g. cabins forecast apart and added up for the whole flight. Only valid
 * when the parts are independent: under a common shock forecast the whole flight from its units instead.
 */
export function sumIndependentPmfs(pmfs: readonly ArrayLike<number>[]): Float64Array {
  if (!Array.isArray(pmfs)) throw new RangeError('pmfs must be an array of pmfs');
  pmfs.forEach((pmf, index) => validatePmf(pmf, `pmfs[${index}]`));
  let result = new Float64Array([1]);
  for (const pmf of pmfs) {
    const next = new Float64Array(result.length + pmf.length - 1);
    for (let i = 0; i < result.length; i++) {
      if (result[i] === 0) continue;
      for (let j = 0; j < pmf.length; j++) next[i + j] += result[i] * pmf[j];
    }
    result = next;
  }
  return result;
}
