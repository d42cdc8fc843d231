// Writes one flight's manifest inside the import transaction. The file is the full list for the flight: bookings are
// matched by PNR and passengers by PNR + sequence and updated in place, so a re-import never duplicates anyone and
// keeps the check-in and boarding state the feed recorded; whoever is stored but missing from the file is cancelled.
import type { EntityManager } from 'typeorm';
import type { ManifestImportCounts } from '@shared/schemas/manifest';
import { BookingEntity, type FlightEntity, PassengerEntity } from '../../db/entities';
import type { ManifestFlightGroup, ManifestPassengerRow } from './manifest-rows';

export const emptyCounts = (): ManifestImportCounts => ({ bookingsCreated: 0, bookingsUpdated: 0, bookingsCancelled: 0, passengersCreated: 0, passengersUpdated: 0, passengersCancelled: 0 });

export const passengerKey = (pnr: string, sequence: number) => `${pnr}|${sequence}`;

/**
 * The fields a manifest owns; status, check-in and boarding belong to the departure-control feed, and the seat to
 * whichever of the two gave one last (see below).
 */
export function manifestFields({ row }: ManifestPassengerRow) {
  return {
    firstName: row.first_name,
    lastName: row.last_name,
    cabin: row.cabin,
    fareMinor: row.fare_minor,
    fareCurrency: row.fare_currency,
    fareType: row.fare_type,
    ssrCodes: row.ssr_codes,
    optionalFees: row.optional_fees,
    frequentFlyerTier: row.frequent_flyer_tier,
    isChild: row.is_child,
    inboundFlight: row.inbound_flight,
    inboundScheduledArrival: row.inbound_scheduled_arrival ? new Date(row.inbound_scheduled_arrival) : null,
  };
}

/** The inbound estimate the feed may have moved survives a re-import unless the connection itself changed. */
function inboundEstimate(existing: PassengerEntity | undefined, next: ReturnType<typeof manifestFields>): Date | null {
  const sameConnection =
    existing && existing.inboundFlight === next.inboundFlight && existing.inboundScheduledArrival?.getTime() === next.inboundScheduledArrival?.getTime();
  return sameConnection ? existing.inboundEstimatedArrival : next.inboundScheduledArrival;
}

/** Stored passengers of the flight keyed by PNR + sequence, with their bookings keyed by PNR. */
export async function storedManifest(em: EntityManager, flightId: number, lock: boolean) {
  const bookings = await em.find(BookingEntity, { where: { flightId }, ...(lock ? { lock: { mode: 'pessimistic_write' as const } } : {}) });
  const passengers = await em.find(PassengerEntity, { where: { flightId }, ...(lock ? { lock: { mode: 'pessimistic_write' as const } } : {}) });
  const pnrOf = new Map(bookings.map((b) => [b.id, b.pnr]));
  const byKey = new Map(passengers.map((p) => [passengerKey(pnrOf.get(p.bookingId) ?? '', p.pnrSequence), p]));
  return { bookingsByPnr: new Map(bookings.map((b) => [b.pnr, b])), passengersByKey: byKey, passengers };
}

export async function applyFlightManifest(em: EntityManager, flight: FlightEntity, group: ManifestFlightGroup, now: Date): Promise<ManifestImportCounts> {
  const counts = emptyCounts();
  const stored = await storedManifest(em, flight.id, true);
  const inFile = new Set<string>();
  const toSave: PassengerEntity[] = [];

  for (const g of group.bookings.values()) {
    let booking = stored.bookingsByPnr.get(g.pnr);
    if (booking) {
      counts.bookingsUpdated++;
      booking.status = 'active';
      if (g.contactEmail) booking.contactEmail = g.contactEmail;
      if (g.language) booking.language = g.language;
      if (g.channel) booking.channel = g.channel;
      booking.itinerary = g.itinerary;
    } else {
      counts.bookingsCreated++;
      booking = em.create(BookingEntity, { flightId: flight.id, pnr: g.pnr, contactEmail: g.contactEmail, language: g.language, channel: g.channel, itinerary: g.itinerary, travelsTogether: true, status: 'active' });
    }
    booking = await em.save(booking);

    for (const p of g.passengers) {
      const key = passengerKey(g.pnr, p.sequence);
      inFile.add(key);
      const fields = manifestFields(p);
      const existing = stored.passengersByKey.get(key);
      const estimate = inboundEstimate(existing, fields);
      if (existing) {
        counts.passengersUpdated++;
        Object.assign(existing, fields, { inboundEstimatedArrival: estimate });
        // An empty seat cell keeps the seat the feed gave at check-in; a seat in the file is the booking system's.
        if (p.row.seat) existing.seat = p.row.seat;
        // Back on the manifest after a cancellation: booked again, with no check-in carried over from before.
        if (existing.status === 'cancelled') Object.assign(existing, { status: 'booked', statusChangedAt: now, checkedInAt: null, boardedAt: null });
        toSave.push(existing);
      } else {
        counts.passengersCreated++;
        toSave.push(
          em.create(PassengerEntity, {
            ...fields,
            bookingId: booking.id,
            flightId: flight.id,
            pnrSequence: p.sequence,
            inboundEstimatedArrival: estimate,
            seat: p.row.seat,
            status: 'booked',
            checkedInAt: null,
            boardedAt: null,
            statusChangedAt: now,
          }),
        );
      }
    }
  }

  for (const [key, p] of stored.passengersByKey) {
    if (inFile.has(key) || p.status === 'cancelled') continue;
    counts.passengersCancelled++;
    Object.assign(p, { status: 'cancelled', statusChangedAt: now });
    toSave.push(p);
  }
  if (toSave.length) await em.save(toSave, { chunk: 200 });

  // A booking none of whose passengers is left travelling is cancelled as a whole.
  for (const booking of stored.bookingsByPnr.values()) {
    if (group.bookings.has(booking.pnr) || booking.status === 'cancelled') continue;
    counts.bookingsCancelled++;
    await em.update(BookingEntity, { id: booking.id }, { status: 'cancelled' });
  }
  return counts;
}
