import { describe, expect, it } from 'vitest';
import { bookingLimitCurve, optimalBookingLimit } from './booking-limit';
import { oversaleRisk, quantile, volunteerTarget } from './risk';
import { showUpDistribution } from './show-up';
import type { CommonShock, ShowUpUnit } from './types';

const fine: ShowUpUnit[] = [
  { size: 1, showProbability: 0.9 },
  { size: 2, showProbability: 0.8 },
  { size: 1, showProbability: 0.7, count: 3 },
];
const withUnit = (index: number, unit: Partial<ShowUpUnit>): ShowUpUnit[] =>
  fine.map((u, i) => (i === index ? { ...u, ...unit } : u));
const scenarios = (list: { weight: number; probabilityFactor: number }[]): CommonShock => ({ kind: 'scenarios', scenarios: list });
const planner = { capacity: 100, showProbability: 0.9, revenuePerBooking: 1, costPerDenial: 2 };

// Common practice: reject bad input with a RangeError that names the field and the rule.
const cases: [string, () => unknown, RegExp][] = [
  ['probability above 1', () => showUpDistribution(withUnit(2, { showProbability: 1.01 })), /^units\[2\]\.showProbability must be within \[0, 1\]/],
  ['negative probability', () => showUpDistribution(withUnit(0, { showProbability: -0.1 })), /^units\[0\]\.showProbability must be within \[0, 1\]/],
  ['NaN probability', () => showUpDistribution(withUnit(1, { showProbability: Number.NaN })), /^units\[1\]\.showProbability must be within \[0, 1\]/],
  ['size 0', () => showUpDistribution(withUnit(1, { size: 0 })), /^units\[1\]\.size must be a positive integer/],
  ['fractional size', () => showUpDistribution(withUnit(0, { size: 1.5 })), /^units\[0\]\.size must be a positive integer/],
  ['negative count', () => showUpDistribution(withUnit(2, { count: -1 })), /^units\[2\]\.count must be a non-negative integer/],
  ['fractional count', () => showUpDistribution(withUnit(2, { count: 2.5 })), /^units\[2\]\.count must be a non-negative integer/],
  ['too many people', () => showUpDistribution([{ size: 1, showProbability: 0.5, count: 50_001 }]), /^units must add up to at most 50000 people/],
  ['rho 0', () => showUpDistribution(fine, { kind: 'beta-binomial', rho: 0 }), /^shock\.rho must be within \(0, 1\)/],
  ['rho 1', () => showUpDistribution(fine, { kind: 'beta-binomial', rho: 1 }), /^shock\.rho must be within \(0, 1\)/],
  ['weights sum 0.9', () => showUpDistribution(fine, scenarios([{ weight: 0.9, probabilityFactor: 1 }])), /^shock\.scenarios weights must sum to 1/],
  ['weights sum 1 + 2e-9', () => showUpDistribution(fine, scenarios([{ weight: 0.5, probabilityFactor: 1 }, { weight: 0.5 + 2e-9, probabilityFactor: 1 }])), /^shock\.scenarios weights must sum to 1/],
  ['negative weight', () => showUpDistribution(fine, scenarios([{ weight: -0.5, probabilityFactor: 1 }, { weight: 1.5, probabilityFactor: 1 }])), /^shock\.scenarios\[0\]\.weight must be a finite number >= 0/],
  ['NaN factor', () => showUpDistribution(fine, scenarios([{ weight: 1, probabilityFactor: Number.NaN }])), /^shock\.scenarios\[0\]\.probabilityFactor must be a finite number >= 0/],
  ['no scenarios', () => showUpDistribution(fine, scenarios([])), /^shock\.scenarios must be a non-empty array/],
  ['negative capacity', () => oversaleRisk([1], -1), /^capacity must be a non-negative integer/],
  ['fractional capacity', () => oversaleRisk([1], 1.5), /^capacity must be a non-negative integer/],
  ['pmf not summing to 1', () => oversaleRisk([0.5, 0.4], 1), /^pmf must sum to 1/],
  ['negative pmf term', () => oversaleRisk([1.5, -0.5], 1), /^pmf\[1\] must be a finite number >= 0/],
  ['empty pmf', () => oversaleRisk([], 1), /^pmf must be a non-empty array/],
  ['alpha 0', () => volunteerTarget([1], 0, 0), /^alpha must be within \(0, 1\)/],
  ['alpha 1', () => volunteerTarget([1], 0, 1), /^alpha must be within \(0, 1\)/],
  ['quantile q above 1', () => quantile([1], 1.5), /^q must be within \[0, 1\]/],
  ['planner capacity', () => bookingLimitCurve({ ...planner, capacity: -3 }), /^capacity must be a non-negative integer/],
  ['planner probability', () => optimalBookingLimit({ ...planner, showProbability: 2 }), /^showProbability must be within \[0, 1\]/],
  ['planner revenue', () => optimalBookingLimit({ ...planner, revenuePerBooking: -1 }), /^revenuePerBooking must be a finite number >= 0/],
  ['planner cost', () => optimalBookingLimit({ ...planner, costPerDenial: Number.POSITIVE_INFINITY }), /^costPerDenial must be a finite number >= 0/],
  ['maxBookings below capacity', () => bookingLimitCurve({ ...planner, maxBookings: 99 }), /^maxBookings must be at least capacity/],
  ['maxBookings too large', () => bookingLimitCurve({ ...planner, maxBookings: 10_001 }), /^maxBookings must be at most 10000/],
  ['planner rho', () => optimalBookingLimit({ ...planner, shock: { kind: 'beta-binomial', rho: 1.2 } }), /^shock\.rho must be within \(0, 1\)/],
];

describe('bad input', () => {
  it.each(cases)('%s: RangeError naming the field', (_name, call, message) => {
    expect(call).toThrow(RangeError);
    expect(call).toThrow(message);
  });

  it('accepts weights off by less than 1e-9', () => {
    const pmf = showUpDistribution(fine, scenarios([{ weight: 0.5, probabilityFactor: 1 }, { weight: 0.5 + 5e-10, probabilityFactor: 0.9 }]));
    expect(pmf.reduce((s, v) => s + v, 0)).toBeCloseTo(1, 14);
  });
});
