// Amounts are typed in major units ("189.00") and travel as integer minor units; these convert at that edge.

/** Decimal places of the currency's minor unit, from the runtime's ISO 4217 data (as formatMoney uses). */
export function minorDigits(currency: string): number {
  try {
    return new Intl.NumberFormat('en-US', { style: 'currency', currency }).resolvedOptions().maximumFractionDigits ?? 2;
  } catch {
    return 2;
  }
}

export type MoneyParse = { ok: true; minor: number | undefined } | { ok: false; message: string };

// Digits with optional thousands commas, then an optional decimal part; a leading minus is kept so the
// shared schema can say "must not be negative" rather than a confusing format message.
const AMOUNT = /^-?(\d{1,3}(,\d{3})+|\d+)(\.(\d+))?$/;

/** "1,075.50" in USD -> 107550. Empty text is undefined, so the schema reports the field as required. */
export function parseMoneyText(text: string, currency: string, label: string): MoneyParse {
  const trimmed = text.trim().replace(/\s/g, '');
  if (trimmed === '') return { ok: true, minor: undefined };
  const digits = minorDigits(currency);
  const match = AMOUNT.exec(trimmed);
  const example = digits === 0 ? '1890' : `189.${'0'.repeat(digits)}`;
  if (!match) return { ok: false, message: `${label} must be an amount such as ${example}` };
  const fraction = match[4] ?? '';
  if (fraction.length > digits) {
    return { ok: false, message: digits === 0 ? `${label} must be a whole amount in ${currency}` : `${label} must have at most ${digits} decimals in ${currency}` };
  }
  const negative = trimmed.startsWith('-');
  const whole = match[1].replace(/,/g, '');
  const minor = Number(whole) * 10 ** digits + Number(fraction.padEnd(digits, '0') || '0');
  if (!Number.isSafeInteger(minor)) return { ok: false, message: `${label} is too large` };
  return { ok: true, minor: negative ? -minor : minor };
}

/** 107550 in USD -> "1075.50": plain digits the field accepts back, not a display format. */
export function minorToText(minor: number, currency: string): string {
  const digits = minorDigits(currency);
  const sign = minor < 0 ? '-' : '';
  const abs = Math.abs(minor);
  if (digits === 0) return `${sign}${abs}`;
  const scale = 10 ** digits;
  return `${sign}${Math.floor(abs / scale)}.${String(abs % scale).padStart(digits, '0')}`;
}
