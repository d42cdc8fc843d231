import { afterEach, describe, expect, it, vi } from 'vitest';
import { readAmount } from './amount';
import { laterWords } from './words';

afterEach(() => vi.unstubAllGlobals());

describe('what a passenger types as their ask', () => {
  it('reads plain amounts into minor units', () => {
    // ISO 4217 (from memory): USD and CAD have 2 decimals; derived: $450 = 45000 cents.
    expect(readAmount('450', 'USD')).toEqual({ ok: true, minor: 45_000 });
    expect(readAmount('$ 1,250.5', 'CAD')).toEqual({ ok: true, minor: 125_050 });
  });

  it('never reads a decimal comma as a thousands mark: "275,50" is refused in English, 275.50 in French', () => {
    // CLDR: en-US groups with ",", fr-CA writes decimals with ",".
    expect(readAmount('275,50', 'CAD')).toMatchObject({ ok: false, reason: expect.stringMatching(/^Your amount is ambiguous/) });
    vi.stubGlobal('navigator', { language: 'fr-CA', languages: ['fr-CA'] });
    expect(readAmount('275,50', 'CAD')).toEqual({ ok: true, minor: 27_550 });
    expect(readAmount('1 250,50 $', 'CAD')).toEqual({ ok: true, minor: 125_050 });
  });

  it('answers in plain words', () => {
    expect(readAmount('', 'USD')).toEqual({ ok: false, reason: 'Your amount is required.' });
    expect(readAmount('lots', 'USD')).toEqual({ ok: false, reason: 'Your amount must be a number, such as 1,234.50.' });
    expect(readAmount('0', 'USD')).toEqual({ ok: false, reason: 'Your amount must be above zero.' });
    expect(readAmount('4.505', 'USD')).toEqual({ ok: false, reason: 'Your amount has at most 2 decimals in USD.' });
  });

  it('spells a later arrival out', () => {
    // Derived: 320 minutes = 5 hours 20 minutes.
    expect([laterWords(320), laterWords(60), laterWords(1), laterWords(61)]).toEqual(['5 hours 20 minutes', '1 hour', '1 minute', '1 hour 1 minute']);
  });
});
