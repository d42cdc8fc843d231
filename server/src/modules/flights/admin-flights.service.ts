// Flights an admin creates, edits and cancels by hand. Each change is audited in its own transaction; a departed or
// cancelled flight is history and refuses edits.
import { Between, type DataSource, type EntityManager } from 'typeorm';
import type { SessionUser } from '@shared/schemas/auth';
import type { AdminFlight, FlightCreateBody, FlightUpdateBody } from '@shared/schemas/admin-flights';
import { FlightEntity, StationEntity } from '../../db/entities';
import { canSeeStation } from '../../domain/station-scope';
import { conflict, notFound } from '../../domain/errors';
import { flightMoved, recordEffect } from '../../events';
import { audit } from '../audit/audit.service';
import { assertKnownAirport, flightTimes, localClock } from './flight-times';

export async function stationForUser(db: DataSource | EntityManager, user: SessionUser, stationId: number): Promise<StationEntity> {
  const station = canSeeStation(user, stationId) ? await db.getRepository(StationEntity).findOneBy({ id: stationId }) : null;
  if (!station) throw notFound('Station');
  return station;
}

export function presentAdminFlight(f: FlightEntity, timeZone: string, bookings: number): AdminFlight {
  return {
    id: f.id, carrierCode: f.carrierCode, flightNumber: f.flightNumber, serviceDate: f.serviceDate, origin: f.origin, destination: f.destination,
    ...localClock(f.scheduledDeparture, f.scheduledArrival, timeZone),
    scheduledDeparture: f.scheduledDeparture.toISOString(), scheduledArrival: f.scheduledArrival.toISOString(),
    seatsByCabin: f.seatsByCabin, aircraftType: f.aircraftType, gate: f.gate, state: f.state, scheduleId: f.scheduleId, bookings,
  };
}

async function bookingCounts(db: DataSource | EntityManager, ids: number[]): Promise<Map<number, number>> {
  if (!ids.length) return new Map();
  const rows: { flight_id: number; n: string }[] = await db.query(
    "SELECT flight_id, COUNT(*) AS n FROM passengers WHERE flight_id IN (?) AND status <> 'cancelled' GROUP BY flight_id",
    [ids],
  );
  return new Map(rows.map((r) => [Number(r.flight_id), Number(r.n)]));
}

export async function listAdminFlights(db: DataSource, station: StationEntity, from: string, to: string) {
  const flights = await db.getRepository(FlightEntity).find({ where: { stationId: station.id, serviceDate: Between(from, to) }, order: { scheduledDeparture: 'ASC', id: 'ASC' } });
  const counts = await bookingCounts(db, flights.map((f) => f.id));
  return { timeZone: station.timeZone, flights: flights.map((f) => presentAdminFlight(f, station.timeZone, counts.get(f.id) ?? 0)) };
}

const label = (f: { carrierCode: string; flightNumber: string; serviceDate: string }) => `${f.carrierCode}${f.flightNumber} on ${f.serviceDate}`;

export async function createFlight(db: DataSource, user: SessionUser, station: StationEntity, body: FlightCreateBody): Promise<AdminFlight> {
  assertKnownAirport('destination', body.destination);
  const { departure, arrival } = flightTimes(body.serviceDate, body.departureTime, body.blockMinutes, station.timeZone);
  return db.transaction(async (em) => {
    const key = { carrierCode: body.carrierCode, flightNumber: body.flightNumber, serviceDate: body.serviceDate, origin: station.iata };
    if (await em.findOneBy(FlightEntity, key)) throw conflict('flight_exists', `${label(body)} from ${station.iata} already exists; edit it instead.`);
    const flight = await em.save(
      em.create(FlightEntity, { ...key, stationId: station.id, destination: body.destination, scheduledDeparture: departure, scheduledArrival: arrival, aircraftType: body.aircraftType || null, seatsByCabin: body.seatsByCabin, gate: body.gate || null, state: 'scheduled', shock: null, scheduleId: null }),
    );
    const out = presentAdminFlight(flight, station.timeZone, 0);
    await audit(em, { actor: user, action: 'flight.created', entityType: 'flight', entityId: flight.id, stationId: station.id, after: { ...out, flightId: flight.id } });
    return out;
  });
}

/** The flight, locked, if the user's stations include its station and it is still open to change. */
async function editableFlight(em: EntityManager, user: SessionUser, flightId: number, what: string): Promise<{ flight: FlightEntity; station: StationEntity }> {
  const flight = await em.findOne(FlightEntity, { where: { id: flightId }, lock: { mode: 'pessimistic_write' } });
  if (!flight || !canSeeStation(user, flight.stationId)) throw notFound('Flight');
  if (flight.state === 'departed' || flight.state === 'cancelled') throw conflict(`flight_${flight.state}`, `${label(flight)} is ${flight.state}: ${what} is no longer possible.`);
  return { flight, station: await em.findOneByOrFail(StationEntity, { id: flight.stationId }) };
}

export async function updateFlight(db: DataSource, user: SessionUser, flightId: number, body: FlightUpdateBody): Promise<AdminFlight> {
  return db.transaction(async (em) => {
    const { flight, station } = await editableFlight(em, user, flightId, 'changing it');
    const counts = await bookingCounts(em, [flight.id]);
    const before = presentAdminFlight(flight, station.timeZone, counts.get(flight.id) ?? 0);
    const departureTime = body.departureTime ?? before.departureTime;
    const blockMinutes = body.blockMinutes ?? before.blockMinutes;
    const { departure, arrival } = flightTimes(flight.serviceDate, departureTime, blockMinutes, station.timeZone);
    flight.scheduledDeparture = departure;
    flight.scheduledArrival = arrival;
    if (body.seatsByCabin) flight.seatsByCabin = body.seatsByCabin;
    if (body.aircraftType !== undefined) flight.aircraftType = body.aircraftType || null;
    if (body.gate !== undefined) flight.gate = body.gate || null;
    await em.save(flight);
    const after = presentAdminFlight(flight, station.timeZone, before.bookings);
    // Capacity and times feed the forecast; the consoles' counts move with the seats.
    recordEffect(em, ...flightMoved(flight.id, flight.stationId, ['forecast', 'counts']));
    await audit(em, { actor: user, action: 'flight.updated', entityType: 'flight', entityId: flight.id, stationId: flight.stationId, before: { ...before, flightId: flight.id }, after: { ...after, flightId: flight.id } });
    return after;
  });
}

export async function cancelFlight(db: DataSource, user: SessionUser, flightId: number, reason: string): Promise<AdminFlight> {
  return db.transaction(async (em) => {
    const { flight, station } = await editableFlight(em, user, flightId, 'cancelling it');
    const counts = await bookingCounts(em, [flight.id]);
    const before = flight.state;
    flight.state = 'cancelled';
    await em.save(flight);
    const out = presentAdminFlight(flight, station.timeZone, counts.get(flight.id) ?? 0);
    recordEffect(em, ...flightMoved(flight.id, flight.stationId, ['forecast', 'counts']));
    await audit(em, { actor: user, action: 'flight.cancelled', entityType: 'flight', entityId: flight.id, stationId: flight.stationId, before: { state: before, flightId: flight.id }, after: { state: 'cancelled', reason, bookings: out.bookings, flightId: flight.id } });
    return out;
  });
}
