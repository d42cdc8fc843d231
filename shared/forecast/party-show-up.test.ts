import { describe, expect, it } from 'vitest';
import { simulateShowUps } from './monte-carlo';
import { oversaleRisk } from './risk';
import { partyMemberPmf, partyShowUp } from './show-up';

describe('partyShowUp (parties that may partly show)', () => {
  it('builds the per-party pmf as cohesion x all-or-none + (1 - cohesion) x Bin(s, p) (definition)', () => {
    // s = 2, p = 0.5, cohesion 0.5: all-or-none (0.5, 0, 0.5), Bin(2, 0.5) = (0.25, 0.5, 0.25)
    const pmf = partyMemberPmf(2, 0.5, 0.5);
    [0.375, 0.25, 0.375].forEach((v, j) => expect(pmf[j]).toBeCloseTo(v, 15));
  });

  it('has mean s p and variance s p (1-p) [(1-c) + c s] per party (derived)', () => {
    const parties = [
      { size: 3, showProbability: 0.8, cohesion: 0.6, count: 5 },
      { size: 2, showProbability: 0.7, cohesion: 0.9, count: 10 },
    ];
    const risk = oversaleRisk(partyShowUp(parties), 0);
    const mean = parties.reduce((s, g) => s + g.count * g.size * g.showProbability, 0);
    const variance = parties.reduce(
      (s, g) => s + g.count * g.size * g.showProbability * (1 - g.showProbability) * (1 - g.cohesion + g.cohesion * g.size),
      0,
    );
    expect(risk.mean).toBeCloseTo(mean, 12);
    expect(risk.sd ** 2).toBeCloseTo(variance, 11);
  });

  it('spreads wider as cohesion grows, at the same mean (from the variance formula; derived)', () => {
    const base = { size: 4, showProbability: 0.85, count: 40 };
    const spread = [0, 0.25, 0.5, 1].map((cohesion) => oversaleRisk(partyShowUp([{ ...base, cohesion }]), 140));
    for (let i = 1; i < spread.length; i++) {
      expect(spread[i].sd).toBeGreaterThan(spread[i - 1].sd);
      expect(spread[i].mean).toBeCloseTo(136, 12);
    }
  });

  it('matches a seeded Monte Carlo simulation when every party travels together', () => {
    const flights = 50_000;
    const units = [{ size: 2, showProbability: 0.8, count: 30 }, { size: 1, showProbability: 0.9, count: 60 }];
    const exact = partyShowUp(units.map((u) => ({ ...u, cohesion: 1 })), { kind: 'beta-binomial', rho: 0.1 });
    const simulated = simulateShowUps(units, flights, 77, { kind: 'beta-binomial', rho: 0.1 });
    const p = oversaleRisk(exact, 100).pOversale;
    expect(Math.abs(oversaleRisk(simulated, 100).pOversale - p)).toBeLessThan(4 * Math.sqrt((p * (1 - p)) / flights));
  });

  it('rejects a cohesion outside [0, 1]', () => {
    expect(() => partyShowUp([{ size: 2, showProbability: 0.8, cohesion: 1.5 }])).toThrow(
      /^parties\[0\]\.cohesion must be within \[0, 1\]/,
    );
  });
});
