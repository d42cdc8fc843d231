// A flight typed as the station reads it (date, local clock time, block minutes) turned into stored instants.
import { instantToLocal, localToInstant, minutesBetween } from '@shared/time';
import { badRequest } from '../../domain/errors';
import { findAirport } from '../../reference/airports';

const MINUTE = 60_000;

/** The departure and arrival instants; a clock time the station's clocks skip that day is refused as invalid on departureTime. */
export function flightTimes(serviceDate: string, departureTime: string, blockMinutes: number, timeZone: string): { departure: Date; arrival: Date } {
  let iso: string;
  try {
    iso = localToInstant('departureTime', `${serviceDate}T${departureTime}`, timeZone);
  } catch (err) {
    const rule = err instanceof RangeError ? err.message.replace(/^departureTime: /, '') : 'is not a valid local time';
    throw badRequest(`departureTime: ${rule}`, [{ field: 'departureTime', rule }]);
  }
  const departure = new Date(iso);
  return { departure, arrival: new Date(departure.getTime() + blockMinutes * MINUTE) };
}

/** The local "HH:mm" and block minutes of stored instants, for the edit form. */
export function localClock(departure: Date, arrival: Date, timeZone: string): { departureTime: string; blockMinutes: number } {
  return { departureTime: instantToLocal(departure, timeZone).slice(11, 16), blockMinutes: minutesBetween(departure, arrival) };
}

/** A destination must be an airport the reference data knows: distances and rules are worked out from it. */
export function assertKnownAirport(field: string, iata: string): void {
  if (!findAirport(iata)) {
    const rule = `${iata} is not an airport in the reference airport data`;
    throw badRequest(`${field}: ${rule}`, [{ field, rule }]);
  }
}
