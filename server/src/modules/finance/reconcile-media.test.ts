// Each medium compared with its own record: bank transfers with the provider's outbound payments, cash and cheques
// with the counter's register, and a summary per medium. The matching rule (each side's items paired by a shared
// reference, then amount, currency and state compared) is the usual two-way reconciliation of a sub-ledger with a
// statement (common practice). Transfer statuses processing / posted / failed / returned / canceled are Stripe
// Treasury's OutboundPayment statuses (Stripe API reference, from memory).
import { describe, expect, it } from 'vitest';
import type { OutboundPaymentSnapshot } from '../payments/reader';
import { compareCounter, type CounterLedgerEntry, type CounterRecord } from './reconcile-counter';
import { summariseByMedium } from './reconcile-summary';
import { compareTransfers, transfersInScope, type TransferCompareInput, type TransferLedgerEntry } from './reconcile-transfers';
import type { CompareInput } from './reconciliation-compare';

const STATION = 7;
const payment = (over: Partial<OutboundPaymentSnapshot> = {}): OutboundPaymentSnapshot => ({ id: 'obp_1', status: 'processing', amountMinor: 40_000, currency: 'USD', compensationId: 1, stationId: STATION, returnCode: null, ...over });
const transfer = (over: Partial<TransferLedgerEntry> = {}): TransferLedgerEntry => ({ id: 1, stationId: STATION, state: 'issued', amountMinor: 40_000, currency: 'USD', providerPaymentId: 'obp_1', ...over });
const tInput = (over: Partial<TransferCompareInput> = {}): TransferCompareInput => ({ ledger: [transfer()], payments: [payment()], stationIds: new Set([STATION]), elsewhere: new Set(), ...over });
const kinds = (i: TransferCompareInput) => compareTransfers(i).map((d) => d.kind);

describe('compareTransfers', () => {
  it('finds nothing when the ledger and the outbound payment agree, sent or posted', () => {
    expect(compareTransfers(tInput())).toEqual([]);
    expect(compareTransfers(tInput({ ledger: [transfer({ state: 'settled' })], payments: [payment({ status: 'posted' })] }))).toEqual([]);
  });

  it('never compares a transfer with cards: an issued transfer with its payment is clean, with none it is missing', () => {
    expect(kinds(tInput({ payments: [] }))).toEqual(['missing-at-provider']);
    expect(compareTransfers(tInput({ payments: [] }))[0]).toMatchObject({ medium: 'bank-transfer', compensationId: 1 });
  });

  it('does not expect a payment while the passenger has not given an account yet', () => {
    expect(kinds(tInput({ ledger: [transfer({ state: 'issuing', providerPaymentId: null }), transfer({ id: 2, state: 'due', providerPaymentId: null })], payments: [] }))).toEqual([]);
  });

  it('finds a second payment that moved money for one compensation (paid twice), not an earlier failed one', () => {
    expect(kinds(tInput({ payments: [payment(), payment({ id: 'obp_2', status: 'posted' })] }))).toEqual(['duplicate-at-provider']);
    expect(kinds(tInput({ payments: [payment(), payment({ id: 'obp_0', status: 'failed' })] }))).toEqual([]);
  });

  it('finds amount, currency and state differences, and a payment the ledger does not know', () => {
    expect(kinds(tInput({ payments: [payment({ amountMinor: 30_000, currency: 'CAD', status: 'posted' })] }))).toEqual(['amount-differs', 'currency-differs', 'state-differs']);
    expect(kinds(tInput({ payments: [payment(), payment({ id: 'obp_9', compensationId: 99 })] }))).toEqual(['missing-in-ledger']);
    // A failed payment nobody knows moved no money.
    expect(kinds(tInput({ payments: [payment(), payment({ id: 'obp_9', compensationId: 99, status: 'failed' })] }))).toEqual([]);
  });

  it('leaves other stations’ payments out', () => {
    const input = tInput({ payments: [payment(), payment({ id: 'obp_8', compensationId: 50, stationId: 8 }), payment({ id: 'obp_7', compensationId: 51, stationId: STATION })], elsewhere: new Set([51]) });
    expect(transfersInScope(input).map((p) => p.id)).toEqual(['obp_1']);
    expect(compareTransfers(input)).toEqual([]);
  });
});

const counterEntry = (over: Partial<CounterLedgerEntry> = {}): CounterLedgerEntry => ({ id: 1, state: 'settled', medium: 'cash', amountMinor: 10_000, currency: 'USD', ...over });
const record = (over: Partial<CounterRecord> = {}): CounterRecord => ({ compensationId: 1, medium: 'cash', drawerId: 'D1', chequeNumber: null, amountMinor: 10_000, currency: 'USD', ...over });

describe('compareCounter', () => {
  it('finds nothing when each settled counter payment has its drawer or cheque record', () => {
    const ledger = [counterEntry(), counterEntry({ id: 2, medium: 'cheque', amountMinor: 20_000 }), counterEntry({ id: 3, state: 'due' })];
    const records = [record(), record({ compensationId: 2, medium: 'cheque', drawerId: null, chequeNumber: '1001', amountMinor: 20_000 })];
    expect(compareCounter({ ledger, records, others: new Map() })).toEqual([]);
  });

  it('finds a settled cash payment with no record, an amount that differs, and a record under another medium', () => {
    expect(compareCounter({ ledger: [counterEntry()], records: [], others: new Map() })).toEqual([expect.objectContaining({ kind: 'missing-at-provider', medium: 'cash', compensationId: 1 })]);
    expect(compareCounter({ ledger: [counterEntry()], records: [record({ amountMinor: 9_000 })], others: new Map() })).toEqual([expect.objectContaining({ kind: 'amount-differs', cardId: 'drawer D1', ledgerValue: 'USD 100.00', providerValue: 'USD 90.00' })]);
    const moved = compareCounter({ ledger: [], records: [record({ compensationId: 5 })], others: new Map([[5, counterEntry({ id: 5, medium: 'bank-transfer', state: 'issued' })]]) });
    expect(moved).toEqual([expect.objectContaining({ kind: 'state-differs', compensationId: 5, cardId: 'drawer D1' })]);
  });
});

describe('summariseByMedium', () => {
  it('counts each medium against its own record, with money paid and a travel credit’s unspent value outstanding', () => {
    const cardInput: CompareInput = {
      ledger: [{ id: 10, stationId: STATION, state: 'issued', amountMinor: 50_000, currency: 'CAD', providerCardId: 'ic_10', medium: 'travel-credit' }],
      cards: [{ id: 'ic_10', cardholderId: null, status: 'active', currency: 'CAD', limitMinor: 50_000, compensationId: 10, stationId: STATION, last4: null, expMonth: null, expYear: null, form: 'voucher' }],
      spentByCard: new Map([['ic_10', 12_000]]), stationIds: new Set([STATION]), elsewhere: new Set(),
    };
    const lines = summariseByMedium({
      rows: [{ medium: 'travel-credit' }, { medium: 'bank-transfer' }, { medium: 'cash' }],
      cardInput, transfers: [payment({ status: 'posted' })], records: [record()], differences: [],
    });
    expect(lines.map((l) => l.medium)).toEqual(['cash', 'cheque', 'bank-transfer', 'prepaid-card', 'travel-credit']);
    expect(lines.find((l) => l.medium === 'travel-credit')).toEqual({ medium: 'travel-credit', against: 'outstanding-credits', ledgerRows: 1, otherSide: 1, differences: 0, paid: [{ currency: 'CAD', amountMinor: 12_000 }], outstanding: [{ currency: 'CAD', amountMinor: 38_000 }] });
    expect(lines.find((l) => l.medium === 'bank-transfer')).toMatchObject({ against: 'provider-transfers', otherSide: 1, paid: [{ currency: 'USD', amountMinor: 40_000 }] });
    expect(lines.find((l) => l.medium === 'cash')).toMatchObject({ against: 'counter-register', otherSide: 1, paid: [{ currency: 'USD', amountMinor: 10_000 }] });
  });
});
