import { describe, expect, it } from 'vitest';
import { canonicalJson, parseForm, splitKey } from './formParser.js';
import { StripeApiError } from './errors.js';

describe('parseForm', () => {
  it('decodes the nested, index-numbered encoding stripe-node sends', () => {
    // Body shape from stripe-node 23.1 `stringifyRequestData` (esm/utils.js): indexed arrays `a[0]`,
    // brackets left unescaped, values percent-encoded.
    const body =
      'cardholder=ich_1&currency=eur&type=virtual&status=active' +
      '&spending_controls[spending_limits][0][amount]=60000&spending_controls[spending_limits][0][interval]=all_time' +
      '&metadata[caseId]=case%20001&metadata[note]=A%26B%3DC';
    expect(parseForm(body)).toEqual({
      cardholder: 'ich_1',
      currency: 'eur',
      type: 'virtual',
      status: 'active',
      spending_controls: { spending_limits: { '0': { amount: '60000', interval: 'all_time' } } },
      metadata: { caseId: 'case 001', note: 'A&B=C' },
    });
  });

  it('also reads percent-encoded brackets, `+` as space and `key[]` pushes (qs conventions, common practice)', () => {
    expect(parseForm('metadata%5Bk%5D=a+b&expand[]=cardholder&expand[]=x')).toEqual({
      metadata: { k: 'a b' },
      expand: ['cardholder', 'x'],
    });
  });

  it('keeps an empty value, which Stripe uses to unset metadata', () => {
    expect(parseForm('metadata=')).toEqual({ metadata: '' });
    expect(parseForm('metadata[caseId]=')).toEqual({ metadata: { caseId: '' } });
  });

  it('refuses a key used both as a value and as an object, naming it', () => {
    let caught: unknown;
    try {
      parseForm('metadata=x&metadata[a]=b');
    } catch (error) {
      caught = error;
    }
    expect(caught).toBeInstanceOf(StripeApiError);
    expect((caught as StripeApiError).param).toBe('metadata[a]');
  });

  it('refuses prototype-polluting keys', () => {
    expect(() => parseForm('metadata[__proto__][x]=1')).toThrow(StripeApiError);
    expect(({} as Record<string, unknown>).x).toBeUndefined();
  });

  it('refuses malformed percent-encoding', () => {
    expect(() => parseForm('name=%E0%A4%A')).toThrow(/percent-encoding/);
  });

  it('splits bracket paths', () => {
    expect(splitKey('a[b][0][c]')).toEqual(['a', 'b', '0', 'c']);
    expect(splitKey('plain')).toEqual(['plain']);
  });
});

describe('canonicalJson', () => {
  it('ignores key order so equal parameters fingerprint equally (derived)', () => {
    expect(canonicalJson(parseForm('a=1&b[x]=2&b[y]=3'))).toBe(canonicalJson(parseForm('b[y]=3&a=1&b[x]=2')));
    expect(canonicalJson(parseForm('a=1'))).not.toBe(canonicalJson(parseForm('a=2')));
  });
});
