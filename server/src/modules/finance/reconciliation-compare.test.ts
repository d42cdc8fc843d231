// Each kind of disagreement between ledger and provider, one at a time, and a clean comparison. What counts as a
// difference follows the usual two-way reconciliation of a sub-ledger with a statement (common practice): each
// side's items matched by a shared reference (here the card's metadata compensationId), then amount, currency
// and state compared item by item.
import { describe, expect, it } from 'vitest';
import type { CardSnapshot } from '../payments/reader';
import { compareLedgerWithProvider, providerState, type CompareInput, type LedgerEntry } from './reconciliation-compare';

const STATION = 7;
const card = (over: Partial<CardSnapshot> = {}): CardSnapshot => ({
  id: 'ic_1', cardholderId: 'ich_1', status: 'active', currency: 'USD', limitMinor: 60_000, compensationId: 1, stationId: STATION,
  last4: '4242', expMonth: 12, expYear: 2029, ...over,
});
const entry = (over: Partial<LedgerEntry> = {}): LedgerEntry => ({ id: 1, stationId: STATION, state: 'issued', amountMinor: 60_000, currency: 'USD', providerCardId: 'ic_1', ...over });
const input = (over: Partial<CompareInput> = {}): CompareInput => ({
  ledger: [entry()], cards: [card()], spentByCard: new Map(), stationIds: new Set([STATION]), elsewhere: new Set(), ...over,
});
const kinds = (i: CompareInput) => compareLedgerWithProvider(i).map((d) => d.kind);

describe('compareLedgerWithProvider', () => {
  it('finds nothing when both sides agree', () => {
    expect(compareLedgerWithProvider(input())).toEqual([]);
  });

  it('finds a card the ledger does not know', () => {
    const diffs = compareLedgerWithProvider(input({ cards: [card(), card({ id: 'ic_9', compensationId: 99 })] }));
    expect(diffs).toEqual([expect.objectContaining({ kind: 'missing-in-ledger', compensationId: 99, cardId: 'ic_9' })]);
  });

  it('finds an issued compensation with no card at the provider', () => {
    expect(kinds(input({ cards: [] }))).toEqual(['missing-at-provider']);
  });

  it('does not expect a card for a compensation still due or in progress', () => {
    expect(kinds(input({ cards: [], ledger: [entry({ state: 'due', providerCardId: null }), entry({ id: 2, state: 'issuing', providerCardId: null })] }))).toEqual([]);
  });

  it('finds a different amount, and a different currency, with both values in words', () => {
    const diffs = compareLedgerWithProvider(input({ cards: [card({ limitMinor: 50_000, currency: 'CAD' })] }));
    expect(diffs.map((d) => d.kind)).toEqual(['amount-differs', 'currency-differs']);
    expect(diffs[0]).toMatchObject({ ledgerValue: 'USD 600.00', providerValue: 'CAD 500.00' });
  });

  it('reads a canceled card as voided and a spent one as settled', () => {
    expect(providerState(card({ status: 'canceled' }), 100)).toBe('voided');
    expect(providerState(card(), 100)).toBe('settled');
    expect(providerState(card({ status: 'inactive' }), 0)).toBe('issued');
    expect(kinds(input({ cards: [card({ status: 'canceled' })] }))).toEqual(['state-differs']);
    expect(kinds(input({ spentByCard: new Map([['ic_1', 60_000]]) }))).toEqual(['state-differs']);
    expect(kinds(input({ ledger: [entry({ state: 'settled' })], spentByCard: new Map([['ic_1', 1]]) }))).toEqual([]);
  });

  it('finds a second card for one compensation, and a card other than the one the ledger names', () => {
    expect(kinds(input({ cards: [card(), card({ id: 'ic_2' })] }))).toEqual(['duplicate-at-provider']);
    expect(kinds(input({ ledger: [entry({ providerCardId: 'ic_gone' })] }))).toEqual(['card-differs']);
  });

  it('reads a re-issue as one payment: the earlier canceled card is no duplicate, and the new limit is what was left', () => {
    // 600.00 owed; 150.00 spent on the first card before the provider canceled it; the new card holds 450.00.
    const reissued = input({
      cards: [card({ id: 'ic_old', status: 'canceled' }), card({ id: 'ic_new', limitMinor: 45_000 })],
      ledger: [entry({ providerCardId: 'ic_new' })],
      spentByCard: new Map([['ic_old', 15_000]]),
    });
    expect(kinds(reissued)).toEqual([]);
    // A second usable card beside it is still a duplicate.
    expect(kinds({ ...reissued, cards: [...reissued.cards, card({ id: 'ic_third' })] })).toEqual(['duplicate-at-provider']);
    // The provider's cancellation agrees with a ledger that says canceled.
    expect(kinds(input({ ledger: [entry({ state: 'canceled' })], cards: [card({ status: 'canceled' })] }))).toEqual([]);
  });

  it('leaves alone cards of other stations and cards that are not Bumpboard’s', () => {
    const foreign = [card({ id: 'ic_x', compensationId: 500, stationId: 8 }), card({ id: 'ic_y', compensationId: null, stationId: null }), card({ id: 'ic_z', compensationId: 600, stationId: STATION })];
    expect(kinds(input({ cards: [card(), ...foreign], elsewhere: new Set([600]) }))).toEqual([]);
  });
});
