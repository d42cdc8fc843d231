// Comparing the ledger's card media (prepaid cards, and travel credits issued as restricted cards) with the
// provider's cards, by the compensation id each card carries in its metadata. Bank transfers, counter payments and
// their own records are compared elsewhere, each with its own. Pure: the run gathers both sides, this says where
// they disagree.
import type { Medium } from '@shared/compensation/media';
import type { DifferenceKind } from '@shared/schemas/finance';
import type { CardSnapshot } from '../payments/reader';
import { moneyText } from './scope';

export interface LedgerEntry {
  id: number;
  stationId: number;
  state: string;
  /** What the provider's card should hold: the compensation's amount, or a travel credit's value. */
  amountMinor: number;
  currency: string;
  providerCardId: string | null;
  /** The card medium of the row; a prepaid card when not given. */
  medium?: Medium;
}

export interface Difference {
  kind: DifferenceKind;
  medium: Medium;
  compensationId: number | null;
  cardId: string | null;
  ledgerValue: string | null;
  providerValue: string | null;
}

export interface CompareInput {
  /** Every compensation of the stations compared. */
  ledger: readonly LedgerEntry[];
  /** Every card the provider listed. */
  cards: readonly CardSnapshot[];
  /** Minor units spent per card id. */
  spentByCard: ReadonlyMap<string, number>;
  stationIds: ReadonlySet<number>;
  /** Compensation ids named by cards that exist in the ledger for other stations: not this run's business. */
  elsewhere: ReadonlySet<number>;
}

/** The card's state in the ledger's words: canceled is voided, a card spent on is settled, else issued. */
export function providerState(card: CardSnapshot, spentMinor: number): 'voided' | 'settled' | 'issued' {
  if (card.status === 'canceled') return 'voided';
  return spentMinor > 0 ? 'settled' : 'issued';
}

/** States in which the ledger says a card exists. */
const EXPECTS_CARD = new Set(['issued', 'settled']);

function inScope(card: CardSnapshot, ledgerIds: ReadonlySet<number>, input: CompareInput): boolean {
  if (card.compensationId !== null && ledgerIds.has(card.compensationId)) return true;
  if (card.compensationId !== null && input.elsewhere.has(card.compensationId)) return false;
  return card.stationId !== null && input.stationIds.has(card.stationId);
}

/** A card the ledger does not know is a travel credit when its metadata says it was issued as a voucher. */
export function cardMedium(card: Pick<CardSnapshot, 'form'>): Medium {
  return card.form === 'voucher' ? 'travel-credit' : 'prepaid-card';
}

/** The provider's cards that belong to the stations compared. */
export function cardsInScope(input: CompareInput): CardSnapshot[] {
  const ledgerIds = new Set(input.ledger.map((l) => l.id));
  return input.cards.filter((c) => inScope(c, ledgerIds, input));
}

export function compareLedgerWithProvider(input: CompareInput): Difference[] {
  const ledgerById = new Map(input.ledger.map((l) => [l.id, l]));
  const ledgerIds = new Set(ledgerById.keys());
  const cardsByCompensation = new Map<number, CardSnapshot[]>();
  const out: Difference[] = [];

  for (const card of input.cards) {
    if (!inScope(card, ledgerIds, input)) continue;
    const entry = card.compensationId === null ? undefined : ledgerById.get(card.compensationId);
    if (!entry) {
      out.push({ kind: 'missing-in-ledger', medium: cardMedium(card), compensationId: card.compensationId, cardId: card.id, ledgerValue: null, providerValue: `${card.status}, ${card.limitMinor === null ? 'no limit' : moneyText(card.limitMinor, card.currency)}` });
      continue;
    }
    cardsByCompensation.set(entry.id, [...(cardsByCompensation.get(entry.id) ?? []), card]);
  }

  for (const entry of input.ledger) {
    const medium = entry.medium ?? 'prepaid-card';
    const cards = cardsByCompensation.get(entry.id) ?? [];
    if (!cards.length) {
      if (EXPECTS_CARD.has(entry.state) || ((entry.state === 'voided' || entry.state === 'canceled') && entry.providerCardId)) {
        out.push({ kind: 'missing-at-provider', medium, compensationId: entry.id, cardId: entry.providerCardId, ledgerValue: `${entry.state}, ${moneyText(entry.amountMinor, entry.currency)}`, providerValue: null });
      }
      continue;
    }
    const named = cards.find((c) => c.id === entry.providerCardId);
    const primary = named ?? cards.find((c) => c.status !== 'canceled') ?? cards[0];
    for (const extra of cards) {
      // A canceled card beside the one the ledger names is an earlier attempt a re-issue replaced, not a second payment.
      if (extra !== primary && extra.status !== 'canceled') out.push({ kind: 'duplicate-at-provider', medium, compensationId: entry.id, cardId: extra.id, ledgerValue: entry.providerCardId, providerValue: `${extra.id} (${extra.status})` });
    }
    const spentEarlier = cards.filter((c) => c !== primary).reduce((sum, c) => sum + (input.spentByCard.get(c.id) ?? 0), 0);
    const expectedLimit = entry.amountMinor - spentEarlier;
    if (entry.providerCardId !== primary.id) {
      out.push({ kind: 'card-differs', medium, compensationId: entry.id, cardId: primary.id, ledgerValue: entry.providerCardId ?? 'no card', providerValue: primary.id });
    }
    if (primary.limitMinor !== expectedLimit) {
      out.push({ kind: 'amount-differs', medium, compensationId: entry.id, cardId: primary.id, ledgerValue: moneyText(expectedLimit, entry.currency), providerValue: primary.limitMinor === null ? 'no all_time limit' : moneyText(primary.limitMinor, primary.currency) });
    }
    if (primary.currency !== entry.currency) {
      out.push({ kind: 'currency-differs', medium, compensationId: entry.id, cardId: primary.id, ledgerValue: entry.currency, providerValue: primary.currency });
    }
    const atProvider = providerState(primary, input.spentByCard.get(primary.id) ?? 0);
    // Voided by finance or canceled by the provider: either way the provider's card is canceled.
    const ledgerState = entry.state === 'canceled' ? 'voided' : entry.state;
    if (atProvider !== ledgerState) {
      out.push({ kind: 'state-differs', medium, compensationId: entry.id, cardId: primary.id, ledgerValue: entry.state, providerValue: atProvider });
    }
  }
  return out;
}
