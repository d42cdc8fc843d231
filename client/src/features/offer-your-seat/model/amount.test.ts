import { describe, expect, it } from 'vitest';
import { readAmount } from './amount';
import { laterWords } from './words';

describe('what a passenger types as their ask', () => {
  it('reads plain amounts into minor units', () => {
    // ISO 4217 (from memory): USD and CAD have 2 decimals; derived: $450 = 45000 cents.
    expect(readAmount('450', 'USD')).toEqual({ ok: true, minor: 45_000 });
    expect(readAmount('$ 1,250.5', 'CAD')).toEqual({ ok: true, minor: 125_050 });
  });

  it('answers in plain words', () => {
    expect(readAmount('', 'USD')).toEqual({ ok: false, reason: 'Please enter an amount.' });
    expect(readAmount('lots', 'USD')).toEqual({ ok: false, reason: 'Please enter an amount in numbers, like 450.' });
    expect(readAmount('0', 'USD')).toEqual({ ok: false, reason: 'Please enter an amount above zero.' });
    expect(readAmount('4.505', 'USD')).toEqual({ ok: false, reason: 'Please use at most 2 digits after the point.' });
  });

  it('spells a later arrival out', () => {
    // Derived: 320 minutes = 5 hours 20 minutes.
    expect([laterWords(320), laterWords(60), laterWords(1), laterWords(61)]).toEqual(['5 hours 20 minutes', '1 hour', '1 minute', '1 hour 1 minute']);
  });
});
