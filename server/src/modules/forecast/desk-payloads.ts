// The desk's payloads, built from one flight state: the header with counts and odds, the passenger list with each
// passenger's chance of showing and why, and the event trail. Pure functions of the state.
import type { DeskPassenger, FlightDesk } from '@shared/schemas/flight-desk';
import type { HistoryPoint, TrailRow } from '@shared/events';
import type { FlightEventEntity, ForecastSnapshotEntity } from '../../db/entities';
import { airportZone } from '../../reference/journey-airports';
import type { FlightState } from './flight-state';

export function deskOf(s: FlightState, version: number): FlightDesk {
  const { flight, station } = s;
  const cabins = s.result.cabins;
  const sum = (k: 'seats' | 'booked' | 'checkedIn' | 'boarded') => cabins.reduce((a, c) => a + c[k], 0);
  return {
    version,
    flight: {
      id: flight.id, carrierCode: flight.carrierCode, flightNumber: flight.flightNumber, serviceDate: flight.serviceDate, origin: flight.origin,
      destination: flight.destination, scheduledDeparture: flight.scheduledDeparture.toISOString(), scheduledArrival: flight.scheduledArrival.toISOString(),
      gate: flight.gate, state: flight.state, aircraftType: flight.aircraftType, seatsByCabin: flight.seatsByCabin,
      destinationTimeZone: airportZone(flight.destination),
    },
    station: { id: station.id, iata: station.iata, name: station.name, timeZone: station.timeZone, regime: station.regime, currency: station.currency },
    cabins,
    totals: { seats: sum('seats'), booked: sum('booked'), checkedIn: sum('checkedIn'), boarded: sum('boarded') },
    forecast: s.result.forecast,
  };
}

export function passengersOf(s: FlightState): DeskPassenger[] {
  const partySize = new Map<number, number>();
  for (const p of s.passengers) if (p.status !== 'cancelled') partySize.set(p.bookingId, (partySize.get(p.bookingId) ?? 0) + 1);
  return s.passengers.map((p) => {
    const estimate = s.result.estimates.get(p.id);
    return {
      id: p.id, bookingId: p.bookingId, pnr: s.pnrOf.get(p.bookingId) ?? '', pnrSequence: p.pnrSequence, partySize: partySize.get(p.bookingId) ?? 1,
      firstName: p.firstName, lastName: p.lastName, cabin: p.cabin, fareMinor: p.fareMinor, fareCurrency: p.fareCurrency, fareType: p.fareType,
      ssrCodes: p.ssrCodes, frequentFlyerTier: p.frequentFlyerTier, isChild: p.isChild, inboundFlight: p.inboundFlight,
      inboundEstimatedArrival: p.inboundEstimatedArrival?.toISOString() ?? null, status: p.status,
      onward: s.onwardOf.get(p.bookingId) ?? [],
      checkedInAt: p.checkedInAt?.toISOString() ?? null, boardedAt: p.boardedAt?.toISOString() ?? null,
      showProbability: estimate?.probability ?? 0, why: estimate?.why ?? 'Not computed yet.',
      seat: p.seat,
    };
  });
}

export const trailRowOf = (e: FlightEventEntity): TrailRow => ({
  id: Number(e.id), eventId: e.eventId, type: e.type, occurredAt: e.occurredAt.toISOString(), receivedAt: e.receivedAt.toISOString(), status: e.status, summary: e.summary,
});

export const historyPointOf = (p: Pick<ForecastSnapshotEntity, 'at' | 'pOversale' | 'expectedDenied' | 'checkedIn' | 'booked'>): HistoryPoint => ({
  at: p.at.toISOString(), pOversale: p.pOversale, expectedDenied: p.expectedDenied, checkedIn: p.checkedIn, booked: p.booked,
});

/**
 * The list shows each chance as a whole percent: a row is sent again when anything else on it changed or its chance
 * moved by half a point since the value consoles hold, so the drift of time alone does not resend the whole list.
 */
export const SHOWN_PROBABILITY_STEP = 0.005;

export function rowChanged(held: DeskPassenger | undefined, next: DeskPassenger): boolean {
  if (!held) return true;
  for (const key of Object.keys(next) as (keyof DeskPassenger)[]) {
    if (key === 'showProbability' || key === 'why') continue;
    const a = held[key];
    const b = next[key];
    if (a === b) continue;
    if (Array.isArray(a) && Array.isArray(b) && a.length === b.length && a.every((x, i) => x === b[i])) continue;
    return true;
  }
  return Math.abs(held.showProbability - next.showProbability) >= SHOWN_PROBABILITY_STEP;
}
