// How flights and bookings are named in notices, with the checks every template shares.

export interface FlightRef {
  carrierCode: string;
  flightNumber: string;
  origin: string;
  destination: string;
}

export interface NoticeStation {
  iata: string;
  name: string;
  /** IANA zone: every time in a notice is shown in the station's zone, with the zone named. */
  timeZone: string;
}

const CARRIER = /^[A-Z0-9]{2,3}$/;
const FLIGHT_NUMBER = /^\d{1,4}[A-Z]?$/;
const AIRPORT = /^[A-Z]{3}$/;
const PNR = /^[A-Z0-9]{5,8}$/;

export function assertFlightRef(field: string, flight: FlightRef): void {
  if (!CARRIER.test(flight.carrierCode)) throw new RangeError(`${field}.carrierCode: expected a 2-3 character airline designator, got ${JSON.stringify(flight.carrierCode)}`);
  if (!FLIGHT_NUMBER.test(flight.flightNumber)) throw new RangeError(`${field}.flightNumber: expected 1-4 digits and an optional letter, got ${JSON.stringify(flight.flightNumber)}`);
  for (const end of ['origin', 'destination'] as const) {
    if (!AIRPORT.test(flight[end])) throw new RangeError(`${field}.${end}: expected a three-letter IATA airport code, got ${JSON.stringify(flight[end])}`);
  }
}

export function assertPnr(field: string, pnr: string): void {
  if (!PNR.test(pnr)) throw new RangeError(`${field}: expected a booking reference of 5-8 capital letters or digits, got ${JSON.stringify(pnr)}`);
}

export function assertStation(field: string, station: NoticeStation): void {
  if (!AIRPORT.test(station.iata)) throw new RangeError(`${field}.iata: expected a three-letter IATA airport code, got ${JSON.stringify(station.iata)}`);
  if (station.name.trim() === '') throw new RangeError(`${field}.name: must not be blank`);
}

/** "ZZ 123". */
export function designator(flight: FlightRef): string {
  return `${flight.carrierCode} ${flight.flightNumber}`;
}

/** "ZZ 123 from BOS to ORD". */
export function flightWords(flight: FlightRef): string {
  return `${designator(flight)} from ${flight.origin} to ${flight.destination}`;
}

/** Text lists from callers: trimmed, blanks dropped. */
export function cleanList(items: readonly string[] | undefined): string[] {
  return (items ?? []).map((s) => s.trim()).filter((s) => s !== '');
}
