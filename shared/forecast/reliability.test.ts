import { describe, expect, it } from 'vitest';
import { oversaleBacktest, reliabilityBins } from './reliability';

describe('reliabilityBins', () => {
  it('bins a small fixed history as worked by hand', () => {
    // Five bins of width 0.2. Bin [0, 0.2): 0.05, 0.15, 0.12 -> mean 0.32/3, one of three happened.
    // Bin [0.4, 0.6): 0.4 (the lower edge belongs to the bin), 0.55 -> mean 0.475, one of two.
    // Bin [0.8, 1]: 0.95 and 1 (the top edge closes the last bin) -> mean 0.975, both happened. Empty bins left out.
    const bins = reliabilityBins([0.05, 0.15, 0.12, 0.4, 0.55, 0.95, 1], [0, 0, 1, 0, 1, 1, 1], 5);
    expect(bins).toHaveLength(3);
    expect(bins[0]).toMatchObject({ from: 0, to: 0.2, count: 3, observedRate: 1 / 3 });
    expect(bins[0].meanPredicted).toBeCloseTo(0.32 / 3, 12);
    expect(bins[1]).toMatchObject({ from: 0.4, to: 0.6, count: 2, observedRate: 0.5 });
    expect(bins[1].meanPredicted).toBeCloseTo(0.475, 12);
    expect(bins[2]).toMatchObject({ from: 0.8, to: 1, count: 2, observedRate: 1 });
    expect(bins[2].meanPredicted).toBeCloseTo(0.975, 12);
  });

  it('refuses a bin count that is not a positive integer', () => {
    expect(() => reliabilityBins([0.5], [1], 0)).toThrow(/bins/);
  });
});

describe('oversaleBacktest', () => {
  it('scores the oversale odds of four held-out flights as worked by hand', () => {
    const result = oversaleBacktest(
      [
        { pOversale: 0.1, expectedDenied: 0.05, oversold: false, beyondSeats: 0 },
        { pOversale: 0.3, expectedDenied: 0.4, oversold: true, beyondSeats: 2 },
        { pOversale: 0.6, expectedDenied: 0.9, oversold: true, beyondSeats: 1 },
        { pOversale: 0.2, expectedDenied: 0.1, oversold: false, beyondSeats: 0 },
      ],
      5,
    );
    // Hand-worked: mean forecast 1.2/4 = 0.3; two of four oversold; Brier (0.01 + 0.49 + 0.16 + 0.04)/4 = 0.175;
    // expected people beyond the seats 0.05 + 0.4 + 0.9 + 0.1 = 1.45 against 3 that happened.
    expect(result.flights).toBe(4);
    expect(result.meanPredicted).toBeCloseTo(0.3, 12);
    expect(result.observedRate).toBe(0.5);
    expect(result.brier).toBeCloseTo(0.175, 12);
    expect(result.expectedDenied).toBeCloseTo(1.45, 12);
    expect(result.actualDenied).toBe(3);
    expect(result.bins.map((b) => [b.from, b.count, b.observedRate])).toEqual([[0, 1, 0], [0.2, 2, 0.5], [0.6, 1, 1]]);
  });
});
