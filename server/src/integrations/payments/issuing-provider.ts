// Bumpboard's view of Stripe Issuing: the few calls the payments module makes, in its own terms (a card snapshot
// with the compensation it pays), over the real SDK. Every create and update carries an idempotency key the
// caller derived from its own record, so a retry after any failure can never issue twice (Stripe docs,
// "Idempotent requests").
import type Stripe from 'stripe';

export interface CardSnapshot {
  id: string;
  cardholderId: string | null;
  status: string;
  /** ISO 4217 in capitals; Stripe answers in lower case. */
  currency: string;
  /** The smallest all_time spending limit: the amount the card pays out. */
  limitMinor: number | null;
  compensationId: number | null;
  stationId: number | null;
  last4: string | null;
  expMonth: number | null;
  expYear: number | null;
  /** The metadata's form: 'voucher' for a travel credit's restricted card. */
  form?: string | null;
}

export interface TransactionSnapshot {
  id: string;
  cardId: string;
  /** Minor units spent (Stripe records a capture as a negative amount). */
  spentMinor: number;
}

export interface CardholderInput {
  name: string;
  email: string | null;
  billing: { line1: string; city: string; postal_code: string; country: string };
  metadata: Record<string, string>;
}

export interface CardInput {
  cardholderId: string;
  currency: string;
  amountMinor: number;
  /** Spending categories the card is limited to; none for a cash-equivalent card. */
  categories: string[];
  metadata: Record<string, string>;
}

export interface Page<T> {
  items: T[];
  hasMore: boolean;
  lastId: string | null;
}

export interface IssuingProvider {
  createCardholder(input: CardholderInput, idempotencyKey: string): Promise<{ id: string }>;
  createCard(input: CardInput, idempotencyKey: string): Promise<CardSnapshot>;
  cardsOfCardholder(cardholderId: string): Promise<CardSnapshot[]>;
  retrieveCard(cardId: string): Promise<CardSnapshot>;
  cancelCard(cardId: string, idempotencyKey: string): Promise<CardSnapshot>;
  listCards(startingAfter: string | null, limit: number): Promise<Page<CardSnapshot>>;
  listTransactions(startingAfter: string | null, limit: number): Promise<Page<TransactionSnapshot>>;
  /** Throws when the signature is missing, wrong or older than the tolerance. */
  verifyWebhook(rawBody: Buffer | string, signature: string | undefined): Stripe.Event;
}

/** Stripe's own default: a signed timestamp more than five minutes old is refused (docs, "Verify webhook signatures"). */
export const WEBHOOK_TOLERANCE_SECONDS = 300;

function numberOrNull(value: string | undefined): number | null {
  if (value === undefined || !/^\d+$/.test(value)) return null;
  return Number(value);
}

export function snapshotOf(card: Stripe.Issuing.Card): CardSnapshot {
  const limits = (card.spending_controls?.spending_limits ?? []).filter((l) => l.interval === 'all_time').map((l) => l.amount);
  const holder = card.cardholder as Stripe.Issuing.Cardholder | string | null;
  return {
    id: card.id,
    cardholderId: typeof holder === 'string' ? holder : (holder?.id ?? null),
    status: card.status,
    currency: card.currency.toUpperCase(),
    limitMinor: limits.length ? Math.min(...limits) : null,
    compensationId: numberOrNull(card.metadata?.compensationId),
    stationId: numberOrNull(card.metadata?.stationId),
    last4: card.last4 ?? null,
    expMonth: card.exp_month ?? null,
    expYear: card.exp_year ?? null,
    form: card.metadata?.form ?? null,
  };
}

export function stripeIssuingProvider(stripe: Stripe, webhookSecret: string): IssuingProvider {
  return {
    async createCardholder(input, idempotencyKey) {
      const holder = await stripe.issuing.cardholders.create(
        { name: input.name, type: 'individual', status: 'active', billing: { address: input.billing }, ...(input.email ? { email: input.email } : {}), metadata: input.metadata },
        { idempotencyKey },
      );
      return { id: holder.id };
    },
    async createCard(input, idempotencyKey) {
      const limit: Stripe.Issuing.CardCreateParams.SpendingControls.SpendingLimit = { amount: input.amountMinor, interval: 'all_time' };
      if (input.categories.length) limit.categories = input.categories as Stripe.Issuing.CardCreateParams.SpendingControls.SpendingLimit.Category[];
      const card = await stripe.issuing.cards.create(
        { cardholder: input.cardholderId, currency: input.currency.toLowerCase(), type: 'virtual', status: 'active', spending_controls: { spending_limits: [limit] }, metadata: input.metadata },
        { idempotencyKey },
      );
      return snapshotOf(card);
    },
    async cardsOfCardholder(cardholderId) {
      const page = await stripe.issuing.cards.list({ cardholder: cardholderId, limit: 100 });
      return page.data.map(snapshotOf);
    },
    async retrieveCard(cardId) {
      return snapshotOf(await stripe.issuing.cards.retrieve(cardId));
    },
    async cancelCard(cardId, idempotencyKey) {
      return snapshotOf(await stripe.issuing.cards.update(cardId, { status: 'canceled' }, { idempotencyKey }));
    },
    async listCards(startingAfter, limit) {
      const page = await stripe.issuing.cards.list({ limit, ...(startingAfter ? { starting_after: startingAfter } : {}) });
      return { items: page.data.map(snapshotOf), hasMore: page.has_more, lastId: page.data.at(-1)?.id ?? null };
    },
    async listTransactions(startingAfter, limit) {
      const page = await stripe.issuing.transactions.list({ limit, ...(startingAfter ? { starting_after: startingAfter } : {}) });
      const items = page.data.map((t) => ({ id: t.id, cardId: typeof t.card === 'string' ? t.card : t.card.id, spentMinor: -t.amount }));
      return { items, hasMore: page.has_more, lastId: page.data.at(-1)?.id ?? null };
    },
    verifyWebhook(rawBody, signature) {
      if (!signature) throw new Error('No Stripe-Signature header.');
      return stripe.webhooks.constructEvent(rawBody, signature, webhookSecret, WEBHOOK_TOLERANCE_SECONDS);
    },
  };
}
