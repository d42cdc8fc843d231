// Reg. (EC) 261/2004 Art. 10(2): on a downgrade the passenger is reimbursed (a) 30 % of the ticket price for flights
// of 1,500 km or less, (b) 50 % for intra-Community flights over 1,500 km (save the French overseas departments)
// and other flights of 1,500–3,500 km, (c) 75 % for all other flights. Art. 10(1): no supplement for an upgrade.
// Distances: Bossen (CJEU C-559/16), Rome–Hamburg 1,326 km. 14 CFR 250.6(c): seated in another section at no extra
// charge, with the difference refunded when the fare is lower (from memory).
import { describe, expect, it } from 'vitest';
import { cabinChangeOwed } from './downgrade-rules';

const base = { regime: 'eu-261' as const, direction: 'downgrade' as const, ticketPriceMinor: 40_000, fareDifferenceMinor: 15_000, intraCommunity: true };

describe('cabinChangeOwed', () => {
  it('reimburses 30 / 50 / 75 % of the ticket price by distance band under Art. 10(2)', () => {
    // Rome–Hamburg, 1,326 km (Bossen): band a → 30 % of EUR 400.00 = EUR 120.00
    expect(cabinChangeOwed({ ...base, distanceKm: 1326 }).owedMinor).toBe(12_000);
    // Intra-Community, over 1,500 km → 50 %
    expect(cabinChangeOwed({ ...base, distanceKm: 2_200 }).owedMinor).toBe(20_000);
    // Not intra-Community: 3,500 km inclusive is band b (50 %), beyond is 75 %
    expect(cabinChangeOwed({ ...base, intraCommunity: false, distanceKm: 3_500 }).owedMinor).toBe(20_000);
    expect(cabinChangeOwed({ ...base, intraCommunity: false, distanceKm: 6_000 }).owedMinor).toBe(30_000);
    expect(cabinChangeOwed({ ...base, intraCommunity: false, distanceKm: 6_000 }).rule).toMatch(/75 %/);
  });

  it('rounds half a cent up (derived: 30 % of 333 is 99.9 → 100)', () => {
    expect(cabinChangeOwed({ ...base, ticketPriceMinor: 333, distanceKm: 500 }).owedMinor).toBe(100);
  });

  it('asks nothing for an upgrade, and refunds the fare difference under the US rule', () => {
    expect(cabinChangeOwed({ ...base, direction: 'upgrade', distanceKm: 500 })).toMatchObject({ owedMinor: 0, rule: expect.stringMatching(/Art\. 10\(1\)/) });
    expect(cabinChangeOwed({ ...base, regime: 'us-dot', distanceKm: null }).owedMinor).toBe(15_000);
  });

  it('refuses to guess the band without a distance', () => {
    expect(() => cabinChangeOwed({ ...base, distanceKm: null })).toThrow(RangeError);
  });
});
