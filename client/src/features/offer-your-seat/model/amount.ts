// What a passenger types as "the least I would accept" ("$450", "450.00") to integer minor units.

export function currencyDecimals(currency: string) {
  return new Intl.NumberFormat('en-US', { style: 'currency', currency }).resolvedOptions().maximumFractionDigits ?? 2;
}

/** The amount in minor units, or a plain-words reason it cannot be read. */
export function readAmount(text: string, currency: string): { ok: true; minor: number } | { ok: false; reason: string } {
  const digits = currencyDecimals(currency);
  // A leading currency sign or code ("$", "US$", "CAD") is allowed; anything else must be digits.
  const cleaned = text.replace(/[\s,]/g, '').replace(new RegExp(`^(?:${currency}|[A-Za-z]{0,2}\\p{Sc})`, 'iu'), '');
  if (cleaned === '') return { ok: false, reason: 'Please enter an amount.' };
  const m = /^(\d{1,7})(?:\.(\d*))?$/.exec(cleaned);
  if (!m) return { ok: false, reason: 'Please enter an amount in numbers, like 450.' };
  const fraction = m[2] ?? '';
  if (fraction.length > digits) return { ok: false, reason: digits === 0 ? 'Please enter a whole amount, without cents.' : `Please use at most ${digits} digits after the point.` };
  const minor = Number(m[1] + fraction.padEnd(digits, '0'));
  if (minor === 0) return { ok: false, reason: 'Please enter an amount above zero.' };
  return { ok: true, minor };
}
