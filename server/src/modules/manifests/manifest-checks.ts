// Checks that need the stored flight: the onward flights join this one and name known airports, and the file does
// not book the flight beyond the station's ceiling (capacity times its maximum overbooking factor).
import { checkItinerary } from '@shared/compensation';
import type { ManifestProblem } from '@shared/schemas/manifest';
import type { FlightEntity, StationEntity } from '../../db/entities';
import { flightSegment, journeyAirport } from '../../reference/journey-airports';
import type { ManifestFlightGroup } from './manifest-rows';

export const passengersIn = (g: ManifestFlightGroup) => [...g.bookings.values()].reduce((n, b) => n + b.passengers.length, 0);

export const capacityOf = (flight: FlightEntity) => Object.values(flight.seatsByCabin).reduce((n, s) => n + s, 0);

/** The most bookings a flight may hold: capacity times the station's factor, rounded down. */
export const bookingLimit = (flight: FlightEntity, station: StationEntity) => Math.floor((capacityOf(flight) * station.maxOverbookingBp) / 10_000);

export function flightProblems(group: ManifestFlightGroup, flight: FlightEntity, station: StationEntity, label: string): ManifestProblem[] {
  const problems: ManifestProblem[] = [];
  const count = passengersIn(group);
  const limit = bookingLimit(flight, station);
  if (count > limit) {
    problems.push({
      line: group.firstLine,
      field: 'flight_number',
      rule: `flight ${label} would hold ${count} booked passengers; ${station.iata} allows at most ${limit} (${capacityOf(flight)} seats × ${station.maxOverbookingBp / 10_000} maximum overbooking). Check that the file holds this flight only.`,
    });
  }
  const leg = flightSegment(flight);
  for (const booking of group.bookings.values()) {
    if (booking.itinerary.length === 0) continue;
    try {
      checkItinerary(leg, booking.itinerary);
      booking.itinerary.forEach((s, i) => journeyAirport(`itinerary[${i}].destination`, s.destination));
    } catch (err) {
      if (!(err instanceof RangeError)) throw err;
      problems.push({ line: booking.firstLine, field: 'itinerary', rule: `PNR ${booking.pnr}: ${err.message}` });
    }
  }
  return problems;
}
