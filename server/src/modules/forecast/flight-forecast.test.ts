// A flight's figures from its passengers, on cases small enough to work by hand (binomial sums written out).
import { describe, expect, it } from 'vitest';
import { DEFAULT_SHOW_UP_PROFILE as profile } from '@shared/schemas/show-up-profile';
import { computeFlightForecast, type ForecastInput } from './flight-forecast';

const departure = new Date('2026-12-03T10:00:00Z');
const now = new Date('2026-12-03T08:30:00Z');
type P = ForecastInput['passengers'][number];
const pax = (id: number, bookingId: number, over: Partial<P> = {}): P => ({
  id, bookingId, cabin: 'Y', fareType: 'standard', status: 'checked-in', inboundFlight: null, inboundEstimatedArrival: null, travelsTogether: true, ...over,
});
const input = (passengers: P[], seatsByCabin: Record<string, number> = { Y: 1 }): ForecastInput => ({
  passengers, seatsByCabin, departure, now, profile, riskTolerance: 0.05, shock: null,
});

describe('computeFlightForecast', () => {
  it('two checked-in strangers for one seat: each shows with 0.995 independently', () => {
    const { forecast, cabins } = computeFlightForecast(input([pax(1, 1), pax(2, 2)]));
    // P(0) = 0.005², P(1) = 2 × 0.995 × 0.005, P(2) = 0.995².
    expect(forecast.pmf[0]).toBeCloseTo(0.000025, 15);
    expect(forecast.pmf[1]).toBeCloseTo(0.00995, 15);
    expect(forecast.pmf[2]).toBeCloseTo(0.990025, 15);
    expect(forecast.pOversale).toBeCloseTo(0.990025, 12);
    // One seat short whenever both show: E[denied] = P(2) × 1.
    expect(forecast.expectedDenied).toBeCloseTo(0.990025, 12);
    expect(forecast.mean).toBeCloseTo(1.99, 12);
    expect(cabins).toEqual([{ cabin: 'Y', seats: 1, booked: 2, checkedIn: 2, boarded: 0, expectedShows: 1.99, pOversale: expect.closeTo(0.990025, 12) }]);
  });

  it('a party of two in the same state shows as one unit: all or nothing', () => {
    const { forecast } = computeFlightForecast(input([pax(1, 1), pax(2, 1)]));
    expect(forecast.pmf[0]).toBeCloseTo(0.005, 15);
    expect(forecast.pmf[1]).toBeCloseTo(0, 15);
    expect(forecast.pmf[2]).toBeCloseTo(0.995, 15);
    expect(forecast.pOversale).toBeCloseTo(0.995, 12);
  });

  it('a party whose members are in different states counts them one by one', () => {
    // One boarded (1), one not checked in (local Y at 90 min: G = 0.68 + (120 − 90)/60 × 0.19 = 0.775,
    // p = 0.9 × 0.225 / (1 − 0.9 × 0.775) = 0.2025 / 0.3025 = 0.669421…): P(2 shows) = p.
    const { forecast } = computeFlightForecast(input([pax(1, 1, { status: 'boarded' }), pax(2, 1, { status: 'booked' })]));
    expect(forecast.pmf[0]).toBeCloseTo(0, 15);
    expect(forecast.pmf[2]).toBeCloseTo(0.2025 / 0.3025, 12);
    expect(forecast.pOversale).toBeCloseTo(0.2025 / 0.3025, 12);
  });

  it('cancelled passengers are left out of every figure; per-cabin odds use each cabin’s own seats', () => {
    const r = computeFlightForecast(input([pax(1, 1, { cabin: 'J' }), pax(2, 2), pax(3, 3, { status: 'cancelled' })], { J: 1, Y: 1 }));
    expect(r.forecast.capacity).toBe(2);
    expect(r.forecast.pmf).toHaveLength(3);
    expect(r.forecast.pOversale).toBe(0);
    expect(r.cabins.map((c) => [c.cabin, c.booked, c.checkedIn, c.pOversale])).toEqual([['J', 1, 1, 0], ['Y', 1, 1, 0]]);
    expect(r.estimates.get(3)?.probability).toBe(0);
  });
});
