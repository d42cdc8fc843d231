// Formatting for notices: money from integer minor units, instants in a named zone, HTML escaping.
import { assertMoney, minorUnitExponent } from '@shared/compensation/money';
import { minorToDecimalString } from '@shared/money';

/** Notices are written in English; one locale keeps the wording and number format the same on every server. */
export const NOTICE_LOCALE = 'en-GB';

const HTML_ESCAPES: Record<string, string> = { '&': '&amp;', '<': '&lt;', '>': '&gt;', '"': '&quot;', "'": '&#39;' };

/** Escapes text for an HTML element or a quoted attribute value. */
export function escapeHtml(text: string): string {
  return text.replace(/[&<>"']/g, (c) => HTML_ESCAPES[c]);
}

/**
 * "USD 600.00": the ISO code rather than a symbol, since "$" alone does not say which dollar. The number of
 * decimals is the currency's ISO 4217 minor unit, so amounts are shown exactly as they are stored.
 */
export function formatMoneyMinor(field: string, money: { amountMinor: number; currency: string }): string {
  assertMoney(field, money);
  const exponent = minorUnitExponent(money.currency);
  return new Intl.NumberFormat(NOTICE_LOCALE, {
    style: 'currency',
    currency: money.currency,
    currencyDisplay: 'code',
    minimumFractionDigits: exponent,
    maximumFractionDigits: exponent,
    // A decimal string is formatted exactly; dividing by 10^exponent in floating point is not.
  }).format(minorToDecimalString(money.amountMinor, exponent) as Intl.StringNumericLiteral);
}

export function assertTimeZone(field: string, timeZone: string): void {
  try {
    new Intl.DateTimeFormat(NOTICE_LOCALE, { timeZone });
  } catch {
    throw new RangeError(`${field}: expected an IANA time zone such as America/New_York, got ${JSON.stringify(timeZone)}`);
  }
}

export function assertInstant(field: string, at: unknown): asserts at is Date {
  if (!(at instanceof Date) || Number.isNaN(at.getTime())) throw new RangeError(`${field}: expected a valid date and time`);
}

/**
 * "Tue 2 Jun 2026, 07:35 (America/New_York, GMT-04:00)": local wall-clock time with the zone named and its
 * offset on that day, so the reader need not know whether summer time applies.
 */
export function formatLocalDateTime(field: string, at: Date, timeZone: string): string {
  assertInstant(field, at);
  assertTimeZone(`${field} time zone`, timeZone);
  const parts = new Intl.DateTimeFormat(NOTICE_LOCALE, {
    timeZone,
    weekday: 'short',
    day: 'numeric',
    month: 'short',
    year: 'numeric',
    hour: '2-digit',
    minute: '2-digit',
    hourCycle: 'h23',
    timeZoneName: 'longOffset',
  }).formatToParts(at);
  const part = (type: Intl.DateTimeFormatPartTypes) => parts.find((p) => p.type === type)?.value ?? '';
  // A zero offset comes out as plain "GMT"; spell it out so every notice reads the same way.
  const offset = part('timeZoneName') === 'GMT' ? 'GMT+00:00' : part('timeZoneName');
  return `${part('weekday')} ${part('day')} ${part('month')} ${part('year')}, ${part('hour')}:${part('minute')} (${timeZone}, ${offset})`;
}

/** "3 hours 20 minutes"; whole minutes, rounded. */
export function formatDuration(minutes: number): string {
  const total = Math.round(Math.abs(minutes));
  const h = Math.floor(total / 60);
  const m = total % 60;
  const unit = (n: number, word: string) => `${n} ${word}${n === 1 ? '' : 's'}`;
  if (h === 0) return unit(m, 'minute');
  return m === 0 ? unit(h, 'hour') : `${unit(h, 'hour')} ${unit(m, 'minute')}`;
}

/** "Ada Lovelace", "Ada Lovelace and Alan Turing", "A, B and C". */
export function joinNames(field: string, names: readonly string[]): string {
  const clean = names.map((n) => n.trim()).filter((n) => n !== '');
  if (clean.length === 0 || clean.length !== names.length) throw new RangeError(`${field}: expected at least one name, none of them blank`);
  if (clean.length === 1) return clean[0];
  return `${clean.slice(0, -1).join(', ')} and ${clean[clean.length - 1]}`;
}
