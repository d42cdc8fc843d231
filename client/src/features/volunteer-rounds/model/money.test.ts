import { afterEach, describe, expect, it, vi } from 'vitest';
import { minorDigits, moneyInput, parseMoney } from './money';

afterEach(() => vi.unstubAllGlobals());
const inGerman = () => vi.stubGlobal('navigator', { language: 'de-DE', languages: ['de-DE'] });

describe('money typed by people', () => {
  it('knows each currency’s decimals', () => {
    // ISO 4217 list one minor units (from memory): USD 2, EUR 2, CAD 2, JPY 0, KWD 3.
    expect([minorDigits('USD'), minorDigits('EUR'), minorDigits('CAD'), minorDigits('JPY'), minorDigits('KWD')]).toEqual([2, 2, 2, 0, 3]);
  });

  it('reads whole amounts, cents, a currency sign and thousands commas into minor units', () => {
    // Derived: $600 is 60000 cents; $1,200.50 is 120050 cents; ¥5000 is 5000 (no minor unit).
    expect(parseMoney('600', 'USD')).toEqual({ ok: true, minor: 60_000 });
    expect(parseMoney(' $1,200.50 ', 'USD')).toEqual({ ok: true, minor: 120_050 });
    expect(parseMoney('600.5', 'USD')).toEqual({ ok: true, minor: 60_050 });
    expect(parseMoney('5000', 'JPY')).toEqual({ ok: true, minor: 5000 });
    expect(parseMoney('USD 600', 'USD')).toEqual({ ok: true, minor: 60_000 });
    expect(parseMoney('US$600', 'USD')).toEqual({ ok: true, minor: 60_000 });
    expect(parseMoney('€250', 'EUR')).toEqual({ ok: true, minor: 25_000 });
  });

  it('reads "275,50" as 275.50 in a German browser, and refuses it in an American one instead of reading 27,550', () => {
    // CLDR separators: de-DE decimal ",", group "."; en-US decimal ".", group ",".
    expect(parseMoney('275,50', 'USD')).toMatchObject({ ok: false, rule: expect.stringMatching(/^is ambiguous/) });
    inGerman();
    expect(parseMoney('275,50', 'EUR')).toEqual({ ok: true, minor: 27_550 });
    expect(parseMoney('275.50', 'EUR')).toMatchObject({ ok: false, rule: expect.stringMatching(/^is ambiguous: in de-DE/) });
    expect(moneyInput(27_550, 'EUR')).toBe('275,50');
  });

  it('does not round: 0.29 stays 29 cents, where 0.29 * 100 in floating point is 28.999…', () => {
    // IEEE 754 double arithmetic (derived): 0.29 * 100 === 28.999999999999996.
    expect(0.29 * 100).not.toBe(29);
    expect(parseMoney('0.29', 'USD')).toEqual({ ok: true, minor: 29 });
  });

  it('names the rule an amount breaks', () => {
    expect(parseMoney('', 'USD')).toEqual({ ok: false, rule: 'is required' });
    expect(parseMoney('six hundred', 'USD')).toEqual({ ok: false, rule: 'must be a number, such as 1,234.50' });
    expect(parseMoney('-5', 'USD')).toEqual({ ok: false, rule: 'must not be negative' });
    expect(parseMoney('1.234', 'USD')).toEqual({ ok: false, rule: 'has at most 2 decimals in USD' });
    expect(parseMoney('10.5', 'JPY')).toEqual({ ok: false, rule: 'must be a whole amount: JPY has no decimals' });
  });

  it('writes amounts back as they would be typed', () => {
    expect([moneyInput(60_000, 'USD'), moneyInput(60_050, 'USD'), moneyInput(5, 'USD'), moneyInput(5000, 'JPY')]).toEqual(['600', '600.50', '0.05', '5000']);
    for (const minor of [0, 1, 99, 100, 123_456]) {
      const typed = parseMoney(moneyInput(minor, 'USD'), 'USD');
      expect(typed).toEqual({ ok: true, minor });
    }
  });
});
