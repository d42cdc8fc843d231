import { describe, expect, it } from 'vitest';
import { betaBinomialPmf } from './binomial';
import { betaQuadrature } from './gauss-jacobi';
import { simulateShowUps } from './monte-carlo';
import { allOrNoneDistribution, groupUnits } from './poisson-binomial';
import { oversaleRisk } from './risk';
import { betaRateTransform, integrateOverShock, quadratureNodeCount } from './shock';
import { showUpDistribution } from './show-up';
import type { ShowUpUnit } from './types';

/** A mixed flight: 90 individuals from 0.55 to 0.98, 8 pairs, 3 parties of four (made up for the tests). */
function mixedFlight(): ShowUpUnit[] {
  const units: ShowUpUnit[] = [];
  for (let i = 0; i < 90; i++) units.push({ size: 1, showProbability: 0.55 + (0.43 * ((i * 37) % 90)) / 89 });
  for (let i = 0; i < 8; i++) units.push({ size: 2, showProbability: 0.7 + 0.03 * i });
  for (let i = 0; i < 3; i++) units.push({ size: 4, showProbability: 0.8 + 0.05 * i });
  return units;
}

function moments(pmf: ArrayLike<number>): { mean: number; variance: number } {
  const { mean, sd } = oversaleRisk(pmf, 0);
  return { mean, variance: sd * sd };
}

describe('beta-binomial shock for passengers with different probabilities', () => {
  it('matches a seeded Monte Carlo simulation of the same model within 4 standard errors', () => {
    const units = mixedFlight();
    const shock = { kind: 'beta-binomial', rho: 0.04 } as const;
    const exact = showUpDistribution(units, shock);
    const flights = 100_000;
    const simulated = simulateShowUps(units, flights, 20240611, shock);
    for (const capacity of [90, 100, 110, 120]) {
      const p = oversaleRisk(exact, capacity).pOversale;
      const standardError = Math.sqrt((p * (1 - p)) / flights);
      expect(Math.abs(oversaleRisk(simulated, capacity).pOversale - p)).toBeLessThan(4 * standardError + 1e-9);
    }
    for (let k = 0; k < exact.length; k++) {
      const standardError = Math.sqrt((exact[k] * (1 - exact[k])) / flights);
      expect(Math.abs(simulated[k] - exact[k])).toBeLessThan(5 * standardError + 2e-5);
    }
  });

  it('keeps every booked probability on average: mean = sum(s p) (derived from E[theta] = mean)', () => {
    const units = mixedFlight();
    const expectedMean = units.reduce((s, u) => s + u.size * u.showProbability, 0);
    expect(moments(showUpDistribution(units, { kind: 'beta-binomial', rho: 0.3 })).mean).toBeCloseTo(expectedMean, 10);
  });

  it('has variance sum(p(1-p)) + Var(theta)[(sum s)^2 - sum s^2] for individuals (derived)', () => {
    // each p_i(theta) = p_i + slope_i (theta - m), slope_i = min(p_i/m, (1-p_i)/(1-m)), Var(theta) = m(1-m)rho;
    // the law of total variance then gives the formula above
    const ps = [0.5, 0.62, 0.7, 0.75, 0.81, 0.88, 0.9, 0.93, 0.97, 0.99];
    const units = ps.map((p) => ({ size: 1, showProbability: p, count: 12 }));
    const rho = 0.08;
    const m = ps.reduce((s, p) => s + p, 0) / ps.length;
    const slopes = ps.map((p) => Math.min(p / m, (1 - p) / (1 - m)));
    const sumSlopes = 12 * slopes.reduce((s, v) => s + v, 0);
    const sumSquares = 12 * slopes.reduce((s, v) => s + v * v, 0);
    const independent = 12 * ps.reduce((s, p) => s + p * (1 - p), 0);
    const expected = independent + m * (1 - m) * rho * (sumSlopes ** 2 - sumSquares);
    expect(moments(showUpDistribution(units, { kind: 'beta-binomial', rho })).variance).toBeCloseTo(expected, 9);
  });

  it('gives the exact beta-binomial when the quadrature path runs on identical individuals', () => {
    const { groups, total } = groupUnits(Array.from({ length: 150 }, () => ({ size: 1, showProbability: 0.86 })));
    const viaQuadrature = integrateOverShock({ kind: 'beta-binomial', rho: 0.05 }, { meanProbability: 0.86, degree: 150, people: 150 }, (t) =>
      allOrNoneDistribution(groups, total, t),
    );
    const exact = betaBinomialPmf(150, 0.86, 0.05);
    exact.forEach((v, k) => expect(Math.abs(viaQuadrature[k] - v)).toBeLessThan(1e-13));
  });

  it('with the reduced node count agrees with the exact rule (ceil((units+1)/2) nodes) to 1e-12', () => {
    const units: ShowUpUnit[] = [];
    for (let i = 0; i < 400; i++) units.push({ size: 1, showProbability: 0.6 + (0.38 * ((i * 53) % 400)) / 399 });
    const { groups, total } = groupUnits(units);
    const mean = groups.reduce((s, g) => s + g.probability, 0) / total;
    expect(quadratureNodeCount(400, 400)).toBeLessThan(201);
    for (const rho of [0.01, 0.2, 0.8]) {
      const reduced = showUpDistribution(units, { kind: 'beta-binomial', rho });
      const rule = betaQuadrature(201, mean * (1 / rho - 1), (1 - mean) * (1 / rho - 1));
      const exact = new Float64Array(total + 1);
      rule.nodes.forEach((theta, j) => {
        const conditional = allOrNoneDistribution(groups, total, betaRateTransform(theta, mean));
        for (let k = 0; k <= total; k++) exact[k] += rule.weights[j] * conditional[k];
      });
      exact.forEach((v, k) => expect(Math.abs(reduced[k] - v)).toBeLessThan(1e-12));
    }
  });

  it('fattens the oversale tail compared with independent show-ups (positive correlation)', () => {
    const units = mixedFlight();
    const independent = oversaleRisk(showUpDistribution(units), 112).pOversale;
    const correlated = oversaleRisk(showUpDistribution(units, { kind: 'beta-binomial', rho: 0.05 }), 112).pOversale;
    expect(correlated).toBeGreaterThan(independent);
  });
});

describe('betaRateTransform', () => {
  it('maps the rate onto each probability linearly, inside [0, 1], identity at p = mean', () => {
    const mean = 0.8;
    for (const theta of [0, 0.3, 0.8, 1]) {
      const t = betaRateTransform(theta, mean);
      expect(t(mean)).toBeCloseTo(theta, 15);
      expect(t(0)).toBe(0);
      expect(t(1)).toBe(1);
      expect(t(0.4)).toBeCloseTo((0.4 * theta) / mean, 15);
      expect(t(0.9)).toBeCloseTo(1 - (0.1 * (1 - theta)) / 0.2, 15);
    }
  });
});

describe('scenario shock', () => {
  it('is the weighted sum of Poisson-binomials with p * factor capped at 1 (definition)', () => {
    const units = mixedFlight();
    const scenarios = [
      { weight: 0.25, probabilityFactor: 0.9 },
      { weight: 0.5, probabilityFactor: 1 },
      { weight: 0.25, probabilityFactor: 1.15 },
    ];
    const mixed = showUpDistribution(units, { kind: 'scenarios', scenarios });
    const parts = scenarios.map((s) =>
      showUpDistribution(units.map((u) => ({ ...u, showProbability: Math.min(1, u.showProbability * s.probabilityFactor) }))),
    );
    mixed.forEach((v, k) => expect(v).toBeCloseTo(parts.reduce((sum, f, i) => sum + scenarios[i].weight * f[k], 0), 15));
  });

  it('ignores a zero-weight scenario', () => {
    const units = mixedFlight();
    const shocked = showUpDistribution(units, {
      kind: 'scenarios',
      scenarios: [{ weight: 1, probabilityFactor: 1 }, { weight: 0, probabilityFactor: 3 }],
    });
    expect(Array.from(shocked)).toEqual(Array.from(showUpDistribution(units)));
  });
});

describe('beta-binomial shock at the edge of floating point', () => {
  // Found by the fast-check property "raising a p never lowers P(X > C)": a mean show rate of 5e-324 makes the Beta's
  // a underflow to 0. The Beta is then a point mass, so the result must equal the distribution without a shock.
  it('treats a mean that rounds the Beta shape to zero as no shock at all', () => {
    const units = [{ size: 2, showProbability: 5e-324 }];
    const plain = showUpDistribution(units);
    const shocked = showUpDistribution(units, { kind: 'beta-binomial', rho: 2 / 3 });
    expect(Array.from(shocked)).toEqual(Array.from(plain));
  });
});
