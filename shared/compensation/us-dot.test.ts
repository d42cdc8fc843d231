import { describe, expect, it } from 'vitest';
import { compensationDue, type CompensationInput } from './index';

const usd = (dollars: number) => ({ amountMinor: dollars * 100, currency: 'USD' });
const base: CompensationInput = {
  regime: 'us-dot',
  deniedOn: '2025-03-01',
  oneWayFare: usd(300),
  plannedArrivalDelayMinutes: 90,
  aircraftSeats: 180,
};

describe('us-dot amounts (14 CFR 250.5, caps of 89 FR 84815 effective 22 Jan 2025)', () => {
  it('domestic fare $300, alternate +1:30 -> 200% = $600', () => {
    // derived: §250.5(a)(2), more than 1 h and less than 2 h -> 200% of the fare
    const result = compensationDue(base);
    expect(result).toMatchObject({ amountMinor: 60_000, currency: 'USD', band: 'us-200pct', ruleRef: '14 CFR 250.5(a)(2)' });
  });

  it('domestic fare $300, alternate +3:00 -> 400% = $1,200', () => {
    // derived: §250.5(a)(3), 2 h or more -> 400%
    expect(compensationDue({ ...base, plannedArrivalDelayMinutes: 180 })).toMatchObject({ amountMinor: 120_000, band: 'us-400pct' });
  });

  it('domestic fare $700, alternate +3:00 -> $2,800 capped at $2,150', () => {
    // derived: 400% of $700 = $2,800 > cap $2,150 (89 FR 84815)
    const result = compensationDue({ ...base, oneWayFare: usd(700), plannedArrivalDelayMinutes: 180 });
    expect(result.amountMinor).toBe(215_000);
    expect(result.explanation).toContain('capped at USD 2,150.00');
  });

  it('international fare $400, alternate +3:00 -> 200% band = $800', () => {
    // derived: §250.5(b)(2), more than 1 h and less than 4 h -> 200%
    const result = compensationDue({ ...base, international: true, oneWayFare: usd(400), plannedArrivalDelayMinutes: 180 });
    expect(result).toMatchObject({ amountMinor: 80_000, band: 'us-200pct', ruleRef: '14 CFR 250.5(b)(2)' });
  });

  it('exactly +1:00 -> $0', () => {
    // derived: §250.5(a)(1) "not later than one hour" and §250.6(d)
    expect(compensationDue({ ...base, plannedArrivalDelayMinutes: 60 })).toMatchObject({ amountMinor: 0, band: 'us-none-within-1h' });
  });

  it('exactly +2:00 domestic -> 400% band', () => {
    // derived: §250.5(a)(2) needs "less than two hours", so 2 h is the 400% band
    expect(compensationDue({ ...base, plannedArrivalDelayMinutes: 120 })).toMatchObject({ amountMinor: 120_000, band: 'us-400pct' });
  });

  it('no alternate offered -> 400% band', () => {
    // derived: §250.5(a)(3) applies when no qualifying alternate is offered
    expect(compensationDue({ ...base, plannedArrivalDelayMinutes: null })).toMatchObject({ amountMinor: 120_000, band: 'us-400pct' });
  });

  it('uses the $775 / $1,550 caps for a denial before 22 Jan 2025', () => {
    // 86 FR 2534 (13 Jan 2021), effective 13 Apr 2021: caps $775 / $1,550
    const result = compensationDue({ ...base, deniedOn: '2025-01-21', oneWayFare: usd(700), plannedArrivalDelayMinutes: 180 });
    expect(result.amountMinor).toBe(155_000);
    expect(result.rulesInForce.effectiveFrom).toBe('2021-04-13');
  });

  it('switches to the new caps on the effective day itself', () => {
    // 89 FR 84815: effective 22 Jan 2025
    const result = compensationDue({ ...base, deniedOn: '2025-01-22', oneWayFare: usd(700), plannedArrivalDelayMinutes: 180 });
    expect(result.amountMinor).toBe(215_000);
  });
});

describe('us-dot scope, fares and exemptions', () => {
  it('aircraft under 30 seats is outside Part 250 (§250.2)', () => {
    const result = compensationDue({ ...base, aircraftSeats: 29 });
    expect(result).toMatchObject({ amountMinor: 0, band: 'out-of-scope', ruleRef: '14 CFR 250.2' });
    expect(result.explanation).toContain('30 seats');
  });

  it('30 seats is in scope (§250.2: 30 or more)', () => {
    expect(compensationDue({ ...base, aircraftSeats: 30 }).amountMinor).toBe(60_000);
  });

  it('flags an unknown seat count for review', () => {
    const { aircraftSeats: _omitted, ...withoutSeats } = base;
    expect(compensationDue(withoutSeats).reviewFlags.join(' ')).toContain('seat count not given');
  });

  it('zero-fare ticket uses the lowest cash fare in the same class (§250.5(d))', () => {
    // derived: lowest cash fare $250 x 200% = $500
    const result = compensationDue({ ...base, oneWayFare: usd(0), lowestCashFareSameClass: usd(250) });
    expect(result.amountMinor).toBe(50_000);
    expect(result.explanation).toContain('zero-fare');
  });

  it('zero-fare ticket without the lowest cash fare is refused', () => {
    expect(() => compensationDue({ ...base, oneWayFare: usd(0) })).toThrow(/lowestCashFareSameClass/);
  });

  it('adds the refund of unused optional fees (§250.5(f)) and the may-pay-more note (§250.5(g))', () => {
    const result = compensationDue({ ...base, unusedOptionalFeesMinor: 3_500 });
    expect(result.notes.join(' ')).toContain('USD 35.00');
    expect(result.notes.join(' ')).toContain('250.5(g)');
  });

  it.each([
    ['us-ticketing-checkin-acceptability', '14 CFR 250.6(a)'],
    ['us-smaller-aircraft', '14 CFR 250.6(b)'],
    ['us-other-section', '14 CFR 250.6(c)'],
  ])('exemption %s removes the entitlement (%s)', (code, ruleRef) => {
    expect(compensationDue({ ...base, exemption: code })).toMatchObject({ amountMinor: 0, band: 'exempt', ruleRef });
  });

  it('weight/balance exemption needs an aircraft of 60 seats or fewer (§250.6(b))', () => {
    expect(compensationDue({ ...base, aircraftSeats: 60, exemption: 'us-weight-balance' }).band).toBe('exempt');
    expect(() => compensationDue({ ...base, aircraftSeats: 61, exemption: 'us-weight-balance' })).toThrow(/exemption: .*60 or fewer/);
  });

  it('alternate-within-1h exemption must agree with the planned delay (§250.6(d))', () => {
    expect(compensationDue({ ...base, plannedArrivalDelayMinutes: 45, exemption: 'us-alternate-within-1h' }).band).toBe('exempt');
    expect(() => compensationDue({ ...base, plannedArrivalDelayMinutes: 61, exemption: 'us-alternate-within-1h' })).toThrow(/exemption/);
  });

  it('volunteer gets amount 0: volunteers agree their own benefits (§250.2b)', () => {
    const result = compensationDue({ regime: 'us-dot', deniedOn: '2025-03-01', voluntary: true, plannedArrivalDelayMinutes: null });
    expect(result).toMatchObject({ amountMinor: 0, currency: 'USD', band: 'volunteer' });
    expect(result.explanation).toContain('volunteers agree their own benefits');
  });
});
