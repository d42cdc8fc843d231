// Comparing the ledger's cash and cheque payments with the counter's own records: each settled compensation paid at
// the counter has one counter payment (a drawer or a numbered cheque) for the same medium, amount and currency, and
// each counter payment belongs to a compensation the ledger says is settled by it. Pure.
import type { Medium } from '@shared/compensation/media';
import type { Difference } from './reconciliation-compare';
import { moneyText } from './scope';

export interface CounterLedgerEntry {
  id: number;
  state: string;
  medium: Medium;
  amountMinor: number;
  currency: string;
}

export interface CounterRecord {
  compensationId: number;
  medium: 'cash' | 'cheque';
  drawerId: string | null;
  chequeNumber: string | null;
  amountMinor: number;
  currency: string;
}

export interface CounterCompareInput {
  /** The stations' compensations paid, or to be paid, in cash or by cheque. */
  ledger: readonly CounterLedgerEntry[];
  /** The stations' counter payments, whatever the compensation's medium now says. */
  records: readonly CounterRecord[];
  /** Compensations named by records but not in `ledger` (their medium changed since): id → the ledger's row. */
  others: ReadonlyMap<number, CounterLedgerEntry>;
}

/** How the register names a counter payment: its drawer or its cheque. */
export function registerRef(r: Pick<CounterRecord, 'medium' | 'drawerId' | 'chequeNumber'>): string {
  return r.medium === 'cash' ? `drawer ${r.drawerId ?? '?'}` : `cheque ${r.chequeNumber ?? '?'}`;
}

export function compareCounter(input: CounterCompareInput): Difference[] {
  const recordOf = new Map(input.records.map((r) => [r.compensationId, r]));
  const out: Difference[] = [];
  for (const entry of input.ledger) {
    const record = recordOf.get(entry.id);
    if (!record) {
      if (entry.state === 'settled') {
        out.push({ kind: 'missing-at-provider', medium: entry.medium, compensationId: entry.id, cardId: null, ledgerValue: `settled, ${moneyText(entry.amountMinor, entry.currency)} (${entry.medium})`, providerValue: null });
      }
      continue;
    }
    out.push(...compareOne(entry, record));
  }
  for (const record of input.records) {
    const entry = input.others.get(record.compensationId);
    if (entry) out.push({ kind: 'state-differs', medium: record.medium, compensationId: entry.id, cardId: registerRef(record), ledgerValue: `${entry.state}, ${entry.medium}`, providerValue: `paid ${moneyText(record.amountMinor, record.currency)} (${record.medium})` });
  }
  return out;
}

function compareOne(entry: CounterLedgerEntry, record: CounterRecord): Difference[] {
  const out: Difference[] = [];
  const base = { medium: entry.medium, compensationId: entry.id, cardId: registerRef(record) };
  if (record.medium !== entry.medium || entry.state !== 'settled') {
    out.push({ kind: 'state-differs', ...base, ledgerValue: `${entry.state}, ${entry.medium}`, providerValue: `paid (${record.medium})` });
  }
  if (record.amountMinor !== entry.amountMinor) {
    out.push({ kind: 'amount-differs', ...base, ledgerValue: moneyText(entry.amountMinor, entry.currency), providerValue: moneyText(record.amountMinor, record.currency) });
  }
  if (record.currency !== entry.currency) out.push({ kind: 'currency-differs', ...base, ledgerValue: entry.currency, providerValue: record.currency });
  return out;
}
