// Form 251 lines from passenger records. The line structure is BTS Form 251 "Report of Passengers Denied Confirmed
// Space" (OMB No. 2138-0018, required by 14 CFR 250.10): 1(a)/1(b) qualified for compensation with or without
// alternate transportation, 2(a)-(c) did not qualify, 4 received compensation, 5 volunteers, 6(a)/(b) upgrades and
// downgrades, 7 total boardings, 8(a)-(c) amounts paid for 1(a), 1(b) and 5. Line 8 counts cash or check only, never
// the value of transportation vouchers: BTS revised instructions for Form 251, para. F (30 June 2004), as restated
// by DOT's Aviation Consumer Protection Division on 21 April 2006. Line 3 as the total of lines 1 and 2 is from memory.
import { describe, expect, it } from 'vitest';
import { perDay, type ReportItem } from './report-items';
import { categoryFromCompensation, form251Lines, paidInMoneyForForm251 } from './report-lines';
import { regimeLines } from './regime-lines';

const item = (over: Partial<ReportItem>): ReportItem => ({
  serviceDate: '2026-10-05', voluntary: false, category: '1a', band: 'us-200pct', amountMinor: 50_000, currency: 'USD', state: 'issued', form: 'prepaid-card', spentMinor: 0, ...over,
});
const byCode = (lines: ReturnType<typeof form251Lines>) => Object.fromEntries(lines.map((l) => [l.code, l]));

describe('form251Lines', () => {
  const items = [
    item({}),
    item({ amountMinor: 70_000, state: 'due' }),
    item({ category: '1b', band: 'us-400pct', amountMinor: 107_500, serviceDate: '2026-11-12' }),
    item({ category: '2a', band: 'us-none-within-1h', amountMinor: 0, state: 'due' }),
    item({ category: '2b', band: 'exempt', amountMinor: 0, state: 'due' }),
    item({ category: '2c', band: 'exempt', amountMinor: 0, state: 'due' }),
    item({ voluntary: true, category: null, band: 'volunteer', amountMinor: 80_000 }),
    item({ voluntary: true, category: null, band: 'volunteer', amountMinor: 40_000, state: 'voided' }),
    item({ voluntary: true, category: null, band: 'volunteer', amountMinor: 30_000, form: 'voucher', state: 'settled' }),
    item({ amountMinor: 60_000, state: 'canceled', serviceDate: '2026-11-12' }),
  ];
  const lines = byCode(form251Lines(items, 1234, [
    { serviceDate: '2026-10-05', direction: 'upgrade', owedMinor: 0, currency: 'USD' },
    { serviceDate: '2026-10-05', direction: 'downgrade', owedMinor: 12_000, currency: 'USD' },
    { serviceDate: '2026-10-06', direction: 'downgrade', owedMinor: 8_000, currency: 'USD' },
  ]));

  it('has the lines of the form, in its order, each with its source', () => {
    const codes = form251Lines([], 0).map((l) => l.code);
    expect(codes.slice(0, 14)).toEqual(['1a', '1b', '2a', '2b', '2c', '3', '4', '5', '6a', '6b', '7', '8a', '8b', '8c']);
    expect(form251Lines([], 0).every((l) => l.source.length > 10)).toBe(true);
  });

  it('keeps a denial whose payment was canceled on its line (derived: 3 on 1a, 1 on 1b, 1 each on 2a–2c)', () => {
    expect([lines['1a'].count, lines['1b'].count, lines['2a'].count, lines['2b'].count, lines['2c'].count]).toEqual([3, 1, 1, 1, 1]);
    expect(lines['3'].count).toBe(7);
  });

  it('counts on line 4 only those paid, and on line 5 every volunteer, a voided payment included', () => {
    expect(lines['4'].count).toBe(2);
    expect(lines['5'].count).toBe(3);
    expect(lines['7'].count).toBe(1234);
  });

  it('sums on line 8 only money paid, never a voucher (derived: 500.00 on 8a, 1,075.00 on 8b, 800.00 on 8c)', () => {
    expect(lines['8a'].amounts).toEqual([{ currency: 'USD', amountMinor: 50_000 }]);
    expect(lines['8b'].amounts).toEqual([{ currency: 'USD', amountMinor: 107_500 }]);
    expect(lines['8c'].amounts).toEqual([{ currency: 'USD', amountMinor: 80_000 }]);
    expect(lines['8c'].source).toMatch(/never the value of transportation vouchers/);
    expect(lines['x-vouchers']).toMatchObject({ count: 1, amounts: [{ currency: 'USD', amountMinor: 30_000 }] });
  });

  it('shows what is owed, lost payments included (derived: 700.00 due + 400.00 voided + 600.00 canceled)', () => {
    expect(lines['x-owed']).toMatchObject({ count: 3, amounts: [{ currency: 'USD', amountMinor: 170_000 }] });
    expect(lines['x-owed'].note).toMatch(/2 of them/);
  });

  it('fills upgrades and downgrades from the cabin changes recorded at the desk', () => {
    expect(lines['6a'].count).toBe(1);
    expect(lines['6b']).toMatchObject({ count: 2, amounts: [{ currency: 'USD', amountMinor: 20_000 }] });
  });

  it('gives a chart whose days add up to the paid lines and the owed line', () => {
    const days = perDay(items, paidInMoneyForForm251);
    const sum = (k: 'voluntaryPaidMinor' | 'involuntaryPaidMinor' | 'owedMinor') => days.reduce((s, d) => s + d[k], 0);
    expect(sum('voluntaryPaidMinor')).toBe(lines['8c'].amounts![0].amountMinor);
    expect(sum('involuntaryPaidMinor')).toBe(lines['8a'].amounts![0].amountMinor + lines['8b'].amounts![0].amountMinor);
    expect(sum('owedMinor')).toBe(lines['x-owed'].amounts![0].amountMinor);
  });

  it('owes only what was not spent on a card the provider canceled (derived: 600.00 − 150.00 = 450.00)', () => {
    const partly = byCode(form251Lines([item({ amountMinor: 60_000, state: 'canceled', spentMinor: 15_000 })], 0));
    expect(partly['x-owed'].amounts).toEqual([{ currency: 'USD', amountMinor: 45_000 }]);
    expect(perDay([item({ amountMinor: 60_000, state: 'canceled', spentMinor: 15_000 })], paidInMoneyForForm251)[0].owedMinor).toBe(45_000);
  });
});

describe('categoryFromCompensation (14 CFR 250.5 bands and 250.6 exceptions)', () => {
  it('puts a paid band on line 1a, or 1b when no alternate transportation was offered', () => {
    expect(categoryFromCompensation('us-200pct', '14 CFR 250.5(a)(2)', 'The alternate is planned to arrive 1 h 30 min after')).toBe('1a');
    expect(categoryFromCompensation('us-400pct', '14 CFR 250.5(a)(3)', 'No alternate transportation was offered: 400%')).toBe('1b');
  });

  it('puts the exceptions on lines 2a to 2c', () => {
    expect(categoryFromCompensation('us-none-within-1h', '14 CFR 250.5(a)(1); 14 CFR 250.6(d)', '')).toBe('2a');
    expect(categoryFromCompensation('exempt', '14 CFR 250.6(b)', '')).toBe('2b');
    expect(categoryFromCompensation('exempt', '14 CFR 250.6(a)', '')).toBe('2c');
    expect(categoryFromCompensation('out-of-scope', '14 CFR 250.2', '')).toBeNull();
  });
});

describe('regimeLines', () => {
  it('counts volunteers and denials, keeps lost payments owed, and splits the owed amounts by band', () => {
    const items = [
      item({ category: null, band: 'eu-b', amountMinor: 40_000, currency: 'EUR' }),
      item({ category: null, band: 'eu-c', amountMinor: 60_000, currency: 'EUR', state: 'due' }),
      item({ category: null, band: 'eu-c', amountMinor: 60_000, currency: 'EUR', state: 'failed' }),
      item({ category: null, band: 'exempt', amountMinor: 0, currency: 'EUR', state: 'due' }),
      item({ voluntary: true, category: null, band: 'volunteer', amountMinor: 30_000, currency: 'EUR' }),
      item({ voluntary: true, category: null, band: 'volunteer', amountMinor: 25_000, currency: 'EUR', state: 'voided' }),
    ];
    const lines = byCode(regimeLines('eu-261', items, 0, [{ serviceDate: '2026-10-05', direction: 'downgrade', owedMinor: 7_500, currency: 'EUR' }]));
    expect(lines.V1.count).toBe(2);
    expect(lines.D1.count).toBe(4);
    expect(lines.D2.count).toBe(3);
    expect(lines.D3.count).toBe(1);
    // Reg. (EC) 261/2004 Art. 7(1)(c): EUR 600 for the longest band; people read the band, not its code.
    expect(lines['D2.2'].amounts).toEqual([{ currency: 'EUR', amountMinor: 120_000 }]);
    expect(lines['D2.2'].label).toBe('owed compensation: EUR 600.00 for longer flights');
    expect(Object.keys(lines).join(' ')).not.toMatch(/eu-/);
    expect(lines.D5.amounts).toEqual([{ currency: 'EUR', amountMinor: 40_000 }]);
    // derived: 600.00 due + 600.00 refused + 250.00 voided
    expect(lines.O.amounts).toEqual([{ currency: 'EUR', amountMinor: 145_000 }]);
    expect(lines.V2.amounts).toEqual([{ currency: 'EUR', amountMinor: 30_000 }]);
    expect(lines.C2).toMatchObject({ count: 1, amounts: [{ currency: 'EUR', amountMinor: 7_500 }] });
    expect(lines.C2.source).toMatch(/Art\. 10\(2\)/);
  });
});
