import { describe, expect, it } from 'vitest';
import { learnShowRates, MAX_PRIOR_STRENGTH, priorStrength, type SegmentHistory } from './learn';
import { createSeededRandom } from './monte-carlo';

function binomialDraw(n: number, p: number, random: () => number): number {
  let k = 0;
  for (let i = 0; i < n; i++) if (random() < p) k++;
  return k;
}

describe('learnShowRates', () => {
  it('works a two-segment example by hand', () => {
    // Hand-worked: parent 10/20 = 0.5; S = 10(0.8-0.5)^2 + 10(0.2-0.5)^2 = 1.8; (k-1) mu(1-mu) = 0.25;
    // denominator 0.25 (20 - 200/20) = 2.5; rho = 1.55 / 2.5 = 0.62; m = 1/0.62 - 1 = 0.612903;
    // A = (8 + 0.612903 * 0.5) / (10 + 0.612903) = 0.782675.
    const rates = learnShowRates(
      [
        { segment: ['LHR', 'A'], booked: 10, showed: 8 },
        { segment: ['LHR', 'B'], booked: 10, showed: 2 },
      ],
      { minEvidence: 0 },
    );
    expect(rates.get('')).toEqual({ rate: 0.5, evidence: 20, shrunkToward: null });
    expect(rates.get('LHR')).toMatchObject({ rate: 0.5, evidence: 20, shrunkToward: '' });
    expect(rates.get('LHR/A')!.rate).toBeCloseTo(0.782675, 6);
    expect(rates.get('LHR/B')!.rate).toBeCloseTo(1 - 0.782675, 6);
    expect(rates.get('LHR/A')!.shrunkToward).toBe('LHR');
  });

  it('estimates the prior strength by the method of moments, and the largest one when segments differ by chance only', () => {
    expect(priorStrength([[{ booked: 10, showed: 8 }, { booked: 10, showed: 2 }]])).toBeCloseTo(1 / 0.62 - 1, 9);
    expect(priorStrength([[{ booked: 100, showed: 90 }, { booked: 100, showed: 90 }]])).toBe(MAX_PRIOR_STRENGTH);
    expect(priorStrength([[{ booked: 100, showed: 90 }]])).toBe(MAX_PRIOR_STRENGTH);
  });

  it('gives a segment with no bookings, or fewer than the minimum evidence, its parent rate', () => {
    const history: SegmentHistory[] = [
      { segment: ['LHR', 'JFK', 'Y'], booked: 400, showed: 360 },
      { segment: ['LHR', 'JFK', 'J'], booked: 0, showed: 0 },
      { segment: ['LHR', 'JFK', 'F'], booked: 12, showed: 2 },
    ];
    const rates = learnShowRates(history, { minEvidence: 30 });
    const parent = rates.get('LHR/JFK')!.rate;
    expect(rates.get('LHR/JFK/J')).toEqual({ rate: parent, evidence: 0, shrunkToward: 'LHR/JFK' });
    expect(rates.get('LHR/JFK/F')).toEqual({ rate: parent, evidence: 12, shrunkToward: 'LHR/JFK' });
    // With the rule lowered, the 12 bookings pull F well below its parent.
    expect(learnShowRates(history, { minEvidence: 5 }).get('LHR/JFK/F')!.rate).toBeLessThan(parent);
  });

  it('lets a segment of huge evidence stand on its own record', () => {
    const rates = learnShowRates([
      { segment: ['LHR', 'Y'], booked: 5_000_000, showed: 4_000_000 },
      { segment: ['LHR', 'J'], booked: 50, showed: 49 },
      { segment: ['LHR', 'F'], booked: 60, showed: 58 },
    ]);
    expect(rates.get('LHR/Y')!.rate).toBeCloseTo(0.8, 3);
  });

  it('recovers known rates from generated history within bounds from the sample size', () => {
    const random = createSeededRandom(20261203);
    // Invented true rates per station/route/fare class (made up for the test).
    const truth = new Map<string, number>();
    const history: SegmentHistory[] = [];
    for (const [s, station] of ['LHR', 'FCO'].entries()) {
      for (const [r, route] of ['JFK', 'ORD', 'YYZ'].entries()) {
        for (const [f, fare] of ['flex', 'saver'].entries()) {
          const p = 0.8 + 0.03 * s + 0.02 * r + 0.05 * f;
          const booked = 1500 + 500 * ((s + r + f) % 3);
          truth.set([station, route, fare].join('/'), p);
          history.push({ segment: [station, route, fare], booked, showed: binomialDraw(booked, p, random) });
        }
      }
    }
    const rates = learnShowRates(history);
    for (const row of history) {
      const key = row.segment.join('/');
      const p = truth.get(key)!;
      const learned = rates.get(key)!;
      // 4 standard errors of a binomial proportion, plus the most the shrinkage can pull (weight m/(n+m) on a
      // parent no further than 0.2 away), with m read off the level as the estimator sees it.
      const m = priorStrength([history.filter((h) => h.segment[0] === row.segment[0] && h.segment[1] === row.segment[1])]);
      const bound = 4 * Math.sqrt((p * (1 - p)) / row.booked) + (Math.min(m, 1e4) / (row.booked + m)) * 0.2;
      expect(Math.abs(learned.rate - p), key).toBeLessThanOrEqual(bound);
      expect(learned.evidence).toBe(row.booked);
    }
  });

  it('refuses bad history with the field named', () => {
    expect(() => learnShowRates([{ segment: ['LHR'], booked: 3, showed: 4 }])).toThrow(/history\[0\]\.showed/);
    expect(() => learnShowRates([{ segment: ['LHR'], booked: -1, showed: 0 }])).toThrow(/history\[0\]\.booked/);
    expect(() => learnShowRates([{ segment: [], booked: 1, showed: 0 }])).toThrow(/history\[0\]\.segment/);
    expect(() => learnShowRates([], { minEvidence: -1 })).toThrow(/minEvidence/);
    expect(learnShowRates([]).size).toBe(0);
  });
});
