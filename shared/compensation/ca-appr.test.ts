import { describe, expect, it } from 'vitest';
import { apprPaymentDeadline, apprTopUp, compensationDue, type CompensationInput } from './index';

// Amounts CAD 900 / 1,800 / 2,400 for arrival delays < 6 h / 6 h to < 9 h / >= 9 h: SOR/2019-150 s. 20(1) (from memory).
const appr: CompensationInput = { regime: 'ca-appr', deniedOn: '2025-03-01', plannedArrivalDelayMinutes: 420 };

describe('ca-appr denied boarding within the carrier control', () => {
  it('arrival +7 h -> CAD 1,800', () => {
    expect(compensationDue(appr)).toMatchObject({ amountMinor: 180_000, currency: 'CAD', band: 'ca-6h-to-9h', ruleRef: 'SOR/2019-150 s. 20(1)' });
  });

  it('arrival +2 h -> CAD 900; +10 h -> CAD 2,400', () => {
    expect(compensationDue({ ...appr, plannedArrivalDelayMinutes: 120 }).amountMinor).toBe(90_000);
    expect(compensationDue({ ...appr, plannedArrivalDelayMinutes: 600 }).amountMinor).toBe(240_000);
  });

  it('no alternate: highest band, flagged for review', () => {
    const result = compensationDue({ ...appr, plannedArrivalDelayMinutes: null });
    expect(result.amountMinor).toBe(240_000);
    expect(result.reviewFlags).toHaveLength(1);
  });

  it('notes the 48 h payment and the top-up', () => {
    const notes = compensationDue(appr).notes.join(' ');
    expect(notes).toContain('48 h');
    expect(notes).toContain('top up');
  });

  it('exemption for a situation outside the carrier control removes the amount', () => {
    expect(compensationDue({ ...appr, exemption: 'ca-outside-carrier-control' })).toMatchObject({ amountMinor: 0, band: 'exempt' });
  });

  it('refuses a denial before the regulations applied', () => {
    expect(() => compensationDue({ ...appr, deniedOn: '2019-07-14' })).toThrow(/deniedOn/);
  });
});

describe('apprPaymentDeadline', () => {
  it('is 48 h after the denial, in UTC', () => {
    // derived: 2025-03-01T22:30-05:00 = 2025-03-02T03:30Z, plus 48 h
    expect(apprPaymentDeadline('2025-03-01T22:30:00-05:00')).toBe('2025-03-04T03:30:00.000Z');
  });

  it('refuses a date-time without offset', () => {
    expect(() => apprPaymentDeadline('2025-03-01T22:30:00')).toThrow(/deniedAt/);
  });
});

describe('apprTopUp', () => {
  it('paid CAD 900 under 6 h, actual 7 h -> top up CAD 900 to CAD 1,800', () => {
    expect(apprTopUp('ca-under-6h', 420)).toMatchObject({ actualBand: 'ca-6h-to-9h', paidMinor: 90_000, dueMinor: 180_000, topUpMinor: 90_000 });
  });

  it('paid CAD 1,800, actual 9 h -> top up CAD 600', () => {
    expect(apprTopUp('ca-6h-to-9h', 540).topUpMinor).toBe(60_000);
  });

  it('never claws back when the actual delay is lower', () => {
    expect(apprTopUp('ca-9h-or-more', 100)).toMatchObject({ dueMinor: 240_000, topUpMinor: 0 });
  });

  it('refuses an unknown band and a negative delay', () => {
    expect(() => apprTopUp('ca-12h' as never, 100)).toThrow(/paidBand/);
    expect(() => apprTopUp('ca-under-6h', -5)).toThrow(/actualDelayMinutes/);
  });
});
