// The airport dataset in the shapes the shared journey rules and time module want.
import type { AirportResolver, JourneySegment } from '@shared/compensation';
import type { FlightEntity } from '../db/entities';
import { findAirport, isEuAirport } from './airports';

export const journeyAirport: AirportResolver = (field, iata) => {
  const airport = findAirport(iata);
  if (!airport) throw new RangeError(`${field}: no airport ${JSON.stringify(iata)} in the airport dataset`);
  return { iata: airport.iata, country: airport.country, lat: airport.lat, lon: airport.lon, eu: isEuAirport(airport.iata) };
};

/** The IANA zone of an airport, or null when the dataset has none. */
export function airportZone(iata: string): string | null {
  try {
    return findAirport(iata)?.tz ?? null;
  } catch {
    return null;
  }
}

/** A stored flight as the first segment of a journey. */
export function flightSegment(flight: FlightEntity): JourneySegment {
  return {
    carrier: flight.carrierCode, number: flight.flightNumber, origin: flight.origin, destination: flight.destination,
    departure: flight.scheduledDeparture.toISOString(), arrival: flight.scheduledArrival.toISOString(),
  };
}
