// Amounts typed by agents and admins ("600", "275,50 €") to integer minor units and back, through the shared
// money module in the person's locale, so every money field of the rounds reads text the same way.
import { currencyDecimals, moneyFieldText, readMoneyField } from '../../../lib/money';

/** Decimals of a currency as Intl knows them, checked against ISO 4217: USD 2, JPY 0. */
export function minorDigits(currency: string) {
  return currencyDecimals(currency);
}

export type MoneyParse = { ok: true; minor: number } | { ok: false; rule: string };

/** Reads an amount in major units; the rule of a refusal reads after the field's name ("amount is ambiguous: …"). */
export function parseMoney(text: string, currency: string): MoneyParse {
  const r = readMoneyField(text, currency, 'amount');
  return r.ok ? r : { ok: false, rule: r.rule };
}

/** An amount as a person would type it back: "600" for whole amounts, "600.50" (or "600,50") otherwise. */
export function moneyInput(minor: number, currency: string) {
  return moneyFieldText(minor, currency);
}
