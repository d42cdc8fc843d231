// Which currencies amounts can be typed and shown in, and how many decimals each has, from the runtime's Intl data.
import { isoExponent } from './iso4217';

export class MoneyCurrencyError extends RangeError {}

const CODE = /^[A-Z]{3}$/;
const cache = new Map<string, number | string>();

function knownToIntl(currency: string): boolean {
  // supportedValuesOf lists the codes the runtime has data for; Intl.NumberFormat alone accepts any three letters.
  const list = typeof Intl.supportedValuesOf === 'function' ? Intl.supportedValuesOf('currency') : null;
  return list === null || list.includes(currency);
}

function examine(currency: string): number | string {
  if (!CODE.test(currency)) return `"${currency}" is not an ISO 4217 currency code (three capital letters)`;
  if (!knownToIntl(currency)) return `${currency} is not a currency this browser or server knows`;
  const intl = new Intl.NumberFormat('en', { style: 'currency', currency }).resolvedOptions().maximumFractionDigits ?? 2;
  const iso = isoExponent(currency);
  // CLDR gives fewer display decimals than ISO 4217 for a few currencies (HUF, IDR, COP, PKR, IQD…) and has changed
  // them between releases, so browser and server could read the same amount 100 times apart: refuse those instead.
  if (intl !== iso) return `${currency} cannot be used for amounts: this runtime's currency data gives ${intl} decimals where ISO 4217 gives ${iso}`;
  return intl;
}

/** The explanation if amounts cannot be read in this currency, or null when they can. */
export function currencyProblem(currency: string): string | null {
  if (!cache.has(currency)) cache.set(currency, examine(currency));
  const v = cache.get(currency);
  return typeof v === 'string' ? v : null;
}

/** Decimals of the currency's minor unit (USD 2, JPY 0, KWD 3), from Intl and checked against ISO 4217. */
export function currencyExponent(currency: string): number {
  if (!cache.has(currency)) cache.set(currency, examine(currency));
  const v = cache.get(currency);
  if (typeof v === 'string') throw new MoneyCurrencyError(v);
  return v as number;
}
