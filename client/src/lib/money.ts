// Money typed and shown in the browser: the shared money module with the person's own locale, read once.
import { currencyExponent, currencyProblem, formatMoney as formatWith, moneyInputText, parseMoney, type MoneyParse } from '@shared/money';

/** The browser's first language (Playwright's `locale`, the person's settings); en-US where none is given. */
export function userLocale(): string {
  const preferred = typeof navigator === 'undefined' ? undefined : (navigator.languages?.[0] ?? navigator.language);
  try {
    return preferred ? new Intl.NumberFormat(preferred).resolvedOptions().locale : 'en-US';
  } catch {
    return 'en-US';
  }
}

/** Integer minor units shown in the person's locale: "275,50 €" in a German browser. */
export function formatMoney(amountMinor: number, currency: string, locale = userLocale()): string {
  return formatWith(amountMinor, currency, locale);
}

/** What a person typed into a money field, read in their locale; a refusal names `field` and the rule. */
export function readMoneyField(text: string, currency: string, field: string, options: { allowZero?: boolean } = {}): MoneyParse {
  return parseMoney(text, { locale: userLocale(), currency, field, ...options });
}

/** An amount as the person would type it back ("275,50" in a German browser), for prefilled fields. */
export function moneyFieldText(amountMinor: number, currency: string, options: { keepDecimals?: boolean } = {}): string {
  return moneyInputText(amountMinor, currency, userLocale(), options);
}

/** Decimals of the currency's minor unit, or 2 where the currency cannot be used (the field then says why). */
export function currencyDecimals(currency: string): number {
  return currencyProblem(currency) === null ? currencyExponent(currency) : 2;
}

export { currencyProblem };
