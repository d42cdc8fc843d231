import { describe, expect, it } from 'vitest';
import { currencyExponent, currencyProblem, formatMoney, moneyInputText, parseMoney } from './index';
import { ISO_4217_EXPONENT_NOT_TWO } from './iso4217';

// Outside check: the minor-unit column of ISO 4217 list one (SIX, "Current currency & funds code list").
// Values from memory; the list itself is the source to check them against.
const ISO_4217_LIST_ONE: Record<string, number> = {
  USD: 2, EUR: 2, GBP: 2, CAD: 2, CHF: 2, INR: 2, AUD: 2, MXN: 2, BRL: 2, SEK: 2, NOK: 2, DKK: 2, PLN: 2, CZK: 2,
  TRY: 2, ZAR: 2, SGD: 2, HKD: 2, CNY: 2, TWD: 2, THB: 2, MAD: 2, EGP: 2, AED: 2, SAR: 2, NZD: 2,
  JPY: 0, KRW: 0, ISK: 0, CLP: 0, VND: 0, XOF: 0, XAF: 0, XPF: 0, UGX: 0, PYG: 0, RWF: 0, BIF: 0, DJF: 0, GNF: 0,
  KMF: 0, VUV: 0,
  BHD: 3, JOD: 3, KWD: 3, LYD: 3, OMR: 3, TND: 3,
  // Where the runtime's CLDR data shows fewer decimals than ISO 4217 lists (HUF 2, IDR 2, COP 2, PKR 2, IQD 3).
  HUF: 2, IDR: 2, COP: 2, PKR: 2, IQD: 3,
};

const read = (text: string, locale: string, currency: string) => parseMoney(text, { locale, currency, field: 'Offer' });
const minor = (text: string, locale: string, currency: string) => {
  const r = read(text, locale, currency);
  return r.ok ? r.minor : r.message;
};

describe('currency exponents, held against ISO 4217', () => {
  it.each(Object.entries(ISO_4217_LIST_ONE))('%s: ISO 4217 gives %i decimals; the module agrees or refuses the currency', (code, iso) => {
    // Never a third reading: either Intl agrees with the standard, or amounts in that currency are refused.
    if (currencyProblem(code) === null) expect(currencyExponent(code)).toBe(iso);
    else expect(() => currencyExponent(code)).toThrow(/ISO 4217 gives/);
  });

  it('reads the everyday currencies with the ISO 4217 exponent', () => {
    for (const code of ['USD', 'EUR', 'GBP', 'CAD', 'CHF', 'INR', 'JPY', 'KRW', 'ISK', 'KWD', 'BHD', 'TND']) {
      expect(currencyProblem(code), code).toBeNull();
      expect(currencyExponent(code), code).toBe(ISO_4217_LIST_ONE[code]);
    }
  });

  it('refuses HUF and IDR in this runtime, where Intl shows 0 decimals and ISO 4217 lists 2, naming the field', () => {
    expect(read('1000', 'hu-HU', 'HUF')).toMatchObject({ ok: false, message: expect.stringMatching(/^Offer cannot be read: HUF .*ISO 4217 gives 2/) });
    expect(read('150000', 'id-ID', 'IDR')).toMatchObject({ ok: false, message: expect.stringMatching(/^Offer cannot be read: IDR/) });
  });

  it('keeps the not-two exponents consistent with the test table', () => {
    for (const [code, exponent] of Object.entries(ISO_4217_EXPONENT_NOT_TWO)) {
      if (code in ISO_4217_LIST_ONE) expect(exponent, code).toBe(ISO_4217_LIST_ONE[code]);
    }
  });

  it('refuses codes that are not currencies', () => {
    expect(currencyProblem('usd')).toMatch(/three capital letters/);
    expect(currencyProblem('XYZ')).toMatch(/not a currency/);
  });
});

// Separators per locale as CLDR publishes them (de-DE "1.234,50", fr-FR "1 234,50" with a narrow no-break space,
// de-CH "1’234.50", en-IN "12,34,567.50"); the expected minor units are derived by hand from the ISO exponent.
describe('amounts typed in each locale', () => {
  it.each([
    ['en-US', 'USD', '275.50', 27_550],
    ['en-US', 'USD', '$1,075', 107_500],
    ['en-US', 'USD', '1,234,567.89', 123_456_789],
    ['en-US', 'USD', '0.29', 29],
    ['de-DE', 'EUR', '275,50', 27_550],
    ['de-DE', 'EUR', '1.234,50 €', 123_450],
    ['de-DE', 'EUR', 'EUR 400', 40_000],
    ['de-DE', 'EUR', '1.234', 123_400],
    ['fr-FR', 'EUR', '275,50', 27_550],
    ['fr-FR', 'EUR', '1 234,50', 123_450],
    ['fr-FR', 'EUR', '1\u202f234,50\u00a0€', 123_450],
    ['fr-CA', 'CAD', '1 800,00 $', 180_000],
    ['fr-CA', 'CAD', '900,5', 90_050],
    ['it-IT', 'EUR', '1.234,56', 123_456],
    ['en-IN', 'INR', '12,34,567.50', 123_456_750],
    ['en-IN', 'INR', '1,234,567.50', 123_456_750],
    ['de-CH', 'CHF', "1'234.50", 123_450],
    ['de-CH', 'CHF', '1’234.50', 123_450],
    ['en-GB', 'GBP', '£220', 22_000],
    ['ja-JP', 'JPY', '50,000', 50_000],
    ['en-US', 'KWD', '1,234.567', 1_234_567],
    ['ar-EG', 'EUR', '٢٧٥٫٥٠', 27_550],
  ])('%s %s: "%s" is %i minor units', (locale, currency, text, expected) => {
    expect(minor(text, locale, currency)).toBe(expected);
  });

  it.each([
    // The defect this module closes: a comma typed as a decimal mark must not become a thousands mark.
    ['en-US', 'USD', '275,50', /^Offer is ambiguous: in en-US "," separates groups of three digits/],
    ['de-DE', 'EUR', '275.50', /^Offer is ambiguous: in de-DE "\." separates groups of three digits .*decimals follow ","/],
    ['de-DE', 'EUR', '1.5', /^Offer is ambiguous/],
    ['fr-FR', 'EUR', '1.234,50', /^Offer is ambiguous: in fr-FR decimals follow ","/],
    ['de-CH', 'CHF', '1234,50', /^Offer is ambiguous/],
    ['en-US', 'USD', '1,2345', /^Offer is ambiguous/],
    ['en-US', 'USD', '1,234 567', /^Offer is ambiguous/],
    ['de-DE', 'EUR', '1,2,3', /^Offer has more than one decimal mark/],
    ['en-US', 'USD', '-5', /^Offer must not be negative$/],
    ['en-US', 'USD', '', /^Offer is required$/],
    ['en-US', 'USD', 'six hundred', /^Offer must be a number, such as 1,234\.50$/],
    ['en-US', 'USD', '1.234', /^Offer has at most 2 decimals in USD$/],
    ['en-US', 'JPY', '10.5', /^Offer must be a whole amount: JPY has no decimals$/],
    ['en-US', 'USD', '99999999999', /^Offer must be at most \$10,000,000\.00$/],
    ['en-US', 'USD', '€250', /^Offer must be a number/],
  ])('%s %s: "%s" is refused', (locale, currency, text, message) => {
    expect(minor(text, locale, currency)).toMatch(message);
  });

  it('refuses zero where an amount above zero is needed', () => {
    expect(parseMoney('0', { locale: 'en-US', currency: 'USD', field: 'Your ask', allowZero: false })).toMatchObject({ ok: false, message: 'Your ask must be above zero' });
  });
});

describe('amounts shown and written back', () => {
  it('formats exactly, with every decimal of the minor unit', () => {
    expect(formatMoney(27_550, 'EUR', 'de-DE')).toBe('275,50\u00a0€');
    expect(formatMoney(107_500, 'USD', 'en-US')).toBe('$1,075.00');
    expect(formatMoney(5_000, 'JPY', 'en-US')).toBe('¥5,000');
    expect(formatMoney(1_234, 'KWD', 'en-US')).toMatch(/1\.234$/);
    // Derived: 2^53 - 1 cents; dividing by 100 in floating point would print …409.91 only by luck.
    expect(formatMoney(9_007_199_254_740_991, 'USD', 'en-US')).toBe('$90,071,992,547,409.91');
  });

  it('writes an amount back the way the locale types it, and reads it back the same', () => {
    for (const [locale, currency] of [['en-US', 'USD'], ['de-DE', 'EUR'], ['fr-CA', 'CAD'], ['de-CH', 'CHF'], ['en-IN', 'INR'], ['ja-JP', 'JPY'], ['en-US', 'KWD']]) {
      for (const amount of [0, 1, 29, 99, 100, 27_550, 123_456, 99_999_999]) {
        expect(minor(moneyInputText(amount, currency, locale), locale, currency), `${locale} ${currency} ${amount}`).toBe(amount);
      }
    }
    expect(moneyInputText(27_550, 'EUR', 'de-DE')).toBe('275,50');
    expect(moneyInputText(60_000, 'USD', 'en-US')).toBe('600');
  });
});
