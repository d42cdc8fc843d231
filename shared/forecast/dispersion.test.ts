import { describe, expect, it } from 'vitest';
import { estimateCommonShock } from './dispersion';
import { betaSample, createSeededRandom } from './monte-carlo';
import { betaShape } from './binomial';

function flights(count: number, booked: number, mean: number, rho: number, seed: number) {
  const random = createSeededRandom(seed);
  const { a, b } = rho > 0 ? betaShape(mean, rho) : { a: 0, b: 0 };
  return Array.from({ length: count }, () => {
    const theta = rho > 0 ? betaSample(a, b, random) : mean;
    let showed = 0;
    for (let i = 0; i < booked; i++) if (random() < theta) showed++;
    return { booked, showed, expectedShowed: booked * mean };
  });
}

/**
 * Standard error of the moment estimate for F flights of n people, from the normal approximation of each flight's
 * shows (Var[(y - E)^2] = 2 Var(y)^2): SE = sqrt(2 / F) (1 + (n - 1) rho) / (n - 1).
 */
const standardError = (count: number, n: number, rho: number) => Math.sqrt(2 / count) * (1 + (n - 1) * rho) / (n - 1);

describe('estimateCommonShock', () => {
  it('recovers a known common shock from generated flights within 4 standard errors', () => {
    const estimate = estimateCommonShock(flights(2000, 150, 0.88, 0.02, 11));
    expect(Math.abs(estimate.rho - 0.02)).toBeLessThanOrEqual(4 * standardError(2000, 150, 0.02));
    expect(estimate.shock).toEqual({ kind: 'beta-binomial', rho: estimate.rho });
    expect(estimate.dispersionRatio).toBeGreaterThan(2);
  });

  it('finds no shock, or one within 4 standard errors of none, when passengers are independent', () => {
    const estimate = estimateCommonShock(flights(2000, 150, 0.88, 0, 12));
    expect(estimate.rho).toBeLessThanOrEqual(4 * standardError(2000, 150, 0));
  });

  it('works a three-flight example by hand', () => {
    // Hand-worked: 100 booked each, expected 90, variance 9 each; deviations 0, 10, -10 -> excess (0 + 100 + 100) - 27 = 173;
    // scale 3 * 100 * 99 * 0.09 = 2673; rho = 173 / 2673.
    const estimate = estimateCommonShock([90, 100, 80].map((showed) => ({ booked: 100, showed, expectedShowed: 90 })));
    expect(estimate.rho).toBeCloseTo(173 / 2673, 12);
    expect(estimate.dispersionRatio).toBeCloseTo(200 / 27, 12);
  });
});
