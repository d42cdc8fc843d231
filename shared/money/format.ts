// Integer minor units to text, by locale and currency, exactly (no floating-point division on the way).
import { currencyExponent, currencyProblem } from './currency';
import { numberSymbols } from './symbols';

/** 27550, exponent 2 -> "275.50": a plain decimal string Intl formats without rounding. */
export function minorToDecimalString(minor: number, exponent: number): string {
  const sign = minor < 0 ? '-' : '';
  const digits = Math.abs(Math.trunc(minor)).toString().padStart(exponent + 1, '0');
  if (exponent === 0) return `${sign}${digits}`;
  return `${sign}${digits.slice(0, -exponent)}.${digits.slice(-exponent)}`;
}

/** "€275.50" in en-US, "275,50 €" in de-DE; every decimal of the minor unit is shown. */
export function formatMoney(minor: number, currency: string, locale = 'en-US'): string {
  // An amount already stored in a currency this runtime cannot read is still shown, plainly, never as a guess.
  if (currencyProblem(currency) !== null) return `${currency} ${minor} (minor units)`;
  const exponent = currencyExponent(currency);
  const nf = new Intl.NumberFormat(locale, { style: 'currency', currency, minimumFractionDigits: exponent, maximumFractionDigits: exponent });
  // Intl formats a decimal string exactly (ES2023 Intl.NumberFormat v3), so 9007199254740991 cents stay exact.
  return nf.format(minorToDecimalString(minor, exponent) as Intl.StringNumericLiteral);
}

/** The amount as a person would type it back in this locale: "275,50" in de-DE, "600" when whole (or "600.00"). */
export function moneyInputText(minor: number, currency: string, locale = 'en-US', options: { keepDecimals?: boolean } = {}): string {
  const exponent = currencyExponent(currency);
  const text = minorToDecimalString(minor, exponent);
  if (exponent === 0) return text;
  const [whole, fraction] = text.split('.');
  if (/^0+$/.test(fraction) && !options.keepDecimals) return whole;
  return `${whole}${numberSymbols(locale, currency).decimal}${fraction}`;
}

/** A worked example for messages: "1.234,50" in de-DE, "1,234.50" in en-US, "1,234" for JPY. */
export function exampleAmount(locale: string, currency: string): string {
  const exponent = currencyExponent(currency);
  return new Intl.NumberFormat(locale, { minimumFractionDigits: exponent, maximumFractionDigits: exponent }).format(exponent === 0 ? 1234 : 1234.5);
}
