// How a locale writes numbers and a currency, read from Intl.NumberFormat's formatToParts rather than a hand list.

export interface NumberSymbols {
  locale: string;
  decimal: string;
  group: string;
  /** Digits in a group next to the decimal (3), and in the groups before it (3, or 2 in en-IN). */
  primaryGroup: number;
  secondaryGroup: number;
  /** The locale's digits 0–9 (ASCII for most, Arabic-Indic for ar-EG…). */
  digits: string[];
  /** Ways the currency may be written around an amount: symbol, narrow symbol, code. */
  currencySigns: string[];
}

const cache = new Map<string, NumberSymbols>();

function partsOf(locale: string, options: Intl.NumberFormatOptions, value: number) {
  return new Intl.NumberFormat(locale, options).formatToParts(value);
}

export function numberSymbols(locale: string, currency: string): NumberSymbols {
  const key = `${locale}|${currency}`;
  const hit = cache.get(key);
  if (hit) return hit;
  const resolved = new Intl.NumberFormat(locale).resolvedOptions().locale;
  const parts = partsOf(resolved, { style: 'currency', currency, minimumFractionDigits: 2 }, 1234567890.5);
  const groups = parts.filter((p) => p.type === 'integer').map((p) => p.value.length);
  const nf = new Intl.NumberFormat(resolved, { useGrouping: false });
  const signs = new Set<string>();
  for (const loc of [resolved, 'en', 'en-CA', 'en-AU']) {
    for (const currencyDisplay of ['symbol', 'narrowSymbol', 'code'] as const) {
      const sign = partsOf(loc, { style: 'currency', currency, currencyDisplay }, 1).find((p) => p.type === 'currency')?.value;
      if (sign) signs.add(sign);
    }
  }
  const symbols: NumberSymbols = {
    locale: resolved,
    decimal: parts.find((p) => p.type === 'decimal')?.value ?? '.',
    group: parts.find((p) => p.type === 'group')?.value ?? ',',
    primaryGroup: groups.at(-1) ?? 3,
    secondaryGroup: groups.length > 2 ? groups.at(-2)! : (groups.at(-1) ?? 3),
    digits: Array.from({ length: 10 }, (_, i) => nf.format(i)),
    // Longest first, so "US$" is removed whole before "$" is tried.
    currencySigns: [...signs].sort((a, b) => b.length - a.length),
  };
  cache.set(key, symbols);
  return symbols;
}

/** A separator as people type it: every kind of space is a space, a typographic apostrophe is an apostrophe. */
export function plainSeparator(ch: string): string {
  if (/^\s$/u.test(ch)) return ' ';
  if (ch === '\u2019' || ch === '\u02BC') return "'";
  return ch;
}
