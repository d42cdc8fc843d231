import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { betaBinomialPmf, binomialPmf } from './binomial';
import { bookingLimitCurve, optimalBookingLimit } from './booking-limit';
import { oversaleRisk } from './risk';

describe('optimalBookingLimit against MCM 2002 "Optimal Overbooking"', () => {
  // MCM 2002 Problem "Optimal Overbooking", Duke University team, The UMAP Journal 23(3), 2002, table excerpt:
  // 150 seats, denied-boarding cost (k + 1) x fare, optimal bookings for k = 1, 2, 3.
  const table: [number, number[]][] = [
    [0.8, [189, 186, 184]],
    [0.85, [177, 175, 173]],
    [0.9, [167, 165, 164]],
  ];
  for (const [showProbability, expected] of table) {
    it(`gives ${expected.join(', ')} at p = ${showProbability}`, () => {
      const got = [1, 2, 3].map(
        (k) =>
          optimalBookingLimit({ capacity: 150, showProbability, revenuePerBooking: 100, costPerDenial: (k + 1) * 100 })
            .bookings,
      );
      expect(got).toEqual(expected);
    });
  }
});

describe('bookingLimitCurve', () => {
  it('runs from capacity to maxBookings with R(n) = r n - h E[(X_n - C)+] (definition)', () => {
    const curve = bookingLimitCurve({ capacity: 50, showProbability: 0.9, revenuePerBooking: 3, costPerDenial: 10, maxBookings: 70 });
    expect(curve.map((p) => p.bookings)).toEqual(Array.from({ length: 21 }, (_, i) => 50 + i));
    for (const point of curve) {
      const risk = oversaleRisk(binomialPmf(point.bookings, 0.9), 50);
      expect(point.pOversale).toBeCloseTo(risk.pOversale, 13);
      expect(point.expectedDenied).toBeCloseTo(risk.expectedDenied, 12);
      expect(point.expectedNet).toBeCloseTo(3 * point.bookings - 10 * risk.expectedDenied, 11);
    }
  });

  it('defaults maxBookings to 2 * capacity + 50', () => {
    const curve = bookingLimitCurve({ capacity: 10, showProbability: 0.5, revenuePerBooking: 1, costPerDenial: 1 });
    expect(curve[curve.length - 1].bookings).toBe(70);
  });

  it('uses the beta-binomial of each n under a beta shock', () => {
    const shock = { kind: 'beta-binomial', rho: 0.03 } as const;
    const curve = bookingLimitCurve({ capacity: 100, showProbability: 0.85, revenuePerBooking: 1, costPerDenial: 3, maxBookings: 125, shock });
    for (const point of curve) {
      expect(point.pOversale).toBeCloseTo(oversaleRisk(betaBinomialPmf(point.bookings, 0.85, 0.03), 100).pOversale, 12);
    }
  });
});

describe('optimalBookingLimit', () => {
  it('agrees with the argmax of the curve (marginal formula vs scan; derived)', () => {
    fc.assert(
      fc.property(
        fc.integer({ min: 0, max: 120 }),
        fc.double({ min: 0.3, max: 1, noNaN: true }),
        fc.double({ min: 0, max: 500, noNaN: true }),
        fc.double({ min: 0, max: 2000, noNaN: true }),
        (capacity, showProbability, revenuePerBooking, costPerDenial) => {
          const o = { capacity, showProbability, revenuePerBooking, costPerDenial };
          const optimum = optimalBookingLimit(o);
          const curve = bookingLimitCurve(o);
          let best = curve[0];
          for (const point of curve) if (point.expectedNet > best.expectedNet) best = point;
          const scale = Math.max(1, Math.abs(best.expectedNet));
          // equal answers, or two n whose expected nets tie to rounding
          if (optimum.bookings !== best.bookings) expect(Math.abs(optimum.expectedNet - best.expectedNet)).toBeLessThan(1e-9 * scale);
          else expect(optimum.expectedNet).toBeCloseTo(best.expectedNet, 8);
        },
      ),
      { numRuns: 150 },
    );
  });

  it('stays at capacity when everyone shows and a denial costs at least a booking earns', () => {
    // p = 1: every booking beyond C is denied, so R(C+1) - R(C) = r - h <= 0 (derived); equality keeps the smaller n
    expect(optimalBookingLimit({ capacity: 30, showProbability: 1, revenuePerBooking: 5, costPerDenial: 9 })).toEqual({
      bookings: 30,
      expectedNet: 150,
      atSearchLimit: false,
    });
    expect(optimalBookingLimit({ capacity: 30, showProbability: 1, revenuePerBooking: 5, costPerDenial: 5 }).bookings).toBe(30);
    expect(optimalBookingLimit({ capacity: 0, showProbability: 0.9, revenuePerBooking: 0, costPerDenial: 0 }).bookings).toBe(0);
  });

  it('flags the search limit when each extra booking still pays (h p < r)', () => {
    // h p = 0.6 < r = 1, so r - h p P(X_n >= C) > 0 for every n (derived)
    const o = { capacity: 150, showProbability: 0.3, revenuePerBooking: 1, costPerDenial: 2 };
    expect(optimalBookingLimit(o)).toMatchObject({ bookings: 350, atSearchLimit: true });
    expect(optimalBookingLimit({ ...o, shock: { kind: 'scenarios', scenarios: [{ weight: 1, probabilityFactor: 1 }] } }))
      .toMatchObject({ bookings: 350, atSearchLimit: true });
  });

  it('with a one-scenario factor-1 shock gives the no-shock answer via the scan', () => {
    const o = { capacity: 150, showProbability: 0.85, revenuePerBooking: 100, costPerDenial: 300 };
    const plain = optimalBookingLimit(o);
    const scanned = optimalBookingLimit({ ...o, shock: { kind: 'scenarios', scenarios: [{ weight: 1, probabilityFactor: 1 }] } });
    expect(scanned.bookings).toBe(plain.bookings);
    expect(scanned.expectedNet).toBeCloseTo(plain.expectedNet, 9);
  });

  it('books fewer under a common shock on this example (wider spread, same mean; computed, not a general law)', () => {
    const o = { capacity: 150, showProbability: 0.85, revenuePerBooking: 100, costPerDenial: 300 };
    const plain = optimalBookingLimit(o).bookings;
    const shocked = optimalBookingLimit({ ...o, shock: { kind: 'beta-binomial', rho: 0.05 } });
    expect(shocked.bookings).toBeLessThan(plain);
    const curve = bookingLimitCurve({ ...o, shock: { kind: 'beta-binomial', rho: 0.05 } });
    expect(Math.max(...curve.map((p) => p.expectedNet))).toBe(shocked.expectedNet);
  });
});
