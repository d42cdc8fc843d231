// The one guard for "nothing new on a departed flight": volunteer rounds, raises, accepts, passenger bids and new
// denial proposals all ask it before they store anything. Paying what is already owed never asks it: the deadlines
// to pay run on after the aircraft has left.
import type { EntityManager } from 'typeorm';
import { FlightEntity, StationEntity } from '../../db/entities';
import { conflict } from '../../domain/errors';

const MINUTE = 60_000;

export interface DepartureFacts {
  state: FlightEntity['state'];
  scheduledDeparture: Date;
}

/**
 * Gone when the feed or the desk said so (departed), or when the scheduled time plus the station's grace has passed
 * and no one said otherwise. A cancelled flight is not departed: its passengers are rebooked, not volunteers.
 */
export function hasDeparted(flight: DepartureFacts, graceMinutes: number, now: Date = new Date()): boolean {
  if (flight.state === 'departed') return true;
  if (flight.state === 'cancelled') return false;
  return now.getTime() > flight.scheduledDeparture.getTime() + graceMinutes * MINUTE;
}

export const departedError = (flightLabel: string, what: string) =>
  conflict('flight_departed', `${flightLabel} has departed: ${what} is no longer possible. What is owed for earlier decisions can still be paid.`);

/** Throws a conflict, flight_departed, when the flight is gone; `what` names the refused action in plain words. */
export async function assertNotDeparted(em: EntityManager, flightOrId: FlightEntity | number, what: string, now: Date = new Date()): Promise<void> {
  const flight = typeof flightOrId === 'number' ? await em.findOneByOrFail(FlightEntity, { id: flightOrId }) : flightOrId;
  const station = await em.findOneByOrFail(StationEntity, { id: flight.stationId });
  if (hasDeparted(flight, station.departureGraceMinutes, now)) throw departedError(`${flight.carrierCode} ${flight.flightNumber}`, what);
}
