import stdlibBinomialCdf from '@stdlib/stats-base-dists-binomial-cdf';
import stdlibBinomialPmf from '@stdlib/stats-base-dists-binomial-pmf';
import { describe, expect, it } from 'vitest';
import { betaBinomialPmf, binomialPmf } from './binomial';
import { upperTail } from './risk';

/** Below about 1e-280 the reference cdf (regularised incomplete beta) loses digits; see the exact check below. */
const CDF_FLOOR = 1e-280;
const TRIALS = [0, 1, 2, 7, 30, 100, 151, 500, 1000];
const PROBABILITIES = [1e-6, 0.001, 0.03, 0.2, 0.5, 0.77, 0.9, 0.99, 0.999999];

function relativeError(actual: number, expected: number): number {
  return Math.abs(actual - expected) / expected;
}

describe('binomialPmf against @stdlib/stats-base-dists-binomial-pmf and -cdf (reference library)', () => {
  it('matches the pmf to 1e-12 relative wherever the value exceeds 1e-300', () => {
    let worst = 0;
    for (const n of TRIALS) {
      for (const p of PROBABILITIES) {
        const pmf = binomialPmf(n, p);
        expect(pmf.length).toBe(n + 1);
        for (let k = 0; k <= n; k++) {
          const expected = stdlibBinomialPmf(k, n, p);
          if (expected > 1e-300) worst = Math.max(worst, relativeError(pmf[k], expected));
          else expect(pmf[k]).toBeLessThan(1e-290);
        }
      }
    }
    expect(worst).toBeLessThanOrEqual(1e-12);
  });

  it('matches the lower cdf and the top-summed upper tail to 1e-12 relative where the cdf exceeds 1e-280', () => {
    let worst = 0;
    for (const n of TRIALS) {
      for (const p of PROBABILITIES) {
        const pmf = binomialPmf(n, p);
        const mirrored = binomialPmf(n, 1 - (1 - p));
        let lower = 0;
        for (let k = 0; k <= n; k++) {
          lower += pmf[k];
          const expectedLower = stdlibBinomialCdf(k, n, p);
          if (expectedLower > CDF_FLOOR) worst = Math.max(worst, relativeError(lower, expectedLower));
          // P(X > k) for Bin(n, p) is P(Y <= n-k-1) for Y ~ Bin(n, 1-p): an upper tail without 1 - cdf (derived).
          // 1 - p is rounded, so the engine is run at the p that rounded value stands for.
          if (k < n) {
            const expectedUpper = stdlibBinomialCdf(n - k - 1, n, 1 - p);
            const upper = upperTail(mirrored, k + 1);
            if (expectedUpper > CDF_FLOOR) worst = Math.max(worst, relativeError(upper, expectedUpper));
          }
        }
      }
    }
    expect(worst).toBeLessThanOrEqual(1e-12);
  });

  it('keeps 1e-13 relative accuracy deep in the tail, where the reference cdf drifts (exact BigInt sum, derived)', () => {
    // Bin(500, 77/100): P(X <= k) = sum_j C(500,j) 77^j 23^(500-j) / 100^500, summed exactly in integers.
    // The double 0.77 differs from 77/100 by under 1e-16 relative, far below the tolerance. Near k = 8
    // (about 1e-298) the stdlib cdf is off by about 6e-9 relative, which is why the check above stops at CDF_FLOOR.
    const n = 500;
    const pmf = binomialPmf(n, 0.77);
    let choose = 1n;
    let exactNumerator = 0n;
    let lower = 0;
    for (let k = 0; k <= 40; k++) {
      if (k > 0) choose = (choose * BigInt(n - k + 1)) / BigInt(k);
      exactNumerator += choose * 77n ** BigInt(k) * 23n ** BigInt(n - k);
      lower += pmf[k];
      // compare on a 1e330 scale so the exact value fits a double; the scaling adds only a rounding or two
      const exactScaled = Number((exactNumerator * 10n ** 330n) / 100n ** BigInt(n));
      if (exactScaled > 1e30) expect(relativeError(lower * 1e300 * 1e30, exactScaled)).toBeLessThan(1e-13);
    }
  });

  it('is exact at the edges: n = 0, p = 0, p = 1', () => {
    expect(Array.from(binomialPmf(0, 0.4))).toEqual([1]);
    expect(Array.from(binomialPmf(3, 0))).toEqual([1, 0, 0, 0]);
    expect(Array.from(binomialPmf(3, 1))).toEqual([0, 0, 0, 1]);
  });

  it('rejects bad parameters with the field named', () => {
    expect(() => binomialPmf(2.5, 0.5)).toThrow(/^n must be a non-negative integer/);
    expect(() => binomialPmf(3, 1.2)).toThrow(/^p must be within \[0, 1\]/);
  });
});

/** Exact beta-binomial pmf for integer a, b: C(n,k) B(k+a, n-k+b) / B(a,b) with B(x,y) = (x-1)!(y-1)!/(x+y-1)!. */
function exactBetaBinomial(n: number, a: number, b: number): number[] {
  const factorial = (m: number): bigint => {
    let out = 1n;
    for (let i = 2n; i <= BigInt(m); i++) out *= i;
    return out;
  };
  const beta = (x: number, y: number): [bigint, bigint] => [factorial(x - 1) * factorial(y - 1), factorial(x + y - 1)];
  const [betaAbNum, betaAbDen] = beta(a, b);
  const values: number[] = [];
  for (let k = 0; k <= n; k++) {
    const choose = factorial(n) / (factorial(k) * factorial(n - k));
    const [num, den] = beta(k + a, n - k + b);
    const scaledNumerator = choose * num * betaAbDen * 10n ** 40n;
    values.push(Number(scaledNumerator / (den * betaAbNum)) / 1e40);
  }
  return values;
}

describe('betaBinomialPmf', () => {
  it('equals the exact rational value for integer shapes a = 2, b = 3 (mean 0.4, rho 1/6; derived with BigInt)', () => {
    for (const n of [1, 5, 40, 120]) {
      const pmf = betaBinomialPmf(n, 0.4, 1 / 6);
      const exact = exactBetaBinomial(n, 2, 3);
      for (let k = 0; k <= n; k++) expect(relativeError(pmf[k], exact[k])).toBeLessThan(1e-12);
    }
  });

  it('is the discrete uniform for a = b = 1 (mean 0.5, rho 1/3): Beta(1,1) is the uniform rate (derived)', () => {
    const pmf = betaBinomialPmf(200, 0.5, 1 / 3);
    for (const value of pmf) expect(relativeError(value, 1 / 201)).toBeLessThan(1e-12);
  });

  it('has mean n m and variance n m (1-m) [1 + (n-1) rho] (standard beta-binomial moments)', () => {
    for (const [n, m, rho] of [[150, 0.85, 0.02], [300, 0.1, 0.4], [60, 0.5, 0.95]]) {
      const pmf = betaBinomialPmf(n, m, rho);
      let mean = 0;
      for (let k = 0; k <= n; k++) mean += k * pmf[k];
      let variance = 0;
      for (let k = 0; k <= n; k++) variance += (k - mean) ** 2 * pmf[k];
      expect(relativeError(mean, n * m)).toBeLessThan(1e-12);
      expect(relativeError(variance, n * m * (1 - m) * (1 + (n - 1) * rho))).toBeLessThan(1e-10);
    }
  });

  it('handles the U shape of small shapes (a, b < 1) without losing mass', () => {
    const pmf = betaBinomialPmf(1000, 0.3, 0.9);
    expect(pmf.reduce((s, v) => s + v, 0)).toBeCloseTo(1, 12);
    expect(pmf[0]).toBeGreaterThan(pmf[500]);
    expect(pmf[1000]).toBeGreaterThan(pmf[500]);
  });

  it('tends to the binomial as rho -> 0 (limit of the Beta mixing; derived)', () => {
    const mixed = betaBinomialPmf(400, 0.83, 1e-10);
    const plain = binomialPmf(400, 0.83);
    for (let k = 0; k <= 400; k++) expect(Math.abs(mixed[k] - plain[k])).toBeLessThan(1e-8);
  });

  it('is a point mass for mean 0 or 1', () => {
    expect(Array.from(betaBinomialPmf(2, 0, 0.3))).toEqual([1, 0, 0]);
    expect(Array.from(betaBinomialPmf(2, 1, 0.3))).toEqual([0, 0, 1]);
  });
});
