// A run's summary, one line per medium: the ledger's rows, the records read on the other side, the differences, the
// money that side says was paid, and what is still outstanding (a card's unspent value: for a travel credit, the
// carrier's liability until it is used). Pure.
import { MEDIA, type Medium } from '@shared/compensation/media';
import type { MediumReconciliation } from '@shared/schemas/finance';
import type { OutboundPaymentSnapshot } from '../payments/reader';
import type { CounterRecord } from './reconcile-counter';
import { MOVED_MONEY } from './reconcile-transfers';
import { cardMedium, cardsInScope, type CompareInput, type Difference } from './reconciliation-compare';

const AGAINST: Record<Medium, MediumReconciliation['against']> = {
  cash: 'counter-register',
  cheque: 'counter-register',
  'bank-transfer': 'provider-transfers',
  'prepaid-card': 'provider-cards',
  'travel-credit': 'outstanding-credits',
};

export interface SummaryInput {
  rows: readonly { medium: Medium }[];
  cardInput: CompareInput;
  /** The outbound payments of the stations compared. */
  transfers: readonly OutboundPaymentSnapshot[];
  records: readonly CounterRecord[];
  differences: readonly Difference[];
}

class Sums {
  private readonly byCurrency = new Map<string, number>();
  add(currency: string, amountMinor: number) {
    if (amountMinor) this.byCurrency.set(currency, (this.byCurrency.get(currency) ?? 0) + amountMinor);
  }
  list() {
    return [...this.byCurrency].sort(([a], [b]) => a.localeCompare(b)).map(([currency, amountMinor]) => ({ currency, amountMinor }));
  }
}

export function summariseByMedium(input: SummaryInput): MediumReconciliation[] {
  const lines = new Map(MEDIA.map((m) => [m, { ledgerRows: 0, otherSide: 0, differences: 0, paid: new Sums(), outstanding: new Sums() }]));
  for (const r of input.rows) lines.get(r.medium)!.ledgerRows += 1;
  for (const d of input.differences) lines.get(d.medium)!.differences += 1;
  for (const card of cardsInScope(input.cardInput)) {
    const line = lines.get(cardMedium(card))!;
    const spent = input.cardInput.spentByCard.get(card.id) ?? 0;
    line.otherSide += 1;
    line.paid.add(card.currency, spent);
    if (card.status !== 'canceled' && card.limitMinor !== null) line.outstanding.add(card.currency, Math.max(0, card.limitMinor - spent));
  }
  for (const p of input.transfers) {
    const line = lines.get('bank-transfer')!;
    line.otherSide += 1;
    if (MOVED_MONEY.has(p.status)) line.paid.add(p.currency, p.amountMinor);
  }
  for (const r of input.records) {
    const line = lines.get(r.medium)!;
    line.otherSide += 1;
    line.paid.add(r.currency, r.amountMinor);
  }
  return MEDIA.map((medium) => {
    const l = lines.get(medium)!;
    return { medium, against: AGAINST[medium], ledgerRows: l.ledgerRows, otherSide: l.otherSide, differences: l.differences, paid: l.paid.list(), outstanding: l.outstanding.list() };
  });
}
