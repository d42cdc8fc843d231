// Money is always integer minor units with an ISO 4217 code; these helpers validate and print it.
import { currencyExponent } from '../money';

export interface Money {
  amountMinor: number;
  currency: string;
}

const CURRENCY_FORMAT = /^[A-Z]{3}$/;

/** Decimals of the currency's minor unit: the one shared money module decides (Intl, held against ISO 4217). */
export function minorUnitExponent(currency: string): number {
  return currencyExponent(currency);
}

export function assertCurrency(field: string, currency: unknown): asserts currency is string {
  if (typeof currency !== 'string' || !CURRENCY_FORMAT.test(currency)) {
    throw new RangeError(`${field}: expected an ISO 4217 code of three capital letters, got ${JSON.stringify(currency)}`);
  }
}

export function assertMinorAmount(field: string, amount: unknown): asserts amount is number {
  if (typeof amount !== 'number' || !Number.isSafeInteger(amount) || amount < 0) {
    throw new RangeError(`${field}: expected a non-negative integer amount in minor units, got ${JSON.stringify(amount)}`);
  }
}

export function assertMoney(field: string, money: unknown): asserts money is Money {
  if (typeof money !== 'object' || money === null) {
    throw new RangeError(`${field}: expected { amountMinor, currency }`);
  }
  const candidate = money as Partial<Money>;
  assertMinorAmount(`${field}.amountMinor`, candidate.amountMinor);
  assertCurrency(`${field}.currency`, candidate.currency);
}

/** "USD 1,075.00": fixed format so statements read the same on every runtime and locale. */
export function formatMoney(amountMinor: number, currency: string): string {
  const exponent = minorUnitExponent(currency);
  const negative = amountMinor < 0;
  const digits = Math.abs(amountMinor).toString().padStart(exponent + 1, '0');
  const whole = digits.slice(0, digits.length - exponent) || '0';
  const fraction = exponent > 0 ? `.${digits.slice(digits.length - exponent)}` : '';
  const grouped = groupThousands(whole);
  return `${negative ? '-' : ''}${currency} ${grouped}${fraction}`;
}

/** "1500" -> "1,500" without depending on the runtime's locale data. */
export function groupThousands(digits: string | number): string {
  return String(digits).replace(/\B(?=(\d{3})+(?!\d))/g, ',');
}
