// The period report by medium, worked by hand from the facts below: each medium's paid figure comes from its own
// record (counter payment, transfer sent, card spending), a travel credit's unspent value is outstanding, and the
// owed figure counts every compensation whatever became of its payment. No outside source: arithmetic on our rows.
import { describe, expect, it } from 'vitest';
import { mediumLines, type MediumFact } from './report-media';

const fact = (over: Partial<MediumFact>): MediumFact => ({
  medium: 'cash', state: 'settled', amountMinor: 10_000, currency: 'USD', creditValueMinor: null, counterPaidMinor: null, drawerId: null, chequeNumber: null,
  transferState: null, spentMinor: 0, liveCard: false, ...over,
});

describe('mediumLines', () => {
  it('adds each medium up from its own record', () => {
    const lines = mediumLines([
      fact({ medium: 'cash', counterPaidMinor: 10_000, drawerId: 'D1' }),
      fact({ medium: 'cash', counterPaidMinor: 20_000, amountMinor: 20_000, drawerId: 'D2' }),
      fact({ medium: 'cash', state: 'due' }),
      fact({ medium: 'cheque', counterPaidMinor: 30_000, amountMinor: 30_000, chequeNumber: '1001' }),
      fact({ medium: 'bank-transfer', state: 'settled', transferState: 'posted', amountMinor: 40_000 }),
      fact({ medium: 'bank-transfer', state: 'failed', transferState: 'failed', amountMinor: 50_000 }),
      fact({ medium: 'prepaid-card', state: 'issued', amountMinor: 60_000, spentMinor: 15_000, liveCard: true }),
      // Canada: CAD 900.00 given up for a CAD 1,200.00 credit, CAD 200.00 used.
      fact({ medium: 'travel-credit', state: 'settled', currency: 'CAD', amountMinor: 90_000, creditValueMinor: 120_000, spentMinor: 20_000, liveCard: true }),
      // A voided card holds nothing any more.
      fact({ medium: 'travel-credit', state: 'voided', currency: 'CAD', amountMinor: 90_000, creditValueMinor: 120_000, liveCard: false }),
    ]);
    expect(lines.map((l) => [l.medium, l.currency, l.count, l.owedMinor, l.paidMinor, l.outstandingMinor, l.detail])).toEqual([
      ['cash', 'USD', 3, 40_000, 30_000, 0, '2 drawers'],
      ['cheque', 'USD', 1, 30_000, 30_000, 0, '1 cheque'],
      ['bank-transfer', 'USD', 2, 90_000, 40_000, 0, ''],
      ['prepaid-card', 'USD', 1, 60_000, 15_000, 45_000, ''],
      ['travel-credit', 'CAD', 2, 180_000, 20_000, 100_000, ''],
    ]);
    expect(lines.find((l) => l.medium === 'travel-credit')?.creditValueMinor).toBe(120_000);
  });

  it('has no line for a medium nobody was paid through', () => {
    expect(mediumLines([])).toEqual([]);
  });
});
