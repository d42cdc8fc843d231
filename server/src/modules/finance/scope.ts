// Finance sees the stations it belongs to, and only those; a station named outside them is "not found".
import type { SessionUser } from '@shared/schemas/auth';
import { minorUnitExponent } from '@shared/compensation/money';
import { notFound } from '../../domain/errors';
import { canSeeStation } from '../../domain/station-scope';

export function stationScope(user: SessionUser, stationId: number | undefined): number[] {
  if (stationId === undefined) return user.stations.map((s) => s.id);
  if (!canSeeStation(user, stationId)) throw notFound('Station');
  return [stationId];
}

/** "600.00" for 60000 USD: the decimal amount as a spreadsheet reads it, with the currency's own minor unit. */
export function decimalAmount(amountMinor: number, currency: string): string {
  const exponent = minorUnitExponent(currency);
  if (exponent === 0) return String(amountMinor);
  const sign = amountMinor < 0 ? '-' : '';
  const digits = String(Math.abs(amountMinor)).padStart(exponent + 1, '0');
  return `${sign}${digits.slice(0, -exponent)}.${digits.slice(-exponent)}`;
}

/**
 * "USD 600.00" for alerts and messages. A currency whose minor unit we cannot settle (the case a refused payment may
 * be about) is shown in minor units rather than failing: the message that reports a problem must not be one.
 */
export function moneyText(amountMinor: number, currency: string): string {
  try {
    return `${currency} ${decimalAmount(amountMinor, currency)}`;
  } catch {
    return `${amountMinor} minor units of ${currency}`;
  }
}
