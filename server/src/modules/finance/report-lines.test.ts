// Form 251 lines from passenger records. The line structure is BTS Form 251 "Report of Passengers Denied Confirmed
// Space" (OMB No. 2138-0018, required by 14 CFR 250.10): 1(a)/1(b) qualified for compensation with or without
// alternate transportation, 2(a)-(c) did not qualify, 4 received compensation, 5 volunteers, 7 total boardings,
// 8(a)-(c) amounts paid for 1(a), 1(b) and 5. Line 3 as the total of lines 1 and 2 is from memory.
import { describe, expect, it } from 'vitest';
import { categoryFromCompensation, form251Lines, regimeLines, type ReportItem } from './report-lines';

const item = (over: Partial<ReportItem>): ReportItem => ({
  voluntary: false, category: '1a', band: 'us-200pct', amountMinor: 50_000, currency: 'USD', paid: true, voided: false, hasCompensation: true, ...over,
});
const byCode = (lines: ReturnType<typeof form251Lines>) => Object.fromEntries(lines.map((l) => [l.code, l]));

describe('form251Lines', () => {
  const items = [
    item({}),
    item({ amountMinor: 70_000, paid: false }),
    item({ category: '1b', band: 'us-400pct', amountMinor: 107_500 }),
    item({ category: '2a', band: 'us-none-within-1h', amountMinor: 0, paid: false }),
    item({ category: '2b', band: 'exempt', amountMinor: 0, paid: false }),
    item({ category: '2c', band: 'exempt', amountMinor: 0, paid: false }),
    item({ voluntary: true, category: null, band: 'volunteer', amountMinor: 80_000 }),
    item({ voluntary: true, category: null, band: 'volunteer', amountMinor: 40_000, voided: true }),
  ];
  const lines = byCode(form251Lines(items, 1234));

  it('has the lines of the form, in its order', () => {
    expect(form251Lines([], 0).map((l) => l.code)).toEqual(['1a', '1b', '2a', '2b', '2c', '3', '4', '5', '6a', '6b', '7', '8a', '8b', '8c']);
  });

  it('counts each category, with line 3 their total (derived: 2 + 1 + 1 + 1 + 1)', () => {
    expect([lines['1a'].count, lines['1b'].count, lines['2a'].count, lines['2b'].count, lines['2c'].count]).toEqual([2, 1, 1, 1, 1]);
    expect(lines['3'].count).toBe(6);
  });

  it('counts on line 4 only those paid, and on line 5 volunteers not voided', () => {
    expect(lines['4'].count).toBe(2);
    expect(lines['5'].count).toBe(1);
    expect(lines['7'].count).toBe(1234);
  });

  it('sums on line 8 only what was paid (derived: 500.00 on 8a, 1,075.00 on 8b, 800.00 on 8c)', () => {
    expect(lines['8a'].amounts).toEqual([{ currency: 'USD', amountMinor: 50_000 }]);
    expect(lines['8b'].amounts).toEqual([{ currency: 'USD', amountMinor: 107_500 }]);
    expect(lines['8c'].amounts).toEqual([{ currency: 'USD', amountMinor: 80_000 }]);
  });

  it('leaves upgrades and downgrades blank, saying so', () => {
    expect(lines['6a']).toMatchObject({ count: null, note: expect.stringMatching(/Not tracked/) });
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
  it('counts volunteers and denials, and splits the owed amounts by band', () => {
    const lines = byCode(regimeLines([
      item({ category: null, band: 'eu-b', amountMinor: 40_000, currency: 'EUR' }),
      item({ category: null, band: 'eu-c', amountMinor: 60_000, currency: 'EUR', paid: false }),
      item({ category: null, band: 'exempt', amountMinor: 0, currency: 'EUR', paid: false }),
      item({ voluntary: true, category: null, band: 'volunteer', amountMinor: 30_000, currency: 'EUR' }),
    ], 0));
    expect(lines.D1.count).toBe(3);
    expect(lines.D2.count).toBe(2);
    expect(lines.D3.count).toBe(1);
    // Reg. (EC) 261/2004 Art. 7(1)(c): EUR 600 for the longest band; people read the band, not its code.
    expect(lines['D2.2'].amounts).toEqual([{ currency: 'EUR', amountMinor: 60_000 }]);
    expect(lines['D2.2'].label).toBe('owed compensation: EUR 600.00 for longer flights');
    expect(Object.keys(lines).join(' ')).not.toMatch(/eu-/);
    expect(lines.D5.amounts).toEqual([{ currency: 'EUR', amountMinor: 40_000 }]);
    expect(lines.D6.amounts).toEqual([{ currency: 'EUR', amountMinor: 60_000 }]);
    expect(lines.V2.amounts).toEqual([{ currency: 'EUR', amountMinor: 30_000 }]);
  });
});
