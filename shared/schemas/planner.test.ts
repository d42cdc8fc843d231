import { describe, expect, it } from 'vitest';
import { denialCostHelperSchema, plannerInputSchema, totalDenialCostMinor } from './planner';

const valid = {
  capacity: 150,
  showProbability: 0.85,
  revenuePerBookingMinor: 18_900,
  costPerDenialMinor: 60_000,
  currency: 'EUR',
};

// Rules of the planner form (common practice for the bounds; ISO 4217 codes are three capital letters).
const accepted: [string, Record<string, unknown>][] = [
  ['minimal payload', valid],
  ['capacity 1', { ...valid, capacity: 1 }],
  ['capacity 1000', { ...valid, capacity: 1000 }],
  ['show probability exactly 1', { ...valid, showProbability: 1 }],
  ['zero revenue and zero cost', { ...valid, revenuePerBookingMinor: 0, costPerDenialMinor: 0 }],
  ['maxBookings at capacity', { ...valid, maxBookings: 150 }],
  ['maxBookings at 2 * capacity + 50', { ...valid, maxBookings: 350 }],
  ['rho just inside', { ...valid, rho: 0.0001 }],
  ['zero-decimal currency', { ...valid, currency: 'JPY' }],
];

const rejected: [string, Record<string, unknown>, string, string][] = [
  ['capacity 0', { ...valid, capacity: 0 }, 'capacity', 'capacity must be at least 1 seat'],
  ['capacity 1001', { ...valid, capacity: 1001 }, 'capacity', 'capacity must be at most 1000 seats'],
  ['fractional capacity', { ...valid, capacity: 150.5 }, 'capacity', 'capacity must be a whole number of seats'],
  ['capacity as text', { ...valid, capacity: '150' }, 'capacity', 'capacity must be a number'],
  ['capacity missing', { ...valid, capacity: undefined }, 'capacity', 'capacity is required'],
  ['show probability 0', { ...valid, showProbability: 0 }, 'showProbability', 'showProbability must be greater than 0'],
  ['show probability 1.2', { ...valid, showProbability: 1.2 }, 'showProbability', 'showProbability must be at most 1'],
  ['revenue in decimals', { ...valid, revenuePerBookingMinor: 189.5 }, 'revenuePerBookingMinor', 'revenuePerBookingMinor must be a whole number of minor units (e.g. cents)'],
  ['negative cost', { ...valid, costPerDenialMinor: -1 }, 'costPerDenialMinor', 'costPerDenialMinor must not be negative'],
  ['lower-case currency', { ...valid, currency: 'eur' }, 'currency', 'currency must be a three-letter ISO 4217 code in capitals, such as EUR'],
  ['four-letter currency', { ...valid, currency: 'EURO' }, 'currency', 'currency must be a three-letter ISO 4217 code in capitals, such as EUR'],
  ['maxBookings below capacity', { ...valid, maxBookings: 149 }, 'maxBookings', 'maxBookings must be at least the capacity'],
  ['maxBookings above 2 * capacity + 50', { ...valid, maxBookings: 351 }, 'maxBookings', 'maxBookings must be at most twice the capacity plus 50 (350)'],
  ['fractional maxBookings', { ...valid, maxBookings: 160.2 }, 'maxBookings', 'maxBookings must be a whole number of bookings'],
  ['rho 0', { ...valid, rho: 0 }, 'rho', 'rho (show-up correlation) must be greater than 0'],
  ['rho 1', { ...valid, rho: 1 }, 'rho', 'rho (show-up correlation) must be less than 1'],
  ['unknown field', { ...valid, overbookingLevel: 3 }, '', 'Unrecognized key: "overbookingLevel"'],
];

describe('plannerInputSchema', () => {
  it.each(accepted)('accepts %s', (_name, payload) => {
    expect(plannerInputSchema.safeParse(payload).success).toBe(true);
  });

  it.each(rejected)('rejects %s', (_name, payload, path, message) => {
    const result = plannerInputSchema.safeParse(payload);
    expect(result.success).toBe(false);
    expect(result.error?.issues.map((issue) => [issue.path.join('.'), issue.message])).toContainEqual([path, message]);
  });

  it('does not add a maxBookings issue when capacity itself is invalid', () => {
    const result = plannerInputSchema.safeParse({ ...valid, capacity: 0, maxBookings: 500 });
    expect(result.error?.issues.map((issue) => issue.path.join('.'))).toEqual(['capacity']);
  });
});

describe('denialCostHelperSchema', () => {
  it('accepts whole non-negative amounts and adds them up', () => {
    const parts = denialCostHelperSchema.parse({ averageCompensationMinor: 40_000, rebookingCostMinor: 12_500, goodwillMinor: 0 });
    expect(totalDenialCostMinor(parts)).toBe(52_500);
  });

  it.each([
    ['goodwillMinor', -5, 'goodwillMinor must not be negative'],
    ['rebookingCostMinor', 1.5, 'rebookingCostMinor must be a whole number of minor units (e.g. cents)'],
    ['averageCompensationMinor', undefined, 'averageCompensationMinor is required'],
  ])('rejects %s = %s', (field, value, message) => {
    const payload = { averageCompensationMinor: 40_000, rebookingCostMinor: 12_500, goodwillMinor: 0, [field]: value };
    const result = denialCostHelperSchema.safeParse(payload);
    expect(result.error?.issues.map((issue) => [issue.path.join('.'), issue.message])).toContainEqual([field, message]);
  });
});
