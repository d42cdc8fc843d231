import { describe, expect, it } from 'vitest';
import { CARDHOLDER_NAME_MAX, cardholderName } from './cardholder-name';

// The rule checked: Stripe's Issuing cardholder `name` is "at most 24 characters" and "cannot contain any special
// characters or numbers" (stripe-node 23.1 CardholderCreateParams.name docs). The local stand-in accepts
// /^\p{L}[\p{L} .'-]*$/u; Bumpboard sends only A-Z, a-z and single spaces, which fits both.
const ALLOWED = /^[A-Za-z]+( [A-Za-z]+)*$/;

describe('cardholderName', () => {
  it('keeps a short plain name as it is', () => {
    expect(cardholderName('Ana', 'Lima')).toBe('Ana Lima');
  });

  it('folds accents and drops digits, hyphens and apostrophes', () => {
    expect(cardholderName('José-María', "O'Brien 3rd")).toBe('Jose Maria O Brien rd');
  });

  it('shortens the given names to an initial when the whole name is over 24 characters', () => {
    expect(cardholderName('Maximiliana Josefina', 'Vandersloot')).toBe('M Vandersloot');
  });

  it('cuts a very long family name at a word boundary', () => {
    const name = cardholderName('Q', 'Wolfeschlegel Steinhausen Bergerdorff');
    expect(name.length).toBeLessThanOrEqual(CARDHOLDER_NAME_MAX);
    expect(name).toBe('Q Wolfeschlegel');
  });

  it('never answers with an empty name', () => {
    expect(cardholderName('123', '---')).toBe('Passenger');
  });

  it('always fits the printed-name rule, whatever the manifest held', () => {
    const samples = [['Łukasz', 'Żółć'], ['陳', '大文'], ['A'.repeat(60), 'B'.repeat(60)], ['  ', 'x'], ['Zoë', 'Ångström']];
    for (const [first, last] of samples) {
      const name = cardholderName(first, last);
      expect(name.length, name).toBeLessThanOrEqual(CARDHOLDER_NAME_MAX);
      expect(name, name).toMatch(ALLOWED);
    }
  });
});
