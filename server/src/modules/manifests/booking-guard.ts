// The checks a booking from the departure-control feed must pass, the same as a manifest row: its onward flights join
// this flight and name known airports, and the flight stays under the station's booking ceiling.
import { checkItinerary, type JourneySegment } from '@shared/compensation';
import type { EntityManager } from 'typeorm';
import { Not } from 'typeorm';
import { PassengerEntity, StationEntity, type FlightEntity } from '../../db/entities';
import { flightSegment, journeyAirport } from '../../reference/journey-airports';
import { bookingLimit, capacityOf } from './manifest-checks';

export interface BookingProblem {
  field: string;
  rule: string;
}

/** Null when the booking may be stored; otherwise the field and the rule it breaks. Counts others on the flight. */
export async function feedBookingProblem(em: EntityManager, flight: FlightEntity, bookingId: number | null, partySize: number, itinerary: readonly JourneySegment[]): Promise<BookingProblem | null> {
  try {
    checkItinerary(flightSegment(flight), itinerary);
    itinerary.forEach((s, i) => journeyAirport(`itinerary[${i}].destination`, s.destination));
  } catch (err) {
    if (!(err instanceof RangeError)) throw err;
    return { field: err.message.split(':')[0], rule: err.message.slice(err.message.indexOf(':') + 1).trim() };
  }
  const station = await em.findOneByOrFail(StationEntity, { id: flight.stationId });
  const others = await em.countBy(PassengerEntity, { flightId: flight.id, status: Not('cancelled'), ...(bookingId ? { bookingId: Not(bookingId) } : {}) });
  const limit = bookingLimit(flight, station);
  if (others + partySize > limit) {
    return { field: 'passengers', rule: `${flight.carrierCode}${flight.flightNumber} would hold ${others + partySize} booked passengers; ${station.iata} allows at most ${limit} (${capacityOf(flight)} seats × ${station.maxOverbookingBp / 10_000} maximum overbooking)` };
  }
  return null;
}
