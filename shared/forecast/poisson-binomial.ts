import { binomialPmf } from './binomial';
import type { ShowUpUnit } from './types';
import {
  requireNonNegativeInteger,
  requirePeopleWithinLimit,
  requirePositiveInteger,
  requireProbability,
} from './validate';

/** Units with the same size and show probability, merged so they can be added as one binomial block. */
export interface UnitGroup {
  size: number;
  probability: number;
  count: number;
}

/** Maps a booked show probability to the one that holds in a given shock scenario or quadrature node. */
export type ProbabilityTransform = (probability: number) => number;

/** Validates units and merges equal (size, probability) pairs; `total` is the number of people booked. */
export function groupUnits(units: readonly ShowUpUnit[], field = 'units'): { groups: UnitGroup[]; total: number } {
  if (!Array.isArray(units)) throw new RangeError(`${field} must be an array`);
  const byKey = new Map<string, UnitGroup>();
  let total = 0;
  units.forEach((unit, index) => {
    const at = `${field}[${index}]`;
    if (unit === null || typeof unit !== 'object') throw new RangeError(`${at} must be an object`);
    requirePositiveInteger(unit.size, `${at}.size`);
    requireProbability(unit.showProbability, `${at}.showProbability`);
    const count = unit.count ?? 1;
    requireNonNegativeInteger(count, `${at}.count`);
    total += unit.size * count;
    requirePeopleWithinLimit(total, field);
    if (count === 0) return;
    const key = `${unit.size}:${unit.showProbability}`;
    const group = byKey.get(key);
    if (group) group.count += count;
    else byKey.set(key, { size: unit.size, probability: unit.showProbability, count });
  });
  return { groups: [...byKey.values()], total };
}

/** Moves the whole distribution up by `span` people (a block that shows for certain). */
function shiftUp(pmf: Float64Array, top: number, span: number): void {
  for (let k = top; k >= 0; k--) pmf[k + span] = pmf[k];
  pmf.fill(0, 0, span);
}

/**
 * Adds one party of `size` people who all show with probability p: f'[k] = (1-p) f[k] + p f[k-size].
 * Runs from the top down so each f[k-size] read is still the old value; every term stays non-negative.
 */
function addParty(pmf: Float64Array, top: number, size: number, p: number): void {
  const q = 1 - p;
  for (let k = top + size; k >= size; k--) pmf[k] = q * pmf[k] + p * pmf[k - size];
  for (let k = Math.min(size - 1, top); k >= 0; k--) pmf[k] *= q;
}

/** Convolves with a binomial block of `count` parties of `size`: out[i + j*size] += f[i] * Bin(count, p)[j]. */
function addBinomialBlock(pmf: Float64Array, top: number, group: UnitGroup, p: number, scratch: Float64Array): void {
  const block = binomialPmf(group.count, p);
  const end = top + group.size * group.count;
  scratch.fill(0, 0, end + 1);
  for (let i = 0; i <= top; i++) {
    const base = pmf[i];
    if (base === 0) continue;
    for (let j = 0, k = i; j < block.length; j++, k += group.size) scratch[k] += base * block[j];
  }
  pmf.set(scratch.subarray(0, end + 1));
}

/**
 * Exact distribution of people showing up when units are independent (Poisson-binomial with party steps).
 * O(units x people) with a Float64Array; no step ever subtracts, so no term can turn negative.
 */
export function allOrNoneDistribution(
  groups: readonly UnitGroup[],
  total: number,
  transform?: ProbabilityTransform,
): Float64Array {
  const pmf = new Float64Array(total + 1);
  pmf[0] = 1;
  let scratch: Float64Array | undefined;
  let top = 0;
  for (const group of groups) {
    const p = transform ? transform(group.probability) : group.probability;
    if (p === 0) continue;
    const span = group.size * group.count;
    if (p === 1) shiftUp(pmf, top, span);
    else if (group.count === 1) addParty(pmf, top, group.size, p);
    else addBinomialBlock(pmf, top, group, p, (scratch ??= new Float64Array(total + 1)));
    top += span;
  }
  return pmf;
}

/** Convolves in place with a small pmf over 0..s (one party that may partly show); top-down keeps old reads. */
export function addUnitPmf(pmf: Float64Array, top: number, unitPmf: ArrayLike<number>): void {
  const s = unitPmf.length - 1;
  for (let k = top + s; k >= 0; k--) {
    let value = 0;
    for (let j = Math.max(0, k - top); j <= Math.min(s, k); j++) value += unitPmf[j] * pmf[k - j];
    pmf[k] = value;
  }
}
