import { describe, expect, it, vi } from 'vitest';
import { computePlan } from './curve';
import { buildDenialCost, EMPTY_COST_HELPER } from './denial-cost';
import { minorToText, parseMoneyText } from './money-text';
import { checkTarget, EMPTY_TARGET } from './plan-target';
import { checkPlannerFields, EMPTY_FIELDS, fieldsFromInput } from './planner-fields';

// Team 180, "Optimal Overbooking", MCM 2002 (The UMAP Journal 23(3), 2002), Table 1: C = 150, p = 0.90, a bumped
// passenger costs (k + 1) times the fare: k = 1 -> 167 bookings, k = 2 -> 165, k = 3 -> 164.
const mcmFields = { ...EMPTY_FIELDS, capacity: '150', showRate: '0.9', revenue: '200.00', costPerDenial: '400.00' };

describe('money typed in major units', () => {
  it.each([
    ['189', 'USD', 18_900],
    ['1,075.50', 'USD', 107_550],
    ['0.5', 'EUR', 50],
    ['1890', 'JPY', 1_890], // ISO 4217: JPY has no minor unit
  ])('reads %s %s as %i minor units', (text, currency, minor) => {
    expect(parseMoneyText(text, currency, 'Revenue')).toEqual({ ok: true, minor });
  });

  it('says how many decimals the currency has when there are too many', () => {
    expect(parseMoneyText('1.005', 'USD', 'Revenue')).toEqual({ ok: false, message: 'Revenue has at most 2 decimals in USD' });
  });

  it('refuses a decimal comma in an English browser rather than reading it as thousands, and reads it in German', () => {
    // CLDR: en-US groups thousands with ",", de-DE writes decimals with ",".
    expect(parseMoneyText('189,50', 'EUR', 'Revenue')).toMatchObject({ ok: false, message: expect.stringMatching(/^Revenue is ambiguous: in en-US/) });
    vi.stubGlobal('navigator', { language: 'de-DE', languages: ['de-DE'] });
    expect(parseMoneyText('189,50', 'EUR', 'Revenue')).toEqual({ ok: true, minor: 18_950 });
    expect(minorToText(18_900, 'EUR')).toBe('189,00');
    vi.unstubAllGlobals();
  });

  it('gives back text the field accepts', () => {
    expect(minorToText(107_550, 'USD')).toBe('1075.50');
    expect(minorToText(5, 'USD')).toBe('0.05');
    expect(parseMoneyText(minorToText(107_550, 'USD'), 'USD', 'x')).toEqual({ ok: true, minor: 107_550 });
  });
});

describe('planner fields checked with the shared schema', () => {
  it('accepts the worked example and keeps money in minor units', () => {
    const check = checkPlannerFields(mcmFields, 'USD');
    expect(check).toEqual({ ok: true, input: { capacity: 150, showProbability: 0.9, revenuePerBookingMinor: 20_000, costPerDenialMinor: 40_000, currency: 'USD' } });
  });

  it.each([
    ['showRate', '90 %', 0.9],
    ['showRate', '0,9', 0.9],
    ['rho', '0.02', 0.02],
  ] as const)('reads %s "%s"', (field, text, value) => {
    const check = checkPlannerFields({ ...mcmFields, [field]: text }, 'USD');
    expect(check.ok && (field === 'rho' ? check.input.rho : check.input.showProbability)).toBe(value);
  });

  it.each([
    ['capacity', '', 'Seats is required'],
    ['capacity', '150.5', 'Seats must be a whole number of seats'],
    ['capacity', 'many', 'Seats must be a number'],
    ['showRate', '1.2', 'Show rate must be at most 1'],
    ['showRate', '0', 'Show rate must be greater than 0'],
    ['revenue', '-5', 'Revenue per booking must not be negative'],
    ['costPerDenial', '', 'Cost per denied boarding is required'],
    ['rho', '1', 'Show-up correlation (rho) must be less than 1'],
  ] as const)('puts the rule beside %s for "%s"', (field, text, message) => {
    const check = checkPlannerFields({ ...mcmFields, [field]: text }, 'USD');
    expect(check.ok).toBe(false);
    expect(!check.ok && check.errors[field]).toBe(message);
  });

  it('round-trips saved inputs into the same text', () => {
    const check = checkPlannerFields({ ...mcmFields, rho: '0.02' }, 'USD');
    if (!check.ok) throw new Error('expected valid fields');
    expect(checkPlannerFields(fieldsFromInput(check.input), 'USD')).toEqual(check);
  });
});

describe('route or flight being planned', () => {
  it('builds a route key from the station', () => {
    expect(checkTarget('BOS', { ...EMPTY_TARGET, destination: 'ord' })).toEqual({ ok: true, routeKey: 'BOS-ORD' });
    expect(checkTarget('BOS', { kind: 'flight', destination: 'ORD', designator: 'bb 123', date: '2031-06-01' })).toEqual({ ok: true, routeKey: 'BOS-ORD/BB123/2031-06-01' });
  });

  it.each([
    [{ destination: 'BOS' }, 'destination', 'Destination must differ from the origin BOS'],
    [{ destination: 'CHICAGO' }, 'destination', 'Destination must be a three-letter IATA airport code, such as ORD'],
    [{ kind: 'flight', destination: 'ORD', designator: '123' }, 'designator', 'Flight must be a carrier code and number, such as BB123'],
    [{ kind: 'flight', destination: 'ORD', designator: 'BB1' }, 'date', 'Date is required'],
  ] as const)('names the wrong part of %j', (patch, field, message) => {
    const check = checkTarget('BOS', { ...EMPTY_TARGET, ...patch });
    expect(!check.ok && check.errors[field]).toBe(message);
  });
});

describe('curve and optimum computed in the browser', () => {
  it.each([
    ['400.00', 167],
    ['600.00', 165],
    ['800.00', 164],
  ])('cost %s per denial on a 200.00 fare gives the MCM 2002 optimum %i', (cost, bookings) => {
    const check = checkPlannerFields({ ...mcmFields, costPerDenial: cost }, 'USD');
    if (!check.ok) throw new Error('expected valid fields');
    const plan = computePlan(check.input);
    expect(plan.best.bookings).toBe(bookings);
    // derived: the chart starts at the seats and reaches past the optimum; the table holds the optimum row
    expect(plan.chart[0].bookings).toBe(150);
    expect(plan.chart[plan.chart.length - 1].bookings).toBeGreaterThan(bookings);
    expect(plan.table.some((p) => p.bookings === bookings)).toBe(true);
    expect(plan.atCapacity.expectedNet).toBeLessThan(plan.best.expectedNet);
  });

  it('keeps a long table to the capacity row and the stretch around the optimum', () => {
    const check = checkPlannerFields({ ...mcmFields, capacity: '1000', showRate: '0.8' }, 'USD');
    if (!check.ok) throw new Error('expected valid fields');
    const plan = computePlan(check.input);
    expect(plan.table[0].bookings).toBe(1000);
    expect(plan.table.length).toBe(42);
    expect(plan.table[1].bookings).toBe(plan.best.bookings - 20);
  });
});

describe('cost of one denied boarding from the station rules', () => {
  const us = { regime: 'us-dot' as const, deniedOn: '2026-03-01', currency: 'USD' };

  it('adds rebooking and goodwill to 400 % of a 200.00 fare for a 3 h domestic delay', () => {
    // 14 CFR 250.5(a)(3): planned arrival more than 2 h late (domestic) -> 400 % of the one-way fare, cap USD 2,150
    // (89 FR 84815, effective 22 Jan 2025)
    const out = buildDenialCost({ ...EMPTY_COST_HELPER, fare: '200', rebooking: '150', goodwill: '50' }, us);
    expect(out.compensation?.amountMinor).toBe(80_000);
    expect(out.compensation?.band).toBe('us-400pct');
    expect(out.totalMinor).toBe(100_000);
  });

  it('uses the revenue per booking as the fare when none is typed, and applies the cap', () => {
    // 14 CFR 250.5(a)(2): more than 1 h and up to 2 h -> 200 % of the fare, cap USD 1,075 (89 FR 84815)
    const out = buildDenialCost({ ...EMPTY_COST_HELPER, delayHours: '1.5' }, { ...us, revenuePerBookingMinor: 70_000 });
    expect(out.compensation?.amountMinor).toBe(107_500);
  });

  it('takes the distance band under EU 261', () => {
    // Reg. (EC) 261/2004 Art. 7(1)(a): EUR 250 for flights of 1,500 km or less
    const out = buildDenialCost({ ...EMPTY_COST_HELPER, distanceKm: '1000' }, { regime: 'eu-261', deniedOn: '2026-03-01', currency: 'EUR' });
    expect(out.compensation?.amountMinor).toBe(25_000);
    expect(out.totalMinor).toBe(25_000);
  });

  it('names the missing distance beside its field', () => {
    const out = buildDenialCost(EMPTY_COST_HELPER, { regime: 'eu-261', deniedOn: '2026-03-01', currency: 'EUR' });
    expect(out.errors.distanceKm).toBe('Distance: required for eu-261 (great-circle distance to the final destination, Art. 7(4))');
  });

  it('refuses to add amounts of different currencies', () => {
    const out = buildDenialCost({ ...EMPTY_COST_HELPER, distanceKm: '1000' }, { regime: 'eu-261', deniedOn: '2026-03-01', currency: 'NOK' });
    expect(out.totalMinor).toBeUndefined();
    expect(out.errors.form).toBe('The rules pay in EUR but this station plans in NOK: convert the amount and type the cost yourself.');
  });

  it('pays the APPR amount for a delay under 6 h', () => {
    // SOR/2019-150 s. 20(1)(a): CAD 900 for an arrival delay of less than 6 h (from memory)
    const out = buildDenialCost(EMPTY_COST_HELPER, { regime: 'ca-appr', deniedOn: '2026-03-01', currency: 'CAD' });
    expect(out.compensation?.amountMinor).toBe(90_000);
  });
});
