// Form 251 lines (DOT Form 251, "Report of Passengers Denied Confirmed Space"; line structure from memory) and the
// 14 CFR 250.6 exceptions they mirror: (a) ticketing/check-in/acceptability, (b) smaller aircraft, (d) alternate within 1 h.
import { describe, expect, it } from 'vitest';
import { denialCategory } from './category';

describe('denialCategory', () => {
  it('compensated with an alternate is 1a, without one 1b', () => {
    expect(denialCategory({ bands: ['us-400pct'], hasAlternate: true })).toBe('1a');
    expect(denialCategory({ bands: ['us-400pct'], hasAlternate: false })).toBe('1b');
    expect(denialCategory({ bands: ['eu-a', 'eu-a'], hasAlternate: true })).toBe('1a');
  });

  it('an alternate planned within 1 h (14 CFR 250.6(d)) is 2a', () => {
    expect(denialCategory({ bands: ['us-none-within-1h'], hasAlternate: true })).toBe('2a');
    expect(denialCategory({ bands: [], exemption: 'us-alternate-within-1h', hasAlternate: true })).toBe('2a');
  });

  it('a smaller aircraft (250.6(b)) is 2b, failed check-in requirements (250.6(a)) 2c', () => {
    expect(denialCategory({ bands: ['exempt'], exemption: 'us-smaller-aircraft', hasAlternate: true })).toBe('2b');
    expect(denialCategory({ bands: ['exempt'], exemption: 'us-weight-balance', hasAlternate: false })).toBe('2b');
    expect(denialCategory({ bands: ['exempt'], exemption: 'us-ticketing-checkin-acceptability', hasAlternate: true })).toBe('2c');
  });

  it('leaves to a person what fits no line', () => {
    expect(denialCategory({ bands: ['exempt'], exemption: 'us-other-section', hasAlternate: true })).toBeNull();
    expect(denialCategory({ bands: ['out-of-scope'], hasAlternate: true })).toBeNull();
    expect(denialCategory({ bands: ['not-computed'], hasAlternate: false })).toBeNull();
  });
});
