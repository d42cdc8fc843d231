// Each passenger's chance of showing, worked by hand from the default profile (shared/schemas/show-up-profile.ts) and
// Bayes' rule P(show | not checked in) = q(1 - G) / (1 - qG) (derived in shared/forecast/check-in.ts).
import { describe, expect, it } from 'vitest';
import { DEFAULT_SHOW_UP_PROFILE as profile } from '@shared/schemas/show-up-profile';
import { checkedInShare, connectionProbability, passengerShowProbability, type PassengerState } from './show-probability';

const departure = new Date('2026-12-03T10:00:00Z');
const minutesBefore = (m: number) => new Date(departure.getTime() - m * 60_000);
const someone = (over: Partial<PassengerState> = {}): PassengerState => ({
  id: 1, bookingId: 1, cabin: 'Y', fareType: 'standard', status: 'booked', inboundFlight: null, inboundEstimatedArrival: null, ...over,
});

describe('checkedInShare', () => {
  it('interpolates the curve linearly between its points', () => {
    // 180 min lies half-way from (240, 0.50) to (120, 0.68): 0.50 + 0.5 × 0.18 = 0.59.
    expect(checkedInShare(profile, 180)).toBeCloseTo(0.59, 12);
    expect(checkedInShare(profile, 720)).toBeCloseTo(0.3, 12);
    // 52.5 min: from (60, 0.87) to (45, 0.96), half-way: 0.915.
    expect(checkedInShare(profile, 52.5)).toBeCloseTo(0.915, 12);
  });
  it('is the first point before the curve starts and 1 once check-in has closed', () => {
    expect(checkedInShare(profile, 3000)).toBe(0);
    expect(checkedInShare(profile, 30)).toBe(1);
    expect(checkedInShare(profile, 5)).toBe(1);
  });
});

describe('connectionProbability', () => {
  it('is 0.97 with 15 minutes to spare beyond the minimum connect, 0.03 when 15 short, linear between', () => {
    // Minimum connect 45 min. Landing 08:45: 75 min, 30 spare.
    expect(connectionProbability(profile, departure, new Date('2026-12-03T08:45:00Z'))).toBe(0.97);
    // Landing 09:15: exactly the minimum; half-way on the ramp: 0.03 + 0.5 × 0.94 = 0.5.
    expect(connectionProbability(profile, departure, new Date('2026-12-03T09:15:00Z'))).toBeCloseTo(0.5, 12);
    // Landing 09:40: 25 short.
    expect(connectionProbability(profile, departure, new Date('2026-12-03T09:40:00Z'))).toBe(0.03);
    expect(connectionProbability(profile, departure, null)).toBe(0.97);
  });
});

describe('passengerShowProbability', () => {
  it('a local economy passenger not checked in 3 hours out: q = 0.90, G = 0.59', () => {
    // 0.9 × 0.41 / (1 − 0.9 × 0.59) = 0.369 / 0.469 = 0.786780…
    const e = passengerShowProbability(someone(), profile, departure, minutesBefore(180));
    expect(e.probability).toBeCloseTo(0.7867803837953093, 12);
    expect(e.why).toContain('booking rate 90 %');
    expect(e.why).toContain('59 % of shows');
  });
  it('a flexible business fare an hour out: q = 0.92 × 0.93 = 0.8556, G = 0.87', () => {
    // 0.8556 × 0.13 / (1 − 0.8556 × 0.87) = 0.111228 / 0.255628 = 0.435116…
    const e = passengerShowProbability(someone({ cabin: 'J', fareType: 'flex' }), profile, departure, minutesBefore(60));
    expect(e.probability).toBeCloseTo(0.4351166538876806, 12);
    expect(e.why).toContain('flexible fare');
  });
  it('a connecting passenger multiplies by the chance of making the connection', () => {
    // Connecting economy q = 0.88, G = 0.59 → 0.88 × 0.41 / (1 − 0.88 × 0.59) = 0.750415…; landing on the minimum: × 0.5.
    const p = someone({ inboundFlight: 'ZZ12', inboundEstimatedArrival: new Date('2026-12-03T09:15:00Z') });
    expect(passengerShowProbability(p, profile, departure, minutesBefore(180)).probability).toBeCloseTo(0.3752079866888519, 12);
    const checkedIn = passengerShowProbability({ ...p, status: 'checked-in' }, profile, departure, minutesBefore(180));
    expect(checkedIn.probability).toBeCloseTo(0.995 * 0.5, 12);
  });
  it('checked in: the profile’s checked-in show rate; boarded: sure; offloaded, cancelled, volunteered: none', () => {
    expect(passengerShowProbability(someone({ status: 'checked-in' }), profile, departure, minutesBefore(90)).probability).toBe(0.995);
    expect(passengerShowProbability(someone({ status: 'boarded' }), profile, departure, minutesBefore(10)).probability).toBe(1);
    expect(passengerShowProbability(someone({ status: 'offloaded' }), profile, departure, minutesBefore(10)).probability).toBe(0);
    expect(passengerShowProbability(someone({ status: 'cancelled' }), profile, departure, minutesBefore(10)).probability).toBe(0);
    expect(passengerShowProbability(someone({ status: 'checked-in', volunteered: true }), profile, departure, minutesBefore(10)).probability).toBe(0);
  });
  it('not checked in after check-in closed: no chance, and says so', () => {
    const e = passengerShowProbability(someone(), profile, departure, minutesBefore(20));
    expect(e.probability).toBe(0);
    expect(e.why).toContain('check-in has closed');
  });
});
