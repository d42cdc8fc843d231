// Text a person typed ("275,50", "1.234,50 €", "$1,075") to integer minor units, read one way by locale and currency.
// The locale's decimal separator is the only decimal mark; grouping marks are accepted only between groups of three
// digits (or the locale's own pattern, as en-IN's 12,34,567); anything that could be read two ways is refused.
import { currencyExponent, currencyProblem } from './currency';
import { exampleAmount, formatMoney } from './format';
import { numberSymbols, plainSeparator } from './symbols';

/** The most any single amount may be, in minor units (USD 10 million, JPY 1 billion): beyond it is a typing slip. */
export const MAX_AMOUNT_MINOR = 1_000_000_000;

export type MoneyParse = { ok: true; minor: number } | { ok: false; rule: string; message: string };

export interface MoneyParseOptions {
  locale: string;
  currency: string;
  /** The field's label, named in every message ("Custom amount must not be negative"). */
  field: string;
  /** Zero is refused unless allowed (a passenger's ask of 0 means nothing). */
  allowZero?: boolean;
  maxMinor?: number;
}

const quote = (s: string) => (s === ' ' ? 'a space' : `"${s}"`);

export function parseMoney(text: string, options: MoneyParseOptions): MoneyParse {
  const { locale, currency, field, allowZero = true, maxMinor = MAX_AMOUNT_MINOR } = options;
  const fail = (rule: string): MoneyParse => ({ ok: false, rule, message: `${field} ${rule}` });
  const problem = currencyProblem(currency);
  if (problem !== null) return fail(`cannot be read: ${problem}`);
  const exponent = currencyExponent(currency);
  const sym = numberSymbols(locale, currency);
  const example = exampleAmount(sym.locale, currency);

  // Direction marks (ar-EG) carry no meaning; the locale's own digits are read as 0–9.
  let s = text.replace(/\p{Cf}/gu, '').trim();
  s = Array.from(s, (ch) => { const d = sym.digits.indexOf(ch); return d >= 0 ? String(d) : ch; }).join('');
  if (s === '') return fail('is required');
  s = stripCurrency(s, sym.currencySigns);
  if (/^[-\u2212]|[-\u2212]$/u.test(s)) return fail('must not be negative');

  const decimal = plainSeparator(sym.decimal);
  const group = plainSeparator(sym.group);
  const chars = Array.from(s, plainSeparator);
  for (const ch of chars) {
    if (/\d/.test(ch) || ch === decimal || ch === group || ch === ' ') continue;
    if ('.,\'·'.includes(ch)) {
      return fail(`is ambiguous: in ${sym.locale} decimals follow ${quote(decimal)} and thousands are separated by ${quote(group)} (${example})`);
    }
    return fail(`must be a number, such as ${example}`);
  }
  const plain = chars.join('');
  const pieces = plain.split(decimal);
  if (pieces.length > 2) return fail(`has more than one decimal mark ${quote(decimal)} (${example})`);
  const [integer, fraction = ''] = pieces;
  if (pieces.length === 2 && !/^\d+$/.test(fraction)) {
    return fail(`is ambiguous: only digits may follow the decimal mark ${quote(decimal)} in ${sym.locale} (${example})`);
  }
  const grouped = readGroups(integer, sym.primaryGroup, sym.secondaryGroup);
  if (grouped === null) {
    const marks = [...new Set(integer.replace(/\d/g, ''))];
    const mark = marks.length === 1 ? marks[0] : group;
    const decimalsHint = exponent === 0 ? `${currency} has no decimals` : `decimals follow ${quote(decimal)}`;
    return fail(`is ambiguous: in ${sym.locale} ${quote(mark)} separates groups of three digits (${example}); ${decimalsHint}`);
  }
  if (grouped === '' && fraction === '') return fail(`must be a number, such as ${example}`);
  if (fraction.length > exponent) {
    return fail(exponent === 0 ? `must be a whole amount: ${currency} has no decimals` : `has at most ${exponent} decimals in ${currency}`);
  }
  const digits = `${grouped || '0'}${fraction.padEnd(exponent, '0')}`.replace(/^0+(?=\d)/, '');
  if (digits.length > 15 || Number(digits) > maxMinor) return fail(`must be at most ${formatMoney(maxMinor, currency, sym.locale)}`);
  const minor = Number(digits);
  if (minor === 0 && !allowZero) return fail('must be above zero');
  return { ok: true, minor };
}

function stripCurrency(s: string, signs: string[]): string {
  const upper = s.toUpperCase();
  for (const sign of signs) {
    if (upper.startsWith(sign.toUpperCase())) return s.slice(sign.length).trim();
    if (upper.endsWith(sign.toUpperCase())) return s.slice(0, s.length - sign.length).trim();
  }
  return s;
}

/** The integer digits without their group marks, or null when the marks are not in groups of three (or the locale's). */
function readGroups(integer: string, primary: number, secondary: number): string | null {
  const marks = new Set(integer.replace(/\d/g, ''));
  if (marks.size === 0) return integer;
  if (marks.size > 1) return null;
  const groups = integer.split([...marks][0]);
  const [first, ...rest] = groups;
  if (first.length === 0 || rest.length === 0) return null;
  const last = rest.at(-1)!;
  const middle = rest.slice(0, -1);
  const western = first.length <= 3 && rest.every((g) => g.length === 3);
  const local = last.length === primary && first.length <= secondary && middle.every((g) => g.length === secondary);
  return western || local ? groups.join('') : null;
}
