import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { binomialPmf } from './binomial';
import { oversaleRisk } from './risk';
import { partyShowUp } from './show-up';
import { showUpDistribution } from './show-up';
import type { CommonShock, ShowUpUnit } from './types';

// Properties that follow from the model itself (derived); fast-check draws the flights.
const probability = fc.double({ min: 0, max: 1, noNaN: true });
const unit = fc.record({
  size: fc.integer({ min: 1, max: 5 }),
  showProbability: probability,
  count: fc.integer({ min: 0, max: 4 }),
});
const flight = fc.array(unit, { minLength: 0, maxLength: 25 });
const shock: fc.Arbitrary<CommonShock | undefined> = fc.oneof(
  fc.constant(undefined),
  fc.double({ min: 0.001, max: 0.95, noNaN: true }).map((rho) => ({ kind: 'beta-binomial' as const, rho })),
  fc
    .array(fc.record({ weight: fc.double({ min: 0.01, max: 1, noNaN: true }), factor: fc.double({ min: 0, max: 1.5, noNaN: true }) }), {
      minLength: 1,
      maxLength: 5,
    })
    .map((parts) => {
      const total = parts.reduce((s, p) => s + p.weight, 0);
      return {
        kind: 'scenarios' as const,
        scenarios: parts.map((p) => ({ weight: p.weight / total, probabilityFactor: p.factor })),
      };
    }),
);

function peopleIn(units: ShowUpUnit[]): number {
  return units.reduce((s, u) => s + u.size * (u.count ?? 1), 0);
}

describe('show-up distribution properties (fast-check)', () => {
  it('sums to 1 within 1e-12 with no negative term, with or without a shock', () => {
    fc.assert(
      fc.property(flight, shock, (units, s) => {
        const pmf = showUpDistribution(units, s);
        expect(pmf.length).toBe(peopleIn(units) + 1);
        expect(Math.abs(pmf.reduce((sum, v) => sum + v, 0) - 1)).toBeLessThanOrEqual(1e-12);
        for (const v of pmf) expect(v).toBeGreaterThanOrEqual(0);
      }),
      { numRuns: 150 },
    );
  });

  it('treats parties of size 1 exactly like individuals listed one by one', () => {
    fc.assert(
      fc.property(fc.array(fc.record({ p: probability, count: fc.integer({ min: 0, max: 6 }) }), { maxLength: 12 }), (rows) => {
        const counted = showUpDistribution(rows.map((r) => ({ size: 1, showProbability: r.p, count: r.count })));
        const listed = showUpDistribution(rows.flatMap((r) => Array.from({ length: r.count }, () => ({ size: 1, showProbability: r.p }))));
        expect(counted.length).toBe(listed.length);
        counted.forEach((v, k) => expect(Math.abs(v - listed[k])).toBeLessThanOrEqual(1e-13));
      }),
    );
  });

  it('gives the binomial as rho -> 0', () => {
    fc.assert(
      fc.property(fc.integer({ min: 0, max: 300 }), probability, (n, p) => {
        const shocked = showUpDistribution([{ size: 1, showProbability: p, count: n }], { kind: 'beta-binomial', rho: 1e-11 });
        const plain = binomialPmf(n, p);
        shocked.forEach((v, k) => expect(Math.abs(v - plain[k])).toBeLessThanOrEqual(1e-8));
      }),
    );
  });

  it('gives the independent Poisson-binomial as rho -> 0 for mixed flights too', () => {
    fc.assert(
      fc.property(flight, (units) => {
        const shocked = showUpDistribution(units, { kind: 'beta-binomial', rho: 1e-11 });
        const plain = showUpDistribution(units);
        shocked.forEach((v, k) => expect(Math.abs(v - plain[k])).toBeLessThanOrEqual(1e-8));
      }),
      { numRuns: 60 },
    );
  });

  it('never lowers P(X > C) when any one show probability is raised', () => {
    fc.assert(
      fc.property(flight.filter((u) => u.length > 0), fc.nat(), probability, fc.nat({ max: 80 }), shock, (units, pick, bump, capacity, s) => {
        const index = pick % units.length;
        const raised = units.map((u, i) =>
          i === index ? { ...u, showProbability: u.showProbability + (1 - u.showProbability) * bump } : u,
        );
        const before = oversaleRisk(showUpDistribution(units, s), capacity).pOversale;
        const after = oversaleRisk(showUpDistribution(raised, s), capacity).pOversale;
        // The engine's figures are exact to about 1e-12 in absolute terms (a counterexample raised a chance of exactly 0
        // and moved a risk of 1.0000002e-12 to 1.7e-19), so monotone means monotone beyond 1e-9.
        expect(after).toBeGreaterThanOrEqual(before - 1e-9);
      }),
      { numRuns: 150 },
    );
  });

  it('is unchanged by a shock with one scenario of factor 1', () => {
    fc.assert(
      fc.property(flight, (units) => {
        const plain = showUpDistribution(units);
        const shocked = showUpDistribution(units, { kind: 'scenarios', scenarios: [{ weight: 1, probabilityFactor: 1 }] });
        expect(Array.from(shocked)).toEqual(Array.from(plain));
      }),
    );
  });

  it('partyShowUp with cohesion 1 equals the all-together model, with cohesion 0 the per-person model', () => {
    fc.assert(
      fc.property(flight, shock, (units, s) => {
        const together = partyShowUp(units.map((u) => ({ ...u, cohesion: 1 })), s);
        const allOrNone = showUpDistribution(units, s);
        together.forEach((v, k) => expect(Math.abs(v - allOrNone[k])).toBeLessThanOrEqual(1e-12));
        const apart = partyShowUp(units.map((u) => ({ ...u, cohesion: 0 })), s);
        const perPerson = showUpDistribution(units.map((u) => ({ size: 1, showProbability: u.showProbability, count: u.size * (u.count ?? 1) })), s);
        apart.forEach((v, k) => expect(Math.abs(v - perPerson[k])).toBeLessThanOrEqual(1e-12));
      }),
      { numRuns: 80 },
    );
  });
});
