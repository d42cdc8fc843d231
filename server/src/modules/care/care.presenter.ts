// What leaves the server about care: the records as the shared schema shapes them, and the station's suggested amounts.
import type { CareDueItem } from '@shared/compensation';
import type { CareGiven, CareSetup } from '@shared/schemas/care';
import type { CareGivenEntity } from '../../db/entities';

export const presentGiven = (g: CareGivenEntity): CareGiven => ({
  id: g.id, kind: g.kind, description: g.description, amountMinor: g.amountMinor, currency: g.currency, hotelName: g.hotelName,
  providedBy: g.providedBy, recordedBy: g.recordedByLabel, recordedAt: new Date(g.recordedAt).toISOString(),
});

/** The station's allowance for meals and refreshments, the cheapest partner hotel for the nights; null where none is set. */
export function suggestedMinor(item: CareDueItem, setup: CareSetup): number | null {
  if (item.kind === 'meal' && setup.mealMinor > 0) return setup.mealMinor * item.quantity;
  if (item.kind === 'refreshment' && setup.refreshmentMinor > 0) return setup.refreshmentMinor * item.quantity;
  if (item.kind === 'hotel' && setup.hotels.length) return Math.min(...setup.hotels.map((h) => h.nightlyRateMinor)) * item.quantity;
  return null;
}
