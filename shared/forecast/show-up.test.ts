import { describe, expect, it } from 'vitest';
import { binomialPmf } from './binomial';
import { showUpDistribution } from './show-up';
import type { ShowUpUnit } from './types';

const individuals = (ps: number[]): ShowUpUnit[] => ps.map((p) => ({ size: 1, showProbability: p }));

describe('showUpDistribution without a shock (exact Poisson-binomial)', () => {
  it('reproduces the Math Stack Exchange worked example p = (0.5, 0.3, 0.7, 0.3, 0.9)', () => {
    // Math Stack Exchange worked Poisson-binomial example: pmf (147, 1939, 6334, 7494, 3519, 567) / 20000,
    // so P(K = 2) = 3167/10000 exactly
    const pmf = showUpDistribution(individuals([0.5, 0.3, 0.7, 0.3, 0.9]));
    const expected = [147, 1939, 6334, 7494, 3519, 567].map((v) => v / 20000);
    expect(pmf.length).toBe(6);
    pmf.forEach((value, k) => expect(value).toBeCloseTo(expected[k], 15));
    expect(pmf[2]).toBeCloseTo(3167 / 10000, 15);
  });

  it('gives the binomial for identical individuals, whether listed apart or with count', () => {
    const reference = binomialPmf(180, 0.87);
    const apart = showUpDistribution(individuals(Array<number>(180).fill(0.87)));
    const counted = showUpDistribution([{ size: 1, showProbability: 0.87, count: 180 }]);
    for (let k = 0; k <= 180; k++) {
      expect(apart[k]).toBeCloseTo(reference[k], 14);
      expect(counted[k]).toBeCloseTo(reference[k], 15);
    }
  });

  it('moves a party of s in steps of s: one pair at p = 0.8 gives 0.2 at 0 and 0.8 at 2 (derived)', () => {
    const pair = showUpDistribution([{ size: 2, showProbability: 0.8 }]);
    [0.2, 0, 0.8].forEach((value, k) => expect(pair[k]).toBeCloseTo(value, 15));
    const pmf = showUpDistribution([
      { size: 1, showProbability: 0.5 },
      { size: 3, showProbability: 0.25, count: 2 },
    ]);
    // derived by hand: parties shown j ~ Bin(2, 1/4) -> 9/16, 6/16, 1/16 at 0, 3, 6 people; the single adds 0 or 1
    const expected = [9 / 32, 9 / 32, 0, 6 / 32, 6 / 32, 0, 1 / 32, 1 / 32];
    pmf.forEach((value, k) => expect(value).toBeCloseTo(expected[k], 15));
  });

  it('is exact on the edges: no one booked, p = 0, p = 1, count 0', () => {
    expect(Array.from(showUpDistribution([]))).toEqual([1]);
    expect(Array.from(showUpDistribution([{ size: 1, showProbability: 0.9, count: 0 }]))).toEqual([1]);
    expect(Array.from(showUpDistribution(individuals([0, 0, 0])))).toEqual([1, 0, 0, 0]);
    expect(Array.from(showUpDistribution([...individuals([1, 1]), { size: 3, showProbability: 1 }]))).toEqual([
      0, 0, 0, 0, 0, 1,
    ]);
    // a certain pair plus a coin: 2 or 3 people, half each (derived)
    expect(Array.from(showUpDistribution([{ size: 2, showProbability: 1 }, { size: 1, showProbability: 0.5 }]))).toEqual([
      0, 0, 0.5, 0.5,
    ]);
  });

  it('has mean sum(s p) and variance sum(s^2 p (1-p)) for independent units (derived)', () => {
    const units: ShowUpUnit[] = [
      { size: 1, showProbability: 0.91, count: 40 },
      { size: 1, showProbability: 0.62 },
      { size: 2, showProbability: 0.78, count: 7 },
      { size: 4, showProbability: 0.55, count: 3 },
    ];
    const pmf = showUpDistribution(units);
    let mean = 0;
    for (let k = 0; k < pmf.length; k++) mean += k * pmf[k];
    let variance = 0;
    for (let k = 0; k < pmf.length; k++) variance += (k - mean) ** 2 * pmf[k];
    const expectedMean = units.reduce((s, u) => s + u.size * u.showProbability * (u.count ?? 1), 0);
    const expectedVariance = units.reduce(
      (s, u) => s + u.size ** 2 * u.showProbability * (1 - u.showProbability) * (u.count ?? 1),
      0,
    );
    expect(mean).toBeCloseTo(expectedMean, 11);
    expect(variance).toBeCloseTo(expectedVariance, 10);
  });

  it('keeps far tails non-negative and accurate for a large mixed flight', () => {
    const units: ShowUpUnit[] = [];
    for (let i = 0; i < 600; i++) units.push({ size: 1, showProbability: 0.55 + (0.44 * i) / 599 });
    units.push({ size: 2, showProbability: 0.97, count: 50 });
    const pmf = showUpDistribution(units);
    expect(pmf.length).toBe(701);
    expect(Math.min(...pmf)).toBeGreaterThanOrEqual(0);
    expect(pmf.reduce((s, v) => s + v, 0)).toBeCloseTo(1, 12);
    // P(everyone shows) = prod p_i: far below 1e-12, still carried with full relative precision (derived)
    let allShow = 0.97 ** 50;
    for (const u of units.slice(0, 600)) allShow *= u.showProbability;
    expect(pmf[700] / allShow).toBeCloseTo(1, 11);
  });
});
