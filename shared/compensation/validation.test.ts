import { describe, expect, it } from 'vitest';
import { compensationDue, type CompensationInput } from './index';
import { formatMoney } from './money';

const us: CompensationInput = {
  regime: 'us-dot',
  deniedOn: '2025-03-01',
  oneWayFare: { amountMinor: 30_000, currency: 'USD' },
  plannedArrivalDelayMinutes: 90,
  aircraftSeats: 150,
};
const euCase: CompensationInput = { regime: 'eu-261', deniedOn: '2025-03-01', distanceKm: 1326, plannedArrivalDelayMinutes: null };

function rangeErrorOf(run: () => unknown): RangeError {
  try {
    run();
  } catch (error) {
    if (error instanceof RangeError) return error;
    throw error;
  }
  throw new Error('expected a RangeError');
}

describe('bad input is a RangeError naming the field', () => {
  it.each<[string, () => unknown, string]>([
    ['unknown regime', () => compensationDue({ ...us, regime: 'mars-1' as never }), 'regime'],
    ['negative fare', () => compensationDue({ ...us, oneWayFare: { amountMinor: -1, currency: 'USD' } }), 'oneWayFare.amountMinor'],
    ['non-integer fare', () => compensationDue({ ...us, oneWayFare: { amountMinor: 300.5, currency: 'USD' } }), 'oneWayFare.amountMinor'],
    ['currency not ISO 4217 format', () => compensationDue({ ...us, oneWayFare: { amountMinor: 300, currency: 'usd' } }), 'oneWayFare.currency'],
    ['fare not in USD', () => compensationDue({ ...us, oneWayFare: { amountMinor: 300, currency: 'EUR' } }), 'oneWayFare.currency'],
    ['date that is not a date', () => compensationDue({ ...us, deniedOn: 'yesterday' }), 'deniedOn'],
    ['date that is not on the calendar', () => compensationDue({ ...us, deniedOn: '2025-02-30' }), 'deniedOn'],
    ['date before the first rules row', () => compensationDue({ ...us, deniedOn: '2001-01-01' }), 'deniedOn'],
    ['missing distance for EU', () => compensationDue({ ...euCase, distanceKm: undefined }), 'distanceKm'],
    ['missing distance for UK', () => compensationDue({ ...euCase, regime: 'uk-261', distanceKm: undefined }), 'distanceKm'],
    ['negative distance', () => compensationDue({ ...euCase, distanceKm: -3 }), 'distanceKm'],
    ['missing fare for US involuntary', () => compensationDue({ ...us, oneWayFare: undefined }), 'oneWayFare'],
    ['negative delay', () => compensationDue({ ...us, plannedArrivalDelayMinutes: -10 }), 'plannedArrivalDelayMinutes'],
    ['fractional delay', () => compensationDue({ ...us, plannedArrivalDelayMinutes: 90.5 }), 'plannedArrivalDelayMinutes'],
    ['delay left out', () => compensationDue({ ...us, plannedArrivalDelayMinutes: undefined as never }), 'plannedArrivalDelayMinutes'],
    ['unknown exemption code', () => compensationDue({ ...us, exemption: 'because' }), 'exemption'],
    ['exemption of another regime', () => compensationDue({ ...euCase, exemption: 'us-smaller-aircraft' }), 'exemption'],
    ['exemption for a volunteer', () => compensationDue({ ...us, voluntary: true, exemption: 'us-smaller-aircraft' }), 'exemption'],
    ['seat count of zero', () => compensationDue({ ...us, aircraftSeats: 0 }), 'aircraftSeats'],
    ['flag that is not boolean', () => compensationDue({ ...us, international: 'yes' as never }), 'international'],
    ['negative optional fees', () => compensationDue({ ...us, unusedOptionalFeesMinor: -100 }), 'unusedOptionalFeesMinor'],
  ])('%s', (_label, run, field) => {
    expect(rangeErrorOf(run).message.startsWith(`${field}:`)).toBe(true);
  });

  it('a volunteer needs no fare and no distance', () => {
    expect(compensationDue({ regime: 'eu-261', deniedOn: '2025-03-01', voluntary: true, plannedArrivalDelayMinutes: null }).amountMinor).toBe(0);
  });

  it('accepts a date-time and keeps the calendar date written in it', () => {
    const result = compensationDue({ ...us, deniedOn: '2025-01-22T00:30:00+09:00', oneWayFare: { amountMinor: 70_000, currency: 'USD' }, plannedArrivalDelayMinutes: 180 });
    expect(result.rulesInForce.effectiveFrom).toBe('2025-01-22');
  });
});

describe('formatMoney', () => {
  it.each([
    [107_500, 'USD', 'USD 1,075.00'],
    [5, 'EUR', 'EUR 0.05'],
    [1_234, 'JPY', 'JPY 1,234'],
    [1_234, 'KWD', 'KWD 1.234'],
  ])('%d %s -> %s (ISO 4217 minor units)', (amountMinor, currency, text) => {
    expect(formatMoney(amountMinor, currency)).toBe(text);
  });
});
