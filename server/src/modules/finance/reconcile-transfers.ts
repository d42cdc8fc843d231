// Comparing the ledger's bank transfers with the provider's outbound payments, matched by the compensation id each
// payment carries in its metadata. A payment processing or posted moved money; a failed or canceled one did not; a
// returned one came back. Pure: the run gathers both sides, this says where they disagree.
import type { Difference } from './reconciliation-compare';
import type { OutboundPaymentSnapshot } from '../payments/reader';
import { moneyText } from './scope';

export interface TransferLedgerEntry {
  id: number;
  stationId: number;
  state: string;
  amountMinor: number;
  currency: string;
  /** The outbound payment the current attempt's payout names, once sent. */
  providerPaymentId: string | null;
}

export interface TransferCompareInput {
  ledger: readonly TransferLedgerEntry[];
  payments: readonly OutboundPaymentSnapshot[];
  stationIds: ReadonlySet<number>;
  /** Compensation ids named by payments that belong to other stations' ledgers. */
  elsewhere: ReadonlySet<number>;
}

/** Money left (or is leaving) the carrier's account. */
export const MOVED_MONEY = new Set(['processing', 'posted']);

/** The ledger's word for the provider's status of the transfer. */
export function transferState(status: string): string {
  if (status === 'processing') return 'issued';
  if (status === 'posted') return 'settled';
  if (status === 'returned') return 'canceled';
  if (status === 'canceled') return 'voided';
  return 'failed';
}

/** States in which the ledger says a transfer exists. */
const EXPECTS_TRANSFER = new Set(['issued', 'settled']);

function inScope(p: OutboundPaymentSnapshot, ledgerIds: ReadonlySet<number>, input: TransferCompareInput): boolean {
  if (p.compensationId !== null && ledgerIds.has(p.compensationId)) return true;
  if (p.compensationId !== null && input.elsewhere.has(p.compensationId)) return false;
  return p.stationId !== null && input.stationIds.has(p.stationId);
}

/** The outbound payments that belong to the stations compared. */
export function transfersInScope(input: TransferCompareInput): OutboundPaymentSnapshot[] {
  const ledgerIds = new Set(input.ledger.map((l) => l.id));
  return input.payments.filter((p) => inScope(p, ledgerIds, input));
}

export function compareTransfers(input: TransferCompareInput): Difference[] {
  const ledgerById = new Map(input.ledger.map((l) => [l.id, l]));
  const byCompensation = new Map<number, OutboundPaymentSnapshot[]>();
  const out: Difference[] = [];
  const medium = 'bank-transfer' as const;

  for (const p of transfersInScope(input)) {
    const entry = p.compensationId === null ? undefined : ledgerById.get(p.compensationId);
    if (!entry) {
      // A transfer that failed moved nothing: not a difference in money, whatever the ledger says.
      if (MOVED_MONEY.has(p.status) || p.status === 'returned') {
        out.push({ kind: 'missing-in-ledger', medium, compensationId: p.compensationId, cardId: p.id, ledgerValue: null, providerValue: `${p.status}, ${moneyText(p.amountMinor, p.currency)}` });
      }
      continue;
    }
    byCompensation.set(entry.id, [...(byCompensation.get(entry.id) ?? []), p]);
  }

  for (const entry of input.ledger) {
    const payments = byCompensation.get(entry.id) ?? [];
    if (!payments.length) {
      if (EXPECTS_TRANSFER.has(entry.state) || (entry.providerPaymentId && entry.state !== 'due' && entry.state !== 'issuing')) {
        out.push({ kind: 'missing-at-provider', medium, compensationId: entry.id, cardId: entry.providerPaymentId, ledgerValue: `${entry.state}, ${moneyText(entry.amountMinor, entry.currency)}`, providerValue: null });
      }
      continue;
    }
    const named = payments.find((p) => p.id === entry.providerPaymentId);
    const primary = named ?? payments.find((p) => MOVED_MONEY.has(p.status)) ?? payments[0];
    for (const extra of payments) {
      // An earlier attempt that failed or came back beside the one the ledger names is history, not a second payment.
      if (extra !== primary && MOVED_MONEY.has(extra.status)) {
        out.push({ kind: 'duplicate-at-provider', medium, compensationId: entry.id, cardId: extra.id, ledgerValue: entry.providerPaymentId, providerValue: `${extra.id} (${extra.status}, ${moneyText(extra.amountMinor, extra.currency)})` });
      }
    }
    // A row still 'issuing' is being sent right now: the provider may already hold the payment the ledger will name.
    if (entry.state === 'issuing') continue;
    if (entry.providerPaymentId !== primary.id) {
      out.push({ kind: 'card-differs', medium, compensationId: entry.id, cardId: primary.id, ledgerValue: entry.providerPaymentId ?? 'no transfer', providerValue: primary.id });
    }
    if (primary.amountMinor !== entry.amountMinor) {
      out.push({ kind: 'amount-differs', medium, compensationId: entry.id, cardId: primary.id, ledgerValue: moneyText(entry.amountMinor, entry.currency), providerValue: moneyText(primary.amountMinor, primary.currency) });
    }
    if (primary.currency !== entry.currency) {
      out.push({ kind: 'currency-differs', medium, compensationId: entry.id, cardId: primary.id, ledgerValue: entry.currency, providerValue: primary.currency });
    }
    const atProvider = transferState(primary.status);
    if (atProvider !== entry.state) {
      out.push({ kind: 'state-differs', medium, compensationId: entry.id, cardId: primary.id, ledgerValue: entry.state, providerValue: `${atProvider} (${primary.status})` });
    }
  }
  return out;
}
