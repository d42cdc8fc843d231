// Worked examples from the rules' text (derived by hand from it):
// - 14 CFR Part 260, §260.1(a) (89 FR 32832, 2024): fees for ancillary services paid for but not provided are
//   refunded; 14 CFR 250.6(c): a passenger seated in a section with a lower fare is owed an appropriate refund.
// - SOR/2019-150 (APPR): additional services paid for and not received refunded; a lower class, the difference
//   refunded (section number from memory, not verified).
// - Reg. (EC) 261/2004: no separate refund of optional fees (Art. 8 refunds the whole ticket when chosen); Art. 10(2)
//   reimburses 30 / 50 / 75 % of the ticket price by distance on a downgrade.
import { describe, expect, it } from 'vitest';
import { refundsDue } from './refund-rules';

const fees = [{ kind: 'seat' as const, amountMinor: 3_500, currency: 'USD' }, { kind: 'bag' as const, amountMinor: 4_000, currency: 'USD' }];

describe('refundsDue', () => {
  it('US: the seat (USD 35) and the bag (USD 40) paid for the flight not flown come back, USD 75 in all (Part 260)', () => {
    const [r] = refundsDue({ regime: 'us-dot', fareCurrency: 'USD', fees, cabinChange: null });
    expect(r).toMatchObject({ kind: 'optional-fees', amountMinor: 7_500, currency: 'USD', lines: [{ label: 'Seat selection', amountMinor: 3_500 }, { label: 'Checked bag', amountMinor: 4_000 }] });
    expect(r.ruleRef).toMatch(/14 CFR/);
  });

  it('Canada: the same for additional services (APPR)', () => {
    const cad = fees.map((f) => ({ ...f, currency: 'CAD' }));
    expect(refundsDue({ regime: 'ca-appr', fareCurrency: 'CAD', fees: cad, cabinChange: null })[0]).toMatchObject({ amountMinor: 7_500, ruleRef: expect.stringMatching(/SOR\/2019-150/) });
  });

  it('EU: no fee refund; a recorded downgrade on Rome-Hamburg (1,326 km, CJEU C-559/16) of a EUR 400 ticket is 30 % = EUR 120', () => {
    const eur = fees.map((f) => ({ ...f, currency: 'EUR' }));
    const cabinChange = { id: 9, direction: 'downgrade' as const, owedMinor: 12_000, owedRule: 'Art. 10(2): 30 % of the ticket price (1326 km, band a)', currency: 'EUR' };
    expect(refundsDue({ regime: 'eu-261', fareCurrency: 'EUR', fees: eur, cabinChange })).toEqual([
      { kind: 'downgrade', amountMinor: 12_000, currency: 'EUR', ruleRef: cabinChange.owedRule, cabinChangeId: 9, lines: [{ label: 'Downgrade', amountMinor: 12_000 }] },
    ]);
  });

  it('an upgrade, nothing paid and no cabin change owe nothing', () => {
    expect(refundsDue({ regime: 'us-dot', fareCurrency: 'USD', fees: [], cabinChange: { id: 1, direction: 'upgrade', owedMinor: 0, owedRule: 'no charge', currency: 'USD' } })).toEqual([]);
  });
});
