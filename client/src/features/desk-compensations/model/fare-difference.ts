import { minorUnitExponent } from '@shared/compensation/money';

/**
 * "120.50" in the fare's currency to minor units, with a point as the decimal mark and no grouping; null for
 * anything else (more decimals than the currency has, a comma, a sign), so an ambiguous amount is refused.
 */
export function toMinor(text: string, currency: string): number | null {
  const exponent = minorUnitExponent(currency);
  const match = (exponent === 0 ? /^(\d+)$/ : new RegExp(`^(\\d+)(?:\\.(\\d{1,${exponent}}))?$`)).exec(text.trim());
  if (!match) return null;
  return Number(match[1]) * 10 ** exponent + Number((match[2] ?? '').padEnd(exponent, '0') || 0);
}
