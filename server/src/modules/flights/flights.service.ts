import { Between, In, type DataSource } from 'typeorm';
import type { DepartureRow } from '@shared/schemas/flights';
import { FlightEntity, FlightForecastEntity, StationEntity } from '../../db/entities';
import { notFound } from '../../domain/errors';

interface CountRow { flight_id: number; bookings: string; checked_in: string; boarded: string }

const HOUR = 3_600_000;

/**
 * The station's gate day: flights that left in the last 3 hours (still being closed out) and those departing in the
 * next 24, so a late shift sees tomorrow's first wave without a date picker.
 */
export async function listDepartures(db: DataSource, stationId: number, now = new Date()) {
  const station = await db.getRepository(StationEntity).findOneBy({ id: stationId });
  if (!station) throw notFound('Station');
  const flights = await db.getRepository(FlightEntity).find({
    where: { stationId, scheduledDeparture: Between(new Date(now.getTime() - 3 * HOUR), new Date(now.getTime() + 24 * HOUR)) },
    order: { scheduledDeparture: 'ASC' },
  });
  const counts: CountRow[] = flights.length
    ? await db.query(
        `SELECT flight_id, COUNT(*) AS bookings, SUM(status IN ('checked-in','boarded')) AS checked_in, SUM(status = 'boarded') AS boarded
           FROM passengers WHERE flight_id IN (?) AND status <> 'cancelled' GROUP BY flight_id`,
        [flights.map((f) => f.id)],
      )
    : [];
  const byFlight = new Map(counts.map((c) => [Number(c.flight_id), c]));
  const forecasts = flights.length ? await db.getRepository(FlightForecastEntity).find({ select: { flightId: true, pOversale: true, expectedDenied: true }, where: { flightId: In(flights.map((f) => f.id)) } }) : [];
  const odds = new Map(forecasts.map((x) => [x.flightId, x]));
  const rows: DepartureRow[] = flights.map((f) => {
    const c = byFlight.get(f.id);
    return {
      id: f.id,
      carrierCode: f.carrierCode,
      flightNumber: f.flightNumber,
      origin: f.origin,
      destination: f.destination,
      scheduledDeparture: f.scheduledDeparture.toISOString(),
      scheduledArrival: f.scheduledArrival.toISOString(),
      gate: f.gate,
      state: f.state,
      seats: Object.values(f.seatsByCabin).reduce((a, b) => a + b, 0),
      seatsByCabin: f.seatsByCabin,
      bookings: Number(c?.bookings ?? 0),
      checkedIn: Number(c?.checked_in ?? 0),
      boarded: Number(c?.boarded ?? 0),
      pOversale: odds.get(f.id)?.pOversale ?? null,
      expectedDenied: odds.get(f.id)?.expectedDenied ?? null,
    };
  });
  return { station: { id: station.id, iata: station.iata, name: station.name, timeZone: station.timeZone }, flights: rows };
}
