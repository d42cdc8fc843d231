import { describe, expect, it } from 'vitest';
import { compensationDue, type CompensationInput } from './index';

// Bossen (CJEU C-559/16, 7 Sep 2017): Rome Fiumicino - Brussels - Hamburg; the direct distance
// Rome - Hamburg of 1,326 km decides the band, not the 1,173 + 483 km flown.
const romeHamburg: CompensationInput = {
  regime: 'eu-261',
  deniedOn: '2025-03-01',
  distanceKm: 1326,
  intraCommunity: true,
  plannedArrivalDelayMinutes: 105,
};

describe('eu-261 Art. 7', () => {
  it('Rome - Hamburg 1,326 km -> EUR 250 (Bossen)', () => {
    const result = compensationDue(romeHamburg);
    expect(result).toMatchObject({ amountMinor: 25_000, currency: 'EUR', band: 'eu-a', fullAmountMinor: 25_000 });
    expect(result.notes.join(' ')).toContain('C-559/16');
  });

  it('the flown legs 1,173 + 483 km would wrongly reach band b: the direct distance is used', () => {
    // derived: 1,173 + 483 = 1,656 km > 1,500 km; the caller must pass the direct distance
    expect(compensationDue({ ...romeHamburg, distanceKm: 1173 + 483 }).band).toBe('eu-b');
  });

  it('rerouted arriving +1:45 -> EUR 250, may be halved to EUR 125 (Art. 7(2)(a), derived)', () => {
    expect(compensationDue(romeHamburg)).toMatchObject({ amountMinor: 25_000, reducibleUnderArt7_2: true });
    expect(compensationDue({ ...romeHamburg, applyReroutingReduction: true })).toMatchObject({
      amountMinor: 12_500,
      fullAmountMinor: 25_000,
      ruleRef: 'Reg. (EC) 261/2004 Art. 7(1)(a), Art. 7(2)',
    });
  });

  it('rerouted arriving +2:30 -> EUR 250, not halvable (derived: over the 2 h of Art. 7(2)(a))', () => {
    const result = compensationDue({ ...romeHamburg, plannedArrivalDelayMinutes: 150, applyReroutingReduction: true });
    expect(result).toMatchObject({ amountMinor: 25_000, reducibleUnderArt7_2: false });
    expect(result.explanation).toContain('does not apply');
  });

  it('no re-routing offered: full amount, not halvable', () => {
    const result = compensationDue({ ...romeHamburg, plannedArrivalDelayMinutes: null, applyReroutingReduction: true });
    expect(result).toMatchObject({ amountMinor: 25_000, reducibleUnderArt7_2: false });
  });

  it('intra-Community flight over 3,500 km stays in band b: EUR 400 (Art. 7(1)(b))', () => {
    expect(compensationDue({ ...romeHamburg, distanceKm: 9000 })).toMatchObject({ amountMinor: 40_000, band: 'eu-b' });
  });

  it('non-EU flight over 3,500 km -> EUR 600 (Art. 7(1)(c)), halvable within 4 h (Art. 7(2)(c))', () => {
    const result = compensationDue({ ...romeHamburg, intraCommunity: false, distanceKm: 6000, plannedArrivalDelayMinutes: 240, applyReroutingReduction: true });
    expect(result).toMatchObject({ amountMinor: 30_000, fullAmountMinor: 60_000, band: 'eu-c' });
  });

  it('policy: exactly 3,500 km on a non-EU flight falls in the EUR 400 band and says so', () => {
    const result = compensationDue({ ...romeHamburg, intraCommunity: false, distanceKm: 3500 });
    expect(result).toMatchObject({ amountMinor: 40_000, band: 'eu-b' });
    expect(result.notes.join(' ')).toContain('3,500 km inclusive');
  });

  it('flags distances within 5 km of a band edge for review', () => {
    expect(compensationDue({ ...romeHamburg, distanceKm: 1497 }).reviewFlags.join(' ')).toContain('1,500 km band edge');
    expect(compensationDue({ ...romeHamburg, distanceKm: 1326 }).reviewFlags).toEqual([]);
  });

  it('documented exemption removes the entitlement (Art. 3(2)(a))', () => {
    expect(compensationDue({ ...romeHamburg, exemption: 'eu-no-checkin' })).toMatchObject({ amountMinor: 0, band: 'exempt', ruleRef: 'Reg. (EC) 261/2004 Art. 3(2)(a)' });
  });

  it('volunteer: amount 0, Art. 8 and 9 still noted (Art. 4(1))', () => {
    const result = compensationDue({ regime: 'eu-261', deniedOn: '2025-03-01', voluntary: true, plannedArrivalDelayMinutes: null });
    expect(result).toMatchObject({ amountMinor: 0, band: 'volunteer', currency: 'EUR' });
    expect(result.notes.join(' ')).toContain('Art. 8');
  });
});

describe('uk-261 (retained Reg. 261/2004; amounts seen only in secondary sources)', () => {
  const uk: CompensationInput = { regime: 'uk-261', deniedOn: '2025-03-01', distanceKm: 1000, plannedArrivalDelayMinutes: null };

  it.each([
    [1000, false, 22_000, 'uk-a'],
    [2000, false, 35_000, 'uk-b'],
    [5000, false, 52_000, 'uk-c'],
    [5000, true, 35_000, 'uk-b'],
  ])('%d km (domestic %s) -> %d pence, band %s', (distanceKm, intraCommunity, amountMinor, band) => {
    expect(compensationDue({ ...uk, distanceKm, intraCommunity })).toMatchObject({ amountMinor, band, currency: 'GBP' });
  });

  it('refuses a denial before the UK rules start (use eu-261 then)', () => {
    expect(() => compensationDue({ ...uk, deniedOn: '2020-12-31' })).toThrow(/deniedOn/);
  });
});
