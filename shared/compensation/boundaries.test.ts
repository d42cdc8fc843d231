// Rule-by-rule table of every band boundary: the minute (or km) before, at and after each edge.
import { describe, expect, it } from 'vitest';
import { compensationDue, type CompensationInput } from './index';

const US_FARE = { amountMinor: 10_000, currency: 'USD' }; // $100: 200% = $200, 400% = $400, far below the caps

interface Row {
  rule: string;
  input: Partial<CompensationInput>;
  band: string;
  amountMinor: number;
  reducible?: boolean;
}

const usDomestic = (minutes: number): Partial<CompensationInput> => ({ regime: 'us-dot', oneWayFare: US_FARE, aircraftSeats: 100, plannedArrivalDelayMinutes: minutes });
const usInternational = (minutes: number): Partial<CompensationInput> => ({ ...usDomestic(minutes), international: true });
const eu = (regime: 'eu-261' | 'uk-261', distanceKm: number, intraCommunity: boolean, minutes: number | null = null): Partial<CompensationInput> => ({
  regime, distanceKm, intraCommunity, plannedArrivalDelayMinutes: minutes,
});
const ca = (minutes: number): Partial<CompensationInput> => ({ regime: 'ca-appr', plannedArrivalDelayMinutes: minutes });

const ROWS: Row[] = [
  // 14 CFR 250.5(a): within 1 h none; more than 1 h and less than 2 h 200%; 2 h or more 400%
  { rule: '250.5(a)(1) 59 min', input: usDomestic(59), band: 'us-none-within-1h', amountMinor: 0 },
  { rule: '250.5(a)(1) 60 min', input: usDomestic(60), band: 'us-none-within-1h', amountMinor: 0 },
  { rule: '250.5(a)(2) 61 min', input: usDomestic(61), band: 'us-200pct', amountMinor: 20_000 },
  { rule: '250.5(a)(2) 119 min', input: usDomestic(119), band: 'us-200pct', amountMinor: 20_000 },
  { rule: '250.5(a)(3) 120 min', input: usDomestic(120), band: 'us-400pct', amountMinor: 40_000 },
  { rule: '250.5(a)(3) 121 min', input: usDomestic(121), band: 'us-400pct', amountMinor: 40_000 },
  // 14 CFR 250.5(b): same with 1 h / 4 h
  { rule: '250.5(b)(1) 59 min', input: usInternational(59), band: 'us-none-within-1h', amountMinor: 0 },
  { rule: '250.5(b)(1) 60 min', input: usInternational(60), band: 'us-none-within-1h', amountMinor: 0 },
  { rule: '250.5(b)(2) 61 min', input: usInternational(61), band: 'us-200pct', amountMinor: 20_000 },
  { rule: '250.5(b)(2) 239 min', input: usInternational(239), band: 'us-200pct', amountMinor: 20_000 },
  { rule: '250.5(b)(3) 240 min', input: usInternational(240), band: 'us-400pct', amountMinor: 40_000 },
  { rule: '250.5(b)(3) 241 min', input: usInternational(241), band: 'us-400pct', amountMinor: 40_000 },
  // Reg. 261/2004 Art. 7(1): 1,500 km or less; 1,500-3,500 km; over 3,500 km (intra-EU over 1,500 km stays b)
  { rule: 'EU 7(1)(a) 1,499 km', input: eu('eu-261', 1499, false), band: 'eu-a', amountMinor: 25_000 },
  { rule: 'EU 7(1)(a) 1,500 km', input: eu('eu-261', 1500, false), band: 'eu-a', amountMinor: 25_000 },
  { rule: 'EU 7(1)(b) 1,501 km', input: eu('eu-261', 1501, false), band: 'eu-b', amountMinor: 40_000 },
  { rule: 'EU 7(1)(b) 3,499 km', input: eu('eu-261', 3499, false), band: 'eu-b', amountMinor: 40_000 },
  { rule: 'EU 7(1)(b) 3,500 km (policy: inclusive)', input: eu('eu-261', 3500, false), band: 'eu-b', amountMinor: 40_000 },
  { rule: 'EU 7(1)(c) 3,501 km', input: eu('eu-261', 3501, false), band: 'eu-c', amountMinor: 60_000 },
  { rule: 'EU 7(1)(a) intra 1,500 km', input: eu('eu-261', 1500, true), band: 'eu-a', amountMinor: 25_000 },
  { rule: 'EU 7(1)(b) intra 1,501 km', input: eu('eu-261', 1501, true), band: 'eu-b', amountMinor: 40_000 },
  { rule: 'EU 7(1)(b) intra 3,501 km', input: eu('eu-261', 3501, true), band: 'eu-b', amountMinor: 40_000 },
  // Art. 7(2): halvable when the re-routing arrives not more than 2 h / 3 h / 4 h late
  { rule: 'EU 7(2)(a) 119 min', input: eu('eu-261', 1000, false, 119), band: 'eu-a', amountMinor: 25_000, reducible: true },
  { rule: 'EU 7(2)(a) 120 min', input: eu('eu-261', 1000, false, 120), band: 'eu-a', amountMinor: 25_000, reducible: true },
  { rule: 'EU 7(2)(a) 121 min', input: eu('eu-261', 1000, false, 121), band: 'eu-a', amountMinor: 25_000, reducible: false },
  { rule: 'EU 7(2)(b) 179 min', input: eu('eu-261', 2000, false, 179), band: 'eu-b', amountMinor: 40_000, reducible: true },
  { rule: 'EU 7(2)(b) 180 min', input: eu('eu-261', 2000, false, 180), band: 'eu-b', amountMinor: 40_000, reducible: true },
  { rule: 'EU 7(2)(b) 181 min', input: eu('eu-261', 2000, false, 181), band: 'eu-b', amountMinor: 40_000, reducible: false },
  { rule: 'EU 7(2)(b) intra 181 min', input: eu('eu-261', 5000, true, 181), band: 'eu-b', amountMinor: 40_000, reducible: false },
  { rule: 'EU 7(2)(c) 239 min', input: eu('eu-261', 5000, false, 239), band: 'eu-c', amountMinor: 60_000, reducible: true },
  { rule: 'EU 7(2)(c) 240 min', input: eu('eu-261', 5000, false, 240), band: 'eu-c', amountMinor: 60_000, reducible: true },
  { rule: 'EU 7(2)(c) 241 min', input: eu('eu-261', 5000, false, 241), band: 'eu-c', amountMinor: 60_000, reducible: false },
  // Retained UK Reg. 261: same bands in GBP 220 / 350 / 520 (secondary sources)
  { rule: 'UK 7(1)(a) 1,500 km', input: eu('uk-261', 1500, false), band: 'uk-a', amountMinor: 22_000 },
  { rule: 'UK 7(1)(b) 1,501 km', input: eu('uk-261', 1501, false), band: 'uk-b', amountMinor: 35_000 },
  { rule: 'UK 7(1)(b) 3,500 km', input: eu('uk-261', 3500, false), band: 'uk-b', amountMinor: 35_000 },
  { rule: 'UK 7(1)(c) 3,501 km', input: eu('uk-261', 3501, false), band: 'uk-c', amountMinor: 52_000 },
  { rule: 'UK 7(2)(a) 120 min', input: eu('uk-261', 1000, false, 120), band: 'uk-a', amountMinor: 22_000, reducible: true },
  { rule: 'UK 7(2)(a) 121 min', input: eu('uk-261', 1000, false, 121), band: 'uk-a', amountMinor: 22_000, reducible: false },
  // SOR/2019-150 s. 20(1): < 6 h; 6 h to < 9 h; 9 h or more
  { rule: 'APPR 20(1)(a) 359 min', input: ca(359), band: 'ca-under-6h', amountMinor: 90_000 },
  { rule: 'APPR 20(1)(b) 360 min', input: ca(360), band: 'ca-6h-to-9h', amountMinor: 180_000 },
  { rule: 'APPR 20(1)(b) 361 min', input: ca(361), band: 'ca-6h-to-9h', amountMinor: 180_000 },
  { rule: 'APPR 20(1)(b) 539 min', input: ca(539), band: 'ca-6h-to-9h', amountMinor: 180_000 },
  { rule: 'APPR 20(1)(c) 540 min', input: ca(540), band: 'ca-9h-or-more', amountMinor: 240_000 },
  { rule: 'APPR 20(1)(c) 541 min', input: ca(541), band: 'ca-9h-or-more', amountMinor: 240_000 },
];

describe('band boundaries, rule by rule', () => {
  it.each(ROWS)('$rule -> $band', ({ input, band, amountMinor, reducible }) => {
    const result = compensationDue({ deniedOn: '2025-03-01', plannedArrivalDelayMinutes: null, ...input } as CompensationInput);
    expect(result.band).toBe(band);
    expect(result.amountMinor).toBe(amountMinor);
    if (reducible !== undefined) expect(result.reducibleUnderArt7_2).toBe(reducible);
  });
});
