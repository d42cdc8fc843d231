// Every probability the engine returns lies in [0, 1], and the volunteer target never asks for more people than could
// be over the seats. Kolmogorov's axioms (probabilities lie in [0, 1]) are the outside check; the rest is derived.
import { describe, expect, it } from 'vitest';
import { bookingLimitCurve, oversaleRisk, showUpDistribution, upperTail, volunteerTarget } from './index';
import { probabilityOut } from './validate';

describe('probabilities stay within [0, 1]', () => {
  it('clamps a sum that rounding carries a hair past 1, as a long manifest can', () => {
    // A pmf that sums to 1 + 1e-12, inside the engine's summing tolerance: every outcome above 0 seats is an oversale.
    const pmf = [0, 0.5, 0.5 + 1e-12];
    expect(oversaleRisk(pmf, 0).pOversale).toBe(1);
    expect(upperTail(pmf, 0)).toBe(1);
    expect(upperTail(pmf, 1)).toBe(1);
  });

  it('refuses, rather than shows, a value that is not a rounding artefact', () => {
    expect(() => probabilityOut(1.2, 'pOversale')).toThrow(/pOversale: the engine produced 1.2, outside \[0, 1\]/);
    expect(() => probabilityOut(Number.NaN, 'pOversale')).toThrow(/outside/);
    expect(probabilityOut(-1e-15, 'p')).toBe(0);
  });

  it('holds for 5,000 bookings on 169 seats and along a booking-limit curve', () => {
    const units = Array.from({ length: 5000 }, (_, i) => ({ size: 1 + (i % 3 === 0 ? 1 : 0), showProbability: i % 2 ? 0.93 : 0.999 }));
    const risk = oversaleRisk(showUpDistribution(units), 169);
    expect(risk.pOversale).toBeLessThanOrEqual(1);
    expect(risk.pFullOrOver).toBeLessThanOrEqual(1);
    for (const point of bookingLimitCurve({ capacity: 150, showProbability: 0.9, revenuePerBooking: 1, costPerDenial: 3, maxBookings: 400 })) {
      expect(point.pOversale).toBeGreaterThanOrEqual(0);
      expect(point.pOversale).toBeLessThanOrEqual(1);
    }
  });
});

describe('the volunteer target', () => {
  it('never exceeds bookings minus seats, even when everyone is sure to show', () => {
    // 10 bookings all certain to show on 6 seats: 4 must give up their seats, and no more can (derived).
    const pmf = showUpDistribution(Array.from({ length: 10 }, () => ({ size: 1, showProbability: 1 })));
    expect(volunteerTarget(pmf, 6, 0.05)).toBe(4);
    expect(volunteerTarget(pmf, 12, 0.05)).toBe(0);
  });
});
