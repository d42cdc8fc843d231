import { describe, expect, it } from 'vitest';
import { binomialPmf } from './binomial';
import { oversaleRisk, quantile, sumIndependentPmfs, upperTail, volunteerTarget } from './risk';
import { showUpDistribution } from './show-up';

// Math Stack Exchange worked Poisson-binomial example, p = (0.5, 0.3, 0.7, 0.3, 0.9):
// pmf (147, 1939, 6334, 7494, 3519, 567) / 20000. The figures below are derived from it by hand.
const worked = [147, 1939, 6334, 7494, 3519, 567].map((v) => v / 20000);

describe('oversaleRisk', () => {
  it('gives the tail figures of the worked example for 3 seats (derived)', () => {
    const risk = oversaleRisk(worked, 3);
    expect(risk.pOversale).toBeCloseTo((3519 + 567) / 20000, 15);
    expect(risk.pFullOrOver).toBeCloseTo((7494 + 3519 + 567) / 20000, 15);
    expect(risk.expectedDenied).toBeCloseTo((3519 + 2 * 567) / 20000, 15);
    expect(risk.mean).toBeCloseTo(2.7, 14); // sum of p
    expect(risk.sd).toBeCloseTo(Math.sqrt(0.25 + 0.21 + 0.21 + 0.21 + 0.09), 14); // sum of p(1-p)
    expect(risk.median).toBe(3); // P(X <= 2) = 0.421 < 0.5 <= P(X <= 3) = 0.7957
  });

  it('is exact at capacity 0 and with capacity above everyone', () => {
    const atZero = oversaleRisk(worked, 0);
    expect(atZero.pFullOrOver).toBe(1);
    expect(atZero.pOversale).toBeCloseTo(1 - 147 / 20000, 15);
    expect(atZero.expectedDenied).toBeCloseTo(2.7, 14);
    expect(oversaleRisk(worked, 5)).toMatchObject({ pOversale: 0, expectedDenied: 0 });
    expect(oversaleRisk(worked, 5).pFullOrOver).toBeCloseTo(567 / 20000, 15);
    expect(oversaleRisk(worked, 9)).toMatchObject({ pOversale: 0, pFullOrOver: 0, expectedDenied: 0 });
    expect(oversaleRisk([1], 0)).toEqual({ pOversale: 0, pFullOrOver: 1, expectedDenied: 0, mean: 0, sd: 0, median: 0 });
  });

  it('has E[(X-C)+] = sum_{j>C} P(X >= j) (tail-sum identity)', () => {
    const pmf = binomialPmf(190, 0.83);
    for (const capacity of [140, 150, 160, 175]) {
      let tails = 0;
      for (let j = capacity + 1; j <= 190; j++) tails += upperTail(pmf, j);
      expect(oversaleRisk(pmf, capacity).expectedDenied).toBeCloseTo(tails, 12);
    }
  });

  it('keeps a tiny oversale probability with its own precision instead of 1 - cdf', () => {
    // Bin(100, 0.5): P(X > 95) = (C(100,96) + C(100,97) + C(100,98) + C(100,99) + 1) / 2^100 (derived)
    const exact = (3921225 + 161700 + 4950 + 100 + 1) / 2 ** 100;
    expect(oversaleRisk(binomialPmf(100, 0.5), 95).pOversale / exact).toBeCloseTo(1, 12);
  });
});

describe('quantile', () => {
  it('returns the smallest k with P(X <= k) >= q', () => {
    expect(quantile(worked, 0)).toBe(0);
    expect(quantile(worked, 0.0073)).toBe(0); // P(X=0) = 0.00735
    expect(quantile(worked, 0.0074)).toBe(1);
    expect(quantile(worked, 0.421)).toBe(2); // P(X <= 2) = 0.421 exactly
    expect(quantile(worked, 0.95)).toBe(4); // P(X <= 4) = 0.97165
    expect(quantile(worked, 1)).toBe(5);
  });

  it('skips leading zeros at q = 0 and trailing zeros at q = 1', () => {
    expect(quantile([0, 0, 0.5, 0.5, 0], 0)).toBe(2);
    expect(quantile([0, 0, 0.5, 0.5, 0], 1)).toBe(3);
  });
});

describe('volunteerTarget', () => {
  it('finds the smallest v with P(X - v > C) <= alpha', () => {
    // worked example, C = 2: P(X > 2) = 0.579, P(X > 3) = 0.2043, P(X > 4) = 0.02835, P(X > 5) = 0
    expect(volunteerTarget(worked, 2, 0.6)).toBe(0);
    expect(volunteerTarget(worked, 2, 0.5)).toBe(1);
    expect(volunteerTarget(worked, 2, 0.2043)).toBe(1);
    expect(volunteerTarget(worked, 2, 0.2)).toBe(2);
    expect(volunteerTarget(worked, 2, 0.01)).toBe(3);
    expect(volunteerTarget(worked, 7, 0.01)).toBe(0);
  });

  it('asks for more volunteers as alpha shrinks on a real-sized flight', () => {
    const pmf = showUpDistribution([{ size: 1, showProbability: 0.88, count: 190 }]);
    const targets = [0.5, 0.2, 0.05, 0.01].map((alpha) => volunteerTarget(pmf, 160, alpha));
    for (let i = 1; i < targets.length; i++) expect(targets[i]).toBeGreaterThanOrEqual(targets[i - 1]);
    const v = targets[3];
    expect(oversaleRisk(pmf, 160 + v).pOversale).toBeLessThanOrEqual(0.01);
    expect(oversaleRisk(pmf, 160 + v - 1).pOversale).toBeGreaterThan(0.01);
  });
});

describe('sumIndependentPmfs', () => {
  it('adds independent cabins: two cabins equal the flight forecast in one piece', () => {
    const front = [{ size: 1, showProbability: 0.95, count: 12 }];
    const back = [{ size: 1, showProbability: 0.82, count: 150 }, { size: 2, showProbability: 0.9, count: 6 }];
    const combined = sumIndependentPmfs([showUpDistribution(front), showUpDistribution(back)]);
    const whole = showUpDistribution([...front, ...back]);
    expect(combined.length).toBe(whole.length);
    combined.forEach((v, k) => expect(v).toBeCloseTo(whole[k], 14));
  });

  it('is [1] for no parts and rejects a part that is not a pmf', () => {
    expect(Array.from(sumIndependentPmfs([]))).toEqual([1]);
    expect(() => sumIndependentPmfs([[0.5, 0.5], [0.5, -0.1, 0.6]])).toThrow(/^pmfs\[1\]\[1\] must be a finite number >= 0/);
  });
});
