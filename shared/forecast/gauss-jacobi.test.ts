import { describe, expect, it } from 'vitest';
import { betaQuadrature } from './gauss-jacobi';

describe('betaQuadrature (Gauss-Jacobi by Golub-Welsch)', () => {
  it('reproduces the Gauss-Legendre rules for Beta(1, 1), the uniform on [0, 1]', () => {
    // Gauss-Legendre on [-1, 1] (Abramowitz & Stegun, Table 25.4; from memory): 2 nodes +-1/sqrt(3), weights 1;
    // 3 nodes 0, +-sqrt(3/5), weights 8/9, 5/9. Mapped to [0, 1] and divided by 2.
    const two = betaQuadrature(2, 1, 1);
    expect(two.nodes[0]).toBeCloseTo(0.5 - 0.5 / Math.sqrt(3), 15);
    expect(two.nodes[1]).toBeCloseTo(0.5 + 0.5 / Math.sqrt(3), 15);
    two.weights.forEach((w) => expect(w).toBeCloseTo(0.5, 15));
    const three = betaQuadrature(3, 1, 1);
    expect(Array.from(three.nodes).map((x) => Number(x.toFixed(14)))).toEqual(
      [0.5 - Math.sqrt(0.6) / 2, 0.5, 0.5 + Math.sqrt(0.6) / 2].map((x) => Number(x.toFixed(14))),
    );
    [5 / 18, 8 / 18, 5 / 18].forEach((w, i) => expect(three.weights[i]).toBeCloseTo(w, 14));
  });

  it('integrates Beta moments E[X^j] = prod_{i<j} (a+i)/(a+b+i) exactly up to degree 2N - 1', () => {
    // the moment formula follows from E[X^j] = B(a+j, b) / B(a, b) (standard Beta property)
    const cases: [number, number, number][] = [
      [5, 2, 3],
      [10, 0.3, 0.2],
      [40, 17.1, 1.9],
      [120, 900, 300],
      [200, 0.5, 0.5],
      [64, 1e5, 3e5],
    ];
    for (const [size, a, b] of cases) {
      const { nodes, weights } = betaQuadrature(size, a, b);
      let exact = 1;
      for (let j = 0; j <= 2 * size - 1; j++) {
        let approx = 0;
        for (let i = 0; i < size; i++) approx += weights[i] * nodes[i] ** j;
        expect(Math.abs(approx / exact - 1)).toBeLessThan(1e-11);
        exact *= (a + j) / (a + b + j);
      }
    }
  });

  it('has sorted nodes inside [0, 1] and positive weights summing to 1', () => {
    const { nodes, weights } = betaQuadrature(150, 0.7, 4);
    for (let i = 1; i < nodes.length; i++) expect(nodes[i]).toBeGreaterThan(nodes[i - 1]);
    expect(nodes[0]).toBeGreaterThanOrEqual(0);
    expect(nodes[nodes.length - 1]).toBeLessThanOrEqual(1);
    for (const w of weights) expect(w).toBeGreaterThan(0);
    expect(weights.reduce((s, w) => s + w, 0)).toBeCloseTo(1, 15);
  });

  it('handles a + b = 1 and a + b = 2, where the general recurrence is 0/0', () => {
    for (const [a, b] of [[0.4, 0.6], [0.5, 1.5]]) {
      const { nodes, weights } = betaQuadrature(6, a, b);
      const mean = nodes.reduce((s, x, i) => s + weights[i] * x, 0);
      expect(mean).toBeCloseTo(a / (a + b), 14);
    }
  });

  it('rejects a bad node count or shape', () => {
    expect(() => betaQuadrature(0, 1, 1)).toThrow(RangeError);
    expect(() => betaQuadrature(3, 0, 1)).toThrow(/a and b must be finite and > 0/);
  });
});
