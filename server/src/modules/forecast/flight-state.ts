// Everything the desk shows about one flight at one moment, read without writing anything: the inputs of the
// forecast, the figures computed from them, and the latest event-trail rows.
import type { DataSource } from 'typeorm';
import { In } from 'typeorm';
import { BookingEntity, FlightEntity, FlightEventEntity, PassengerEntity, StationEntity, VolunteerEntity } from '../../db/entities';
import { computeFlightForecast, type FlightForecastResult } from './flight-forecast';
import { ratesFor } from '../learning/rates.service';

/** Rows of the event trail the desk shows. */
export const TRAIL_ROWS = 200;

export interface FlightState {
  flight: FlightEntity;
  station: StationEntity;
  /** The moment the figures are for: taken before any input was read, so every change committed by then is in. */
  at: Date;
  passengers: PassengerEntity[];
  pnrOf: Map<number, string>;
  /** Each booking's onward flights, as the desk lists them ("ZZ 123 FCO-JFK"). */
  onwardOf: Map<number, string[]>;
  result: FlightForecastResult;
  /** The learned rates version the figures used; null for the hand-set profile. */
  ratesVersion: number | null;
  trail: FlightEventEntity[];
}

/** The database's clock, so that several app processes agree on which figures are newer. */
export async function databaseNow(db: DataSource): Promise<Date> {
  const [row]: { now: Date | string }[] = await db.query('SELECT UTC_TIMESTAMP(3) AS now');
  return row.now instanceof Date ? row.now : new Date(`${row.now}Z`);
}

/**
 * Reads the flight's inputs and computes its figures as of `at` (by default the database's clock now, read first).
 * Returns null for an unknown flight.
 */
export async function readFlightState(db: DataSource, flightId: number, at?: Date): Promise<FlightState | null> {
  const when = at ?? (await databaseNow(db));
  const flight = await db.getRepository(FlightEntity).findOneBy({ id: flightId });
  if (!flight) return null;
  const [station, rates, passengers, bookings, accepted, trail] = await Promise.all([
    db.getRepository(StationEntity).findOneByOrFail({ id: flight.stationId }),
    ratesFor(db, flight.stationId, flight.destination),
    db.getRepository(PassengerEntity).find({ where: { flightId }, order: { lastName: 'ASC', firstName: 'ASC', id: 'ASC' } }),
    db.getRepository(BookingEntity).find({ select: { id: true, pnr: true, travelsTogether: true, itinerary: true, channel: true }, where: { flightId } }),
    db.getRepository(VolunteerEntity).find({ select: { id: true, passengerIds: true }, where: { flightId, status: In(['accepted']) } }),
    // The trail's own columns only: the stored payload is large and never shown.
    db.getRepository(FlightEventEntity).find({
      select: { id: true, eventId: true, type: true, occurredAt: true, receivedAt: true, status: true, summary: true },
      where: { flightId }, order: { receivedAt: 'DESC', id: 'DESC' }, take: TRAIL_ROWS,
    }),
  ]);
  const together = new Map(bookings.map((b) => [b.id, b.travelsTogether]));
  const channelOf = new Map(bookings.map((b) => [b.id, b.channel]));
  const volunteered = new Set(accepted.flatMap((v) => v.passengerIds));
  const result = computeFlightForecast({
    passengers: passengers.map((p) => ({ ...p, travelsTogether: together.get(p.bookingId) ?? true, channel: channelOf.get(p.bookingId) ?? null, volunteered: volunteered.has(p.id) })),
    seatsByCabin: flight.seatsByCabin,
    departure: flight.scheduledDeparture,
    now: when,
    profile: rates.profile,
    riskTolerance: station.riskToleranceBp / 10_000,
    // A supervisor's shock for the day wins over the learned everyday one.
    shock: flight.shock ?? rates.shock,
  });
  return { flight, station, at: when, ratesVersion: rates.version, passengers, pnrOf: new Map(bookings.map((b) => [b.id, b.pnr])), onwardOf: new Map(bookings.map((b) => [b.id, (b.itinerary ?? []).map((seg) => `${seg.carrier} ${seg.number} ${seg.origin}-${seg.destination}`)])), result, trail };
}
