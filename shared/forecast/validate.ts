import type { CommonShock } from './types';

/** Upper bound on people in one distribution: the exact DP is O(units x people), so this keeps a call well under a second. */
export const MAX_PEOPLE = 50_000;

/** Tolerance on scenario weights summing to 1 and on a pmf summing to 1. */
export const SUM_TOLERANCE = 1e-9;

export function requireProbability(value: number, field: string): void {
  if (typeof value !== 'number' || Number.isNaN(value) || value < 0 || value > 1) {
    throw new RangeError(`${field} must be within [0, 1] (got ${String(value)})`);
  }
}

export function requireOpenUnitInterval(value: number, field: string): void {
  if (typeof value !== 'number' || Number.isNaN(value) || value <= 0 || value >= 1) {
    throw new RangeError(`${field} must be within (0, 1), both ends excluded (got ${String(value)})`);
  }
}

export function requirePositiveInteger(value: number, field: string): void {
  if (!Number.isSafeInteger(value) || value < 1) {
    throw new RangeError(`${field} must be a positive integer (got ${String(value)})`);
  }
}

export function requireNonNegativeInteger(value: number, field: string): void {
  if (!Number.isSafeInteger(value) || value < 0) {
    throw new RangeError(`${field} must be a non-negative integer (got ${String(value)})`);
  }
}

export function requireNonNegativeFinite(value: number, field: string): void {
  if (typeof value !== 'number' || !Number.isFinite(value) || value < 0) {
    throw new RangeError(`${field} must be a finite number >= 0 (got ${String(value)})`);
  }
}

export function requirePeopleWithinLimit(total: number, field: string): void {
  if (total > MAX_PEOPLE) {
    throw new RangeError(`${field} must add up to at most ${MAX_PEOPLE} people (got ${total})`);
  }
}

export function validateShock(shock: CommonShock, field = 'shock'): void {
  if (shock === null || typeof shock !== 'object') {
    throw new RangeError(`${field} must be an object with kind 'beta-binomial' or 'scenarios'`);
  }
  if (shock.kind === 'beta-binomial') {
    requireOpenUnitInterval(shock.rho, `${field}.rho`);
    return;
  }
  if (shock.kind !== 'scenarios') {
    throw new RangeError(`${field}.kind must be 'beta-binomial' or 'scenarios'`);
  }
  if (!Array.isArray(shock.scenarios) || shock.scenarios.length === 0) {
    throw new RangeError(`${field}.scenarios must be a non-empty array`);
  }
  let weightSum = 0;
  shock.scenarios.forEach((scenario, index) => {
    requireNonNegativeFinite(scenario.weight, `${field}.scenarios[${index}].weight`);
    requireNonNegativeFinite(scenario.probabilityFactor, `${field}.scenarios[${index}].probabilityFactor`);
    weightSum += scenario.weight;
  });
  if (Math.abs(weightSum - 1) > SUM_TOLERANCE) {
    throw new RangeError(`${field}.scenarios weights must sum to 1 within ${SUM_TOLERANCE} (got ${weightSum})`);
  }
}

/** A pmf handed in from outside: finite, non-negative entries that sum to 1. */
export function validatePmf(pmf: ArrayLike<number>, field = 'pmf'): void {
  if (pmf === null || typeof pmf !== 'object' || typeof pmf.length !== 'number' || pmf.length < 1) {
    throw new RangeError(`${field} must be a non-empty array of probabilities`);
  }
  let sum = 0;
  for (let k = 0; k < pmf.length; k++) {
    const value = pmf[k];
    if (typeof value !== 'number' || !Number.isFinite(value) || value < 0) {
      throw new RangeError(`${field}[${k}] must be a finite number >= 0 (got ${String(value)})`);
    }
    sum += value;
  }
  if (Math.abs(sum - 1) > SUM_TOLERANCE) {
    throw new RangeError(`${field} must sum to 1 within ${SUM_TOLERANCE} (got ${sum})`);
  }
}

/**
 * Rounding in a long sum can carry a probability a hair past 0 or 1 (1.0000000000000018): within this much it is
 * a rounding artefact and is clamped; beyond it the engine is wrong and says so rather than showing it.
 */
export const PROBABILITY_ROUNDING_TOLERANCE = 1e-9;

/** Every probability the engine returns passes here: the result is always within [0, 1]. */
export function probabilityOut(value: number, field: string): number {
  if (!Number.isFinite(value) || value < -PROBABILITY_ROUNDING_TOLERANCE || value > 1 + PROBABILITY_ROUNDING_TOLERANCE) {
    throw new RangeError(`${field}: the engine produced ${value}, outside [0, 1]`);
  }
  return Math.min(1, Math.max(0, value));
}
