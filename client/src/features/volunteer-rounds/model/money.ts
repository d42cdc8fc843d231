// Amounts typed by people ("600", "$1,200.50") to integer minor units and back, with the currency's own decimals.

/** Decimals of a currency as Intl knows them (ISO 4217 minor units): USD 2, JPY 0. */
export function minorDigits(currency: string) {
  return new Intl.NumberFormat('en-US', { style: 'currency', currency }).resolvedOptions().maximumFractionDigits ?? 2;
}

export type MoneyParse = { ok: true; minor: number } | { ok: false; rule: string };

/** Reads an amount in major units; the currency sign, spaces and thousands commas are ignored. */
export function parseMoney(text: string, currency: string): MoneyParse {
  const digits = minorDigits(currency);
  // A leading currency sign or code ("$", "US$", "CAD") is allowed; anything else must be digits.
  const cleaned = text.replace(/[\s,]/g, '').replace(new RegExp(`^(?:${currency}|[A-Za-z]{0,2}\\p{Sc})`, 'iu'), '');
  if (cleaned === '') return { ok: false, rule: 'enter an amount' };
  const match = /^(\d{1,9})(?:\.(\d*))?$/.exec(cleaned);
  if (!match) return { ok: false, rule: 'must be an amount such as 600 or 600.50' };
  const fraction = match[2] ?? '';
  if (fraction.length > digits) return { ok: false, rule: digits === 0 ? `${currency} has no decimals` : `at most ${digits} decimals` };
  // Whole and fraction are joined as text, so no floating-point rounding touches the amount.
  return { ok: true, minor: Number(match[1] + fraction.padEnd(digits, '0')) };
}

/** An amount as a person would type it back: "600" for whole amounts, "600.50" otherwise. */
export function moneyInput(minor: number, currency: string) {
  const digits = minorDigits(currency);
  if (digits === 0) return String(minor);
  const whole = Math.floor(minor / 10 ** digits);
  const fraction = minor % 10 ** digits;
  return fraction === 0 ? String(whole) : `${whole}.${String(fraction).padStart(digits, '0')}`;
}
