import { describe, expect, it } from 'vitest';
import { escapeHtml, formatDuration, formatLocalDateTime, formatMoneyMinor, joinNames } from './format';

// Intl puts a no-break space between the currency code and the amount, which keeps them on one line.
const NBSP = '\u00a0';

describe('formatMoneyMinor', () => {
  it('places the decimal point by the ISO 4217 minor unit of the currency', () => {
    // ISO 4217: USD and EUR have 2 decimals, JPY 0, KWD 3 (from memory)
    expect(formatMoneyMinor('amount', { amountMinor: 60_000, currency: 'USD' })).toBe(`USD${NBSP}600.00`);
    expect(formatMoneyMinor('amount', { amountMinor: 123_456_789, currency: 'EUR' })).toBe(`EUR${NBSP}1,234,567.89`);
    expect(formatMoneyMinor('amount', { amountMinor: 12_000, currency: 'JPY' })).toBe(`JPY${NBSP}12,000`);
    expect(formatMoneyMinor('amount', { amountMinor: 1_234, currency: 'KWD' })).toBe(`KWD${NBSP}1.234`);
    expect(formatMoneyMinor('amount', { amountMinor: 5, currency: 'CAD' })).toBe(`CAD${NBSP}0.05`);
    // Derived: 2^53 - 1 cents printed exactly (division by 100 in floating point is not exact this far out).
    expect(formatMoneyMinor('amount', { amountMinor: 9_007_199_254_740_991, currency: 'USD' })).toBe(`USD${NBSP}90,071,992,547,409.91`);
  });

  it('refuses amounts that are not whole minor units, and malformed currency codes, naming the field', () => {
    expect(() => formatMoneyMinor('agreedTotal', { amountMinor: 12.5, currency: 'USD' })).toThrow(/agreedTotal\.amountMinor/);
    expect(() => formatMoneyMinor('agreedTotal', { amountMinor: -1, currency: 'USD' })).toThrow(/agreedTotal\.amountMinor/);
    expect(() => formatMoneyMinor('agreedTotal', { amountMinor: 100, currency: 'usd' })).toThrow(/agreedTotal\.currency/);
  });
});

describe('formatLocalDateTime', () => {
  it('shows wall-clock time in the zone, naming the zone and its offset', () => {
    // IANA tz database: New York keeps UTC-4 in June (EDT), Kolkata UTC+5:30 all year
    expect(formatLocalDateTime('at', new Date('2026-06-02T11:35:00Z'), 'America/New_York')).toBe('Tue 2 Jun 2026, 07:35 (America/New_York, GMT-04:00)');
    expect(formatLocalDateTime('at', new Date('2026-06-02T11:35:00Z'), 'Asia/Kolkata')).toBe('Tue 2 Jun 2026, 17:05 (Asia/Kolkata, GMT+05:30)');
    expect(formatLocalDateTime('at', new Date('2026-01-02T11:35:00Z'), 'Europe/London')).toBe('Fri 2 Jan 2026, 11:35 (Europe/London, GMT+00:00)');
  });

  it('follows the US change to daylight time on the second Sunday of March at 02:00 (15 U.S.C. 260a, from memory)', () => {
    // 8 March 2026 is the second Sunday; derived: 06:30Z is 01:30 EST, 07:30Z is 03:30 EDT
    expect(formatLocalDateTime('at', new Date('2026-03-08T06:30:00Z'), 'America/New_York')).toBe('Sun 8 Mar 2026, 01:30 (America/New_York, GMT-05:00)');
    expect(formatLocalDateTime('at', new Date('2026-03-08T07:30:00Z'), 'America/New_York')).toBe('Sun 8 Mar 2026, 03:30 (America/New_York, GMT-04:00)');
  });

  it('tells the repeated hour apart when EU summer time ends, 01:00 UTC on the last Sunday of October (Directive 2000/84/EC, from memory)', () => {
    // 25 October 2026 is the last Sunday; derived: both instants read 02:30 in Rome, only the offset differs
    expect(formatLocalDateTime('at', new Date('2026-10-25T00:30:00Z'), 'Europe/Rome')).toBe('Sun 25 Oct 2026, 02:30 (Europe/Rome, GMT+02:00)');
    expect(formatLocalDateTime('at', new Date('2026-10-25T01:30:00Z'), 'Europe/Rome')).toBe('Sun 25 Oct 2026, 02:30 (Europe/Rome, GMT+01:00)');
  });

  it('refuses an unknown zone or an invalid date, naming the field', () => {
    expect(() => formatLocalDateTime('departure', new Date(), 'Mars/Olympus')).toThrow(/departure time zone/);
    expect(() => formatLocalDateTime('departure', new Date('nonsense'), 'UTC')).toThrow(/departure: expected a valid date/);
  });
});

describe('escapeHtml', () => {
  it('escapes the five characters that matter in element content and quoted attributes (OWASP XSS Prevention Cheat Sheet, rule 1, from memory)', () => {
    expect(escapeHtml(`<img src="x" onerror='alert(1)'> & co`)).toBe('&lt;img src=&quot;x&quot; onerror=&#39;alert(1)&#39;&gt; &amp; co');
  });
});

describe('words', () => {
  it('formats durations in hours and minutes', () => {
    expect([formatDuration(200), formatDuration(60), formatDuration(1), formatDuration(-45)]).toEqual(['3 hours 20 minutes', '1 hour', '1 minute', '45 minutes']);
  });

  it('joins names the way a letter addresses people, and refuses blanks', () => {
    expect(joinNames('names', ['Ada Lovelace'])).toBe('Ada Lovelace');
    expect(joinNames('names', ['A', 'B', 'C'])).toBe('A, B and C');
    expect(() => joinNames('passengerNames', [])).toThrow(/passengerNames/);
    expect(() => joinNames('passengerNames', ['A', ' '])).toThrow(/passengerNames/);
  });
});
