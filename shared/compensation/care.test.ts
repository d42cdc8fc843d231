import { describe, expect, it } from 'vitest';
import { careDue, nightsCovered, type CareInput } from './index';

const kinds = (input: CareInput) => careDue(input).items.map((i) => i.kind);
// Rome Fiumicino - Hamburg 1,326 km (CJEU C-559/16 Bossen): band a, so a full meal from 2 h (Art. 6(1)(a) hours, common practice).
const rome: CareInput = {
  regime: 'eu-261', voluntary: false, choice: null, waitFrom: '2026-05-04T08:00:00Z', alternateDeparture: '2026-05-04T09:00:00Z',
  timeZone: 'Europe/Rome', distanceKm: 1326, intraCommunity: true,
};
const at = (minutes: number) => new Date(Date.parse(rome.waitFrom) + minutes * 60_000).toISOString();

describe('EU Art. 9: meals and refreshments in relation to the wait', () => {
  it('any wait: refreshments and two calls (Art. 9(1)(a), 9(2); owed from the first minute by Art. 4(3))', () => {
    expect(kinds({ ...rome, alternateDeparture: at(1) })).toEqual(['refreshment', 'communication']);
  });

  it('band a: 1 h 59 min no meal, 2 h a meal (Art. 6(1)(a) hours, common practice)', () => {
    expect(kinds({ ...rome, alternateDeparture: at(119) })).not.toContain('meal');
    expect(kinds({ ...rome, alternateDeparture: at(120) })).toContain('meal');
  });

  it('band b (intra-EU over 1,500 km): the meal from 3 h (Art. 6(1)(b) hours, common practice)', () => {
    const b = { ...rome, distanceKm: 2000 };
    expect(kinds({ ...b, alternateDeparture: at(179) })).not.toContain('meal');
    expect(kinds({ ...b, alternateDeparture: at(180) })).toContain('meal');
  });

  it('band c (over 3,500 km, not intra-EU): the meal from 4 h (Art. 6(1)(c) hours, common practice)', () => {
    const c = { ...rome, distanceKm: 6000, intraCommunity: false };
    expect(kinds({ ...c, alternateDeparture: at(239) })).not.toContain('meal');
    expect(kinds({ ...c, alternateDeparture: at(240) })).toContain('meal');
  });

  it('a further meal each 6 h of wait past the first (our policy, common practice)', () => {
    const meal = (m: number) => careDue({ ...rome, alternateDeparture: at(m) }).items.find((i) => i.kind === 'meal')!.quantity;
    expect(meal(120 + 359)).toBe(1);
    expect(meal(120 + 360)).toBe(2);
  });

  it('no care for a volunteer (Art. 4(1) refers to Art. 8 only) and none after a refund (2016/C 214/04, from memory)', () => {
    expect(kinds({ ...rome, voluntary: true, alternateDeparture: at(600) })).toEqual([]);
    expect(kinds({ ...rome, choice: 'refund', alternateDeparture: at(600) })).toEqual([]);
    expect(kinds({ ...rome, choice: 'reroute-earliest', alternateDeparture: at(600) })).toContain('meal');
  });
});

describe('hotel for a stay of one or more nights (Art. 9(1)(b), (c)); the night is 01:00-05:00 local (our policy)', () => {
  // Rome is UTC+2 in May: 20:00Z is 22:00 local.
  const evening = { ...rome, waitFrom: '2026-05-04T20:00:00Z' };
  it('an alternate leaving 04:59 local: no night covered, no hotel', () => {
    expect(kinds({ ...evening, alternateDeparture: '2026-05-05T02:59:00Z' })).not.toContain('hotel');
  });
  it('an alternate leaving 05:00 local the next day: one night, hotel and transport', () => {
    const proposal = careDue({ ...evening, alternateDeparture: '2026-05-05T03:00:00Z' });
    expect(proposal.nights).toBe(1);
    expect(proposal.items.map((i) => i.kind)).toEqual(expect.arrayContaining(['hotel', 'transport']));
  });
  it('counts nights on the airport’s clock, not UTC', () => {
    expect(nightsCovered('2026-05-04T20:00:00Z', '2026-05-06T06:00:00Z', 'Europe/Rome')).toBe(2);
    // 22:00Z-04:00Z covers 01:00-05:00 in UTC but is 23:00-05:00 (+1 h) only partly in Montreal (18:00-00:00 local).
    expect(nightsCovered('2026-05-04T22:00:00Z', '2026-05-05T04:00:00Z', 'America/Toronto')).toBe(0);
  });
});

// SOR/2019-150 s. 14 (from memory, marked in the rules table).
describe('Canada s. 14: food, drink and communication after 2 h; accommodation overnight', () => {
  const yul: CareInput = { regime: 'ca-appr', voluntary: false, choice: null, waitFrom: '2026-05-04T14:00:00Z', alternateDeparture: null, timeZone: 'America/Toronto' };
  const after = (m: number) => ({ ...yul, alternateDeparture: new Date(Date.parse(yul.waitFrom) + m * 60_000).toISOString() });
  it('1 h 59 min: nothing yet; 2 h: food and drink and a means of communication', () => {
    expect(kinds(after(119))).toEqual([]);
    expect(kinds(after(120))).toEqual(['meal', 'communication']);
  });
  it('an overnight wait adds accommodation and transport (s. 14(2)): 10:00 local to 06:00 the next day', () => {
    expect(kinds(after(18 * 60))).not.toContain('hotel'); // 04:00 local: the night is not covered
    expect(kinds(after(20 * 60))).toEqual(['meal', 'communication', 'hotel', 'transport']);
  });
});

describe('US Part 250 and input checks', () => {
  it('Part 250 sets no care', () => {
    expect(careDue({ ...rome, regime: 'us-dot', alternateDeparture: at(600) }).items).toEqual([]);
  });
  it('bad input names the field', () => {
    expect(() => careDue({ ...rome, alternateDeparture: 'tomorrow' })).toThrow(/^alternateDeparture:/);
    expect(() => careDue({ ...rome, alternateDeparture: at(-5) })).toThrow(/^alternateDeparture: must not be before/);
    expect(() => careDue({ ...rome, distanceKm: undefined })).toThrow(/^distanceKm:/);
    expect(() => careDue({ ...rome, regime: 'ca-appr', choice: 'reroute-later', alternateDeparture: at(5) })).toThrow(/^choice:/);
  });
});
