// Amounts are typed in major units ("189.00", "189,00") and travel as integer minor units; the shared money module
// converts at that edge, in the person's locale.
import { currencyDecimals, moneyFieldText, readMoneyField } from '../../../lib/money';

/** Decimal places of the currency's minor unit, from the runtime's Intl data held against ISO 4217. */
export function minorDigits(currency: string): number {
  return currencyDecimals(currency);
}

export type MoneyParse = { ok: true; minor: number | undefined } | { ok: false; message: string };

/** "1,075.50" in USD -> 107550. Empty text is undefined, so the schema reports the field as required. */
export function parseMoneyText(text: string, currency: string, label: string): MoneyParse {
  if (text.trim() === '') return { ok: true, minor: undefined };
  const r = readMoneyField(text, currency, label);
  return r.ok ? r : { ok: false, message: r.message };
}

/** 107550 in USD -> "1075.50" ("1075,50" in a German browser): text the field accepts back. */
export function minorToText(minor: number, currency: string): string {
  // The planner shows every decimal, so a whole amount still reads as money ("200.00"), not a count.
  return moneyFieldText(minor, currency, { keepDecimals: true });
}
