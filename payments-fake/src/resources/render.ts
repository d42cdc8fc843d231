import type { CardRecord, StoreState } from '../store/types.js';

/** Cards embed their cardholder in full, as Stripe returns `issuing.card.cardholder`. */
export function renderCard(card: CardRecord, state: StoreState) {
  // The number and security code never leave in an ordinary answer (see the card retrieve endpoint).
  const { spending_limits: spendingLimits, cardholder, number: _number, cvc: _cvc, ...rest } = card;
  void _number;
  void _cvc;
  return {
    ...rest,
    cardholder: structuredClone(state.cardholders.get(cardholder) ?? null),
    financial_account: null,
    latest_fraud_warning: null,
    lifecycle_controls: null,
    personalization_design: null,
    replaced_by: null,
    replacement_for: null,
    replacement_reason: null,
    second_line: null,
    shipping: null,
    spending_controls: renderSpendingControls(spendingLimits, card.currency),
    wallets: null,
  };
}

export function renderSpendingControls(spendingLimits: CardRecord['spending_limits'], currency: string) {
  return {
    allowed_card_presences: null,
    allowed_categories: null,
    allowed_merchant_countries: null,
    blocked_card_presences: null,
    blocked_categories: null,
    blocked_merchant_countries: null,
    spending_limits: structuredClone(spendingLimits),
    spending_limits_currency: spendingLimits.length > 0 ? currency : null,
  };
}

/** The card's `all_time` limit (the smallest if several), which is the compensation amount. */
export function allTimeLimit(card: CardRecord): number | null {
  const limits = card.spending_limits.filter((limit) => limit.interval === 'all_time').map((limit) => limit.amount);
  return limits.length > 0 ? Math.min(...limits) : null;
}

/** Captures are negative transaction amounts (money leaving the balance), so spent is their negation. */
export function spentOnCard(cardId: string, state: StoreState): number {
  let spent = 0;
  for (const transaction of state.transactions.values()) {
    if (transaction.card === cardId) spent -= transaction.amount;
  }
  return spent;
}
