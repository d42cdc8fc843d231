import { describe, expect, it } from 'vitest';
import { downgradeRefund, optionalFeeRefund } from './index';

// Percentages: Reg. (EC) 261/2004 Art. 10(2)(a)-(c): 30 % up to 1,500 km; 50 % intra-Community over 1,500 km and
// other flights 1,500-3,500 km; 75 % otherwise. Values below are worked from that text (derived).
describe('downgradeRefund', () => {
  it('Rome-Hamburg 1,326 km (CJEU C-559/16 Bossen distance), price EUR 200 -> 30 % = EUR 60', () => {
    expect(downgradeRefund({ regime: 'eu-261', ticketPriceMinor: 20_000, currency: 'EUR', distanceKm: 1326, intraCommunity: true }))
      .toMatchObject({ amountMinor: 6_000, currency: 'EUR', ruleRef: expect.stringContaining('Art. 10(2)(a)') });
  });

  it('exactly 1,500 km stays at 30 % ("1500 kilometres or less")', () => {
    expect(downgradeRefund({ regime: 'eu-261', ticketPriceMinor: 10_000, currency: 'EUR', distanceKm: 1500 }).amountMinor).toBe(3_000);
  });

  it('intra-Community 4,000 km, EUR 500 -> 50 % = EUR 250; non-EU 2,000 km -> 50 %', () => {
    expect(downgradeRefund({ regime: 'eu-261', ticketPriceMinor: 50_000, currency: 'EUR', distanceKm: 4000, intraCommunity: true }).amountMinor).toBe(25_000);
    expect(downgradeRefund({ regime: 'eu-261', ticketPriceMinor: 50_000, currency: 'EUR', distanceKm: 2000 }).ruleRef).toContain('(b): 50 %');
  });

  it('non-EU 6,000 km, EUR 1,000 -> 75 % = EUR 750 (Art. 10(2)(c))', () => {
    expect(downgradeRefund({ regime: 'eu-261', ticketPriceMinor: 100_000, currency: 'EUR', distanceKm: 6000 }).amountMinor).toBe(75_000);
  });

  it('UK: same percentages in GBP; fractions round up for the passenger (common practice)', () => {
    expect(downgradeRefund({ regime: 'uk-261', ticketPriceMinor: 333, currency: 'GBP', distanceKm: 800 }).amountMinor).toBe(100);
  });

  it('US: the fare difference of the lower section (14 CFR 250.6(c)); Canada likewise', () => {
    expect(downgradeRefund({ regime: 'us-dot', ticketPriceMinor: 90_000, lowerClassFareMinor: 35_000, currency: 'USD', distanceKm: 1200 }).amountMinor).toBe(55_000);
    expect(downgradeRefund({ regime: 'ca-appr', ticketPriceMinor: 50_000, lowerClassFareMinor: 60_000, currency: 'CAD', distanceKm: 1200 }).amountMinor).toBe(0);
  });

  it('bad input is a RangeError naming the field', () => {
    expect(() => downgradeRefund({ regime: 'us-dot', ticketPriceMinor: 100, currency: 'USD', distanceKm: 100 })).toThrow(/^lowerClassFareMinor:/);
    expect(() => downgradeRefund({ regime: 'eu-261', ticketPriceMinor: 1.5, currency: 'EUR', distanceKm: 100 })).toThrow(/^ticketPriceMinor:/);
    expect(() => downgradeRefund({ regime: 'eu-261', ticketPriceMinor: 100, currency: 'eur', distanceKm: 100 })).toThrow(/^currency:/);
    expect(() => downgradeRefund({ regime: 'eu-261', ticketPriceMinor: 100, currency: 'EUR', distanceKm: -1 })).toThrow(/^distanceKm:/);
  });
});

describe('optionalFeeRefund', () => {
  const fees = [{ kind: 'seat', amountMinor: 3_500, received: false }, { kind: 'bag', amountMinor: 4_000, received: true }, { kind: 'wifi', amountMinor: 1_200, received: false }];

  it('US: fees for services not received are refunded (14 CFR 250.5 optional fees)', () => {
    expect(optionalFeeRefund({ regime: 'us-dot', currency: 'USD', fees })).toMatchObject({ amountMinor: 4_700, lines: [{ kind: 'seat', amountMinor: 3_500 }, { kind: 'wifi', amountMinor: 1_200 }] });
  });

  it('Canada: the same for additional services not received (SOR/2019-150)', () => {
    expect(optionalFeeRefund({ regime: 'ca-appr', currency: 'CAD', fees }).amountMinor).toBe(4_700);
  });

  it('EU: no separate fee refund under Reg. 261/2004', () => {
    expect(optionalFeeRefund({ regime: 'eu-261', currency: 'EUR', fees }).amountMinor).toBe(0);
  });

  it('bad input names the field', () => {
    expect(() => optionalFeeRefund({ regime: 'us-dot', currency: 'USD', fees: [{ kind: 'seat', amountMinor: -5, received: false }] })).toThrow(/^fees\[0\]\.amountMinor:/);
  });
});
