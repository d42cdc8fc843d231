// The currencies a bank transfer can be paid in. Transfers go out as Stripe Treasury OutboundPayments, and Treasury
// financial accounts hold and move US dollars only (Stripe Treasury docs, "Financial accounts", from memory); the
// local stand-in refuses any other currency the same way. A compensation owed in EUR, GBP or CAD is paid by another
// medium the rule allows (cash, cheque, or a card or credit with the passenger's agreement).
export const TRANSFER_CURRENCIES: readonly string[] = ['USD'];

/** Why a bank transfer cannot pay this currency, in words naming it; null when it can. */
export function transferCurrencyProblem(currency: string): string | null {
  if (TRANSFER_CURRENCIES.includes(currency.toUpperCase())) return null;
  return `a bank transfer pays ${TRANSFER_CURRENCIES.join(', ')} only (the provider's outbound transfers move US dollars); this compensation is owed in ${currency.toUpperCase()}: pay it by cash, cheque, or another medium the rule allows`;
}
