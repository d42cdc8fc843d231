// What the payments module lets others read of the money it moves: the provider's cards, card transactions and bank
// transfers, page by page, and the ledger's own view of a compensation. Finance reads through this folder only; it never
// calls the provider or the payments module's other files itself, so money moves in one module.
import type { CardSnapshot, IssuingProvider, Page, TransactionSnapshot } from '../../../integrations/payments/issuing-provider';
import type { OutboundPaymentSnapshot, PassengerPaymentsProvider } from '../../../integrations/payments/passenger-provider';
import { classifyProviderError } from '../../../integrations/payments/provider-errors';

export type { CardSnapshot, OutboundPaymentSnapshot, Page, TransactionSnapshot };
export { compensationRows, COMPENSATION_FROM, passengerNameOf, presentCompensation } from '../compensation-view';

export interface PaymentsReader {
  listCards(startingAfter: string | null, limit: number): Promise<Page<CardSnapshot>>;
  listCardTransactions(startingAfter: string | null, limit: number): Promise<Page<TransactionSnapshot>>;
  listTransfers(startingAfter: string | null, limit: number): Promise<Page<OutboundPaymentSnapshot>>;
}

export function createPaymentsReader(cards: Pick<IssuingProvider, 'listCards' | 'listTransactions'>, passenger: Pick<PassengerPaymentsProvider, 'listOutboundPayments'>): PaymentsReader {
  return {
    listCards: (after, limit) => cards.listCards(after, limit),
    listCardTransactions: (after, limit) => cards.listTransactions(after, limit),
    listTransfers: (after, limit) => passenger.listOutboundPayments(after, limit),
  };
}

/** A provider failure in words fit for a run's error line (no request data). */
export function readFailureReason(error: unknown, step: string): string {
  return classifyProviderError(error, step).reason;
}
