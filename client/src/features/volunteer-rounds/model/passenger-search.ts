import type { DeskPassenger } from '@shared/schemas/flight-desk';

/** Bookings whose PNR or a traveller's name matches every word typed. */
export function matchingBookings(passengers: readonly DeskPassenger[], query: string) {
  const words = query.trim().toLowerCase().split(/\s+/).filter(Boolean);
  if (words.length === 0) return [];
  const byBooking = new Map<number, DeskPassenger[]>();
  for (const p of passengers) byBooking.set(p.bookingId, [...(byBooking.get(p.bookingId) ?? []), p]);
  return [...byBooking.values()].filter((party) =>
    party.some((p) => words.every((w) => p.pnr.toLowerCase().includes(w) || `${p.firstName} ${p.lastName}`.toLowerCase().includes(w))),
  );
}
