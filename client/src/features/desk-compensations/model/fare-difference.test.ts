// Minor-unit exponents from ISO 4217: USD 2, JPY 0, KWD 3 (from memory, as Intl reports them).
import { describe, expect, it } from 'vitest';
import { toMinor } from './fare-difference';

describe('toMinor', () => {
  it('reads an amount in the currency’s own minor units', () => {
    expect(toMinor('120.50', 'USD')).toBe(12_050);
    expect(toMinor('120.5', 'USD')).toBe(12_050);
    expect(toMinor('120', 'USD')).toBe(12_000);
    expect(toMinor('1200', 'JPY')).toBe(1_200);
    expect(toMinor('1.125', 'KWD')).toBe(1_125);
  });

  it('refuses what could be read two ways, or not at all', () => {
    for (const bad of ['1,200', '12.345', '-5', '', 'ten', '1.5e3']) expect(toMinor(bad, 'USD')).toBeNull();
    expect(toMinor('12.5', 'JPY')).toBeNull();
  });
});
